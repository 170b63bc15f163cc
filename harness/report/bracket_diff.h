// The brackets that differ between a case's gold and predicted trees, written in the suite
// notation "LABEL FROM-TO" (1-based, inclusive, over the full yield), for console and JUnit
// reports. Stateless; uses its own Scorer per call.
#pragma once

#include <string>
#include <vector>

#include "evaluator/scheme.h"
#include "harness/results/results.h"

namespace treegate::report {

struct BracketDiff {
  std::vector<std::string> missing;  // in gold, not predicted
  std::vector<std::string> extra;    // predicted, not in gold
};

/// Empty when either tree is missing or cannot be read.
BracketDiff bracket_diff(const results::CaseRecord& record, const Scheme& scheme);

/// "PP 6-8, NP 4-8" (or "none").
std::string join_brackets(const std::vector<std::string>& brackets);

}  // namespace treegate::report
