// Approximate randomization and paired bootstrap on corpus F1.
// Tested by tests/evaluator/significance_test.cc (against the exact permutation test).
#include "evaluator/significance.h"

#include <cmath>
#include <cstdio>
#include <random>

#include "evaluator/tally.h"

namespace treegate {
namespace {

// Observed differences are compared with a small tolerance so that a shuffle that reproduces
// the observed split is counted despite rounding in the F1 arithmetic.
constexpr double kTolerance = 1e-9;

__extension__ typedef unsigned __int128 Wide;  // GCC and Clang; only for the index draw

struct Totals {
  std::int64_t m = 0, g = 0, t = 0;
};

double f1_of(const Totals& x) {
  return f1_pct(static_cast<std::uint64_t>(x.m), static_cast<std::uint64_t>(x.t),
                static_cast<std::uint64_t>(x.g));
}

}  // namespace

double corpus_f1(std::uint64_t matched, std::uint64_t gold, std::uint64_t test) {
  return f1_pct(matched, test, gold);
}

SignificanceResult approximate_randomization(const std::vector<PairedCounts>& sentences,
                                             std::uint64_t iterations, std::uint64_t seed) {
  SignificanceResult r{SignificanceMethod::kApproximateRandomization};
  r.iterations = iterations;
  r.seed = seed;
  Totals a, b;
  // Only sentences whose counts differ change anything when swapped.
  std::vector<std::int32_t> dm, dg, dt;
  for (const PairedCounts& s : sentences) {
    a.m += s.matched_a, a.g += s.gold_a, a.t += s.test_a;
    b.m += s.matched_b, b.g += s.gold_b, b.t += s.test_b;
    const auto m = static_cast<std::int32_t>(s.matched_a) - static_cast<std::int32_t>(s.matched_b);
    const auto g = static_cast<std::int32_t>(s.gold_a) - static_cast<std::int32_t>(s.gold_b);
    const auto t = static_cast<std::int32_t>(s.test_a) - static_cast<std::int32_t>(s.test_b);
    if (m != 0 || g != 0 || t != 0) dm.push_back(m), dg.push_back(g), dt.push_back(t);
  }
  r.f1_a = f1_of(a);
  r.f1_b = f1_of(b);
  r.delta = r.f1_b - r.f1_a;
  const double observed = std::fabs(r.delta);
  std::mt19937_64 rng(seed);
  const std::size_t n = dm.size();
  for (std::uint64_t it = 0; it < iterations; ++it) {
    // Swapping sentence i moves its difference (A - B) from A's totals to B's.
    std::int64_t sm = 0, sg = 0, st = 0;
    for (std::size_t base = 0; base < n; base += 64) {
      const std::uint64_t bits = rng();
      const std::size_t end = std::min(n, base + 64);
      std::int32_t bm = 0, bg = 0, bt = 0;
      for (std::size_t i = base; i < end; ++i) {
        const std::int32_t take = -static_cast<std::int32_t>((bits >> (i - base)) & 1u);
        bm += dm[i] & take;
        bg += dg[i] & take;
        bt += dt[i] & take;
      }
      sm += bm, sg += bg, st += bt;
    }
    const Totals sa{a.m - sm, a.g - sg, a.t - st};
    const Totals sb{b.m + sm, b.g + sg, b.t + st};
    if (std::fabs(f1_of(sb) - f1_of(sa)) >= observed - kTolerance) ++r.at_least;
  }
  r.p = static_cast<double>(r.at_least + 1) / static_cast<double>(iterations + 1);
  return r;
}

SignificanceResult paired_bootstrap(const std::vector<PairedCounts>& sentences,
                                    std::uint64_t iterations, std::uint64_t seed) {
  SignificanceResult r{SignificanceMethod::kPairedBootstrap};
  r.iterations = iterations;
  r.seed = seed;
  Totals a, b;
  for (const PairedCounts& s : sentences) {
    a.m += s.matched_a, a.g += s.gold_a, a.t += s.test_a;
    b.m += s.matched_b, b.g += s.gold_b, b.t += s.test_b;
  }
  r.f1_a = f1_of(a);
  r.f1_b = f1_of(b);
  r.delta = r.f1_b - r.f1_a;
  const std::uint64_t n = sentences.size();
  if (r.delta == 0.0 || n == 0 || iterations == 0) {
    r.p = 1;
    return r;
  }
  const double sign = r.delta > 0 ? 1.0 : -1.0;
  std::mt19937_64 rng(seed);
  for (std::uint64_t it = 0; it < iterations; ++it) {
    Totals sa, sb;
    for (std::uint64_t k = 0; k < n; ++k) {
      // Multiply-shift maps a 64-bit draw to [0, n) (Lemire 2019); its bias is below n / 2^64.
      const auto i = static_cast<std::size_t>((static_cast<Wide>(rng()) * n) >> 64);
      const PairedCounts& s = sentences[i];
      sa.m += s.matched_a, sa.g += s.gold_a, sa.t += s.test_a;
      sb.m += s.matched_b, sb.g += s.gold_b, sb.t += s.test_b;
    }
    if (sign * (f1_of(sb) - f1_of(sa)) > 2.0 * std::fabs(r.delta)) ++r.at_least;
  }
  r.p = static_cast<double>(r.at_least) / static_cast<double>(iterations);
  return r;
}

SignificanceResult significance(const std::vector<PairedCounts>& sentences,
                                const SignificanceOptions& options) {
  SignificanceResult r =
      options.method == SignificanceMethod::kPairedBootstrap
          ? paired_bootstrap(sentences, options.iterations, options.seed)
          : approximate_randomization(sentences, options.iterations, options.seed);
  r.level = options.level;
  return r;
}

const char* method_name(SignificanceMethod method) {
  return method == SignificanceMethod::kPairedBootstrap ? "paired bootstrap"
                                                        : "approximate randomization";
}

std::string significance_sentence(const SignificanceResult& r) {
  char buf[512];
  if (r.delta == 0.0) {
    std::snprintf(buf, sizeof buf,
                  "The two runs have the same F1 (%.2f); there is no difference to test (p = %.4g; "
                  "%s, %llu iterations, seed %llu).",
                  r.f1_a, r.p, method_name(r.method), static_cast<unsigned long long>(r.iterations),
                  static_cast<unsigned long long>(r.seed));
    return buf;
  }
  std::snprintf(buf, sizeof buf,
                "The F1 difference of %+.2f points (%.2f -> %.2f) %s significant at the %g level "
                "(p = %.4g; %s, %llu iterations, seed %llu).",
                r.delta, r.f1_a, r.f1_b, r.significant() ? "is" : "is not", r.level, r.p,
                method_name(r.method), static_cast<unsigned long long>(r.iterations),
                static_cast<unsigned long long>(r.seed));
  return buf;
}

}  // namespace treegate
