#include "evaluator/score_streams.h"

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"

namespace treegate {
namespace {

std::size_t count_rest(BracketReader& reader, Tree& scratch) {
  std::size_t n = 0;
  while (reader.next(scratch)) ++n;
  return n;
}

}  // namespace

Tally score_streams(std::istream& gold, const std::string& gold_name, std::istream& test,
                    const std::string& test_name, const Scheme& scheme,
                    const SentenceCallback& each, LabelTable& labels) {
  BracketReader gold_reader(gold, gold_name, labels);
  BracketReader test_reader(test, test_name, labels);
  Scorer scorer(scheme, labels);
  Tally tally(scheme);
  Tree g(labels), t(labels);
  BracketSets sets;
  std::size_t index = 0;
  for (;;) {
    const bool has_gold = gold_reader.next(g);
    const bool has_test = test_reader.next(t);
    if (!has_gold && !has_test) break;
    if (has_gold != has_test) {
      const std::size_t gold_count = index + (has_gold ? 1 + count_rest(gold_reader, g) : 0);
      const std::size_t test_count = index + (has_test ? 1 + count_rest(test_reader, t) : 0);
      throw InputError("different numbers of trees: " + gold_name + " has " +
                       std::to_string(gold_count) + ", " + test_name + " has " +
                       std::to_string(test_count));
    }
    ++index;
    const SentenceScore s = scorer.score(g, t, &sets);
    tally.add(s, sets);
    if (each) each(index, s);
  }
  if (index == 0) throw InputError(gold_name + ": no trees found (the file is empty)");
  return tally;
}

}  // namespace treegate
