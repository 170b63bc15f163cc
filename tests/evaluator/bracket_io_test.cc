// Tests of the bracketed-tree reader and writer: canonical one-line dumps, round trips,
// every syntax error as an exact message, recovery after an error, and deep nesting.
#include <doctest/doctest.h>

#include <sstream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"

using namespace treegate;

namespace {

std::string error_of(std::string_view text) {
  try {
    parse_tree(text);
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

std::vector<std::string> read_all(const std::string& text) {
  std::istringstream in(text);
  BracketReader reader(in, "f.trees");
  std::vector<std::string> out;
  Tree t;
  for (;;) {
    try {
      if (!reader.next(t)) break;
      out.push_back(to_bracketed(t));
    } catch (const InputError& e) {
      out.push_back(std::string("ERROR ") + e.what());
    }
  }
  return out;
}

}  // namespace

TEST_CASE("one-line form is canonical and round-trips") {
  const struct {
    const char* in;
    const char* out;
  } table[] = {
      {"(S (NP (DT the) (NN dog)) (VP (VBZ barks)))",
       "(S (NP (DT the) (NN dog)) (VP (VBZ barks)))"},
      {"(S\n  (NP (DT the)\n      (NN dog))\n  (VP (VBZ barks)))",
       "(S (NP (DT the) (NN dog)) (VP (VBZ barks)))"},
      {"( (S (NP (PRP it)) (VP (VBZ is))) )", "( (S (NP (PRP it)) (VP (VBZ is))))"},
      {"((X (Y z)))", "( (X (Y z)))"},
      {"()", "()"},
      {"(NN caf\xc3\xa9)", "(NN caf\xc3\xa9)"},
      {"(SYM \xff\xfe*{}[]'\")", "(SYM \xff\xfe*{}[]'\")"},
      {"(-LRB- -LRB-)", "(-LRB- -LRB-)"},
      {"(S\r\n (NN x)\r\n)", "(S (NN x))"},
  };
  for (const auto& row : table) {
    CAPTURE(row.in);
    const Tree t = parse_tree(row.in);
    CHECK(to_bracketed(t) == row.out);
    CHECK(to_bracketed(parse_tree(to_bracketed(t))) == row.out);
  }
}

TEST_CASE("tree model: words, tags, preterminals, subtrees") {
  const Tree t = parse_tree("(ROOT (S (NP (DT the) (NN dog)) (VP (VBZ barks)) (. .)))");
  REQUIRE(t.num_words() == 4);
  CHECK(t.word(0) == "the");
  CHECK(t.word(3) == ".");
  const auto tags = t.tags();
  CHECK(std::vector<std::string>(tags.begin(), tags.end()) ==
        std::vector<std::string>{"DT", "NN", "VBZ", "."});
  CHECK(t.label(t.root()) == "ROOT");
  const NodeId s = t.node(t.root()).first_child;
  CHECK(t.num_children(s) == 3);
  const NodeId np = t.node(s).first_child;
  CHECK(!t.is_preterminal(np));
  CHECK(t.is_preterminal(t.node(np).first_child));
  CHECK(to_bracketed(t.subtree(np)) == "(NP (DT the) (NN dog))");
  std::size_t visited = 0;
  for_each_preorder(t, [&](NodeId) { ++visited; });
  CHECK(visited == t.size());
}

TEST_CASE("indented form puts each constituent on its own line") {
  const Tree t =
      parse_tree("(S (NP (DT the) (NN dog)) (VP (VBZ barks) (PP (IN at) (NP (PRP us)))))");
  CHECK(to_indented(t) ==
        "(S\n"
        "  (NP (DT the) (NN dog))\n"
        "  (VP (VBZ barks)\n"
        "    (PP (IN at)\n"
        "      (NP (PRP us)))))\n");
  CHECK(to_bracketed(parse_tree(to_indented(t))) == to_bracketed(t));
}

TEST_CASE("syntax errors name file:line:col, the tree and what was expected") {
  CHECK(error_of("(S (NP (DT the) (NN dog))") ==
        "<string>:1:26: tree 1: expected ')' to close '(S' opened at 1:1 but found end of file");
  CHECK(error_of("dog (S (X y))") ==
        "<string>:1:1: tree 1: expected '(' to start a tree but found 'dog'");
  CHECK(error_of("(S (NP the (NN dog)))") ==
        "<string>:1:12: tree 1: expected ')' after the word of '(NP' opened at 1:4 (a tag holds "
        "exactly one word) but found '('");
  CHECK(error_of("(S (NP (NN dog) cat))") ==
        "<string>:1:17: tree 1: expected '(' or ')' inside '(NP' opened at 1:4 but found word "
        "'cat' (a word must be the only child of its tag)");
  CHECK(error_of("(S (NP))") ==
        "<string>:1:7: tree 1: expected a word or '(' inside '(NP' opened at 1:4 but found ')'");
  CHECK(error_of("( (NN x) y)") ==
        "<string>:1:10: tree 1: expected '(' or ')' inside '(' opened at 1:1 but found word 'y' "
        "(a word must be the only child of its tag)");
  CHECK(error_of("(S ( y))") ==
        "<string>:1:7: tree 1: expected a word or '(' inside '(y' opened at 1:4 but found ')'");
  CHECK(error_of(std::string_view("(S (NN a\0b))", 12)) ==
        "<string>:1:9: tree 1: found a NUL byte; expected a word, '(' or ')'");
  CHECK(error_of(")") == "<string>:1:1: tree 1: expected '(' to start a tree but found ')'");
  CHECK(error_of("(S (NN dog)) x") ==
        "<string>:1: expected one bracketed tree but found more text after it");
  CHECK(error_of("   \n") == "<string>:1:1: expected a bracketed tree but found nothing");
}

TEST_CASE("many trees per file; an error names its tree and reading resumes at the next tree") {
  const auto got = read_all(
      "(S (NN a))\n"
      "(S (NN b) c\n"
      "   (NN c))\n"
      "(S (NN d))\n"
      "(S (NN e)\n");
  REQUIRE(got.size() == 4);
  CHECK(got[0] == "(S (NN a))");
  CHECK(got[1] ==
        "ERROR f.trees:2:11: tree 2: expected '(' or ')' inside '(S' opened at 2:1 but "
        "found word 'c' (a word must be the only child of its tag)");
  CHECK(got[2] == "(S (NN d))");
  CHECK(got[3] ==
        "ERROR f.trees:6:1: tree 4: expected ')' to close '(S' opened at 5:1 but found "
        "end of file");
}

TEST_CASE("deep nesting is a result or a clear error, never a stack overflow") {
  SUBCASE("50,000 levels read, written and copied without recursion") {
    std::string text;
    for (int i = 0; i < 50000; ++i) text += "(X ";
    text += "(NN w)";
    text.append(50000, ')');
    const Tree t = parse_tree(text);
    CHECK(t.num_words() == 1);
    CHECK(to_bracketed(t) == text.substr(0, 3 * 50000) + "(NN w)" + std::string(50000, ')'));
    CHECK(t.subtree(t.root()).size() == t.size());
  }
  SUBCASE("1,000,000 levels are refused with the limit in the message") {
    std::string text;
    for (int i = 0; i < 1000000; ++i) text += "(X ";
    CHECK(error_of(text) == "<string>:1:300001: tree 1: nested deeper than 100000 levels");
  }
}

TEST_CASE("long input is read in chunks: a word across a chunk boundary stays whole") {
  std::string text;
  std::string expected_last;
  for (int i = 0; i < 40000; ++i) {
    const std::string w =
        "word" + std::to_string(i) + std::string(static_cast<std::size_t>(i % 13), 'x');
    text += "(S (NN " + w + "))\n";
    expected_last = "(S (NN " + w + "))";
  }
  const auto got = read_all(text);
  REQUIRE(got.size() == 40000);
  CHECK(got.back() == expected_last);
  for (const auto& g : got) REQUIRE(g.rfind("(S (NN word", 0) == 0);
}
