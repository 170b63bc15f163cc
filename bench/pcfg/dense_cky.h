// A straightforward exhaustive CKY for comparison in the benchmark: Viterbi scores only, one
// dense array of scores per cell (every symbol, reset for each sentence), rules indexed by
// left child, the same compiled grammar and unary closure as the real parser.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "harness/pcfg/compiled_grammar.h"

namespace treegate::bench {

class DenseCky {
 public:
  explicit DenseCky(const pcfg::CompiledGrammar& grammar) : g_(grammar) {}
  /// Best log probability of the sentence (-inf without a parse); counts rule applications.
  double parse(const std::vector<std::vector<pcfg::LexEntry>>& lexical,
               std::uint64_t& applications);

 private:
  const pcfg::CompiledGrammar& g_;
  std::vector<double> chart_, pre_;
};

}  // namespace treegate::bench
