// The parts of Parser::parse around the chart: checking the input (memory cap, tags, unknown
// words), the lexical entries of a word, and turning a filled chart into a ParseResult.
// Private to the parser's .cc files; stateless functions.
#pragma once

#include <string>
#include <vector>

#include "harness/pcfg/chart.h"
#include "harness/pcfg/parser.h"

namespace treegate::pcfg {

/// "" when the sentence can go into the chart; else the reason ("error: ..." for bad input).
std::string check_input(const CompiledGrammar& g, const std::vector<std::string>& words,
                        const std::vector<std::string>* tags, const ParseOptions& options);

/// The pre-unary entries of word i (lexicon, unknown-word class, or the gold tag).
std::vector<LexEntry> lexical_entries(const CompiledGrammar& g,
                                      const std::vector<std::string>& words,
                                      const std::vector<std::string>* tags,
                                      const ParseOptions& options, std::size_t i);

/// Reads the result off a filled chart: Viterbi tree, log probabilities, count, k best, or
/// the reason there is no parse.
void fill_outcome(const Chart& chart, const CompiledGrammar& g,
                  const std::vector<std::string>& words, const ParseOptions& options,
                  ParseResult& result);

}  // namespace treegate::pcfg
