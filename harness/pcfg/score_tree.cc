#include "harness/pcfg/score_tree.h"

#include <cmath>
#include <unordered_map>

#include "evaluator/errors.h"
#include "harness/pcfg/signature.h"

namespace treegate::pcfg {
namespace {

/// The rule a node uses, written as in a grammar file.
std::string node_rule(const CompiledGrammar& g, const Tree& tree, NodeId id) {
  Rule rule;
  rule.lhs = std::string(tree.label(id));
  const bool preterminal = tree.is_preterminal(id);
  for (NodeId c = tree.node(id).first_child; c != kNoNode; c = tree.node(c).next_sibling) {
    const Node& child = tree.node(c);
    if (!child.is_leaf()) {
      rule.rhs.push_back({ItemKind::nonterminal, std::string(tree.label(c))});
      continue;
    }
    const std::string word(tree.word(static_cast<std::size_t>(child.word)));
    if (preterminal && g.lexicon(word) == nullptr && g.has_unknown_classes()) {
      rule.rhs.push_back({ItemKind::unknown_class, word_signature(word)});
    } else {
      rule.rhs.push_back({ItemKind::terminal, word});
    }
  }
  return format_rule(rule);
}

}  // namespace

TreeScore score_tree(const CompiledGrammar& g, const Tree& tree) {
  TreeScore out;
  if (tree.empty()) {
    out.problem = "the tree is empty";
    return out;
  }
  if (tree.label(tree.root()) != g.name(g.start())) {
    out.problem = "the root is " + quote_for_message(std::string(tree.label(tree.root()))) +
                  " but the grammar's start symbol is " + quote_for_message(g.name(g.start()));
  }
  // Word spans, children before parents (child ids are greater than their parent's).
  std::vector<NodeSpan> spans(tree.size());
  for (NodeId id = static_cast<NodeId>(tree.size()) - 1; id >= 0; --id) {
    const Node& n = tree.node(id);
    NodeSpan& s = spans[static_cast<std::size_t>(id)];
    s.node = id;
    if (n.is_leaf()) {
      s.from = static_cast<std::size_t>(n.word);
      s.to = s.from + 1;
    } else if (n.first_child == kNoNode) {
      s.from = s.to = 0;
    } else {
      s.from = spans[static_cast<std::size_t>(n.first_child)].from;
      s.to = spans[static_cast<std::size_t>(n.last_child)].to;
    }
  }
  std::unordered_map<std::string, std::size_t> used_index, missing_index;
  for_each_preorder(tree, [&](NodeId id) {
    if (tree.node(id).is_leaf()) return;
    const std::string rule = node_rule(g, tree, id);
    const NodeSpan& span = spans[static_cast<std::size_t>(id)];
    auto [it, fresh] = used_index.emplace(rule, out.used.size());
    if (fresh) out.used.push_back({rule, g.rule_logp(rule), {}});
    RuleUse& use = out.used[it->second];
    use.at.push_back(span);
    if (std::isnan(use.logp)) {
      auto [m, new_missing] = missing_index.emplace(rule, out.missing.size());
      if (new_missing) out.missing.push_back({rule, use.logp, {}});
      out.missing[m->second].at.push_back(span);
    } else {
      out.logprob += use.logp;
    }
  });
  out.derivable = out.missing.empty() && out.problem.empty();
  if (!out.derivable) out.logprob = -INFINITY;
  return out;
}

}  // namespace treegate::pcfg
