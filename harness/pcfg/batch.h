// Parsing many sentences: reading a tokenised (optionally tagged) line, and parsing a list of
// sentences on N threads (one Parser per thread) with results delivered in input order on the
// calling thread. The grammar is shared read-only.
#pragma once

#include <functional>
#include <memory>
#include <string>
#include <string_view>
#include <vector>

#include "harness/pcfg/parser.h"

namespace treegate::pcfg {

struct Sentence {
  std::size_t line = 0;  // 1-based line of the input
  std::vector<std::string> words;
  std::vector<std::string> tags;  // with tagged input
  std::string error;              // a malformed line: why
};

/// The separator of word and tag in tagged input: WORD_TAG splits at the last '_'.
inline constexpr char kTagSeparator = '_';

/// Splits a line at spaces and tabs; with `tagged`, each token is WORD_TAG.
Sentence read_sentence(std::string_view text, std::size_t line, bool tagged);

/// Parses every sentence with `jobs` threads; `deliver(index, result)` is called in input
/// order from the calling thread. Sentences with an error get status error and that reason.
void parse_in_order(const std::shared_ptr<const CompiledGrammar>& grammar,
                    const std::vector<Sentence>& sentences, const ParseOptions& options,
                    unsigned jobs, const std::function<void(std::size_t, ParseResult&)>& deliver);

}  // namespace treegate::pcfg
