#include "harness/pcfg/transforms_edit.h"

#include <utility>

namespace treegate::pcfg {

std::int32_t EditTree::add(std::string label) {
  const auto id = static_cast<std::int32_t>(nodes.size());
  EditNode node;
  node.base = label;
  node.label = std::move(label);
  nodes.push_back(std::move(node));
  return id;
}

bool EditTree::is_preterminal(std::int32_t id) const {
  const EditNode& n = at(id);
  return !n.is_leaf() && n.kids.size() == 1 && at(n.kids[0]).is_leaf();
}

bool EditTree::is_phrasal(std::int32_t id) const {
  return !at(id).is_leaf() && !is_preterminal(id);
}

std::vector<std::int32_t> EditTree::preorder() const {
  std::vector<std::int32_t> order;
  if (root < 0) return order;
  order.reserve(nodes.size());
  std::vector<std::int32_t> stack{root};
  while (!stack.empty()) {
    const std::int32_t id = stack.back();
    stack.pop_back();
    order.push_back(id);
    const auto& kids = at(id).kids;
    stack.insert(stack.end(), kids.rbegin(), kids.rend());
  }
  return order;
}

EditTree to_edit_tree(const Tree& tree) {
  EditTree edit;
  if (tree.empty()) return edit;
  edit.nodes.resize(tree.size());
  edit.words.reserve(tree.num_words());
  for (std::size_t i = 0; i < tree.num_words(); ++i) edit.words.emplace_back(tree.word(i));
  for (NodeId id = 0; id < static_cast<NodeId>(tree.size()); ++id) {
    const Node& n = tree.node(id);
    EditNode& e = edit.nodes[static_cast<std::size_t>(id)];
    e.source = id;
    e.word = n.word;
    if (!n.is_leaf()) {
      e.label = tree.label(id);
      e.base = e.label;
    }
    for (NodeId c = n.first_child; c != kNoNode; c = tree.node(c).next_sibling) e.kids.push_back(c);
  }
  edit.root = tree.root();
  return edit;
}

Tree to_tree(const EditTree& edit, const LabelTable& labels) {
  Tree out(labels);
  if (edit.root < 0) return out;
  std::vector<std::pair<std::int32_t, NodeId>> stack{{edit.root, kNoNode}};  // (node, new parent)
  while (!stack.empty()) {
    auto [id, parent] = stack.back();
    stack.pop_back();
    const EditNode& n = edit.at(id);
    if (n.is_leaf()) {
      out.add_leaf(edit.words[static_cast<std::size_t>(n.word)], parent);
      continue;
    }
    const NodeId copy = out.add_node(std::string_view(n.label), parent);
    for (auto it = n.kids.rbegin(); it != n.kids.rend(); ++it) stack.emplace_back(*it, copy);
  }
  return out;
}

}  // namespace treegate::pcfg
