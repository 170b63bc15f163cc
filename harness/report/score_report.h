// Renders the outcome of `treegate score` (two bracketed files scored against each other)
// as text for people or as one JSON object for scripts (the contract is in the README).
#pragma once

#include <string>
#include <vector>

#include "evaluator/tally.h"

namespace treegate::report {

struct ScoredSentence {
  std::size_t index;  // 1-based position in the files
  SentenceScore score;
};

struct ScoreRun {
  std::string gold_file, test_file;
  Tally tally;
  std::vector<ScoredSentence> sentences;  // every sentence (reasons kept for errors only)
  const LabelTable* labels = &LabelTable::shared();
};

std::string score_text(const ScoreRun& run, bool per_sentence);
std::string score_json(const ScoreRun& run);

}  // namespace treegate::report
