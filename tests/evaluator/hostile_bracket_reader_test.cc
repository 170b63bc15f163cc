// Hostile input for the bracketed-tree reader at the library level: words and errors that
// straddle the reader's growing read chunks (4 KB, 8 KB, ... 1 MB), deep nesting, NUL bytes.
#include <doctest/doctest.h>

#include <sstream>
#include <string>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"

namespace treegate {
namespace {

TEST_CASE("reader: a word straddling every read-chunk boundary stays whole") {
  // Words of 4,000 bytes: boundaries at 4 KB, 12 KB, 28 KB ... fall inside words.
  const std::string word(4000, 'w');
  std::string text;
  const int trees = 40;
  for (int i = 0; i < trees; ++i) text += "(S (NN " + word + std::to_string(i) + ") (VB x))\n";
  std::istringstream in(text);
  LabelTable labels;
  BracketReader reader(in, "long.trees", labels);
  Tree tree(labels);
  int n = 0;
  while (reader.next(tree)) {
    REQUIRE(tree.num_words() == 2);
    CHECK(tree.word(0) == word + std::to_string(n));
    CHECK(reader.tree_line() == static_cast<std::size_t>(n + 1));
    ++n;
  }
  CHECK(n == trees);
}

TEST_CASE("reader: an error far past the first chunk has the right line and column") {
  std::string text;
  for (int i = 0; i < 5000; ++i) text += "(S (NN a) (VB b))\n";  // 90,000 bytes
  text += "(S (NN a) (VB b)\n";
  std::istringstream in(text);
  LabelTable labels;
  BracketReader reader(in, "many.trees", labels);
  Tree tree(labels);
  for (int i = 0; i < 5000; ++i) REQUIRE(reader.next(tree));
  try {
    reader.next(tree);
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()) ==
          "many.trees:5002:1: tree 5001: expected ')' to close '(S' opened at 5001:1 but found "
          "end of file");
  }
}

TEST_CASE("reader: a million levels of nesting is an error, not a stack overflow") {
  const std::size_t n = 1000000;
  std::string text;
  for (std::size_t i = 0; i < n; ++i) text += "(X ";
  text += "(NN a)" + std::string(n, ')');
  LabelTable labels;
  CHECK_THROWS_WITH_AS(parse_tree(text, "deep", labels),
                       "deep:1:300001: tree 1: nested deeper than 100000 levels", InputError);
}

TEST_CASE("reader: NUL bytes are errors with their position") {
  LabelTable labels;
  CHECK_THROWS_WITH_AS(parse_tree(std::string("(S (NN a\0b))", 12), "nul", labels),
                       "nul:1:9: tree 1: found a NUL byte; expected a word, '(' or ')'",
                       InputError);
}

}  // namespace
}  // namespace treegate
