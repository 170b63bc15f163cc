// Lazy k-best over the filled chart: Huang & Chiang (2005), "Better k-best parsing",
// Algorithm 3. Nodes are (cell, symbol) before (pre) and after (post) the unary closure; a
// post node's incoming edges are the best unary chain from each pre-unary symbol of the cell,
// so trees that differ only in the unary chain between the same two symbols are not listed
// separately. Derivations are built only for the nodes the k best trees visit.
#include <algorithm>
#include <cmath>
#include <queue>
#include <set>
#include <unordered_map>
#include <unordered_set>

#include "harness/pcfg/chart.h"
#include "harness/pcfg/parser.h"

namespace treegate::pcfg {
namespace {

struct NodeKey {
  std::uint32_t i, j;
  Symbol s;
  bool post;
  std::uint64_t id() const { return (((std::uint64_t{i} << 20 | j) << 1 | post) << 24) ^ s; }
};

struct Edge {
  double weight;
  NodeKey tails[2];
  int arity;           // 0 (word), 1 (unary chain), 2 (binary rule)
  std::uint32_t rule;  // binary target index, for the tree
};

struct Deriv {
  double score;
  std::uint32_t edge;
  std::uint32_t rank[2];
  bool operator<(const Deriv& o) const { return score < o.score; }  // max-heap on score
};

struct NodeState {
  std::vector<Edge> edges;
  std::vector<Deriv> found;  // D: derivations in order
  std::priority_queue<Deriv> candidates;
  std::set<std::tuple<std::uint32_t, std::uint32_t, std::uint32_t>> queued;
  std::size_t expanded = 0;
};

class KBest {
 public:
  KBest(const Chart& c, const CompiledGrammar& g) : c_(c), g_(g) {}

  /// The k-th best derivation of `v` (0-based), or nullptr.
  const Deriv* kth(const NodeKey& v, std::size_t k) {
    NodeState& st = state(v);
    while (st.found.size() <= k) {
      if (st.expanded < st.found.size()) push_next(v, st, st.found[st.expanded++]);
      if (st.candidates.empty()) return nullptr;
      st.found.push_back(st.candidates.top());
      st.candidates.pop();
    }
    return &st.found[k];
  }

  NodeState& state(const NodeKey& v) {
    auto [it, fresh] = nodes_.try_emplace(v.id());
    if (fresh) init(v, it->second);
    return it->second;
  }

 private:
  /// Presence of a symbol in a cell, through a per-cell index built on first use.
  bool has(std::size_t cell, Symbol s) {
    auto [it, fresh] = present_.try_emplace(cell);
    if (fresh) {
      for (std::uint32_t li = c_.list_begin[cell]; li < c_.list_end[cell]; ++li)
        it->second.insert(c_.lists[li]);
    }
    return it->second.count(s) > 0;
  }

  double best(const NodeKey& v) const {
    if (v.post) return c_.entry(c_.cell(v.i, v.j), v.s).vit;
    return pre_vit(c_, g_, v.i, v.j, v.s);
  }

  void init(const NodeKey& v, NodeState& st) {
    const std::size_t cell = c_.cell(v.i, v.j);
    if (v.post) {
      for (std::uint32_t li = c_.list_begin[cell]; li < c_.list_end[cell]; ++li) {
        if (c_.backs[li].rule == kNotPre) continue;
        const Symbol b = c_.lists[li];
        for (const UnaryLink& link : g_.unary_above(b)) {
          if (link.top == v.s) st.edges.push_back({link.logp, {{v.i, v.j, b, false}, {}}, 1, 0});
        }
      }
    } else if (v.j == v.i + 1) {
      for (const LexEntry& e : c_.lex[v.i]) {
        if (e.symbol == v.s) st.edges.push_back({e.logp, {}, 0, kLexical});
      }
    } else {
      for (std::uint32_t k = v.i + 1; k < v.j; ++k) {
        const std::size_t left = c_.cell(v.i, k), right = c_.cell(k, v.j);
        for (const auto& r : g_.rules_of(v.s)) {
          if (has(left, r.left) && has(right, r.right)) {
            st.edges.push_back(
                {r.logp, {{v.i, k, r.left, true}, {k, v.j, r.right, true}}, 2, r.target});
          }
        }
      }
    }
    for (std::uint32_t e = 0; e < st.edges.size(); ++e) {
      const Edge& edge = st.edges[e];
      double score = edge.weight;
      for (int t = 0; t < edge.arity; ++t) score += best(edge.tails[t]);
      if (std::isfinite(score)) {
        st.candidates.push({score, e, {0, 0}});
        st.queued.insert({e, 0, 0});
      }
    }
  }

  void push_next(const NodeKey& v, NodeState& st, Deriv d) {
    (void)v;
    const Edge edge = st.edges[d.edge];
    for (int t = 0; t < edge.arity; ++t) {
      Deriv next = d;
      ++next.rank[t];
      if (!st.queued.insert({next.edge, next.rank[0], next.rank[1]}).second) continue;
      double score = edge.weight;
      bool ok = true;
      for (int u = 0; u < edge.arity && ok; ++u) {
        const Deriv* sub = kth(edge.tails[u], next.rank[u]);
        ok = sub != nullptr;
        if (ok) score += sub->score;
      }
      // kth may have grown `nodes_`, but NodeState references stay valid (unordered_map).
      if (ok) {
        next.score = score;
        st.candidates.push(next);
      }
    }
  }

  const Chart& c_;
  const CompiledGrammar& g_;
  std::unordered_map<std::uint64_t, NodeState> nodes_;
  std::unordered_map<std::size_t, std::unordered_set<Symbol>> present_;
};

}  // namespace

std::vector<ScoredTree> kbest_trees(const Chart& c, const CompiledGrammar& g,
                                    const std::vector<std::string>& words, std::size_t k) {
  KBest kb(c, g);
  std::vector<ScoredTree> out;
  const NodeKey root{0, static_cast<std::uint32_t>(words.size()), g.start(), true};
  for (std::size_t r = 0; r < k; ++r) {
    const Deriv* d = kb.kth(root, r);
    if (d == nullptr) break;
    ScoredTree scored;
    scored.logprob = d->score;
    struct Frame {
      NodeKey v;
      std::uint32_t rank;
      NodeId parent;
    };
    std::vector<Frame> stack{{root, static_cast<std::uint32_t>(r), kNoNode}};
    Tree& tree = scored.tree;
    while (!stack.empty()) {
      const Frame f = stack.back();
      stack.pop_back();
      const Deriv& dv = *kb.kth(f.v, f.rank);
      const Edge& edge = kb.state(f.v).edges[dv.edge];
      NodeId parent = f.parent;
      if (f.v.post) {
        const Symbol bottom = edge.tails[0].s;
        for (Symbol s = f.v.s; s != bottom;) {
          if (!g.internal(s)) parent = tree.add_node(g.name(s), parent);
          Symbol next = bottom;
          for (const UnaryLink& link : g.unary_above(bottom)) {
            if (link.top == s) next = link.via;
          }
          s = next;
        }
        stack.push_back({edge.tails[0], dv.rank[0], parent});
      } else if (edge.arity == 0) {
        if (!g.word_symbol(f.v.s)) parent = tree.add_node(g.name(f.v.s), parent);
        tree.add_leaf(words[f.v.i], parent);
      } else {
        if (!g.internal(f.v.s)) parent = tree.add_node(g.name(f.v.s), parent);
        stack.push_back({edge.tails[1], dv.rank[1], parent});
        stack.push_back({edge.tails[0], dv.rank[0], parent});
      }
    }
    out.push_back(std::move(scored));
  }
  return out;
}

}  // namespace treegate::pcfg
