// The "LABEL FROM-TO" notation of require/forbid checks.
#include <charconv>

#include "evaluator/errors.h"
#include "harness/suite/suite.h"

namespace treegate::suite {

std::string SpanCheck::text() const {
  return label + " " + std::to_string(from) + "-" + std::to_string(to);
}

namespace {

bool read_number(std::string_view s, std::uint32_t& out) {
  if (s.empty()) return false;
  const auto [p, ec] = std::from_chars(s.data(), s.data() + s.size(), out);
  return ec == std::errc() && p == s.data() + s.size();
}

}  // namespace

SpanCheck parse_span_check(const std::string& text, std::size_t words, const std::string& file,
                           std::size_t line, std::size_t col) {
  const auto bad = [&](const std::string& what) {
    throw InputError(file, line, col,
                     "expected a bracket as LABEL FROM-TO (e.g. \"PP 6-8\"), found " +
                         quote_for_message(text) + ": " + what);
  };
  const auto space = text.find(' ');
  if (space == std::string::npos || space == 0) bad("no label and span");
  SpanCheck check;
  check.label = text.substr(0, space);
  const auto span_at = text.find_first_not_of(' ', space);
  if (span_at == std::string::npos) bad("no span after the label");
  const std::string span = text.substr(span_at);
  const auto dash = span.find('-');
  if (dash == std::string::npos) bad("the span needs FROM-TO");
  if (!read_number(std::string_view(span).substr(0, dash), check.from) ||
      !read_number(std::string_view(span).substr(dash + 1), check.to)) {
    bad("FROM and TO must be whole numbers");
  }
  if (check.from < 1 || check.from > check.to) bad("FROM must be at least 1 and at most TO");
  if (check.to > words) {
    bad("the sentence has " + std::to_string(words) + (words == 1 ? " word" : " words"));
  }
  return check;
}

}  // namespace treegate::suite
