// Grammar file reader and writer: accepted forms, round trip, and every error message as an
// exact string.
#include <doctest/doctest.h>

#include <cmath>

#include "evaluator/errors.h"
#include "harness/pcfg/grammar.h"
#include "harness/pcfg/signature.h"

namespace treegate::pcfg {
namespace {

std::string error_of(const std::string& text) {
  try {
    read_grammar_string(text, "g.pcfg");
  } catch (const InputError& e) {
    return e.what();
  }
  return "(no error)";
}

TEST_CASE("reads header, rules, terminals with escapes, unknown classes and counts") {
  const Grammar g = read_grammar_string(
      "\xEF\xBB\xBF# a comment\n"
      "@start S   # trailing comment\n"
      "@transform parent=2 functions=strip\n"
      "@unknown signatures\r\n"
      "\n"
      "S -> NP VP 1.0\n"
      "NP -> \"say \\\"hi\\\" \\\\ #x\" 0.25 count=3\n"
      "NP -> <unk:lower-ing> 7.5e-1\n"
      "VP -> \"b\xC3\xA4ren\" 1\n",
      "g.pcfg");
  CHECK(g.header.start == "S");
  CHECK(g.header.start_line == 2);
  CHECK(g.header.weights == WeightKind::probabilities);
  REQUIRE(g.header.transforms.size() == 2);
  CHECK(g.header.transforms[0] == std::pair<std::string, std::string>{"parent", "2"});
  CHECK(g.header.transforms[1] == std::pair<std::string, std::string>{"functions", "strip"});
  CHECK(g.header.unknown_signatures);
  REQUIRE(g.rules.size() == 4);
  CHECK(g.rules[0].lhs == "S");
  CHECK(g.rules[0].rhs ==
        std::vector<RhsItem>{{ItemKind::nonterminal, "NP"}, {ItemKind::nonterminal, "VP"}});
  CHECK(g.rules[0].line == 6);
  CHECK(g.rules[1].rhs == std::vector<RhsItem>{{ItemKind::terminal, "say \"hi\" \\ #x"}});
  CHECK(g.rules[1].weight == 0.25);
  CHECK(g.rules[1].count == 3u);
  CHECK(g.rules[2].rhs == std::vector<RhsItem>{{ItemKind::unknown_class, "lower-ing"}});
  CHECK(g.rules[2].weight == 0.75);
  CHECK(g.rules[3].rhs[0].text == "b\xC3\xA4ren");
  CHECK_FALSE(g.rules[0].count.has_value());
}

TEST_CASE("@weights counts are normalised per left-hand side, written weights kept") {
  const Grammar g = read_grammar_string(
      "@start S\n@weights counts\nS -> A 3\nS -> B 1\nA -> \"a\" 5\nB -> \"b\" 2\n", "c.pcfg");
  CHECK(g.rules[0].weight == 0.75);
  CHECK(g.rules[1].weight == 0.25);
  CHECK(g.rules[2].weight == 1.0);
  CHECK(g.rules[0].written_weight == 3.0);
}

TEST_CASE("write_grammar round-trips") {
  const std::string text =
      "@start S\n@weights counts\n@transform parent=2\n@unknown signatures\n"
      "S -> NP VP 3 count=3\nNP -> \"a \\\"q\\\" \\\\\" 0.1\nNP -> <unk:cap-s> "
      "0.30000000000000004\n"
      "VP -> V NP PP X 1e-300\n";
  const Grammar g = read_grammar_string(text, "r.pcfg");
  const std::string written = write_grammar(g);
  CHECK(written == text);
  const Grammar again = read_grammar_string(written, "r2.pcfg");
  REQUIRE(again.rules.size() == g.rules.size());
  for (std::size_t i = 0; i < g.rules.size(); ++i) {
    CHECK(again.rules[i].rhs == g.rules[i].rhs);
    CHECK(again.rules[i].weight == g.rules[i].weight);
    CHECK(again.rules[i].count == g.rules[i].count);
  }
}

TEST_CASE("NaN, zero and negative weights are read (lint reports them)") {
  const Grammar g = read_grammar_string("S -> A nan\nS -> B -0.5\nS -> C 0\n", "w.pcfg");
  CHECK(std::isnan(g.rules[0].weight));
  CHECK(g.rules[1].weight == -0.5);
  CHECK(g.header.start.empty());
}

TEST_CASE("every syntax error names file:line:col and what was expected") {
  const std::vector<std::pair<std::string, std::string>> cases = {
      {"S -> 0.5\n",
       "g.pcfg:1:6: empty right-hand side: expected at least one symbol before the weight (epsilon "
       "rules are not allowed)"},
      {"S ->\n",
       "g.pcfg:1:3: empty right-hand side: expected at least one symbol and a weight after '->' "
       "(epsilon rules are not allowed)"},
      {"S -> NP VP\n",
       "g.pcfg:1:9: expected a weight (a decimal number) at the end of the rule, found 'VP'"},
      {"S -> \"x\"\n",
       "g.pcfg:1:6: expected a weight (a decimal number) at the end of the rule, found a quoted "
       "terminal"},
      {"S NP 1\n", "g.pcfg:1:3: expected '->' after the left-hand side 'S'"},
      {"S\n", "g.pcfg:1:2: expected '->' after the left-hand side 'S'"},
      {"\"s\" -> NP 1\n", "g.pcfg:1:1: expected a nonterminal before '->', not a quoted terminal"},
      {"S -> \"abc 1\n",
       "g.pcfg:1:6: unterminated terminal: expected a closing '\"' on the same line"},
      {"S -> \"a\\nb\" 1\n", "g.pcfg:1:8: expected \\\" or \\\\ after a backslash in a terminal"},
      {"S -> \"\" 1\n",
       "g.pcfg:1:6: empty terminal \"\": expected at least one character between the quotes"},
      {"S -> \"a\"b 1\n", "g.pcfg:1:9: expected whitespace after the closing '\"' of a terminal"},
      {"S -> a\"b\" 1\n",
       "g.pcfg:1:7: expected whitespace before '\"' (a terminal is a separate item)"},
      {"S -> <unk:> 1\n",
       "g.pcfg:1:6: expected an unknown-word class <unk:SIGNATURE>, not '<unk:>'"},
      {"S -> <foo> 1\n", "g.pcfg:1:6: expected an unknown-word class <unk:SIGNATURE>, not '<foo>'"},
      {"S -> A -> 1\n",
       "g.pcfg:1:8: expected a nonterminal name, not '->' (names may not be '->' or start with '<' "
       "or '@')"},
      {"S -> A 1 count=x\n", "g.pcfg:1:16: expected a whole number after count=, not 'x'"},
      {"S -> A 1 count=-2\n", "g.pcfg:1:16: expected a whole number after count=, not '-2'"},
      {"S -> A 1x\n",
       "g.pcfg:1:8: expected a weight (a decimal number) at the end of the rule, found '1x'"},
      {"S -> A 1\n@start S\n",
       "g.pcfg:2:1: header line @start after the first rule: expected every @ line before the "
       "rules"},
      {"@start\n", "g.pcfg:1:7: expected a start symbol after @start"},
      {"@start S T\n", "g.pcfg:1:10: expected the end of the line after @start S"},
      {"@start S\n@start T\n",
       "g.pcfg:2:1: second @start line: the start symbol was set on line 1"},
      {"@start \"S\"\n", "g.pcfg:1:8: expected a start symbol, not a quoted terminal"},
      {"@weights logs\n",
       "g.pcfg:1:10: expected 'probabilities' or 'counts' after @weights, not 'logs'"},
      {"@transform parent\n", "g.pcfg:1:12: expected KEY=VALUE after @transform, not 'parent'"},
      {"@transform\n", "g.pcfg:1:11: expected KEY=VALUE after @transform"},
      {"@unknown words\n", "g.pcfg:1:10: expected 'signatures' after @unknown, not 'words'"},
      {"@begin S\n",
       "g.pcfg:1:1: unknown header line '@begin': expected @start, @weights, @transform or "
       "@unknown"},
      {std::string("S -> A\0 1\n", 10), "g.pcfg:1:7: unexpected NUL byte: expected a text file"},
      {"\n\n  X -> Y 1\n   -> Y 1\n",
       "g.pcfg:4:4: expected a nonterminal name, not '->' (names may not be '->' or start with '<' "
       "or '@')"},
  };
  for (const auto& row : cases) {
    const auto& text = row.first;  // CAPTURE uses a lambda: clang 14 cannot capture a binding
    CAPTURE(text);
    CHECK(error_of(text) == row.second);
  }
}

TEST_CASE("a missing file is an InputError naming it") {
  CHECK_THROWS_WITH_AS(read_grammar_file("/nonexistent/x.pcfg"),
                       "/nonexistent/x.pcfg: cannot open grammar file for reading", InputError);
}

TEST_CASE("word_signature") {
  const std::vector<std::pair<std::string, std::string>> cases = {
      {"Dogs", "cap-s"},
      {"running", "lower-ing"},
      {"1990", "num"},
      {"Anglo-Saxon", "cap-hyph"},
      {"NASA", "caps"},
      {"quickly", "lower-ly"},
      {"B-52s", "cap-num-hyph-s"},
      {"iPhone", "other"},
      {"...", "other"},
      {"is", "lower"},
      {"bus", "lower"},
      {"buses", "lower-s"},
      {"readable", "lower-able"},
      {"nation", "lower-ion"},
      {"3-4", "num-hyph"},
      {"ENDED", "caps-ed"},
      {"", "other"},
  };
  for (const auto& row : cases) {
    const auto& word = row.first;  // CAPTURE uses a lambda: clang 14 cannot capture a binding
    CAPTURE(word);
    CHECK(word_signature(word) == row.second);
  }
}

}  // namespace
}  // namespace treegate::pcfg
