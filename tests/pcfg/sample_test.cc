// Sampling: reproducibility, the depth limit, and statistical consistency of estimate with
// sample (draw 50,000 trees from a known PCFG, re-estimate, compare every rule).
#include <doctest/doctest.h>

#include <cmath>
#include <map>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "harness/pcfg/estimate.h"
#include "harness/pcfg/sample.h"
#include "tests/pcfg/textbook_grammar.h"

namespace treegate::pcfg {
namespace {

// The PCFG of Manning & Schuetze, "Foundations of Statistical Natural Language Processing"
// (1999), chapter 11, the "astronomers saw stars with ears" example (recalled from memory).
// It is consistent: an NP makes on average 0.4 * 2 = 0.8 NPs, a VP 0.3 VPs.
using testdata::kAstronomers;

std::vector<std::string> draw(const Grammar& g, std::size_t n, SampleOptions options) {
  std::vector<std::string> out;
  sample_trees(g, n, options, [&](const Tree& t) { out.push_back(to_bracketed(t)); });
  return out;
}

TEST_CASE("the same seed gives the same trees; another seed other trees") {
  const Grammar g = read_grammar_string(kAstronomers, "ms.pcfg");
  SampleOptions options;
  options.seed = 42;
  const auto first = draw(g, 200, options);
  CHECK(first == draw(g, 200, options));
  options.seed = 43;
  CHECK(first != draw(g, 200, options));
  for (const std::string& text : first) CHECK(to_bracketed(parse_tree(text)) == text);
}

TEST_CASE("draws past the depth limit are discarded; endless recursion is reported") {
  const Grammar endless = read_grammar_string("@start S\nS -> \"a\" S 1\n", "endless.pcfg");
  SampleOptions options;
  options.max_depth = 50;
  options.max_attempts = 20;
  CHECK_THROWS_WITH(draw(endless, 1, options),
                    "endless.pcfg: 20 draws in a row went deeper than 50 levels or past 1000000 "
                    "nodes; raise the limits, or check that the grammar is consistent (treegate "
                    "lint)");
  // A long chain (mean depth 5,000) is drawn without recursion.
  const Grammar chain =
      read_grammar_string("@start S\nS -> \"a\" S 0.9998\nS -> \"a\" 0.0002\n", "chain.pcfg");
  options.max_depth = 1000000;
  SampleStats stats =
      sample_trees(chain, 3, options, [](const Tree& t) { CHECK(t.num_words() > 0); });
  CHECK(stats.trees == 3);
}

TEST_CASE("a nonterminal without rules is named with the line that uses it") {
  CHECK_THROWS_WITH(
      Sampler(read_grammar_string("@start S\nS -> NP VP 1\nNP -> \"x\" 1\n", "g.pcfg")),
      "g.pcfg:2: nonterminal 'VP' has no rules (with positive weight) to sample");
  CHECK_THROWS_WITH(Sampler(read_grammar_string("@start S\nX -> \"x\" 1\n", "g.pcfg")),
                    "g.pcfg:1: start symbol 'S' has no rules to sample");
}

// Statistical consistency. Relative-frequency estimation from trees drawn from a PCFG is the
// maximum-likelihood estimate. For a left-hand side A expanded N_A times in the sample, each
// expansion independently picks rule r with probability p_r, so given N_A the count c_r is
// Binomial(N_A, p_r): c_r / N_A has mean p_r and standard error sqrt(p_r (1 - p_r) / N_A).
// Every rule must lie within 4 standard errors (a two-sided normal tail of about 6e-5 per rule,
// so with 12 rules a correct sampler and estimator fail with probability below 1e-3; the seed is
// fixed, so the outcome is reproducible). Rules of probability 1 must come out exactly 1.
TEST_CASE("sample 50,000 trees, re-estimate: every rule within 4 binomial standard errors") {
  const Grammar known = read_grammar_string(kAstronomers, "ms.pcfg");
  TransformSpec spec = identity_spec();
  spec.start = std::string(1, 'S');  // (assigning "S" trips a false -Wrestrict in GCC 12)
  Estimator estimator(spec);
  SampleOptions options;
  options.seed = 20261201;
  sample_trees(known, 50000, options, [&](const Tree& t) { REQUIRE(!estimator.add(t)); });
  const Grammar estimated = estimator.grammar();
  std::map<std::string, std::uint64_t> lhs_total;
  for (const Rule& r : estimated.rules) lhs_total[r.lhs] += *r.count;
  std::map<std::string, double> found;
  for (const Rule& r : estimated.rules) found[format_rule(r)] = r.weight;
  CHECK(found.size() == known.rules.size());
  for (const Rule& r : known.rules) {
    const double n = static_cast<double>(lhs_total[r.lhs]);
    const double se = std::sqrt(r.weight * (1 - r.weight) / n);
    INFO(format_rule(r), ": known ", r.weight, ", estimated ", found[format_rule(r)], ", N = ", n,
         ", se = ", se);
    REQUIRE(found.count(format_rule(r)) == 1);
    CHECK(std::abs(found[format_rule(r)] - r.weight) <= 4 * se);
  }
}

}  // namespace
}  // namespace treegate::pcfg
