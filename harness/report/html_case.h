// One case of the HTML report: a <details> row (status, change, id, F1, the sentence) that
// opens to the reason, the differing brackets and the trees drawn side by side (gold beside
// predicted; baseline beside new beside gold in a comparison). A CaseRenderer owns a label
// table and a scorer, so use one per thread.
#pragma once

#include <memory>
#include <string>

#include "evaluator/labels.h"
#include "evaluator/parseval.h"
#include "harness/report/html_view.h"

namespace treegate::report::html {

class CaseRenderer {
 public:
  explicit CaseRenderer(const ReportView& view);
  /// `draw`: false shows the trees as bracketed text (for very large reports).
  std::string render(const CaseView& c, bool draw);

 private:
  const ReportView& view_;
  std::unique_ptr<LabelTable> labels_;
  Scorer scorer_;
};

/// Lower comes first when deciding which cases get drawn trees: broken, failing, erring,
/// changed, then the rest.
int case_priority(const CaseView& c);

/// The key to the tree marks (drawn once above the case list).
std::string tree_key();

}  // namespace treegate::report::html
