// What the runner needs from a parser: words (and optionally gold tags) in, a predicted tree
// (or a reason why there is none) out. A ParserFactory is shared by all workers and makes one
// SentenceParser per worker thread; a SentenceParser is used by one thread at a time.
#pragma once

#include <memory>
#include <optional>
#include <span>
#include <string>
#include <vector>

#include "evaluator/tree.h"

namespace treegate::run {

enum class ParseStatus { kParsed, kNoParse, kError };
const char* parse_status_name(ParseStatus status);

struct ParseRequest {
  const std::vector<std::string>* words = nullptr;
  const std::vector<std::string>* tags = nullptr;  // null unless the parser takes gold tags
};

struct ParseOutcome {
  ParseStatus status = ParseStatus::kError;
  std::string reason;  // one line, for kNoParse and kError
  Tree tree;           // empty unless kParsed (labels in LabelTable::shared())
  std::optional<double> logprob, inside_logprob, parses;
  double seconds = 0;  // time spent on this sentence (a batch's time is shared out evenly)
};

class SentenceParser {
 public:
  virtual ~SentenceParser() = default;
  virtual ParseOutcome parse(const ParseRequest& request) = 0;
  /// Parses several sentences; one outcome per request, in order. Default: one by one.
  virtual std::vector<ParseOutcome> parse_batch(std::span<const ParseRequest> batch);
};

class ParserFactory {
 public:
  virtual ~ParserFactory() = default;
  virtual std::unique_ptr<SentenceParser> make() const = 0;
  /// For the results header: "builtin" or "command: prog arg...".
  virtual std::string describe() const = 0;
  /// How many sentences a worker hands to parse_batch at once.
  virtual std::size_t batch_size() const { return 1; }
  /// Whether requests should carry the gold tags.
  virtual bool wants_tags() const { return false; }
  /// Things the user should know before trusting the run (e.g. grammar rules left out).
  virtual std::vector<std::string> warnings() const { return {}; }
};

}  // namespace treegate::run
