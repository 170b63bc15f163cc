// undo_transforms for parser output: reads the grammar header's @transform pairs and runs the
// inverses of transforms_tree.h. Covered by tests/pcfg/transforms_test.cc.
#include "harness/pcfg/transforms.h"

#include "harness/pcfg/transforms_tree.h"

namespace treegate::pcfg {

void check_transforms(const GrammarHeader& header, const std::string& source) {
  from_pairs(header.transforms, source);
}

void undo_transforms(Tree& tree, const GrammarHeader& header) {
  if (header.transforms.empty() || tree.empty()) return;
  const TransformSpec spec = from_pairs(header.transforms, "grammar header");
  EditTree edit = to_edit_tree(tree);
  undo_transforms(edit, spec);
  tree = to_tree(edit, tree.labels());
}

}  // namespace treegate::pcfg
