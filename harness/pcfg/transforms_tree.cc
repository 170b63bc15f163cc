#include "harness/pcfg/transforms_tree.h"

#include <algorithm>
#include <utility>

#include "evaluator/errors.h"
#include "evaluator/scheme.h"

namespace treegate::pcfg {
namespace {

bool is_wrapper_label(std::string_view label) {
  return label.empty() || label == "ROOT" || label == "TOP";
}

std::optional<TreeProblem> check_node(const Tree& tree, NodeId id) {
  const Node& n = tree.node(id);
  if (n.is_leaf()) {
    const NodeId parent = n.parent;
    const bool tagged = parent != kNoNode && tree.is_preterminal(parent) &&
                        !tree.label(parent).empty() &&
                        !(parent == tree.root() && is_wrapper_label(tree.label(parent)));
    if (!tagged) {
      return TreeProblem{id, "word " + quote_for_message(std::string(tree.word(n.word))) +
                                 " has no tag of its own: expected (TAG word)"};
    }
    return std::nullopt;
  }
  const std::string_view label = tree.label(id);
  if (n.first_child == kNoNode) {
    return TreeProblem{id, "constituent " + quote_for_message(std::string(label)) +
                               " has no words: expected (LABEL child ...)"};
  }
  if (label.empty() && id != tree.root()) {
    return TreeProblem{id, "constituent without a label: expected (LABEL child ...)"};
  }
  if (const auto mark = label.find_first_of(kReservedMarks); mark != std::string_view::npos) {
    return TreeProblem{id, "label " + quote_for_message(std::string(label)) + " contains '" +
                               std::string(1, label[mark]) +
                               "', which grammar transforms reserve for their own labels"};
  }
  if (const char c = label.empty() ? ' ' : label[0]; c == '"' || c == '<' || c == '@' ||
                                                     label == "->" ||
                                                     label.find('#') != std::string_view::npos) {
    return TreeProblem{id, "label " + quote_for_message(std::string(label)) +
                               " cannot be a grammar symbol (symbols may not contain '#', start "
                               "with '\"', '<' or '@', or be '->'); rename it in the treebank"};
  }
  return std::nullopt;
}

// The labels of the v-1 nearest ancestors, "^P^G", from the base labels.
std::string ancestor_suffix(const EditTree& tree, const std::vector<std::int32_t>& parent,
                            std::int32_t id, int v) {
  std::string suffix;
  std::int32_t up = parent[static_cast<std::size_t>(id)];
  for (int step = 1; step < v && up >= 0; ++step) {
    suffix += kParentMark;
    suffix += tree.at(up).base;
    up = parent[static_cast<std::size_t>(up)];
  }
  return suffix;
}

std::string context_label(const EditTree& tree, const std::vector<std::int32_t>& kids,
                          std::size_t done, int h) {
  std::size_t from = 0;
  if (h != TransformSpec::kUnlimited && done > static_cast<std::size_t>(h)) {
    from = done - static_cast<std::size_t>(h);
  }
  std::string context;
  for (std::size_t i = from; i < done; ++i) {
    const EditNode& sibling = tree.at(kids[i]);
    context += kIntermediateMark;
    context +=
        sibling.is_leaf() ? tree.words[static_cast<std::size_t>(sibling.word)] : sibling.base;
  }
  return context;
}

void binarize_node(EditTree& tree, std::int32_t id, int h) {
  const std::vector<std::int32_t> kids = std::move(tree.at(id).kids);
  const std::string label = tree.at(id).label;
  std::int32_t holder = id;  // the node that receives the next child
  for (std::size_t i = 0; i + 2 < kids.size(); ++i) {
    std::string context = label + context_label(tree, kids, i + 1, h);
    if (context.size() == label.size()) context += kIntermediateMark;  // h = 0: "X>"
    const std::int32_t next = tree.add(std::move(context));
    tree.at(holder).kids = {kids[i], next};
    holder = next;
  }
  tree.at(holder).kids = {kids[kids.size() - 2], kids.back()};
}

}  // namespace

std::optional<TreeProblem> check_training_tree(const Tree& tree) {
  if (tree.empty()) return TreeProblem{kNoNode, "empty tree (): expected a tree with words"};
  for (NodeId id = 0; id < static_cast<NodeId>(tree.size()); ++id) {
    if (auto problem = check_node(tree, id)) return problem;
  }
  return std::nullopt;
}

TransformSpec::Wrapper wrapper_style(const EditTree& tree, const std::string& start) {
  if (tree.root < 0) return TransformSpec::Wrapper::kAsIs;
  const std::string& label = tree.at(tree.root).label;
  if (label == start) return TransformSpec::Wrapper::kAsIs;
  if (label == "ROOT") return TransformSpec::Wrapper::kRoot;
  if (label == "TOP") return TransformSpec::Wrapper::kTop;
  if (label.empty()) return TransformSpec::Wrapper::kEmpty;
  return TransformSpec::Wrapper::kNone;
}

void strip_functions(EditTree& tree) {
  for (EditNode& n : tree.nodes) {
    if (n.is_leaf()) continue;
    n.label = strip_function_tags(n.label);
    n.base = n.label;
  }
}

void drop_empties(EditTree& tree, const std::string& empty_tag) {
  const std::vector<std::int32_t> order = tree.preorder();
  std::vector<char> alive(tree.nodes.size(), 1);
  for (auto it = order.rbegin(); it != order.rend(); ++it) {
    EditNode& n = tree.at(*it);
    if (n.is_leaf()) continue;
    if (tree.is_preterminal(*it)) {
      alive[static_cast<std::size_t>(*it)] = n.label != empty_tag;
      continue;
    }
    std::erase_if(n.kids, [&](std::int32_t k) { return !alive[static_cast<std::size_t>(k)]; });
    alive[static_cast<std::size_t>(*it)] = !n.kids.empty();
  }
  if (tree.root >= 0 && !alive[static_cast<std::size_t>(tree.root)]) tree.root = -1;
}

void wrap_root(EditTree& tree, const std::string& start) {
  if (tree.root < 0) return;
  EditNode& root = tree.at(tree.root);
  if (root.label == start) return;
  if (is_wrapper_label(root.label)) {
    root.label = start;
    root.base = start;
    return;
  }
  const std::int32_t old_root = tree.root;
  tree.root = tree.add(start);
  tree.at(tree.root).kids = {old_root};
}

void annotate_parents(EditTree& tree, int v) {
  if (v <= 1) return;
  const std::vector<std::int32_t> order = tree.preorder();
  std::vector<std::int32_t> parent(tree.nodes.size(), -1);
  for (std::int32_t id : order) {
    for (std::int32_t k : tree.at(id).kids) parent[static_cast<std::size_t>(k)] = id;
  }
  for (std::int32_t id : order) {
    if (id == tree.root || !tree.is_phrasal(id)) continue;
    tree.at(id).label += ancestor_suffix(tree, parent, id, v);
  }
}

void collapse_unaries(EditTree& tree) {
  for (std::int32_t id : tree.preorder()) {
    if (id == tree.root || !tree.is_phrasal(id)) continue;
    while (tree.at(id).kids.size() == 1 && tree.is_phrasal(tree.at(id).kids[0])) {
      EditNode& child = tree.at(tree.at(id).kids[0]);
      std::vector<std::int32_t> grandkids = std::move(child.kids);
      child.kids.clear();
      EditNode& n = tree.at(id);
      n.label += kUnaryMark;
      n.label += child.label;
      n.kids = std::move(grandkids);
    }
  }
}

void binarize(EditTree& tree, int h) {
  if (h == TransformSpec::kNoBinarize) return;
  for (std::int32_t id : tree.preorder()) {
    if (tree.at(id).kids.size() > 2) binarize_node(tree, id, h);
  }
}

void apply_transforms(EditTree& tree, const TransformSpec& spec) {
  if (spec.strip_functions) strip_functions(tree);
  if (spec.drop_empties) drop_empties(tree, spec.empty_tag);
  if (tree.root < 0) return;
  wrap_root(tree, spec.start);
  annotate_parents(tree, spec.parent);
  if (spec.collapse_unary) collapse_unaries(tree);
  binarize(tree, spec.horizontal);
}

void unbinarize(EditTree& tree) {
  auto intermediate = [&](std::int32_t id) {
    const EditNode& n = tree.at(id);
    return !n.is_leaf() && n.label.find(kIntermediateMark) != std::string::npos;
  };
  std::vector<std::int32_t> stack;
  for (std::int32_t id : tree.preorder()) {
    if (intermediate(id) && id != tree.root) continue;
    std::vector<std::int32_t> kids;
    stack.assign(tree.at(id).kids.rbegin(), tree.at(id).kids.rend());
    while (!stack.empty()) {
      const std::int32_t k = stack.back();
      stack.pop_back();
      if (intermediate(k)) {
        stack.insert(stack.end(), tree.at(k).kids.rbegin(), tree.at(k).kids.rend());
      } else {
        kids.push_back(k);
      }
    }
    tree.at(id).kids = std::move(kids);
  }
}

void expand_unaries(EditTree& tree) {
  for (std::int32_t id : tree.preorder()) {
    if (tree.at(id).is_leaf() || tree.at(id).label.find(kUnaryMark) == std::string::npos) continue;
    const std::string label = tree.at(id).label;
    std::vector<std::int32_t> kids = std::move(tree.at(id).kids);
    std::size_t begin = 0, end = label.find(kUnaryMark);
    tree.at(id).label = label.substr(0, end);
    std::int32_t holder = id;
    while (end != std::string::npos) {
      begin = end + 1;
      end = label.find(kUnaryMark, begin);
      const std::int32_t next = tree.add(label.substr(begin, end - begin));
      tree.at(holder).kids = {next};
      holder = next;
    }
    tree.at(holder).kids = std::move(kids);
  }
}

void remove_parent_annotation(EditTree& tree) {
  for (EditNode& n : tree.nodes) {
    if (n.is_leaf()) continue;
    if (const auto mark = n.label.find(kParentMark); mark != std::string::npos)
      n.label.resize(mark);
  }
}

void unwrap_root(EditTree& tree, const TransformSpec& spec) {
  if (tree.root < 0 || tree.at(tree.root).label != spec.start) return;
  using W = TransformSpec::Wrapper;
  switch (spec.wrapper) {
    case W::kRoot:
      tree.at(tree.root).label = "ROOT";
      break;
    case W::kTop:
      tree.at(tree.root).label = "TOP";
      break;
    case W::kEmpty:
      tree.at(tree.root).label.clear();
      break;
    case W::kNone:
      if (tree.at(tree.root).kids.size() == 1) tree.root = tree.at(tree.root).kids[0];
      break;
    case W::kAsIs:
      break;
  }
}

void undo_transforms(EditTree& tree, const TransformSpec& spec) {
  if (tree.root < 0) return;
  unbinarize(tree);
  expand_unaries(tree);
  remove_parent_annotation(tree);
  unwrap_root(tree, spec);
}

}  // namespace treegate::pcfg
