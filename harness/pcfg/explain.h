// Why does a grammar prefer its parse over the gold tree? Compares the Viterbi tree with the
// gold tree under one compiled grammar: log probabilities and the gap, the rules gold lacks,
// the rules only one derivation uses with their share of the gap, the probability each
// gold-only rule would need, and gold's rank among the k best. Pure functions; thread-safe.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "evaluator/tree.h"
#include "harness/pcfg/compiled_grammar.h"
#include "harness/pcfg/parser.h"
#include "harness/pcfg/score_tree.h"

namespace treegate::pcfg {

struct ExplainOptions {
  std::size_t kbest = 10;  // look for gold among this many best trees (0: do not look)
  bool gold_tags = false;  // parse with gold's tags fixed
};

/// A rule used a different number of times by the two derivations.
struct RuleDifference {
  std::string rule;  // "LHS -> ITEM ..."
  std::size_t gold_uses = 0, best_uses = 0;
  double logp = 0;               // log probability of the rule in the grammar
  double gap_share = 0;          // (best_uses - gold_uses) * logp: its part of the gap in nats
  std::optional<double> needed;  // gold-only rules: probability that makes gold win, all else
                                 // fixed: p * exp(gap / (gold_uses - best_uses)); may exceed 1
};

struct Explanation {
  std::vector<std::string> words;
  Tree gold;
  ParseResult parse;     // the parser's result (status, best tree, log prob, k best)
  TreeScore gold_score;  // derivable?, log prob, missing rules
  TreeScore best_score;  // the best tree's rules (empty without a parse)
  bool gold_is_best = false;
  double gap = 0;                           // log P(best) - log P(gold), nats (when both exist)
  std::vector<RuleDifference> differences;  // sorted by gap_share, largest first
  std::optional<std::size_t> gold_rank;     // 1-based rank among the k best, when found
  std::size_t kbest = 0;                    // how many best trees were searched
};

/// Parses gold's words with `grammar` and explains the result. `gold` is in the treebank's
/// labels; when the grammar's header lists transforms, gold and the parser's trees are
/// transformed forward as the estimator did, so rules are named in the grammar's own labels.
Explanation explain_tree(const std::shared_ptr<const CompiledGrammar>& grammar, const Tree& gold,
                         const ExplainOptions& options = {});

/// The console form: both trees drawn one above the other, brackets not in the other tree
/// marked with '*', log probabilities, gap, missing rules or rule differences, rank.
std::string explanation_text(const Explanation& explanation);

}  // namespace treegate::pcfg
