// Scores two streams of bracketed trees against each other, tree i with tree i, in bounded
// memory (one pair at a time). Syntax errors and a different number of trees are InputErrors;
// a yield mismatch is a per-sentence error and the other sentences are still scored.
#pragma once

#include <functional>
#include <istream>
#include <string>

#include "evaluator/tally.h"

namespace treegate {

using SentenceCallback = std::function<void(std::size_t index, const SentenceScore&)>;

/// Returns the corpus tally; calls `each` (when set) for every sentence, index 1-based.
Tally score_streams(std::istream& gold, const std::string& gold_name, std::istream& test,
                    const std::string& test_name, const Scheme& scheme,
                    const SentenceCallback& each = {}, LabelTable& labels = LabelTable::shared());

}  // namespace treegate
