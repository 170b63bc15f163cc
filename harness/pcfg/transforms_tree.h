// The grammar transforms on EditTrees, each with its inverse, and the checks a training tree
// must pass first. Forward order: strip function tags, drop empty elements, relabel or add the
// root (start symbol), parent annotation, unary-chain collapsing, binarization. The inverse
// runs the undoable steps backwards. All walks are iterative; functions are thread-safe.
#pragma once

#include <optional>
#include <string>

#include "harness/pcfg/transforms_edit.h"
#include "harness/pcfg/transforms_spec.h"

namespace treegate::pcfg {

/// What makes a tree unusable for estimation; `node` is a node of the checked Tree
/// (kNoNode: the tree as a whole).
struct TreeProblem {
  NodeId node = kNoNode;
  std::string message;
};

/// Checks a treebank tree: not empty, every constituent labelled (a root wrapper may have an
/// empty label) and with children, every word under a tag of its own, no reserved marks.
std::optional<TreeProblem> check_training_tree(const Tree& tree);

/// The root wrapper style of an untransformed tree (kAsIs when its root is already `start`).
TransformSpec::Wrapper wrapper_style(const EditTree& tree, const std::string& start);

void strip_functions(EditTree& tree);
/// Removes preterminals tagged `empty_tag` and the constituents left without words.
/// When nothing is left, tree.root becomes -1.
void drop_empties(EditTree& tree, const std::string& empty_tag);
/// A root labelled "", TOP or ROOT is relabelled `start`; a root already labelled `start`
/// stays; any other root gets a new parent labelled `start`.
void wrap_root(EditTree& tree, const std::string& start);
/// Vertical Markov order v (Johnson 1998): phrasal nodes below the root get the labels of
/// their v-1 nearest ancestors: NP^S (v=2), NP^S^VP (v=3). Preterminals are left alone.
void annotate_parents(EditTree& tree, int v);
/// A phrasal node (not the root) whose only child is phrasal merges with it: S~VP.
void collapse_unaries(EditTree& tree);
/// Right-factored binarization with horizontal Markov order h (Klein & Manning 2003); h is
/// TransformSpec::kUnlimited to keep every earlier sibling. X -> A B C D becomes
/// X -> A X>A, X>A -> B X>A>B, X>A>B -> C D (h = 2 or more).
void binarize(EditTree& tree, int h);
/// The whole forward pipeline of `spec` (rare words are the estimator's business).
void apply_transforms(EditTree& tree, const TransformSpec& spec);

/// Inverses. Each accepts any tree (e.g. a parser's output) and leaves unmarked labels alone.
void unbinarize(EditTree& tree);
void expand_unaries(EditTree& tree);
void remove_parent_annotation(EditTree& tree);
/// Restores the treebank's root wrapper style on a root labelled spec.start.
void unwrap_root(EditTree& tree, const TransformSpec& spec);
/// Undoes apply_transforms. Stripped function tags and dropped empty elements are not
/// restored (the scoring scheme removes them anyway).
void undo_transforms(EditTree& tree, const TransformSpec& spec);

}  // namespace treegate::pcfg
