// Building a CompiledGrammar: symbols, lexicon, binarization (see unary_closure.cc for the
// unary part).
#include "harness/pcfg/compiled_grammar.h"

#include <algorithm>
#include <cmath>
#include <tuple>

#include "evaluator/errors.h"

namespace treegate::pcfg {

CompiledGrammar::CompiledGrammar(const Grammar& grammar)
    : header_(grammar.header), source_(grammar.source) {
  if (header_.start.empty()) {
    throw InputError(source_, 0, 0, "no @start line: expected '@start SYMBOL' before the rules");
  }
  // Duplicate rules are merged (their probabilities add up); unusable weights are skipped.
  std::vector<Rule> merged;
  std::unordered_map<std::string, std::size_t> seen;
  for (const Rule& rule : grammar.rules) {
    if (!(rule.weight > 0) || !std::isfinite(rule.weight)) {
      note_skipped(rule);
      continue;
    }
    auto [it, fresh] = seen.emplace(format_rule(rule), merged.size());
    if (fresh) {
      merged.push_back(rule);
    } else {
      merged[it->second].weight += rule.weight;
    }
  }
  for (const Rule& rule : merged) {
    rule_p_[format_rule(rule)] = rule.weight;
    add_rule(rule);
  }
  start_ = find(header_.start);
  bool expanded = false;
  for (const Rule& rule : merged) expanded = expanded || rule.lhs == header_.start;
  if (!expanded) {
    throw InputError(source_, header_.start_line, 0,
                     "start symbol " + quote_for_message(header_.start) +
                         " has no rule with a positive weight: expected a rule '" + header_.start +
                         " -> ...'");
  }
  finish_binary();
  build_unary_closure(unary_);
  unary_.clear();
}

void CompiledGrammar::note_skipped(const Rule& rule) {
  if (skipped_rules_++ == 0) first_skipped_line_ = rule.line;
  if (rule.rhs.size() == 1 && rule.rhs[0].kind == ItemKind::terminal)
    skipped_words_.emplace(rule.rhs[0].text, rule.line);
}

std::size_t CompiledGrammar::skipped_line_of_word(const std::string& word) const {
  const auto it = skipped_words_.find(word);
  return it == skipped_words_.end() ? 0 : it->second;
}

std::string CompiledGrammar::skipped_rules_warning() const {
  if (skipped_rules_ == 0) return "";
  return source_ + ": " + std::to_string(skipped_rules_) +
         (skipped_rules_ == 1 ? " rule" : " rules") +
         " left out, weight not a positive finite number (first at line " +
         std::to_string(first_skipped_line_) + "); see treegate lint";
}

Symbol CompiledGrammar::intern(const std::string& name, std::uint8_t internal) {
  auto [it, fresh] = ids_.emplace(name, static_cast<Symbol>(names_.size()));
  if (fresh) {
    names_.push_back(name);
    internal_.push_back(internal);
  }
  return it->second;
}

Symbol CompiledGrammar::find(const std::string& name) const {
  auto it = ids_.find(name);
  return it == ids_.end() || internal_[it->second] ? kNoSymbol : it->second;
}

void CompiledGrammar::add_rule(const Rule& rule) {
  const Symbol lhs = intern(rule.lhs, 0);
  const double p = rule.weight;
  if (rule.rhs.size() == 1) {
    const RhsItem& item = rule.rhs[0];
    if (item.kind == ItemKind::terminal) {
      lexicon_[item.text].push_back({lhs, std::log(p), p});
    } else if (item.kind == ItemKind::unknown_class) {
      unknown_[item.text].push_back({lhs, std::log(p), p});
    } else {
      unary_.emplace_back(lhs, intern(item.text, 0), p);
    }
    return;
  }
  std::vector<Symbol> syms;
  for (const RhsItem& item : rule.rhs) {
    if (item.kind == ItemKind::nonterminal) {
      syms.push_back(intern(item.text, 0));
      continue;
    }
    const std::size_t before = names_.size();
    const Symbol s = intern(format_item(item), 2);
    if (names_.size() != before) {
      auto& table = item.kind == ItemKind::terminal ? lexicon_ : unknown_;
      table[item.text].push_back({s, 0.0, 1.0});
    }
    syms.push_back(s);
  }
  // Left-factored binarization; the intermediate for a prefix is shared by every rule that
  // starts with that prefix, so it derives exactly the splits of its span into that prefix.
  // (Left factoring keeps the right children real symbols: fewer rule groups per left child.)
  Symbol left = syms[0];
  std::string name = "@" + names_[syms[0]];
  for (std::size_t k = 1; k + 1 < syms.size(); ++k) {
    name += "\x1f" + names_[syms[k]];
    const std::size_t before = names_.size();
    const Symbol mid = intern(name, 1);
    if (names_.size() != before) add_binary(mid, left, syms[k], 1.0);
    left = mid;
  }
  add_binary(lhs, left, syms.back(), p);
}

void CompiledGrammar::add_binary(Symbol lhs, Symbol left, Symbol right, double p) {
  staged_.push_back({lhs, left, right, p});
}

void CompiledGrammar::finish_binary() {
  std::sort(staged_.begin(), staged_.end(), [](const Staged& a, const Staged& b) {
    return std::tie(a.left, a.right, a.lhs) < std::tie(b.left, b.right, b.lhs);
  });
  groups_.assign(names_.size(), {});
  by_lhs_.assign(names_.size(), {});
  for (const Staged& s : staged_) {
    auto& groups = groups_[s.left];
    if (groups.empty() || groups.back().right != s.right) {
      const auto at = static_cast<std::uint32_t>(targets_.size());
      groups.push_back({s.right, at, at});
    }
    targets_.push_back({s.lhs, std::log(s.p), s.p});
    children_.emplace_back(s.left, s.right);
    groups.back().end = static_cast<std::uint32_t>(targets_.size());
    by_lhs_[s.lhs].push_back(
        {s.left, s.right, std::log(s.p), static_cast<std::uint32_t>(targets_.size() - 1)});
  }
  staged_.clear();
  staged_.shrink_to_fit();
  right_id_.assign(names_.size(), kNoSymbol);
  for (const auto& groups : groups_) {
    for (const RightGroup& g : groups) {
      if (right_id_[g.right] == kNoSymbol)
        right_id_[g.right] = static_cast<std::uint32_t>(num_right_++);
    }
  }
  right_mask_.assign(names_.size() * right_words(), 0);
  for (Symbol left = 0; left < names_.size(); ++left) {
    auto& groups = groups_[left];
    std::sort(groups.begin(), groups.end(), [&](const RightGroup& a, const RightGroup& b) {
      return right_id_[a.right] < right_id_[b.right];
    });
    for (const RightGroup& g : groups) {
      const std::uint32_t id = right_id_[g.right];
      right_mask_[left * right_words() + id / 64] |= std::uint64_t{1} << (id % 64);
    }
  }
}

const std::vector<LexEntry>* CompiledGrammar::lexicon(const std::string& word) const {
  auto it = lexicon_.find(word);
  return it == lexicon_.end() ? nullptr : &it->second;
}

const std::vector<LexEntry>* CompiledGrammar::unknown_class(const std::string& signature) const {
  auto it = unknown_.find(signature);
  return it == unknown_.end() ? nullptr : &it->second;
}

double CompiledGrammar::rule_logp(const std::string& rule_text) const {
  auto it = rule_p_.find(rule_text);
  return it == rule_p_.end() ? std::nan("") : std::log(it->second);
}

std::shared_ptr<const CompiledGrammar> load_compiled_grammar(const std::string& path) {
  return std::make_shared<const CompiledGrammar>(read_grammar_file(path));
}

}  // namespace treegate::pcfg
