#include "harness/pcfg/estimate.h"

#include <algorithm>
#include <cstring>
#include <map>

#include "harness/pcfg/signature.h"

namespace treegate::pcfg {
namespace {

enum class EntryKind { phrasal, word, unknown };

struct Entry {
  std::uint32_t lhs;
  EntryKind kind;
  std::vector<RhsItem> rhs;
  std::uint64_t count;
};

std::uint32_t read_id(const std::string& key, std::size_t index) {
  std::uint32_t id;
  std::memcpy(&id, key.data() + index * sizeof id, sizeof id);
  return id;
}

}  // namespace

Estimator::Estimator(TransformSpec spec) : spec_(std::move(spec)) { symbol(spec_.start); }

std::uint32_t Estimator::symbol(const std::string& name) {
  auto [it, added] = symbol_ids_.try_emplace(name, static_cast<std::uint32_t>(symbols_.size()));
  if (added) symbols_.push_back(name);
  return it->second;
}

std::optional<TreeProblem> Estimator::add(const Tree& tree) {
  ++counts_.trees_read;
  if (auto problem = check_training_tree(tree)) return problem;
  EditTree edit = to_edit_tree(tree);
  const TransformSpec::Wrapper style = wrapper_style(edit, spec_.start);
  apply_transforms(edit, spec_);
  if (edit.root < 0) {
    return TreeProblem{
        tree.root(), "tree has no words once empty elements (" + spec_.empty_tag + ") are removed"};
  }
  ++wrappers_[static_cast<std::size_t>(style)];
  for (NodeId id = 0; id < static_cast<NodeId>(tree.size()); ++id) {
    if (tree.node(id).is_leaf()) continue;
    const LabelId label = tree.label_id(id);
    if (label >= raw_kind_.size()) raw_kind_.resize(label + 1, 0);
    raw_kind_[label] |= tree.is_preterminal(id) ? 2 : 1;
  }
  count_tree(edit);
  ++counts_.trees_used;
  return std::nullopt;
}

void Estimator::count_tree(const EditTree& tree) {
  // Each label is looked up once, whether it is counted as a left-hand side or a child.
  ids_.assign(tree.nodes.size(), 0);
  const std::vector<std::int32_t> order = tree.preorder();
  for (std::int32_t id : order) {
    const EditNode& n = tree.at(id);
    if (!n.is_leaf()) ids_[static_cast<std::size_t>(id)] = symbol(n.label);
  }
  for (std::int32_t id : order) {
    const EditNode& n = tree.at(id);
    if (n.is_leaf()) continue;
    const std::uint32_t lhs = ids_[static_cast<std::size_t>(id)];
    if (tree.is_preterminal(id)) {
      const std::string& text = tree.words[static_cast<std::size_t>(tree.at(n.kids[0]).word)];
      auto [it, added] = word_ids_.try_emplace(text, static_cast<std::uint32_t>(words_.size()));
      if (added) {
        words_.push_back(text);
        word_counts_.push_back(0);
      }
      ++word_counts_[it->second];
      ++lexical_[static_cast<std::uint64_t>(lhs) << 32 | it->second];
      ++counts_.words;
      continue;
    }
    key_.resize((n.kids.size() + 1) * sizeof lhs);
    std::memcpy(key_.data(), &lhs, sizeof lhs);
    for (std::size_t i = 0; i < n.kids.size(); ++i) {
      const std::uint32_t kid = ids_[static_cast<std::size_t>(n.kids[i])];
      std::memcpy(key_.data() + (i + 1) * sizeof kid, &kid, sizeof kid);
    }
    auto it = phrasal_.find(key_);
    if (it == phrasal_.end()) it = phrasal_.emplace(key_, 0).first;
    ++it->second;
  }
}

TransformSpec::Wrapper Estimator::wrapper() const {
  const auto most = std::max_element(wrappers_.begin(), wrappers_.end());
  if (*most == 0) return TransformSpec::Wrapper::kAsIs;
  return static_cast<TransformSpec::Wrapper>(most - wrappers_.begin());
}

Grammar Estimator::grammar() const {
  std::vector<Entry> entries;
  entries.reserve(phrasal_.size() + lexical_.size());
  for (const auto& [key, count] : phrasal_) {
    Entry e{read_id(key, 0), EntryKind::phrasal, {}, count};
    for (std::size_t i = 1; i < key.size() / sizeof(std::uint32_t); ++i) {
      e.rhs.push_back({ItemKind::nonterminal, symbols_[read_id(key, i)]});
    }
    entries.push_back(std::move(e));
  }
  std::map<std::pair<std::uint32_t, std::string>, std::uint64_t> unknown;
  std::vector<std::string> signatures(words_.size());
  for (const auto& [key, count] : lexical_) {
    const auto tag = static_cast<std::uint32_t>(key >> 32);
    const auto word = static_cast<std::uint32_t>(key & 0xffffffffu);
    entries.push_back({tag, EntryKind::word, {{ItemKind::terminal, words_[word]}}, count});
    if (word_counts_[word] > static_cast<std::uint64_t>(spec_.rare_words)) continue;
    if (signatures[word].empty()) signatures[word] = word_signature(words_[word]);
    unknown[{tag, signatures[word]}] += count;
  }
  for (const auto& [key, count] : unknown) {
    entries.push_back(
        {key.first, EntryKind::unknown, {{ItemKind::unknown_class, key.second}}, count});
  }
  std::vector<std::uint64_t> totals(symbols_.size(), 0);
  for (const Entry& e : entries) totals[e.lhs] += e.count;
  const std::uint32_t start = symbol_ids_.at(spec_.start);
  std::sort(entries.begin(), entries.end(), [&](const Entry& a, const Entry& b) {
    if (a.lhs != b.lhs) {
      if (a.lhs == start || b.lhs == start) return a.lhs == start;
      return symbols_[a.lhs] < symbols_[b.lhs];
    }
    if (a.kind != b.kind) return a.kind < b.kind;
    if (a.count != b.count) return a.count > b.count;
    return std::lexicographical_compare(
        a.rhs.begin(), a.rhs.end(), b.rhs.begin(), b.rhs.end(),
        [](const RhsItem& x, const RhsItem& y) { return x.text < y.text; });
  });
  Grammar g;
  g.header.start = spec_.start;
  TransformSpec recorded = spec_;
  recorded.wrapper = wrapper();
  g.header.transforms = to_pairs(recorded);
  g.header.unknown_signatures = !unknown.empty();
  g.rules.reserve(entries.size());
  for (Entry& e : entries) {
    Rule r;
    r.lhs = symbols_[e.lhs];
    r.rhs = std::move(e.rhs);
    r.weight = static_cast<double>(e.count) / static_cast<double>(totals[e.lhs]);
    r.written_weight = r.weight;
    r.count = e.count;
    g.rules.push_back(std::move(r));
  }
  return g;
}

EstimateSummary Estimator::summary() const {
  EstimateSummary s = counts_;
  for (char kind : raw_kind_) {
    s.nonterminals_before += (kind & 1) != 0;
    s.preterminals_before += (kind & 2) != 0;
  }
  std::vector<char> lhs_kind(symbols_.size(), 0);
  for (const auto& [key, count] : phrasal_) {
    lhs_kind[read_id(key, 0)] |= 1;
    s.rules_seen_once += count == 1;
  }
  std::map<std::pair<std::uint32_t, std::string>, char> unknown;
  std::map<std::string, char> classes;
  for (const auto& [key, count] : lexical_) {
    const auto tag = static_cast<std::uint32_t>(key >> 32);
    const auto word = static_cast<std::uint32_t>(key & 0xffffffffu);
    lhs_kind[tag] |= 2;
    s.rules_seen_once += count == 1;
    if (word_counts_[word] > static_cast<std::uint64_t>(spec_.rare_words)) continue;
    const std::string sig = word_signature(words_[word]);
    unknown[{tag, sig}] = 1;
    classes[sig] = 1;
  }
  for (char kind : lhs_kind) {
    s.nonterminals_after += (kind & 1) != 0;
    s.preterminals_after += (kind & 2) != 0;
  }
  s.phrasal_rule_types = phrasal_.size();
  s.word_rule_types = lexical_.size();
  s.unknown_rule_types = unknown.size();
  s.rule_types = s.phrasal_rule_types + s.word_rule_types + s.unknown_rule_types;
  s.lexicon = words_.size();
  for (std::uint64_t c : word_counts_)
    s.rare_words += c <= static_cast<std::uint64_t>(spec_.rare_words);
  s.unknown_classes = classes.size();
  return s;
}

}  // namespace treegate::pcfg
