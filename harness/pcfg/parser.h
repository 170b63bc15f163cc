// Parser: exhaustive CKY over a CompiledGrammar: the Viterbi tree and its log probability, the
// inside log probability of the sentence, the number of parse trees, and optionally the k best
// trees (lazy k-best, Huang & Chiang 2005). A Parser owns its chart buffers and is for one
// thread at a time; any number of Parsers may share one CompiledGrammar.
#pragma once

#include <atomic>
#include <cstdint>
#include <memory>
#include <string>
#include <vector>

#include "evaluator/tree.h"
#include "harness/pcfg/compiled_grammar.h"

namespace treegate::pcfg {

struct Chart;

struct ParseOptions {
  bool gold_tags = false;  // use the given tags as the only preterminals of the words
  std::size_t kbest = 0;   // also list the k best trees (0: none)
  std::size_t max_chart_bytes = std::size_t{4} << 30;  // refuse sentences whose chart is bigger
  double max_seconds = 0;                   // give up on a sentence after this long (0: no limit)
  const std::atomic<bool>* stop = nullptr;  // when set and true, give up at the next cell
};

enum class ParseStatus { parsed, no_parse, error };

struct ScoredTree {
  Tree tree;
  double logprob = 0;
};

struct ParseResult {
  ParseStatus status = ParseStatus::error;
  std::string reason;         // why there is no parse (names the word or span)
  Tree tree;                  // the Viterbi tree in the original label set
  double logprob = 0;         // natural log of the Viterbi tree's probability
  double inside_logprob = 0;  // natural log of the sentence probability (sum over trees)
  std::uint64_t parses = 0;   // number of trees (a lower bound when !parses_exact)
  bool parses_exact = false;
  bool parses_infinite = false;
  std::vector<ScoredTree> kbest;
  double seconds = 0;
  std::uint64_t binary_applications = 0;  // rule applications in the chart (for benchmarks)
};

/// Bytes of chart a sentence of `words` words needs with `grammar`.
std::size_t chart_bytes(const CompiledGrammar& grammar, std::size_t words);

class Parser {
 public:
  explicit Parser(std::shared_ptr<const CompiledGrammar> grammar);
  ~Parser();
  Parser(const Parser&) = delete;
  Parser& operator=(const Parser&) = delete;

  /// Parses `words`; with options.gold_tags, `tags` (same length) fixes each word's tag.
  ParseResult parse(const std::vector<std::string>& words, const std::vector<std::string>* tags,
                    const ParseOptions& options);

  const CompiledGrammar& grammar() const { return *grammar_; }

 private:
  std::shared_ptr<const CompiledGrammar> grammar_;
  std::unique_ptr<Chart> chart_;
};

}  // namespace treegate::pcfg
