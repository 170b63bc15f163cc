// Parser: the worked example of Manning & Schuetze and hand-checked small grammars for
// counting, unary cycles, k-best, gold tags, unknown words and the memory guard.
#include <doctest/doctest.h>

#include <cmath>
#include <sstream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "harness/pcfg/parser.h"
#include "tests/pcfg/textbook_grammar.h"

namespace treegate::pcfg {
namespace {

std::vector<std::string> split(const std::string& text) {
  std::istringstream in(text);
  std::vector<std::string> out;
  for (std::string w; in >> w;) out.push_back(w);
  return out;
}

std::shared_ptr<const CompiledGrammar> compile(const std::string& text) {
  return std::make_shared<const CompiledGrammar>(read_grammar_string(text, "t.pcfg"));
}

ParseResult parse(const std::shared_ptr<const CompiledGrammar>& g, const std::string& sentence,
                  ParseOptions options = {}) {
  Parser parser(g);
  return parser.parse(split(sentence), nullptr, options);
}

// Manning, C. D. & Schuetze, H. (1999). Foundations of Statistical Natural Language
// Processing, ch. 11 (Probabilistic Context Free Grammars), the "astronomers saw stars with
// ears" example. The grammar is recalled from the book (not copied from a file); the expected
// values are re-derived by exact arithmetic: t1 (PP on the noun phrase)
// = 1 * 0.1 * 0.7 * 1 * 0.4 * 0.18 * 1 * 1 * 0.18 = 0.0009072; t2 (PP on the verb phrase)
// = 1 * 0.1 * 0.3 * 0.7 * 1 * 0.18 * 1 * 1 * 0.18 = 0.0006804; their sum 0.0015876.
using testdata::kAstronomers;

TEST_CASE("Manning & Schuetze 1999 ch. 11: astronomers saw stars with ears") {
  auto g = compile(kAstronomers);
  ParseOptions options;
  options.kbest = 5;
  ParseResult r = parse(g, "astronomers saw stars with ears", options);
  REQUIRE(r.status == ParseStatus::parsed);
  CHECK(to_bracketed(r.tree) ==
        "(S (NP astronomers) (VP (V saw) (NP (NP stars) (PP (P with) (NP ears)))))");
  CHECK(std::exp(r.logprob) == doctest::Approx(0.0009072).epsilon(1e-12));
  CHECK(std::exp(r.inside_logprob) == doctest::Approx(0.0015876).epsilon(1e-12));
  CHECK(r.parses == 2);
  CHECK(r.parses_exact);
  CHECK_FALSE(r.parses_infinite);
  REQUIRE(r.kbest.size() == 2);
  CHECK(to_bracketed(r.kbest[0].tree) == to_bracketed(r.tree));
  CHECK(to_bracketed(r.kbest[1].tree) ==
        "(S (NP astronomers) (VP (VP (V saw) (NP stars)) (PP (P with) (NP ears))))");
  CHECK(std::exp(r.kbest[1].logprob) == doctest::Approx(0.0006804).epsilon(1e-12));
}

TEST_CASE("long rules are binarized internally and never show in trees; terminals inside rules") {
  auto g = compile(
      "@start S\nS -> A B C D 0.5\nS -> A \"x\" C D 0.5\nA -> \"a\" 1\nB -> \"b\" 1\n"
      "C -> \"c\" 1\nD -> \"d\" 1\n");
  ParseResult r = parse(g, "a b c d");
  REQUIRE(r.status == ParseStatus::parsed);
  CHECK(to_bracketed(r.tree) == "(S (A a) (B b) (C c) (D d))");
  CHECK(std::exp(r.logprob) == doctest::Approx(0.5));
  r = parse(g, "a x c d");
  REQUIRE(r.status == ParseStatus::parsed);
  CHECK(to_bracketed(r.tree) == "(S (A a) x (C c) (D d))");
}

TEST_CASE("parse counts: Catalan numbers for X -> X X | a") {
  // The number of binary trees over n leaves is the Catalan number C(n-1)
  // (Stanley, Enumerative Combinatorics vol. 2, 1999, exercise 6.19): 1, 1, 2, 5, 14, 42, ...
  auto g = compile("@start X\nX -> X X 0.5\nX -> \"a\" 0.5\n");
  const std::vector<std::uint64_t> catalan = {1, 1, 2, 5, 14, 42, 132, 429, 1430, 4862};
  for (std::size_t n = 1; n <= catalan.size(); ++n) {
    std::string sentence;
    for (std::size_t i = 0; i < n; ++i) sentence += "a ";
    ParseResult r = parse(g, sentence);
    CAPTURE(n);
    CHECK(r.parses == catalan[n - 1]);
    // Every tree has n-1 binary and n lexical rules: inside = C(n-1) * 0.5^(2n-1).
    CHECK(r.inside_logprob ==
          doctest::Approx(std::log(double(catalan[n - 1])) + (2.0 * n - 1) * std::log(0.5)));
  }
  // C(36) = 11959798385860453492 fits in 64 bits; C(37) = 44341261915555719160 does not.
  std::string words;
  for (int i = 0; i < 37; ++i) words += "a ";
  ParseResult r = parse(g, words);
  CHECK(r.parses == 11959798385860453492ull);
  CHECK(r.parses_exact);
  ParseResult big = parse(g, words + "a");
  CHECK_FALSE(big.parses_exact);
  CHECK_FALSE(big.parses_infinite);
  CHECK(big.parses == UINT64_MAX);
}

TEST_CASE(
    "unary cycles: inside sums the geometric series, count is infinite, Viterbi skips the cycle") {
  // S -> A 1; A -> B 0.5 | "a" 0.5; B -> A 0.4 | "b" 0.6. For "a": the chains S A (B A)^m a, so
  // inside = 0.5 * sum_m (0.5*0.4)^m = 0.5 / 0.8 = 0.625.
  auto g = compile("@start S\nS -> A 1\nA -> B 0.5\nA -> \"a\" 0.5\nB -> A 0.4\nB -> \"b\" 0.6\n");
  ParseResult r = parse(g, "a");
  REQUIRE(r.status == ParseStatus::parsed);
  CHECK(to_bracketed(r.tree) == "(S (A a))");
  CHECK(std::exp(r.logprob) == doctest::Approx(0.5));
  CHECK(std::exp(r.inside_logprob) == doctest::Approx(0.625).epsilon(1e-12));
  CHECK(r.parses_infinite);
  CHECK_FALSE(r.parses_exact);
  // A cycle that cannot be used in any tree of the sentence does not make the count infinite.
  auto g2 = compile(
      "@start S\nS -> X Y 1\nX -> \"x\" 1\nY -> \"y\" 1\nZ -> W 0.5\nW -> Z 1\nZ -> \"z\" 0.5\n");
  ParseResult r2 = parse(g2, "x y");
  CHECK(r2.parses == 1);
  CHECK(r2.parses_exact);
}

TEST_CASE("no parse: unknown words and missing derivations are named") {
  auto g = compile(kAstronomers);
  ParseResult r = parse(g, "astronomers saw comets");
  CHECK(r.status == ParseStatus::no_parse);
  CHECK(r.reason ==
        "unknown word 'comets' (word 3): no rule rewrites it and the grammar has no unknown-word "
        "classes");
  r = parse(g, "astronomers stars saw");
  CHECK(r.status == ParseStatus::no_parse);
  CHECK(r.reason ==
        "no tree of words 1-3 from 'S'; widest pieces found: words 1-1 (NP), words 2-2 (NP), words "
        "3-3 (V)");
}

TEST_CASE("unknown-word classes by signature") {
  auto g = compile(
      "@start S\n@unknown signatures\nS -> N V 1\nN -> \"dogs\" 0.5\nN -> <unk:lower-s> 0.5\n"
      "V -> \"bark\" 0.9\nV -> <unk:lower-ing> 0.1\n");
  ParseResult r = parse(g, "cats barking");
  REQUIRE(r.status == ParseStatus::parsed);
  CHECK(to_bracketed(r.tree) == "(S (N cats) (V barking))");
  CHECK(std::exp(r.logprob) == doctest::Approx(0.05));
  r = parse(g, "Cats bark");
  CHECK(r.reason == "unknown word 'Cats' (word 1): no rule rewrites it nor its class <unk:cap-s>");
}

TEST_CASE("gold tags fix the preterminals") {
  auto g = compile(kAstronomers);
  Parser parser(g);
  ParseOptions options;
  options.gold_tags = true;
  std::vector<std::string> tags = {"NP", "V", "NP", "P", "NP"};
  ParseResult r = parser.parse(split("astronomers saw stars with ears"), &tags, options);
  REQUIRE(r.status == ParseStatus::parsed);
  CHECK(r.parses == 2);
  CHECK(std::exp(r.logprob) == doctest::Approx(0.0009072));
  tags[1] = "NP";  // "saw" as a noun: no tree
  r = parser.parse(split("astronomers saw stars with ears"), &tags, options);
  CHECK(r.status == ParseStatus::no_parse);
  tags[1] = "VBD";
  r = parser.parse(split("astronomers saw stars with ears"), &tags, options);
  CHECK(r.reason == "tag 'VBD' of 'saw' (word 2) is not a symbol of the grammar");
  tags.pop_back();
  r = parser.parse(split("astronomers saw stars with ears"), &tags, options);
  CHECK(r.status == ParseStatus::error);
  CHECK(r.reason == "4 tags for 5 words: expected one tag per word");
}

TEST_CASE("the memory guard refuses a sentence whose chart is over the cap") {
  auto g = compile(kAstronomers);
  ParseOptions options;
  options.max_chart_bytes = 1 << 20;
  std::vector<std::string> words(2000, "stars");
  Parser parser(g);
  ParseResult r = parser.parse(words, nullptr, options);
  CHECK(r.status == ParseStatus::error);
  CHECK(r.reason.find("sentence of 2000 words needs ~") == 0);
  CHECK(r.reason.find("of chart, over the cap of 1 MiB; raise --max-chart-mb") !=
        std::string::npos);
}

TEST_CASE("the time limit stops a parse that fits in memory but would run for long") {
  // X -> X X | a on 3000 words: every span has every split, about 4.5e9 rule applications,
  // far more than 0.2 s of work on any machine this runs on. The chart fits under the cap.
  auto g = compile("@start X\nX -> X X 0.5\nX -> \"a\" 0.5\n");
  ParseOptions options;
  options.max_seconds = 0.2;
  const std::vector<std::string> words(3000, "a");
  Parser parser(g);
  const ParseResult r = parser.parse(words, nullptr, options);
  CHECK(r.status == ParseStatus::error);
  CHECK(r.reason.find("sentence of 3000 words not parsed within the time limit of 0.2 s "
                      "(stopped at spans of ") == 0);
  CHECK(r.reason.find("; raise --timeout-seconds (parser setting timeout_seconds)") !=
        std::string::npos);
  // The same parser is usable afterwards, and a short sentence parses within the limit.
  const ParseResult ok = parser.parse({"a", "a", "a"}, nullptr, options);
  CHECK(ok.status == ParseStatus::parsed);
  CHECK(ok.parses == 2);
}

TEST_CASE("a stop flag makes a running parse give up at once") {
  auto g = compile("@start X\nX -> X X 0.5\nX -> \"a\" 0.5\n");
  const std::atomic<bool> stop{true};
  ParseOptions options;
  options.stop = &stop;
  Parser parser(g);
  const ParseResult r = parser.parse(std::vector<std::string>(3000, "a"), nullptr, options);
  CHECK(r.status == ParseStatus::error);
  CHECK(r.reason == "stopped before the parse was done");
}

TEST_CASE("rules with unusable weights are left out, counted, and named in the reason") {
  auto g = compile("@start S\nS -> \"a\" nan\nS -> \"b\" 0.5\nS -> \"c\" -0\nS -> \"d\" 0.5\n");
  CHECK(g->skipped_rules() == 2);
  CHECK(g->first_skipped_line() == 2);
  CHECK(g->skipped_line_of_word("c") == 4);
  CHECK(g->skipped_line_of_word("b") == 0);
  Parser parser(g);
  const ParseResult r = parser.parse({"c"}, nullptr, ParseOptions{});
  CHECK(r.status == ParseStatus::no_parse);
  CHECK(r.reason ==
        "unknown word 'c' (word 1): no rule with a usable weight rewrites it (the weight at line "
        "4 is not a positive finite number; see treegate lint) and the grammar has no "
        "unknown-word classes");
  CHECK(parser.parse({"b"}, nullptr, ParseOptions{}).status == ParseStatus::parsed);
}

TEST_CASE("compile errors") {
  CHECK_THROWS_WITH_AS(compile("S -> \"a\" 1\n"),
                       "t.pcfg: no @start line: expected '@start SYMBOL' before the rules",
                       InputError);
  CHECK_THROWS_WITH_AS(
      compile("@start T\nS -> \"a\" 1\n"),
      "t.pcfg:1: start symbol 'T' has no rule with a positive weight: expected a rule 'T -> ...'",
      InputError);
}

}  // namespace
}  // namespace treegate::pcfg
