// Reading trees off a filled chart: the Viterbi tree (iterative, internal symbols spliced out,
// unary chains expanded) and best pre-unary scores.
#include <cmath>

#include "harness/pcfg/chart.h"

namespace treegate::pcfg {

double pre_vit(const Chart& chart, const CompiledGrammar& g, std::size_t i, std::size_t j,
               Symbol s) {
  const Back& back = chart.back(chart.cell(i, j), s);
  if (back.rule == kLexical) {
    double best = -INFINITY;
    for (const LexEntry& e : chart.lex[i]) {
      if (e.symbol == s) best = std::max(best, e.logp);
    }
    return best;
  }
  const auto [left, right] = g.children(back.rule);
  const std::size_t k = back.split;
  return g.target(back.rule).logp + chart.entry(chart.cell(i, k), left).vit +
         chart.entry(chart.cell(k, j), right).vit;
}

namespace {

/// The symbol below `top` on the best unary chain from `top` down to `bottom`.
Symbol chain_step(const CompiledGrammar& g, Symbol top, Symbol bottom) {
  for (const UnaryLink& link : g.unary_above(bottom)) {
    if (link.top == top) return link.via;
  }
  return bottom;
}

struct Frame {
  std::uint32_t i, j;
  Symbol symbol;
  bool post;
  NodeId parent;
};

}  // namespace

Tree viterbi_tree(const Chart& chart, const CompiledGrammar& g,
                  const std::vector<std::string>& words, std::size_t i0, std::size_t j0,
                  Symbol s0) {
  Tree tree;
  std::vector<Frame> stack{
      {static_cast<std::uint32_t>(i0), static_cast<std::uint32_t>(j0), s0, true, kNoNode}};
  auto open = [&](Symbol s, NodeId parent) {
    return g.internal(s) ? parent : tree.add_node(g.name(s), parent);
  };
  while (!stack.empty()) {
    Frame f = stack.back();
    stack.pop_back();
    const std::size_t cell = chart.cell(f.i, f.j);
    const Back& back = chart.back(cell, f.symbol);
    if (f.post) {
      const Symbol bottom = back.bottom;
      NodeId parent = f.parent;
      for (Symbol s = f.symbol; s != bottom; s = chain_step(g, s, bottom)) parent = open(s, parent);
      stack.push_back({f.i, f.j, bottom, false, parent});
      continue;
    }
    if (back.rule == kLexical) {
      if (g.word_symbol(f.symbol)) {
        tree.add_leaf(words[f.i], f.parent);
      } else {
        tree.add_leaf(words[f.i], open(f.symbol, f.parent));
      }
      continue;
    }
    const NodeId node = open(f.symbol, f.parent);
    const auto [left, right] = g.children(back.rule);
    stack.push_back({back.split, f.j, right, true, node});
    stack.push_back({f.i, back.split, left, true, node});
  }
  return tree;
}

}  // namespace treegate::pcfg
