// Tree transforms named in a grammar header (@transform KEY=VALUE) and their inverses.
// undo_transforms restores the original label set of a tree the parser produced with a
// transformed grammar. Stateless; safe to call from any number of threads.
#pragma once

#include "evaluator/tree.h"
#include "harness/pcfg/grammar.h"

namespace treegate::pcfg {

/// Undoes, in reverse order, every transform listed in `header` on `tree` (in place).
void undo_transforms(Tree& tree, const GrammarHeader& header);

}  // namespace treegate::pcfg
