// Tree: one bracketed tree as an arena of nodes (no heap allocation per node).
// Labels are interned in a LabelTable that must outlive the tree; word bytes live in one
// buffer owned by the tree. Leaves must be added in left-to-right order, so that a leaf's
// word index is its position in the yield. A Tree is a value: copying it copies the arena.
// Not thread-safe for concurrent writes; concurrent reads are fine.
#pragma once

#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

#include "evaluator/labels.h"

namespace treegate {

using NodeId = std::int32_t;
inline constexpr NodeId kNoNode = -1;

struct Node {
  LabelId label = LabelTable::kEmpty;  // internal nodes only
  std::int32_t word = -1;              // leaves: index of the word in the yield; else -1
  NodeId parent = kNoNode;
  NodeId first_child = kNoNode;
  NodeId last_child = kNoNode;
  NodeId next_sibling = kNoNode;

  bool is_leaf() const { return word >= 0; }
};

class Tree {
 public:
  Tree() : labels_(&LabelTable::shared()) {}
  explicit Tree(const LabelTable& labels) : labels_(&labels) {}

  /// Empties the tree and keeps its capacity (for reuse in a reading loop).
  void clear();
  /// Makes room for `nodes` nodes (words included), `words` words of `word_bytes` bytes.
  void reserve(std::size_t nodes, std::size_t words, std::size_t word_bytes);

  /// Adds an internal node under `parent` (kNoNode for the root, which must come first).
  NodeId add_node(LabelId label, NodeId parent);
  NodeId add_node(std::string_view label, NodeId parent);
  /// Adds a word under `parent`; words must be added in yield order.
  NodeId add_leaf(std::string_view word, NodeId parent);

  bool empty() const { return nodes_.empty(); }
  std::size_t size() const { return nodes_.size(); }
  NodeId root() const { return nodes_.empty() ? kNoNode : 0; }
  const Node& node(NodeId id) const { return nodes_[static_cast<std::size_t>(id)]; }

  std::size_t num_words() const { return word_starts_.size(); }
  std::string_view word(std::size_t i) const;
  std::vector<std::string_view> words() const;
  /// The node's label text ("" for leaves).
  std::string_view label(NodeId id) const;
  LabelId label_id(NodeId id) const { return node(id).label; }

  /// A node whose children are exactly one leaf (the node's label is the word's tag).
  bool is_preterminal(NodeId id) const {  // inline: the scorer asks it of every node
    const Node& n = node(id);
    return !n.is_leaf() && n.first_child != kNoNode && n.first_child == n.last_child &&
           node(n.first_child).is_leaf();
  }
  std::size_t num_children(NodeId id) const;
  /// Tags of the words in yield order (empty label when a word has no tag).
  std::vector<std::string_view> tags() const;

  /// A new tree holding a copy of the subtree at `id` (same label table).
  Tree subtree(NodeId id) const;

  const LabelTable& labels() const { return *labels_; }

 private:
  const LabelTable* labels_;
  std::vector<Node> nodes_;
  std::string text_;
  std::vector<std::uint32_t> word_starts_;  // word i is text_[starts[i], starts[i+1])
};

/// Calls `visit(id)` for every node in pre-order (parents before children), without recursion.
template <class Visit>
void for_each_preorder(const Tree& tree, Visit&& visit) {
  if (tree.empty()) return;
  std::vector<NodeId> stack{tree.root()};
  std::vector<NodeId> kids;
  while (!stack.empty()) {
    NodeId id = stack.back();
    stack.pop_back();
    visit(id);
    kids.clear();
    for (NodeId c = tree.node(id).first_child; c != kNoNode; c = tree.node(c).next_sibling) {
      kids.push_back(c);
    }
    stack.insert(stack.end(), kids.rbegin(), kids.rend());
  }
}

}  // namespace treegate
