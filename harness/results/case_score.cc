#include "harness/results/case_score.h"

#include "evaluator/tally.h"

namespace treegate::results {
namespace {

SentenceStatus status_of(const std::string& score) {
  if (score == "scored") return SentenceStatus::kScored;
  if (score == "no_parse") return SentenceStatus::kNoParse;
  if (score == "yield_mismatch") return SentenceStatus::kYieldMismatch;
  return SentenceStatus::kError;
}

}  // namespace

void set_score(CaseRecord& c, const SentenceScore& s) {
  c.score = status_name(s.status);
  c.gold_brackets = s.gold_brackets;
  c.test_brackets = s.test_brackets;
  c.matched = s.matched;
  c.crossing = s.crossing;
  c.scored_words = s.words;
  c.tags_correct = s.tags_correct;
  c.f1 = f1_pct(s.matched, s.test_brackets, s.gold_brackets);
}

SentenceScore sentence_score(const CaseRecord& c) {
  SentenceScore s;
  s.status = status_of(c.score);
  s.gold_brackets = c.gold_brackets;
  s.test_brackets = c.test_brackets;
  s.matched = c.matched;
  s.crossing = c.crossing;
  s.words = c.scored_words;
  s.tags_correct = c.tags_correct;
  return s;
}

}  // namespace treegate::results
