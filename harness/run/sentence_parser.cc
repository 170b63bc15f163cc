#include "harness/run/sentence_parser.h"

namespace treegate::run {

const char* parse_status_name(ParseStatus status) {
  switch (status) {
    case ParseStatus::kParsed:
      return "parsed";
    case ParseStatus::kNoParse:
      return "no_parse";
    case ParseStatus::kError:
      return "error";
  }
  return "error";
}

std::vector<ParseOutcome> SentenceParser::parse_batch(std::span<const ParseRequest> batch) {
  std::vector<ParseOutcome> out;
  out.reserve(batch.size());
  for (const auto& r : batch) out.push_back(parse(r));
  return out;
}

}  // namespace treegate::run
