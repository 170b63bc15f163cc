// lint: hand-built grammars, each with one named defect, and the spectral radius against
// values derived by hand.
#include <doctest/doctest.h>

#include <cmath>

#include "harness/pcfg/lint.h"

namespace treegate::pcfg {
namespace {

std::vector<std::string> findings(const std::string& text) {
  std::vector<std::string> out;
  for (const LintFinding& f : lint_grammar(read_grammar_string(text, "l.pcfg")).findings) {
    out.push_back(std::to_string(f.line) + " " + f.check + ": " + f.message);
  }
  return out;
}

TEST_CASE("a clean grammar has no findings") {
  CHECK(findings("@start S\nS -> A B 1\nA -> \"a\" 1\nB -> \"b\" 0.5\nB -> B \"b\" 0.5\n").empty());
}

TEST_CASE("each defect is named") {
  using V = std::vector<std::string>;
  // Defect: NP's probabilities sum to 0.9.
  CHECK(findings("@start S\nS -> NP 1\nNP -> \"a\" 0.5\nNP -> \"b\" 0.4\n") ==
        V{"3 sum: probabilities of the 2 rules of 'NP' sum to 0.9, expected 1 (tolerance 1e-06; "
          "--normalize "
          "writes a fixed copy)"});
  // Defect: the same rule twice (its weights then also sum to more than 1).
  CHECK(findings("@start S\nS -> \"a\" 0.5\nS -> \"a\" 0.5\n") ==
        V{"3 duplicate: S -> \"a\" repeats the rule on line 2"});
  // Defect: zero, negative and NaN weights.
  CHECK(findings("@start S\nS -> \"a\" 1\nS -> \"b\" 0\nS -> \"c\" -1\nS -> \"d\" nan\n") ==
        V{"2 sum: probabilities of the 4 rules of 'S' sum to nan, expected 1 (tolerance 1e-06; "
          "--normalize writes a fixed copy)",
          "3 weight: weight 0 of S -> \"b\": expected a positive finite number",
          "4 weight: weight -1 of S -> \"c\": expected a positive finite number",
          "5 weight: weight nan of S -> \"d\": expected a positive finite number"});
  // Defect: no start symbol; then a start symbol without rules.
  CHECK(findings("S -> \"a\" 1\n") ==
        V{"0 start: no @start line: expected '@start SYMBOL' before the rules"});
  CHECK(findings("@start T\nS -> \"a\" 1\n") ==
        V{"1 start: start symbol 'T' has no rules",
          "2 unreachable: 'S' cannot be reached from the start symbol 'T'"});
  // Defect: Z is not reachable from S.
  CHECK(findings("@start S\nS -> \"a\" 1\nZ -> \"z\" 1\n") ==
        V{"3 unreachable: 'Z' cannot be reached from the start symbol 'S'"});
  // Defect: B only rewrites to itself and C (undefined): no terminal string. B -> B C with
  // probability 1 also makes the expected tree size infinite (radius 1).
  CHECK(
      findings("@start S\nS -> \"a\" 0.5\nS -> A B 0.5\nA -> \"a\" 1\nB -> B C 1\n") ==
      V{"0 inconsistent: not consistent: the spectral radius of the mean-production matrix is 1 "
        "(>= 1), so derivations need not terminate and the expected tree size is infinite (Booth & "
        "Thompson 1973)",
        "5 unproductive: 'B' derives no string of words (every rule of it needs an unproductive "
        "symbol)",
        "5 unproductive: 'C' is used but has no rules (undefined nonterminal)"});
  // Defect: unary cycle A -> B -> A.
  CHECK(findings("@start S\nS -> A 1\nA -> B 0.5\nA -> \"a\" 0.5\nB -> A 0.5\nB -> \"b\" 0.5\n") ==
        V{"3 unary-cycle: unary cycle A -> B -> A (rules on lines 3, 5)"});
  // Defect: "NP" is a word and a nonterminal.
  CHECK(findings("@start S\nS -> NP \"NP\" 1\nNP -> \"a\" 1\n") ==
        V{"2 terminal-nonterminal: 'NP' is used both as a terminal and as a nonterminal"});
  // Defect: S -> S S 0.6 | a 0.4 is not consistent: the mean number of S children is
  // 2 * 0.6 = 1.2 > 1 (Booth & Thompson 1973; a supercritical branching process).
  CHECK(findings("@start S\nS -> S S 0.6\nS -> \"a\" 0.4\n") ==
        V{"0 inconsistent: not consistent: the spectral radius of the mean-production matrix is "
          "1.2 (>= 1), "
          "so derivations need not terminate and the expected tree size is infinite (Booth & "
          "Thompson 1973)"});
}

TEST_CASE("spectral radius of the mean-production matrix") {
  // M = [[0.3, 0.3], [0.5, 0]]: lambda^2 - 0.3 lambda - 0.15 = 0, lambda = (0.3 + sqrt(0.69)) / 2.
  Grammar g = read_grammar_string(
      "@start A\nA -> A B 0.3\nA -> \"a\" 0.7\nB -> A 0.5\nB -> \"b\" 0.5\n", "r.pcfg");
  bool converged = false;
  CHECK(mean_production_radius(g, &converged) ==
        doctest::Approx((0.3 + std::sqrt(0.69)) / 2).epsilon(1e-9));
  CHECK(converged);
  // A periodic matrix M = [[0, 1], [0.5, 0]] (eigenvalues +-sqrt(0.5)): plain power iteration
  // would oscillate; the M + I iteration converges to sqrt(0.5).
  Grammar p = read_grammar_string("@start A\nA -> B 1\nB -> A 0.5\nB -> \"b\" 0.5\n", "p.pcfg");
  CHECK(mean_production_radius(p, &converged) == doctest::Approx(std::sqrt(0.5)).epsilon(1e-9));
  CHECK(converged);
}

TEST_CASE("normalized divides by each left-hand side's total and drops unusable weights") {
  std::vector<std::size_t> dropped;
  Grammar g = normalized(
      read_grammar_string("@start S\nS -> \"a\" 2\nS -> \"b\" 6\nS -> \"c\" 0\n", "n.pcfg"),
      &dropped);
  REQUIRE(g.rules.size() == 2);
  CHECK(g.rules[0].weight == 0.25);
  CHECK(g.rules[1].weight == 0.75);
  CHECK(dropped == std::vector<std::size_t>{4});
  CHECK(lint_grammar(g).findings.empty());
}

}  // namespace
}  // namespace treegate::pcfg
