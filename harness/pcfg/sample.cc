#include "harness/pcfg/sample.h"

#include <algorithm>
#include <unordered_map>

#include "evaluator/errors.h"
#include "harness/pcfg/transforms.h"

namespace treegate::pcfg {

std::uint64_t SampleRng::next() {
  // splitmix64 (Steele, Lea & Flood 2014, "Fast splittable pseudorandom number generators").
  std::uint64_t z = (state_ += 0x9e3779b97f4a7c15ULL);
  z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
  z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
  return z ^ (z >> 31);
}

Sampler::Sampler(const Grammar& grammar, const LabelTable& labels) : table_(&labels) {
  std::unordered_map<std::string, std::int32_t> nt_ids, t_ids;
  auto nonterminal = [&](const std::string& name) {
    auto [it, added] = nt_ids.try_emplace(name, static_cast<std::int32_t>(nonterminals_.size()));
    if (added) {
      nonterminals_.push_back(name);
      choices_.emplace_back();
    }
    return it->second;
  };
  auto terminal = [&](const std::string& text) {
    auto [it, added] = t_ids.try_emplace(text, static_cast<std::int32_t>(terminals_.size()));
    if (added) terminals_.push_back(text);
    return -it->second - 1;
  };
  start_ = nonterminal(grammar.header.start);
  std::vector<std::size_t> first_use;  // rule index where a nonterminal was first used
  for (std::size_t r = 0; r < grammar.rules.size(); ++r) {
    const Rule& rule = grammar.rules[r];
    Choice choice{rule.weight, {}};
    for (const RhsItem& item : rule.rhs) {
      if (item.kind == ItemKind::nonterminal) {
        const std::int32_t id = nonterminal(item.text);
        if (first_use.size() <= static_cast<std::size_t>(id)) first_use.resize(id + 1, r);
        choice.rhs.push_back(id);
      } else {
        // An unknown-word class comes out as the word <unk:SIG>.
        choice.rhs.push_back(
            terminal(item.kind == ItemKind::terminal ? item.text : format_item(item)));
      }
    }
    choices_[static_cast<std::size_t>(nonterminal(rule.lhs))].push_back(std::move(choice));
  }
  for (std::size_t id = 0; id < choices_.size(); ++id) {
    auto& list = choices_[id];
    double total = 0;
    for (Choice& c : list) c.cumulative = total += std::max(c.cumulative, 0.0);
    if (list.empty() || total <= 0) {
      const std::string& name = nonterminals_[id];
      if (static_cast<std::int32_t>(id) == start_)
        throw InputError(grammar.source, grammar.header.start_line, 0,
                         "start symbol " + quote_for_message(name) + " has no rules to sample");
      const Rule& user = grammar.rules[first_use[id]];
      throw InputError(grammar.source, user.line, 0,
                       "nonterminal " + quote_for_message(name) +
                           " has no rules (with positive weight) to sample");
    }
    for (Choice& c : list) c.cumulative /= total;
    list.back().cumulative = 1.0;
  }
  for (const std::string& name : nonterminals_) {
    labels_.push_back(const_cast<LabelTable*>(table_)->intern(name));
  }
}

std::optional<Tree> Sampler::draw(SampleRng& rng, const SampleOptions& options) const {
  Tree tree(*table_);
  struct Pending {
    std::int32_t item;
    NodeId parent;
    std::uint32_t depth;
  };
  std::vector<Pending> stack{{start_, kNoNode, 1}};
  while (!stack.empty()) {
    const Pending p = stack.back();
    stack.pop_back();
    if (p.item < 0) {
      tree.add_leaf(terminals_[static_cast<std::size_t>(-p.item - 1)], p.parent);
      continue;
    }
    if (p.depth > options.max_depth || tree.size() >= options.max_nodes) return std::nullopt;
    const NodeId node = tree.add_node(labels_[static_cast<std::size_t>(p.item)], p.parent);
    const auto& list = choices_[static_cast<std::size_t>(p.item)];
    const double u = rng.unit();
    const auto chosen = std::upper_bound(
        list.begin(), list.end(), u, [](double x, const Choice& c) { return x < c.cumulative; });
    const Choice& c = chosen == list.end() ? list.back() : *chosen;
    for (auto it = c.rhs.rbegin(); it != c.rhs.rend(); ++it)
      stack.push_back({*it, node, p.depth + 1});
  }
  return tree;
}

SampleStats sample_trees(const Grammar& grammar, std::size_t n, const SampleOptions& options,
                         const std::function<void(const Tree&)>& emit) {
  const Sampler sampler(grammar);
  SampleRng rng(options.seed);
  SampleStats stats;
  std::size_t in_a_row = 0;
  while (stats.trees < n) {
    std::optional<Tree> tree = sampler.draw(rng, options);
    if (!tree) {
      ++stats.discarded;
      if (++in_a_row >= options.max_attempts) {
        throw InputError(grammar.source + ": " + std::to_string(in_a_row) +
                         " draws in a row went deeper than " + std::to_string(options.max_depth) +
                         " levels or past " + std::to_string(options.max_nodes) +
                         " nodes; raise the limits, or check that the grammar is consistent "
                         "(treegate lint)");
      }
      continue;
    }
    in_a_row = 0;
    if (!options.raw) undo_transforms(*tree, grammar.header);
    emit(*tree);
    ++stats.trees;
  }
  return stats;
}

}  // namespace treegate::pcfg
