// Estimator: reads a grammar off treebank trees by relative frequency (each rule's count over
// its left-hand side's count), after the transforms of a TransformSpec, with unknown-word
// classes trained on rare words. One Estimator per thread; it owns all its counts.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <unordered_map>
#include <vector>

#include "harness/pcfg/grammar.h"
#include "harness/pcfg/transforms_tree.h"

namespace treegate::pcfg {

struct EstimateSummary {
  std::size_t trees_read = 0;  // trees given to add(), usable or not
  std::size_t trees_used = 0;
  std::size_t words = 0;                // tokens in the used trees
  std::size_t nonterminals_before = 0;  // distinct phrasal labels in the treebank
  std::size_t preterminals_before = 0;  // distinct tags in the treebank
  std::size_t nonterminals_after = 0;   // distinct phrasal left-hand sides in the grammar
  std::size_t preterminals_after = 0;   // distinct left-hand sides of word rules
  std::size_t rule_types = 0;           // all rules written
  std::size_t phrasal_rule_types = 0;
  std::size_t word_rule_types = 0;
  std::size_t unknown_rule_types = 0;  // TAG -> <unk:SIG>
  std::size_t lexicon = 0;             // distinct words
  std::size_t rare_words = 0;          // distinct words seen at most rare_words times
  std::size_t unknown_classes = 0;     // distinct signatures
  std::size_t rules_seen_once = 0;     // rule types with count 1 (unknown-class rules excluded)
};

class Estimator {
 public:
  /// `spec.wrapper` is ignored: the treebank's most common root style is recorded instead.
  explicit Estimator(TransformSpec spec);

  /// Counts the rules of one treebank tree. An unusable tree is not counted; its problem is
  /// returned (node ids are the given tree's).
  std::optional<TreeProblem> add(const Tree& tree);

  /// The grammar of everything added so far (start symbol first, then left-hand sides in
  /// name order; within one, most frequent first). Empty rules when nothing was added.
  Grammar grammar() const;
  EstimateSummary summary() const;
  const TransformSpec& spec() const { return spec_; }

 private:
  std::uint32_t symbol(const std::string& name);
  void count_tree(const EditTree& tree);
  TransformSpec::Wrapper wrapper() const;

  TransformSpec spec_;
  std::unordered_map<std::string, std::uint32_t> symbol_ids_;
  std::vector<std::string> symbols_;
  std::unordered_map<std::string, std::uint32_t> word_ids_;
  std::vector<std::string> words_;
  std::vector<std::uint64_t> word_counts_;
  std::unordered_map<std::string, std::uint64_t> phrasal_;    // packed symbol ids -> count
  std::unordered_map<std::uint64_t, std::uint64_t> lexical_;  // tag << 32 | word -> count
  std::vector<char> raw_kind_;  // by source LabelId: bit 1 phrasal, bit 2 tag
  std::vector<std::size_t> wrappers_ = std::vector<std::size_t>(5, 0);
  std::string key_;  // reused buffers
  std::vector<std::uint32_t> ids_;
  EstimateSummary counts_;
};

}  // namespace treegate::pcfg
