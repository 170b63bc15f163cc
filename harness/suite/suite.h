// The suite model: a Suite (one YAML file) holds Cases, each with a gold tree, construction tags
// and checks (threshold, required/forbidden brackets, known failure). Plain values built by
// the suite loader (suite_loader.h); read-only afterwards, so any thread may read them.
#pragma once

#include <cstdint>
#include <deque>
#include <optional>
#include <string>
#include <vector>

#include "evaluator/tree.h"

namespace treegate::suite {

/// "PP 6-8": a constituent labelled PP over words 6 to 8 (1-based, inclusive, full yield).
struct SpanCheck {
  std::string label;  // compared after stripping function tags (when the scheme strips them)
  std::uint32_t from = 0;
  std::uint32_t to = 0;
  std::string text() const;  // "PP 6-8"
};

/// Reads "LABEL FROM-TO"; throws InputError (position `file:line:col`) when malformed or the
/// span is outside 1..`words`.
SpanCheck parse_span_check(const std::string& text, std::size_t words, const std::string& file,
                           std::size_t line, std::size_t col);

struct Case {
  std::string id;                          // unique within its suite
  std::string source;                      // "file:line:col" of the case, for messages
  Tree gold;                               // empty when `load_error` is set
  std::vector<std::string> words;          // the gold tree's yield
  std::vector<std::string> constructions;  // suite tags first, then the case's own, no repeats
  std::optional<double> min_f1;            // own threshold; else the suite's, else the config's
  std::vector<SpanCheck> require;
  std::vector<SpanCheck> forbid;
  std::optional<std::string> known_failure;  // why it is expected to fail
  std::string load_error;  // non-empty: this case is unusable; reported as an error, not run
};

struct Suite {
  std::string name;  // unique in a run
  std::string about;
  std::string file;  // path as given
  std::string hash;  // fnv1a64 of the file bytes, 16 hex digits
  std::vector<std::string> constructions;
  std::optional<double> min_f1;
  std::deque<Case> cases;  // in file order; treebank cases after the listed ones
};

}  // namespace treegate::suite
