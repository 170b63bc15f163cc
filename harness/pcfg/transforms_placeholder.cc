// Identity placeholder for undo_transforms until the transforms of `estimate` land; a grammar
// without @transform lines needs nothing undone.
#include "harness/pcfg/transforms.h"

namespace treegate::pcfg {

void undo_transforms(Tree&, const GrammarHeader&) {}

}  // namespace treegate::pcfg
