// The unary closure of a CompiledGrammar. For each bottom symbol B and each A with A =>* B by
// unary rules: the best chain (max product, Bellman-Ford), the sum over all chains
// ((I - U)^-1, by fixed-point iteration to convergence), and the number of chains (infinite
// when a chain can pass through a unary cycle).
#include <cmath>
#include <limits>
#include <tuple>

#include "harness/pcfg/compiled_grammar.h"

namespace treegate::pcfg {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

struct Up {
  Symbol parent;
  double p;
};

/// Symbols reachable upward from `from` by one or more unary steps.
std::vector<char> reach_up(const std::vector<std::vector<Up>>& up, Symbol from) {
  std::vector<char> seen(up.size(), 0);
  std::vector<Symbol> stack{from};
  while (!stack.empty()) {
    Symbol s = stack.back();
    stack.pop_back();
    for (const Up& u : up[s]) {
      if (!seen[u.parent]) {
        seen[u.parent] = 1;
        stack.push_back(u.parent);
      }
    }
  }
  return seen;
}

}  // namespace

void CompiledGrammar::build_unary_closure(
    const std::vector<std::tuple<Symbol, Symbol, double>>& unary) {
  const std::size_t n = names_.size();
  closure_.assign(n, {});
  std::vector<std::vector<Up>> up(n);
  std::vector<std::vector<Up>> down(n);  // rules A -> X listed under A (X in .parent)
  for (const auto& [a, b, p] : unary) {
    up[b].push_back({a, p});
    down[a].push_back({b, p});
  }
  std::vector<char> cyclic(n, 0);
  for (Symbol s = 0; s < n; ++s) {
    if (!up[s].empty()) cyclic[s] = reach_up(up, s)[s];
    unary_cycles_ = unary_cycles_ || cyclic[s];
  }
  for (Symbol b = 0; b < n; ++b) {
    if (up[b].empty()) {
      closure_[b].push_back({b, b, 0.0, 1.0, 1.0, 1});
      continue;
    }
    std::vector<char> reach = reach_up(up, b);
    reach[b] = 1;
    std::vector<Symbol> nodes;
    for (Symbol s = 0; s < n; ++s) {
      if (reach[s]) nodes.push_back(s);
    }
    // Infinite chain counts: everything at or above a reachable cyclic symbol.
    std::vector<char> infinite(n, 0);
    for (Symbol s : nodes) {
      if (!cyclic[s]) continue;
      infinite[s] = 1;
      std::vector<char> above = reach_up(up, s);
      for (Symbol t : nodes) infinite[t] = infinite[t] || above[t];
    }
    std::vector<double> best(n, -kInf), sum(n, 0.0), count(n, 0.0);
    std::vector<std::uint64_t> count64(n, 0);
    std::vector<Symbol> via(n, b);
    best[b] = 0.0;
    // Best chains: Bellman-Ford over the reachable symbols (at most |nodes| rounds).
    for (std::size_t round = 0; round < nodes.size(); ++round) {
      bool changed = false;
      for (Symbol a : nodes) {
        for (const Up& d : down[a]) {
          if (!reach[d.parent] || best[d.parent] == -kInf) continue;
          double v = best[d.parent] + std::log(d.p);
          if (v > best[a] && (best[a] == -kInf || v - best[a] > 1e-15 * std::abs(best[a]))) {
            if (a == b) continue;  // the empty chain is the best way from b to itself
            best[a] = v;
            via[a] = d.parent;
            changed = true;
          }
        }
      }
      if (!changed) break;
    }
    // Summed chains and chain counts: fixed-point iteration of x = e_b + U x.
    for (std::size_t round = 0; round < 100000; ++round) {
      double change = 0;
      for (Symbol a : nodes) {
        double s = a == b ? 1.0 : 0.0, c = s;
        std::uint64_t c64 = a == b ? 1 : 0;
        for (const Up& d : down[a]) {
          if (!reach[d.parent]) continue;
          s += d.p * sum[d.parent];
          if (!infinite[d.parent]) {
            c += count[d.parent];
            c64 += count64[d.parent];
          }
        }
        if (infinite[a]) c = kInf;
        double old = sum[a];
        change = std::max(change, std::abs(s - old) / std::max(1.0, std::abs(s)));
        if (count[a] != c) change = std::max(change, 1.0);
        sum[a] = s > 1e300 ? kInf : s;
        count[a] = c;
        count64[a] = c64;
      }
      if (change < 1e-16 || (round > nodes.size() && std::isinf(change))) break;
    }
    closure_[b].push_back({b, b, 0.0, sum[b], count[b], count64[b]});
    for (Symbol a : nodes) {
      if (a != b) closure_[b].push_back({a, via[a], best[a], sum[a], count[a], count64[a]});
    }
  }
}

}  // namespace treegate::pcfg
