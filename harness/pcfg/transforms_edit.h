// EditTree: a mutable copy of an evaluator Tree that the grammar transforms rewrite in place
// (relabel, splice, insert nodes). Node 0 need not stay the root; `root` says which node is.
// Plain value, owned by its user; every walk over it is iterative (trees may be very deep).
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "evaluator/tree.h"

namespace treegate::pcfg {

struct EditNode {
  std::string label;               // internal nodes; empty for leaves
  std::string base;                // label before parent annotation (context for binarizing)
  std::int32_t word = -1;          // leaves: index into EditTree::words; else -1
  std::vector<std::int32_t> kids;  // children, left to right
  NodeId source = kNoNode;         // node of the tree this came from (for error positions)

  bool is_leaf() const { return word >= 0; }
};

struct EditTree {
  std::vector<EditNode> nodes;
  std::vector<std::string> words;
  std::int32_t root = -1;

  EditNode& at(std::int32_t id) { return nodes[static_cast<std::size_t>(id)]; }
  const EditNode& at(std::int32_t id) const { return nodes[static_cast<std::size_t>(id)]; }
  /// Appends a node and returns its id (references into `nodes` may be invalidated).
  std::int32_t add(std::string label);
  /// An internal node whose only child is a leaf.
  bool is_preterminal(std::int32_t id) const;
  /// An internal node that is not a preterminal.
  bool is_phrasal(std::int32_t id) const;
  /// Ids of the nodes reachable from the root, parents before children (pre-order).
  std::vector<std::int32_t> preorder() const;
};

/// Copies `tree` (labels as text). An empty tree gives an EditTree with root -1.
EditTree to_edit_tree(const Tree& tree);
/// Builds an evaluator Tree (labels interned in `labels`), leaves in pre-order.
Tree to_tree(const EditTree& edit, const LabelTable& labels = LabelTable::shared());

}  // namespace treegate::pcfg
