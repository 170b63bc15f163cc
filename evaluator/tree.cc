#include "evaluator/tree.h"

namespace treegate {

void Tree::clear() {
  nodes_.clear();
  text_.clear();
  word_starts_.clear();
}

void Tree::reserve(std::size_t nodes, std::size_t words, std::size_t word_bytes) {
  nodes_.reserve(nodes);
  word_starts_.reserve(words);
  text_.reserve(word_bytes);
}

NodeId Tree::add_node(LabelId label, NodeId parent) {
  const auto id = static_cast<NodeId>(nodes_.size());
  Node n;
  n.label = label;
  n.parent = parent;
  nodes_.push_back(n);
  if (parent != kNoNode) {
    Node& p = nodes_[static_cast<std::size_t>(parent)];
    if (p.last_child == kNoNode) {
      p.first_child = id;
    } else {
      nodes_[static_cast<std::size_t>(p.last_child)].next_sibling = id;
    }
    p.last_child = id;
  }
  return id;
}

NodeId Tree::add_node(std::string_view label, NodeId parent) {
  // The table is shared and only grows; interning through a const pointer is by design.
  return add_node(const_cast<LabelTable*>(labels_)->intern(label), parent);
}

NodeId Tree::add_leaf(std::string_view word, NodeId parent) {
  NodeId id = add_node(LabelTable::kEmpty, parent);
  nodes_[static_cast<std::size_t>(id)].word = static_cast<std::int32_t>(word_starts_.size());
  word_starts_.push_back(static_cast<std::uint32_t>(text_.size()));
  text_.append(word);
  return id;
}

std::string_view Tree::word(std::size_t i) const {
  const std::size_t begin = word_starts_[i];
  const std::size_t end = i + 1 < word_starts_.size() ? word_starts_[i + 1] : text_.size();
  return std::string_view(text_).substr(begin, end - begin);
}

std::vector<std::string_view> Tree::words() const {
  std::vector<std::string_view> out;
  out.reserve(num_words());
  for (std::size_t i = 0; i < num_words(); ++i) out.push_back(word(i));
  return out;
}

std::string_view Tree::label(NodeId id) const {
  const Node& n = node(id);
  return n.is_leaf() ? std::string_view() : labels_->name(n.label);
}

std::size_t Tree::num_children(NodeId id) const {
  std::size_t count = 0;
  for (NodeId c = node(id).first_child; c != kNoNode; c = node(c).next_sibling) ++count;
  return count;
}

std::vector<std::string_view> Tree::tags() const {
  std::vector<std::string_view> out(num_words());
  for (std::size_t i = 0; i < nodes_.size(); ++i) {
    const Node& n = nodes_[i];
    if (n.is_leaf() && n.parent != kNoNode && is_preterminal(n.parent)) {
      out[static_cast<std::size_t>(n.word)] = label(n.parent);
    }
  }
  return out;
}

Tree Tree::subtree(NodeId top) const {
  Tree out(*labels_);
  // Pre-order copy keeps leaves in yield order.
  std::vector<std::pair<NodeId, NodeId>> stack{{top, kNoNode}};  // (source, new parent)
  std::vector<NodeId> kids;
  while (!stack.empty()) {
    auto [src, parent] = stack.back();
    stack.pop_back();
    const Node& n = node(src);
    NodeId copy = n.is_leaf() ? out.add_leaf(word(static_cast<std::size_t>(n.word)), parent)
                              : out.add_node(n.label, parent);
    kids.clear();
    for (NodeId c = n.first_child; c != kNoNode; c = node(c).next_sibling) kids.push_back(c);
    for (auto it = kids.rbegin(); it != kids.rend(); ++it) stack.emplace_back(*it, copy);
  }
  return out;
}

}  // namespace treegate
