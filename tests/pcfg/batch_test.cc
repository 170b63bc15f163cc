// Reading input lines for `parse` and parsing them on several threads in input order.
#include <doctest/doctest.h>

#include "harness/pcfg/batch.h"

namespace treegate::pcfg {
namespace {

TEST_CASE("read_sentence: plain and WORD_TAG tokens, bad tokens named with their column") {
  Sentence s = read_sentence("  the dog\tbarks \r", 3, false);
  CHECK(s.line == 3);
  CHECK(s.words == std::vector<std::string>{"the", "dog", "barks"});
  CHECK(s.error.empty());
  s = read_sentence("the_DT top_hat_NN", 1, true);
  CHECK(s.words == std::vector<std::string>{"the", "top_hat"});
  CHECK(s.tags == std::vector<std::string>{"DT", "NN"});
  CHECK(read_sentence("the_DT dog", 1, true).error == "column 8: expected WORD_TAG, not 'dog'");
  CHECK(read_sentence("the_DT dog_", 1, true).error == "column 8: expected WORD_TAG, not 'dog_'");
  CHECK(read_sentence("a (b)", 1, false).error ==
        "column 3: a word may not contain '(' or ')' (bracketed trees could not show it; treebanks "
        "write -LRB- and -RRB-)");
}

TEST_CASE("parse_in_order: three threads deliver every result in input order") {
  auto g = std::make_shared<const CompiledGrammar>(
      read_grammar_string("@start S\nS -> S S 0.4\nS -> \"a\" 0.5\nS -> \"b\" 0.1\n", "b.pcfg"));
  std::vector<Sentence> sentences;
  for (std::size_t i = 0; i < 200; ++i) {
    sentences.push_back(Sentence{i + 1, {}, {}, ""});
    Sentence& s = sentences.back();
    s.words.assign(i % 9 + 1, "a");
    if (i % 50 == 7) s.words.push_back("c");  // unknown word: no parse
  }
  std::vector<std::size_t> order;
  std::size_t no_parse = 0;
  parse_in_order(g, sentences, ParseOptions{}, 3, [&](std::size_t i, ParseResult& r) {
    order.push_back(i);
    if (r.status == ParseStatus::no_parse) {
      ++no_parse;
      return;
    }
    // The number of trees over n words is the Catalan number C(n-1); here we only check the
    // result belongs to sentence i: its tree has as many words.
    CHECK(r.tree.num_words() == sentences[i].words.size());
  });
  REQUIRE(order.size() == 200);
  for (std::size_t i = 0; i < order.size(); ++i) CHECK(order[i] == i);
  CHECK(no_parse == 4);
}

}  // namespace
}  // namespace treegate::pcfg
