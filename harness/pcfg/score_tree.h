// Scoring a given tree (e.g. a gold tree) under a grammar: its log probability when every rule
// it uses is in the grammar, else the rules it lacks with the nodes that need them. The tree
// must use the grammar's own label set (apply the grammar's transforms first). Pure function.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "evaluator/tree.h"
#include "harness/pcfg/compiled_grammar.h"

namespace treegate::pcfg {

struct NodeSpan {
  NodeId node;
  std::size_t from, to;  // word span [from, to), 0-based
};

struct RuleUse {
  std::string rule;          // "LHS -> ITEM ..." as in a grammar file, without the weight
  double logp = 0;           // log probability in the grammar (NaN when missing)
  std::vector<NodeSpan> at;  // the nodes that use it
};

struct TreeScore {
  bool derivable = false;
  double logprob = 0;            // sum of the used rules' log probabilities (when derivable)
  std::string problem;           // a reason beyond missing rules (wrong root, empty tree)
  std::vector<RuleUse> missing;  // rules the grammar lacks, in first-use order
  std::vector<RuleUse> used;     // every rule the tree uses, in first-use order
};

/// Words unknown to the grammar's lexicon use their class <unk:SIGNATURE> when the grammar has
/// unknown-word classes.
TreeScore score_tree(const CompiledGrammar& grammar, const Tree& tree);

}  // namespace treegate::pcfg
