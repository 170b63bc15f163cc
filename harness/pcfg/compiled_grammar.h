// CompiledGrammar: a Grammar turned into what CKY needs: interned symbols, binary rules grouped
// by left child (long right-hand sides binarized with internal symbols that never reach output
// trees), a lexicon, unknown-word classes and the unary closure. Built once, then immutable:
// share it across threads through std::shared_ptr<const CompiledGrammar>.
#pragma once

#include <cstdint>
#include <memory>
#include <string>
#include <tuple>
#include <unordered_map>
#include <vector>

#include "harness/pcfg/grammar.h"

namespace treegate::pcfg {

using Symbol = std::uint32_t;
inline constexpr Symbol kNoSymbol = 0xffffffffu;

/// A binary rule's parent with its weight; targets sharing (left, right) are contiguous.
struct BinaryTarget {
  Symbol lhs;
  double logp;
  double p;
};
/// The rules with a given (left, right) pair: targets [begin, end).
struct RightGroup {
  Symbol right;
  std::uint32_t begin, end;
};
/// A path of unary rules from `top` down to the pre-unary symbol it is listed under:
/// best chain (logp, first step `via`), summed chains (p) and number of chains (count).
struct UnaryLink {
  Symbol top;
  Symbol via;             // first symbol below `top` on the best chain (== bottom when one step)
  double logp;            // best chain; 0 for the empty chain (top == bottom)
  double p;               // sum over all chains ((I - U)^-1); infinite when the cycles diverge
  double count;           // number of chains; infinity with a usable unary cycle
  std::uint64_t count64;  // the same modulo 2^64
};
struct LexEntry {
  Symbol symbol;
  double logp;
  double p;
};

class CompiledGrammar {
 public:
  /// Throws InputError naming the grammar when it cannot be parsed with (no start symbol, or a
  /// start symbol that no rule expands).
  explicit CompiledGrammar(const Grammar& grammar);

  std::size_t num_symbols() const { return names_.size(); }
  const std::string& name(Symbol s) const { return names_[s]; }
  /// Internal symbols (binarization, terminals inside long rules) are removed from trees.
  bool internal(Symbol s) const { return internal_[s] != 0; }
  /// Internal symbol standing for a terminal inside a long rule: its node becomes the word.
  bool word_symbol(Symbol s) const { return internal_[s] == 2; }
  Symbol find(const std::string& name) const;
  Symbol start() const { return start_; }
  const GrammarHeader& header() const { return header_; }
  const std::string& source() const { return source_; }

  /// Binary rules with left child `left`, grouped by right child, sorted by right_id.
  const std::vector<RightGroup>& groups(Symbol left) const { return groups_[left]; }
  /// Symbols that are a right child of some binary rule get compact ids 0..num_right()-1.
  std::size_t num_right() const { return num_right_; }
  std::uint32_t right_id(Symbol s) const { return right_id_[s]; }
  /// 64-bit words of a right-id bit set.
  std::size_t right_words() const { return (num_right_ + 63) / 64; }
  /// Bit set over right ids: the right children that have a group under `left`.
  const std::uint64_t* right_mask(Symbol left) const { return &right_mask_[left * right_words()]; }
  const BinaryTarget& target(std::uint32_t i) const { return targets_[i]; }
  const BinaryTarget* targets() const { return targets_.data(); }
  std::size_t num_binary_rules() const { return targets_.size(); }
  /// (left, right) children of binary target `i`.
  std::pair<Symbol, Symbol> children(std::uint32_t i) const { return children_[i]; }
  /// Binary rules by parent (for k-best): (left, right, logp).
  struct ByLhs {
    Symbol left, right;
    double logp;
    std::uint32_t target;
  };
  const std::vector<ByLhs>& rules_of(Symbol lhs) const { return by_lhs_[lhs]; }
  /// Unary closure entries whose bottom is `bottom` (the empty chain first).
  const std::vector<UnaryLink>& unary_above(Symbol bottom) const { return closure_[bottom]; }
  bool has_unary_cycles() const { return unary_cycles_; }

  /// Lexical entries of a word, or nullptr when the word is not in the lexicon.
  const std::vector<LexEntry>* lexicon(const std::string& word) const;
  /// Entries of an unknown-word class, or nullptr.
  const std::vector<LexEntry>* unknown_class(const std::string& signature) const;
  bool has_unknown_classes() const { return !unknown_.empty(); }

  /// Rules left out because their weight is not a positive finite number (zero, negative,
  /// nan, inf), and the line of the first of them (0 when none).
  std::size_t skipped_rules() const { return skipped_rules_; }
  std::size_t first_skipped_line() const { return first_skipped_line_; }
  /// Line of the first left-out lexical rule for `word` (0 when none): a word that only such
  /// rules rewrite is unknown to the parser, and the reason should say why.
  std::size_t skipped_line_of_word(const std::string& word) const;
  /// "SOURCE: N rules left out, ..." for the user, or "" when no rule was left out.
  std::string skipped_rules_warning() const;

  /// Log probability of an original rule written "LHS -> ITEM ..." (format_rule), or NaN.
  double rule_logp(const std::string& rule_text) const;

 private:
  Symbol intern(const std::string& name, std::uint8_t internal);
  void add_rule(const Rule& rule);
  void note_skipped(const Rule& rule);
  void add_binary(Symbol lhs, Symbol left, Symbol right, double p);
  void finish_binary();
  void build_unary_closure(const std::vector<std::tuple<Symbol, Symbol, double>>& unary);

  GrammarHeader header_;
  std::string source_;
  std::vector<std::string> names_;
  std::vector<std::uint8_t> internal_;
  std::unordered_map<std::string, Symbol> ids_;
  Symbol start_ = kNoSymbol;
  std::vector<std::vector<RightGroup>> groups_;
  std::size_t num_right_ = 0;
  std::vector<std::uint32_t> right_id_;
  std::vector<std::uint64_t> right_mask_;
  std::vector<BinaryTarget> targets_;
  std::vector<std::pair<Symbol, Symbol>> children_;
  std::vector<std::vector<ByLhs>> by_lhs_;
  std::vector<std::vector<UnaryLink>> closure_;
  bool unary_cycles_ = false;
  std::unordered_map<std::string, std::vector<LexEntry>> lexicon_, unknown_;
  std::unordered_map<std::string, double> rule_p_;
  std::size_t skipped_rules_ = 0, first_skipped_line_ = 0;
  std::unordered_map<std::string, std::size_t> skipped_words_;  // word -> line
  // Staging while building.
  struct Staged {
    Symbol lhs, left, right;
    double p;
  };
  std::vector<Staged> staged_;
  std::vector<std::tuple<Symbol, Symbol, double>> unary_;
};

/// Reads and compiles a grammar file (InputError on bad input).
std::shared_ptr<const CompiledGrammar> load_compiled_grammar(const std::string& path);

}  // namespace treegate::pcfg
