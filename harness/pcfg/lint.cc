#include "harness/pcfg/lint.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>
#include <set>
#include <unordered_map>

#include "evaluator/errors.h"

namespace treegate::pcfg {
namespace {

bool usable(double w) { return w > 0 && std::isfinite(w); }

std::string number(double v) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.10g", v);
  return buffer;
}

std::string q(const std::string& s) { return quote_for_message(s); }

struct Index {
  std::map<std::string, std::vector<const Rule*>> by_lhs;  // ordered for stable output
  std::map<std::string, std::size_t> first_use;            // nonterminal on a RHS: first line
};

Index index_of(const Grammar& g) {
  Index ix;
  for (const Rule& r : g.rules) {
    ix.by_lhs[r.lhs].push_back(&r);
    for (const RhsItem& item : r.rhs) {
      if (item.kind == ItemKind::nonterminal) ix.first_use.emplace(item.text, r.line);
    }
  }
  return ix;
}

void check_weights(const Grammar& g, const Index& ix, const LintOptions& o,
                   std::vector<LintFinding>& out) {
  std::unordered_map<std::string, std::size_t> seen;
  for (const Rule& r : g.rules) {
    if (!usable(r.written_weight)) {
      out.push_back({"weight", r.line,
                     "weight " + format_weight(r.written_weight) + " of " + format_rule(r) +
                         ": expected a positive finite number"});
    }
    auto [it, fresh] = seen.emplace(format_rule(r), r.line);
    if (!fresh) {
      out.push_back({"duplicate", r.line,
                     format_rule(r) + " repeats the rule on line " + std::to_string(it->second)});
    }
  }
  if (g.header.weights == WeightKind::counts) return;  // normalised on load
  for (const auto& [lhs, rules] : ix.by_lhs) {
    double sum = 0;
    for (const Rule* r : rules) sum += r->weight;
    if (std::abs(sum - 1) > o.tolerance || std::isnan(sum)) {
      out.push_back({"sum", rules.front()->line,
                     "probabilities of the " + std::to_string(rules.size()) + " rules of " +
                         q(lhs) + " sum to " + number(sum) + ", expected 1 (tolerance " +
                         number(o.tolerance) + "; --normalize writes a fixed copy)"});
    }
  }
}

void check_symbols(const Grammar& g, const Index& ix, std::vector<LintFinding>& out) {
  const std::string& start = g.header.start;
  if (start.empty()) {
    out.push_back({"start", 0, "no @start line: expected '@start SYMBOL' before the rules"});
  } else if (!ix.by_lhs.count(start)) {
    out.push_back({"start", g.header.start_line, "start symbol " + q(start) + " has no rules"});
  }
  // Reachable from the start symbol.
  std::set<std::string> reached;
  std::vector<std::string> stack;
  if (!start.empty()) stack.push_back(start), reached.insert(start);
  while (!stack.empty()) {
    std::string s = stack.back();
    stack.pop_back();
    auto it = ix.by_lhs.find(s);
    if (it == ix.by_lhs.end()) continue;
    for (const Rule* r : it->second) {
      for (const RhsItem& item : r->rhs) {
        if (item.kind == ItemKind::nonterminal && reached.insert(item.text).second)
          stack.push_back(item.text);
      }
    }
  }
  // Productive: derives some terminal string (fixed point).
  std::set<std::string> productive;
  for (bool changed = true; changed;) {
    changed = false;
    for (const Rule& r : g.rules) {
      if (productive.count(r.lhs) || !usable(r.weight)) continue;
      bool all = std::all_of(r.rhs.begin(), r.rhs.end(), [&](const RhsItem& i) {
        return i.kind != ItemKind::nonterminal || productive.count(i.text);
      });
      if (all) productive.insert(r.lhs), changed = true;
    }
  }
  for (const auto& [lhs, rules] : ix.by_lhs) {
    if (!start.empty() && !reached.count(lhs)) {
      out.push_back({"unreachable", rules.front()->line,
                     q(lhs) + " cannot be reached from the start symbol " + q(start)});
    }
    if (!productive.count(lhs)) {
      out.push_back(
          {"unproductive", rules.front()->line,
           q(lhs) + " derives no string of words (every rule of it needs an unproductive symbol)"});
    }
  }
  for (const auto& [name, line] : ix.first_use) {
    if (!ix.by_lhs.count(name)) {
      out.push_back(
          {"unproductive", line, q(name) + " is used but has no rules (undefined nonterminal)"});
    }
  }
  // A tag that rewrites to itself (`, -> ","`, the treebank habit for punctuation) is fine;
  // any other use of a nonterminal's name as a word is reported.
  std::map<std::string, std::size_t> clash;
  for (const Rule& r : g.rules) {
    for (const RhsItem& item : r.rhs) {
      const bool self = r.rhs.size() == 1 && r.lhs == item.text;
      if (item.kind == ItemKind::terminal && !self &&
          (ix.by_lhs.count(item.text) || ix.first_use.count(item.text))) {
        clash.emplace(item.text, r.line);
      }
    }
  }
  for (const auto& [text, line] : clash) {
    {
      out.push_back({"terminal-nonterminal", line,
                     q(text) + " is used both as a terminal and as a nonterminal"});
    }
  }
}

void check_unary_cycles(const Grammar& g, std::vector<LintFinding>& out) {
  std::map<std::string, std::vector<std::pair<std::string, std::size_t>>> down;
  for (const Rule& r : g.rules) {
    if (r.rhs.size() == 1 && r.rhs[0].kind == ItemKind::nonterminal)
      down[r.lhs].push_back({r.rhs[0].text, r.line});
  }
  std::set<std::string> reported;
  for (const auto& [from, edges] : down) {
    if (reported.count(from)) continue;
    // Depth-first search for a path back to `from`, remembering the route.
    std::map<std::string, std::pair<std::string, std::size_t>> parent;
    std::vector<std::string> stack{from};
    std::string closing;
    std::size_t closing_line = 0;
    while (!stack.empty() && closing.empty()) {
      std::string s = stack.back();
      stack.pop_back();
      auto it = down.find(s);
      if (it == down.end()) continue;
      for (const auto& [to, line] : it->second) {
        if (to == from) {
          closing = s, closing_line = line;
          break;
        }
        if (!parent.count(to)) parent[to] = {s, line}, stack.push_back(to);
      }
    }
    if (closing.empty()) continue;
    std::vector<std::string> path{from};
    std::string lines = std::to_string(closing_line);
    for (std::string s = closing; s != from; s = parent[s].first) {
      path.insert(path.begin() + 1, s);
      lines = std::to_string(parent[s].second) + ", " + lines;
      reported.insert(s);
    }
    std::string text;
    for (const std::string& s : path) text += s + " -> ";
    out.push_back({"unary-cycle", edges.front().second,
                   "unary cycle " + text + from +
                       (path.size() == 1 ? " (rule on line " : " (rules on lines ") + lines + ")"});
    reported.insert(from);
  }
}

}  // namespace

namespace {

/// Strongly connected components (iterative Tarjan); returns the component of each node.
std::vector<std::size_t> components(const std::vector<std::vector<std::size_t>>& next) {
  const std::size_t n = next.size(), none = static_cast<std::size_t>(-1);
  std::vector<std::size_t> index(n, none), low(n), comp(n, none), stack;
  std::vector<char> on(n, 0);
  std::size_t counter = 0, ncomp = 0;
  struct Frame {
    std::size_t node, edge;
  };
  for (std::size_t root = 0; root < n; ++root) {
    if (index[root] != none) continue;
    std::vector<Frame> calls{{root, 0}};
    index[root] = low[root] = counter++;
    stack.push_back(root), on[root] = 1;
    while (!calls.empty()) {
      Frame& f = calls.back();
      if (f.edge < next[f.node].size()) {
        const std::size_t to = next[f.node][f.edge++];
        if (index[to] == none) {
          index[to] = low[to] = counter++;
          stack.push_back(to), on[to] = 1;
          calls.push_back({to, 0});
        } else if (on[to]) {
          low[f.node] = std::min(low[f.node], index[to]);
        }
        continue;
      }
      const std::size_t v = f.node;
      calls.pop_back();
      if (!calls.empty()) low[calls.back().node] = std::min(low[calls.back().node], low[v]);
      if (low[v] == index[v]) {
        for (std::size_t w = none; w != v;) {
          w = stack.back();
          stack.pop_back(), on[w] = 0;
          comp[w] = ncomp;
        }
        ++ncomp;
      }
    }
  }
  return comp;
}

}  // namespace

double mean_production_radius(const Grammar& g, bool* converged) {
  std::unordered_map<std::string, std::size_t> id;
  for (const Rule& r : g.rules) id.emplace(r.lhs, id.size());
  const std::size_t n = id.size();
  struct Cell {
    std::size_t row, col;
    double v;
  };
  std::vector<Cell> m;
  std::vector<std::vector<std::size_t>> next(n);
  for (const Rule& r : g.rules) {
    if (!usable(r.weight)) continue;
    for (const RhsItem& item : r.rhs) {
      auto it = id.find(item.text);
      if (item.kind != ItemKind::nonterminal || it == id.end()) continue;
      m.push_back({id[r.lhs], it->second, r.weight});
      next[id[r.lhs]].push_back(it->second);
    }
  }
  // The radius is the largest over the strongly connected components; on one component M + I
  // is primitive, so power iteration converges (to the radius plus 1).
  const std::vector<std::size_t> comp = components(next);
  std::map<std::size_t, std::vector<Cell>> within;
  for (const Cell& c : m) {
    if (comp[c.row] == comp[c.col]) within[comp[c.row]].push_back(c);
  }
  double radius = 0;
  bool all_done = true;
  std::vector<double> x(n), y(n);
  for (const auto& [component, cells] : within) {
    std::vector<std::size_t> nodes;
    for (std::size_t i = 0; i < n; ++i) {
      if (comp[i] == component) nodes.push_back(i);
    }
    for (std::size_t i : nodes) x[i] = 1.0;
    double estimate = 0;
    bool done = false;
    for (int round = 0; round < 100000 && !done; ++round) {
      for (std::size_t i : nodes) y[i] = x[i];
      for (const Cell& c : cells) y[c.row] += c.v * x[c.col];
      double norm = 0;
      for (std::size_t i : nodes) norm = std::max(norm, y[i]);
      done = round > 10 && std::abs(norm - estimate) <= 1e-14 * norm;
      estimate = norm;
      for (std::size_t i : nodes) x[i] = y[i] / norm;
    }
    all_done = all_done && done;
    radius = std::max(radius, estimate - 1.0);
  }
  if (converged) *converged = all_done;
  return radius;
}

Grammar normalized(const Grammar& g, std::vector<std::size_t>* dropped) {
  std::unordered_map<std::string, double> total;
  for (const Rule& r : g.rules) {
    if (usable(r.weight)) total[r.lhs] += r.weight;
  }
  Grammar out;
  out.header = g.header;
  out.header.weights = WeightKind::probabilities;
  out.source = g.source;
  for (const Rule& r : g.rules) {
    if (!usable(r.weight)) {
      if (dropped) dropped->push_back(r.line);
      continue;
    }
    Rule copy = r;
    copy.weight = copy.written_weight = r.weight / total[r.lhs];
    out.rules.push_back(std::move(copy));
  }
  return out;
}

LintReport lint_grammar(const Grammar& g, const LintOptions& options) {
  LintReport report;
  const Index ix = index_of(g);
  report.nonterminals = ix.by_lhs.size();
  report.rules = g.rules.size();
  check_weights(g, ix, options, report.findings);
  check_symbols(g, ix, report.findings);
  check_unary_cycles(g, report.findings);
  report.spectral_radius = mean_production_radius(g, &report.radius_converged);
  if (!(report.spectral_radius < 1 - 1e-9) && report.radius_converged) {
    report.findings.push_back(
        {"inconsistent", 0,
         "not consistent: the spectral radius of the mean-production matrix is " +
             number(report.spectral_radius) +
             " (>= 1), so derivations need not terminate and the expected tree "
             "size is infinite (Booth & Thompson 1973)"});
  } else if (!report.radius_converged) {
    report.findings.push_back({"inconsistent", 0,
                               "consistency unknown: the power iteration for the spectral radius "
                               "did not converge (estimate " +
                                   number(report.spectral_radius) + ")"});
  }
  std::stable_sort(report.findings.begin(), report.findings.end(),
                   [](const LintFinding& a, const LintFinding& b) { return a.line < b.line; });
  return report;
}

}  // namespace treegate::pcfg
