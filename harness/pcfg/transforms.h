// Tree transforms named in a grammar header (@transform KEY=VALUE) and their inverses.
// undo_transforms restores the original label set of a tree the parser produced with a
// transformed grammar. Stateless; safe to call from any number of threads.
#pragma once

#include <string>

#include "evaluator/tree.h"
#include "harness/pcfg/grammar.h"

namespace treegate::pcfg {

/// Throws InputError ("SOURCE: @transform ...: expected ...") when the header's transform
/// pairs are not ones undo_transforms understands; call it when a grammar is loaded.
void check_transforms(const GrammarHeader& header, const std::string& source);

/// Undoes, in reverse order, every transform listed in `header` on `tree` (in place).
void undo_transforms(Tree& tree, const GrammarHeader& header);

}  // namespace treegate::pcfg
