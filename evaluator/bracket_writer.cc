#include <sstream>

#include "evaluator/bracket_io.h"

namespace treegate {
namespace {

// Emits the tree without recursion: an explicit stack of (node, children-done) entries.
template <class Open, class Leaf, class Close>
void walk(const Tree& tree, Open&& open, Leaf&& leaf, Close&& close) {
  struct Frame {
    NodeId node;
    NodeId next_child;
    std::size_t depth;
  };
  std::vector<Frame> stack;
  stack.push_back({tree.root(), tree.node(tree.root()).first_child, 0});
  open(tree.root(), 0);
  while (!stack.empty()) {
    Frame& f = stack.back();
    if (f.next_child == kNoNode) {
      close(f.node, f.depth);
      stack.pop_back();
      continue;
    }
    NodeId child = f.next_child;
    f.next_child = tree.node(child).next_sibling;
    const std::size_t depth = f.depth + 1;
    if (tree.node(child).is_leaf()) {
      leaf(child);
    } else {
      open(child, depth);
      stack.push_back({child, tree.node(child).first_child, depth});
    }
  }
}

}  // namespace

void write_bracketed(std::ostream& out, const Tree& tree) { out << to_bracketed(tree); }

std::string to_bracketed(const Tree& tree) {
  if (tree.empty()) return "()";
  std::string s;
  s.reserve(tree.size() * 8);
  walk(
      tree,
      [&](NodeId id, std::size_t) {
        if (!s.empty()) s += ' ';
        s += '(';
        s += tree.label(id);
      },
      [&](NodeId id) {
        s += ' ';
        s += tree.word(static_cast<std::size_t>(tree.node(id).word));
      },
      [&](NodeId, std::size_t) { s += ')'; });
  return s;
}

std::string to_indented(const Tree& tree) {
  if (tree.empty()) return "()\n";
  std::string s;
  walk(
      tree,
      [&](NodeId id, std::size_t depth) {
        if (tree.is_preterminal(id)) {
          s += ' ';
        } else {
          if (!s.empty()) s += '\n';
          s.append(depth * 2, ' ');
        }
        s += '(';
        s += tree.label(id);
      },
      [&](NodeId id) {
        s += ' ';
        s += tree.word(static_cast<std::size_t>(tree.node(id).word));
      },
      [&](NodeId, std::size_t) { s += ')'; });
  return s + "\n";
}

}  // namespace treegate
