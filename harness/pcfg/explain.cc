// explain: the gold tree against the parser's best tree under one grammar.
// Tested by tests/pcfg/explain_test.cc.
#include "harness/pcfg/explain.h"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <map>
#include <set>
#include <tuple>

#include "evaluator/bracket_io.h"
#include "harness/pcfg/transforms_spec.h"
#include "harness/pcfg/transforms_tree.h"

namespace treegate::pcfg {
namespace {

using Key = std::tuple<std::string, std::size_t, std::size_t>;  // label, first word, end

// Label and word span [start, end) of every internal node, by node id (iterative).
std::vector<Key> node_keys(const Tree& t) {
  std::vector<Key> keys(t.size());
  std::vector<std::size_t> lo(t.size(), SIZE_MAX), hi(t.size(), 0);
  for (std::size_t i = t.size(); i-- > 0;) {
    const Node& n = t.node(static_cast<NodeId>(i));
    if (n.is_leaf()) lo[i] = static_cast<std::size_t>(n.word), hi[i] = lo[i] + 1;
    if (n.parent != kNoNode) {
      const auto p = static_cast<std::size_t>(n.parent);
      lo[p] = std::min(lo[p], lo[i]);
      hi[p] = std::max(hi[p], hi[i]);
    }
    keys[i] = {std::string(t.label(static_cast<NodeId>(i))), lo[i], hi[i]};
  }
  return keys;
}

// One line per internal node, indented by depth, with its words; '*' marks a node whose
// label and span the other tree lacks.
std::string draw(const Tree& t, const Tree& other) {
  if (t.empty()) return "  (no tree)\n";
  const auto keys = node_keys(t), other_keys = node_keys(other);
  std::multiset<Key> there;
  for (std::size_t i = 0; i < other.size(); ++i) {
    if (!other.node(static_cast<NodeId>(i)).is_leaf()) there.insert(other_keys[i]);
  }
  std::vector<std::size_t> depth(t.size(), 0);
  std::string out;
  for_each_preorder(t, [&](NodeId id) {
    const Node& n = t.node(id);
    const auto i = static_cast<std::size_t>(id);
    if (n.parent != kNoNode) depth[i] = depth[static_cast<std::size_t>(n.parent)] + 1;
    if (n.is_leaf()) return;
    const auto& [label, from, to] = keys[i];
    auto it = there.find(keys[i]);
    const bool shared = it != there.end();
    if (shared) there.erase(it);
    std::string words;
    for (std::size_t w = from; w < to; ++w) words += (w > from ? " " : "") + std::string(t.word(w));
    const std::string head = std::string(2 * depth[i], ' ') + label;
    out += fmt::format("{} {:<28} {}\n", shared ? ' ' : '*', head, words);
  });
  return out;
}

// `t` in the grammar's own labels: the header's transforms applied forward (parent
// annotation, binarization, ...), as the estimator applied them to its treebank. A grammar
// without transforms takes trees as they are.
Tree in_grammar_labels(const Tree& t, const CompiledGrammar& grammar) {
  if (grammar.header().transforms.empty() || t.empty()) return t;
  EditTree edit = to_edit_tree(t);
  apply_transforms(edit, from_pairs(grammar.header().transforms, grammar.source()));
  return to_tree(edit, t.labels());
}

std::map<std::string, const RuleUse*> by_rule(const TreeScore& s) {
  std::map<std::string, const RuleUse*> out;
  for (const RuleUse& u : s.used) out[u.rule] = &u;
  return out;
}

}  // namespace

Explanation explain_tree(const std::shared_ptr<const CompiledGrammar>& grammar, const Tree& gold,
                         const ExplainOptions& options) {
  Explanation e;
  e.gold = gold;
  for (std::string_view w : gold.words()) e.words.emplace_back(w);
  e.kbest = options.kbest;
  // Rules are compared in the grammar's labels; trees are shown in the original ones.
  const Tree gold_g = in_grammar_labels(gold, *grammar);
  e.gold_score = score_tree(*grammar, gold_g);
  Parser parser(grammar);
  ParseOptions po;
  po.kbest = options.kbest;
  po.gold_tags = options.gold_tags;
  std::vector<std::string> tags;
  for (std::string_view t : gold.tags()) tags.emplace_back(t);
  e.parse = parser.parse(e.words, options.gold_tags ? &tags : nullptr, po);
  if (e.parse.status != ParseStatus::parsed) return e;
  const std::string gold_text = to_bracketed(gold_g);
  const Tree best_g = in_grammar_labels(e.parse.tree, *grammar);
  e.gold_is_best = to_bracketed(best_g) == gold_text;
  for (std::size_t k = 0; k < e.parse.kbest.size(); ++k) {
    if (to_bracketed(in_grammar_labels(e.parse.kbest[k].tree, *grammar)) == gold_text) {
      e.gold_rank = k + 1;
      break;
    }
  }
  e.best_score = score_tree(*grammar, best_g);
  if (!e.gold_score.derivable) return e;
  e.gap = e.parse.logprob - e.gold_score.logprob;
  const auto g = by_rule(e.gold_score), b = by_rule(e.best_score);
  std::set<std::string> rules;
  for (const auto& [r, u] : g) rules.insert(r);
  for (const auto& [r, u] : b) rules.insert(r);
  for (const std::string& r : rules) {
    RuleDifference d;
    d.rule = r;
    auto gi = g.find(r), bi = b.find(r);
    d.gold_uses = gi == g.end() ? 0 : gi->second->at.size();
    d.best_uses = bi == b.end() ? 0 : bi->second->at.size();
    if (d.gold_uses == d.best_uses) continue;
    d.logp = (gi != g.end() ? gi->second : bi->second)->logp;
    d.gap_share = (static_cast<double>(d.best_uses) - static_cast<double>(d.gold_uses)) * d.logp;
    if (d.gold_uses > d.best_uses && !e.gold_is_best) {
      d.needed = std::exp(d.logp + e.gap / static_cast<double>(d.gold_uses - d.best_uses));
    }
    e.differences.push_back(std::move(d));
  }
  std::stable_sort(e.differences.begin(), e.differences.end(),
                   [](const auto& x, const auto& y) { return x.gap_share > y.gap_share; });
  return e;
}

std::string explanation_text(const Explanation& e) {
  std::string out;
  std::string sentence;
  for (const auto& w : e.words) sentence += (sentence.empty() ? "" : " ") + w;
  out += "sentence: " + sentence + "\n";
  const bool parsed = e.parse.status == ParseStatus::parsed;
  out += parsed ? fmt::format("\nbest tree (log prob {:.6f}):\n", e.parse.logprob)
                : "\nbest tree: none (" + e.parse.reason + ")\n";
  if (parsed) out += draw(e.parse.tree, e.gold);
  out += e.gold_score.derivable
             ? fmt::format("\ngold tree (log prob {:.6f}):\n", e.gold_score.logprob)
             : std::string("\ngold tree (not derivable with this grammar):\n");
  out += draw(e.gold, parsed ? e.parse.tree : Tree(e.gold.labels()));
  out += "(* marks a bracket the other tree does not have)\n";
  if (!e.gold_score.derivable) {
    if (!e.gold_score.problem.empty()) out += "\nproblem: " + e.gold_score.problem + "\n";
    if (!e.gold_score.missing.empty())
      out += "\nrules the gold tree needs that the grammar lacks:\n";
    for (const RuleUse& m : e.gold_score.missing) {
      std::string where;
      for (const NodeSpan& s : m.at) {
        where += fmt::format("{}words {}-{}", where.empty() ? "" : ", ", s.from + 1, s.to);
      }
      out += fmt::format("  {}   at {}\n", m.rule, where);
    }
    return out;
  }
  if (!parsed) return out;
  if (e.gold_is_best) {
    out += "\nThe gold tree is the parser's best tree.\n";
    return out;
  }
  out += fmt::format(
      "\ngap: log P(best) - log P(gold) = {:.6f} nats (best is {:.4g} times as likely)\n", e.gap,
      std::exp(e.gap));
  out += "\nrules used a different number of times (largest share of the gap first):\n";
  out += fmt::format("  {:<32} {:>5} {:>5} {:>10} {:>10}  {}\n", "rule", "gold", "best", "log p",
                     "gap share", "p needed for gold to win");
  for (const RuleDifference& d : e.differences) {
    std::string need;
    if (d.needed) {
      need = *d.needed > 1 ? fmt::format("{:.6g} (impossible: above 1)", *d.needed)
                           : fmt::format("{:.6g} (now {:.6g})", *d.needed, std::exp(d.logp));
    }
    out += fmt::format("  {:<32} {:>5} {:>5} {:>10.4f} {:>+10.4f}  {}\n", d.rule, d.gold_uses,
                       d.best_uses, d.logp, d.gap_share, need);
  }
  if (e.kbest > 0) {
    out += e.gold_rank
               ? fmt::format("\ngold is number {} among the {} best trees\n", *e.gold_rank,
                             e.parse.kbest.size())
               : fmt::format("\ngold is not among the {} best trees\n", e.parse.kbest.size());
  }
  return out;
}

}  // namespace treegate::pcfg
