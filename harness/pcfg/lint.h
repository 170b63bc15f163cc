// lint_grammar: checks a Grammar for mistakes a grammar writer makes (sums per left-hand side,
// duplicates, bad weights, start symbol, unreachable and unproductive symbols, unary cycles,
// terminal/nonterminal clashes) and whether it is consistent (Booth & Thompson 1973: the
// spectral radius of the mean-production matrix is below 1). Pure functions.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "harness/pcfg/grammar.h"

namespace treegate::pcfg {

struct LintFinding {
  std::string check;     // short name: sum, duplicate, weight, start, unreachable, ...
  std::size_t line = 0;  // 1-based line in the grammar file (0: the whole file)
  std::string message;
};

struct LintOptions {
  double tolerance = 1e-6;  // allowed |sum - 1| per left-hand side
};

struct LintReport {
  std::vector<LintFinding> findings;  // in line order
  double spectral_radius = 0;         // of the mean-production matrix
  bool radius_converged = true;       // power iteration reached its tolerance
  std::size_t nonterminals = 0, rules = 0;
};

LintReport lint_grammar(const Grammar& grammar, const LintOptions& options = {});

/// The spectral radius of the mean-production matrix M[A][B] = sum over rules A -> x of
/// p * (occurrences of B in x), by power iteration on M + I (aperiodic, same Perron vector).
double mean_production_radius(const Grammar& grammar, bool* converged = nullptr);

/// A copy whose positive, finite weights are divided by their left-hand side's total;
/// rules with other weights are dropped (their lines go to `dropped`).
Grammar normalized(const Grammar& grammar, std::vector<std::size_t>* dropped = nullptr);

}  // namespace treegate::pcfg
