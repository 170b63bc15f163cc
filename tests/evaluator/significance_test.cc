// Significance tests checked against their definitions computed by brute force:
// - approximate randomization (Noreen 1989, "Computer-Intensive Methods for Testing Hypotheses";
//   Yeh 2000, "More accurate tests for the statistical significance of result differences")
//   estimates the exact paired permutation test, whose p-value is the share of all 2^n swap
//   patterns with |dF1| at least the observed one;
// - the paired bootstrap (Berg-Kirkpatrick, Burkett & Klein 2012, "An empirical investigation
//   of statistical significance in NLP", section 2) estimates the share of all n^n equally
//   likely resamples whose difference exceeds twice the observed one.
// Both Monte-Carlo estimates must agree with the exact value within 4 standard errors.
#include "evaluator/significance.h"

#include <doctest/doctest.h>

#include <cmath>
#include <random>

namespace treegate {
namespace {

struct Sums {
  std::uint64_t m = 0, g = 0, t = 0;
};

double exact_permutation_p(const std::vector<PairedCounts>& s) {
  Sums a, b;
  for (const auto& x : s) {
    a.m += x.matched_a, a.g += x.gold_a, a.t += x.test_a;
    b.m += x.matched_b, b.g += x.gold_b, b.t += x.test_b;
  }
  const double observed = std::fabs(corpus_f1(b.m, b.g, b.t) - corpus_f1(a.m, a.g, a.t));
  const std::size_t n = s.size();
  std::uint64_t hits = 0;
  for (std::uint64_t mask = 0; mask < (1ull << n); ++mask) {
    Sums sa, sb;
    for (std::size_t i = 0; i < n; ++i) {
      const bool swap = (mask >> i) & 1u;
      const auto& x = s[i];
      Sums& to_a = swap ? sb : sa;
      Sums& to_b = swap ? sa : sb;
      to_a.m += x.matched_a, to_a.g += x.gold_a, to_a.t += x.test_a;
      to_b.m += x.matched_b, to_b.g += x.gold_b, to_b.t += x.test_b;
    }
    const double d = std::fabs(corpus_f1(sb.m, sb.g, sb.t) - corpus_f1(sa.m, sa.g, sa.t));
    if (d >= observed - 1e-9) ++hits;
  }
  return static_cast<double>(hits) / static_cast<double>(1ull << n);
}

double exact_bootstrap_p(const std::vector<PairedCounts>& s) {
  Sums a, b;
  for (const auto& x : s) {
    a.m += x.matched_a, a.g += x.gold_a, a.t += x.test_a;
    b.m += x.matched_b, b.g += x.gold_b, b.t += x.test_b;
  }
  const double delta = corpus_f1(b.m, b.g, b.t) - corpus_f1(a.m, a.g, a.t);
  const double sign = delta > 0 ? 1 : -1;
  const std::size_t n = s.size();
  std::uint64_t total = 1;
  for (std::size_t i = 0; i < n; ++i) total *= n;
  std::uint64_t hits = 0;
  for (std::uint64_t code = 0; code < total; ++code) {
    Sums sa, sb;
    std::uint64_t c = code;
    for (std::size_t k = 0; k < n; ++k, c /= n) {
      const auto& x = s[c % n];
      sa.m += x.matched_a, sa.g += x.gold_a, sa.t += x.test_a;
      sb.m += x.matched_b, sb.g += x.gold_b, sb.t += x.test_b;
    }
    if (sign * (corpus_f1(sb.m, sb.g, sb.t) - corpus_f1(sa.m, sa.g, sa.t)) > 2 * std::fabs(delta)) {
      ++hits;
    }
  }
  return static_cast<double>(hits) / static_cast<double>(total);
}

// Random paired counts; `edge` in [0, 1] biases system B towards more matches.
std::vector<PairedCounts> sample(std::size_t n, double edge, std::mt19937_64& rng) {
  std::vector<PairedCounts> out(n);
  std::uniform_int_distribution<int> gold(3, 15);
  std::uniform_real_distribution<double> u(0, 1);
  for (auto& x : out) {
    x.gold_a = x.gold_b = static_cast<std::uint32_t>(gold(rng));
    x.test_a = static_cast<std::uint32_t>(x.gold_a + (u(rng) < 0.3 ? 1 : 0));
    x.test_b = static_cast<std::uint32_t>(x.gold_b + (u(rng) < 0.3 ? 1 : 0));
    x.matched_a = static_cast<std::uint32_t>(x.gold_a * (0.5 + 0.4 * u(rng)));
    x.matched_b = std::min<std::uint32_t>(
        x.test_b, static_cast<std::uint32_t>(x.gold_b * (0.5 + 0.4 * u(rng) + edge * u(rng))));
  }
  return out;
}

bool agrees(double estimate, double exact, std::uint64_t r) {
  const double se = std::sqrt(std::max(exact * (1 - exact), 1.0 / r) / static_cast<double>(r));
  return std::fabs(estimate - exact) <= 4 * se + 2.0 / static_cast<double>(r + 1);
}

TEST_CASE("approximate randomization agrees with the exact permutation test (n <= 16)") {
  std::mt19937_64 rng(7);
  for (std::size_t n : {4u, 8u, 12u, 16u}) {
    for (double edge : {0.0, 0.15, 0.4}) {
      const auto s = sample(n, edge, rng);
      const double exact = exact_permutation_p(s);
      const SignificanceResult r = approximate_randomization(s, 10000, 99);
      INFO("n=" << n << " edge=" << edge << " exact=" << exact << " ar=" << r.p);
      CHECK(agrees(r.p, exact, 10000));
    }
  }
}

TEST_CASE("paired bootstrap agrees with exhaustive resampling (n <= 7)") {
  std::mt19937_64 rng(11);
  for (std::size_t n : {4u, 6u, 7u}) {
    for (double edge : {0.05, 0.3}) {
      const auto s = sample(n, edge, rng);
      const double exact = exact_bootstrap_p(s);
      const SignificanceResult r = paired_bootstrap(s, 10000, 5);
      INFO("n=" << n << " edge=" << edge << " exact=" << exact << " boot=" << r.p);
      CHECK(agrees(r.p, exact, 10000));
    }
  }
}

TEST_CASE("identical runs give p = 1 and the sentence says there is no difference") {
  std::mt19937_64 rng(3);
  auto s = sample(50, 0, rng);
  for (auto& x : s) x.matched_b = x.matched_a, x.test_b = x.test_a;
  const SignificanceResult r = approximate_randomization(s, 10000, 1);
  CHECK(r.p == 1.0);
  CHECK(paired_bootstrap(s, 1000, 1).p == 1.0);
  CHECK(significance_sentence(r).find("no difference") != std::string::npos);
}

TEST_CASE("seeded: the same seed gives the same p, a clear gain is significant") {
  std::mt19937_64 rng(5);
  const auto s = sample(400, 0.5, rng);
  SignificanceOptions o;
  const SignificanceResult one = significance(s, o), two = significance(s, o);
  CHECK(one.at_least == two.at_least);
  CHECK(one.p == two.p);
  CHECK(one.significant());
  CHECK(significance_sentence(one).find("is significant at the 0.05 level") != std::string::npos);
}

}  // namespace
}  // namespace treegate
