// score_tree: a derivable tree's log probability equals the parser's; missing rules are listed
// with the nodes that need them.
#include <doctest/doctest.h>

#include <cmath>

#include "evaluator/bracket_io.h"
#include "harness/pcfg/score_tree.h"

namespace treegate::pcfg {
namespace {

// Manning & Schuetze (1999), Foundations of Statistical NLP, ch. 11; grammar recalled from the
// book, values re-derived by exact arithmetic (see parser_test.cc).
const char* kAstronomers =
    "@start S\nS -> NP VP 1.0\nPP -> P NP 1.0\nVP -> V NP 0.7\nVP -> VP PP 0.3\nP -> \"with\" 1.0\n"
    "V -> \"saw\" 1.0\nNP -> NP PP 0.4\nNP -> \"astronomers\" 0.1\nNP -> \"ears\" 0.18\n"
    "NP -> \"saw\" 0.04\nNP -> \"stars\" 0.18\nNP -> \"telescopes\" 0.1\n";

TEST_CASE("score_tree: both astronomer trees") {
  CompiledGrammar g(read_grammar_string(kAstronomers, "t.pcfg"));
  TreeScore vp = score_tree(
      g, parse_tree("(S (NP astronomers) (VP (VP (V saw) (NP stars)) (PP (P with) (NP ears))))"));
  CHECK(vp.derivable);
  CHECK(std::exp(vp.logprob) == doctest::Approx(0.0006804).epsilon(1e-12));
  CHECK(vp.used.size() == 9);  // nine distinct rules
  CHECK(vp.used[2].rule == "VP -> VP PP");
  CHECK(vp.used[2].at.size() == 1);
  CHECK(vp.used[2].at[0].from == 1);
  CHECK(vp.used[2].at[0].to == 5);
  TreeScore np = score_tree(
      g, parse_tree("(S (NP astronomers) (VP (V saw) (NP (NP stars) (PP (P with) (NP ears)))))"));
  CHECK(std::exp(np.logprob) == doctest::Approx(0.0009072).epsilon(1e-12));
}

TEST_CASE("score_tree: missing rules with their nodes; wrong root") {
  CompiledGrammar g(read_grammar_string(kAstronomers, "t.pcfg"));
  TreeScore t = score_tree(
      g, parse_tree("(S (NP (DT the) (NP stars)) (VP (V saw) (NP (DT the) (NP ears))))"));
  CHECK_FALSE(t.derivable);
  REQUIRE(t.missing.size() == 2);
  CHECK(t.missing[0].rule == "NP -> DT NP");
  CHECK(t.missing[0].at.size() == 2);
  CHECK(t.missing[0].at[1].from == 3);
  CHECK(t.missing[0].at[1].to == 5);
  CHECK(t.missing[1].rule == "DT -> \"the\"");
  TreeScore r = score_tree(g, parse_tree("(ROOT (S (NP stars) (VP (V saw) (NP ears))))"));
  CHECK_FALSE(r.derivable);
  CHECK(r.problem == "the root is 'ROOT' but the grammar's start symbol is 'S'");
}

TEST_CASE("score_tree uses unknown-word classes for words outside the lexicon") {
  CompiledGrammar g(
      read_grammar_string("@start S\n@unknown signatures\nS -> N V 1\nN -> \"dogs\" 0.5\nN -> "
                          "<unk:lower-s> 0.5\nV -> \"bark\" 1\n",
                          "u.pcfg"));
  TreeScore t = score_tree(g, parse_tree("(S (N cats) (V bark))"));
  CHECK(t.derivable);
  CHECK(std::exp(t.logprob) == doctest::Approx(0.5));
  CHECK(t.used[1].rule == "N -> <unk:lower-s>");
}

}  // namespace
}  // namespace treegate::pcfg
