// Which nodes of a gold and a predicted tree are matched, wrong or missing brackets, found the
// same way as the PARSEVAL scorer (evaluator/parseval.h) counts them, for drawing and listing
// in the HTML report. Pure functions; a Scorer is not thread-safe, so pass one per thread.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "evaluator/parseval.h"

namespace treegate::report::html {

struct TreeDiff {
  SentenceScore score;
  std::vector<std::uint8_t> gold_marks, test_marks;  // Mark flags by NodeId (html_tree.h)
  std::vector<std::string> missing, wrong;           // "PP 6–8 (with a hook)", full-yield words
};

/// Scores `test` against `gold` with `scorer` and marks every node: matched, wrong (test
/// bracket not in gold), missing (gold bracket not in test), and preterminals whose tag is not
/// gold's. With duplicate brackets (a multiset) the first ones in pre-order are the matched ones.
TreeDiff diff_trees(const Tree& gold, const Tree& test, Scorer& scorer);

}  // namespace treegate::report::html
