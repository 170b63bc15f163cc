// The results file: everything about one run, one JSON object per line (JSON Lines). Line 1 is
// the header (tool, grammar, suites, scheme, gate, shard); every further line is one case.
// RunResults is a plain value; write_results is atomic (temp file + rename); no shared state.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "evaluator/scheme.h"
#include "harness/suite/gate_settings.h"

namespace treegate::results {

inline constexpr int kFormatVersion = 1;

/// What happened to a case, from the gate's point of view.
enum class Outcome {
  kPass,             // scored and every check passed
  kFail,             // scored, a check failed
  kError,            // no parse, parser error, yield mismatch, or a bad case in the suite
  kExpectedFailure,  // marked known_failure and did not pass
  kUnexpectedPass,   // marked known_failure but passed
};
const char* outcome_name(Outcome outcome);
std::optional<Outcome> outcome_from_name(const std::string& name);
/// Counts as failing for regressions and fixes (kFail, kError).
inline bool is_failing(Outcome o) { return o == Outcome::kFail || o == Outcome::kError; }
inline bool is_passing(Outcome o) { return o == Outcome::kPass || o == Outcome::kUnexpectedPass; }
/// The one definition of a regression and of a fix, shared by the gate and `compare`: a case
/// marked known_failure in either run (expected failure) is neither.
inline bool is_regression(Outcome before, Outcome now) {
  return is_passing(before) && is_failing(now);
}
inline bool is_fix(Outcome before, Outcome now) { return is_failing(before) && is_passing(now); }

struct CheckOutcome {
  std::string check;  // "min_f1 90", "require PP 6-8", "forbid NP 4-8"
  bool passed = false;
  std::string detail;  // one line: why it failed ("" when passed)
};

struct CaseRecord {
  std::string suite, id;
  std::size_t n = 0;  // 1-based position of the case in its suite (gives the canonical order)
  std::vector<std::string> words;
  std::vector<std::string> constructions;
  std::string gold;       // bracketed, one line ("" for a case that could not be read)
  std::string predicted;  // bracketed, one line; "" when there is no tree
  std::string parse;      // "parsed", "no_parse", "error", "not_run"
  std::string score;      // evaluator status: "scored", "no_parse", "yield_mismatch", "error"
  Outcome outcome = Outcome::kError;
  std::string reason;  // one line: why it failed or erred ("" when it passed)
  std::optional<double> logprob, inside_logprob;  // natural log; null when unknown
  std::optional<double> parses;                   // number of parses (may be approximate)
  std::uint32_t gold_brackets = 0, test_brackets = 0, matched = 0, crossing = 0;
  std::uint32_t scored_words = 0, tags_correct = 0;
  double f1 = 0;        // sentence F1 in percent
  double min_f1 = 100;  // the threshold that applied
  std::optional<std::string> known_failure;
  std::vector<CheckOutcome> checks;
  double seconds = 0;  // parse time; 0 when timings are left out
};

struct SuiteInfo {
  std::string name, file, hash;  // hash: fnv1a64 of the suite file, 16 hex digits
  std::size_t cases = 0;         // cases in the whole suite (not only this shard)
};

struct Shard {
  std::size_t index = 1, count = 1;  // K and N of --shard K/N
};

struct Header {
  int format = kFormatVersion;
  std::string tool_version;
  std::string grammar;            // path as given ("" with an external parser and no grammar)
  std::string grammar_hash;       // fnv1a64 of the grammar file
  std::string parser;             // "builtin" or "command: argv..."
  std::vector<SuiteInfo> suites;  // in run order
  Scheme scheme;
  suite::GateSettings gate;
  double case_min_f1 = 100;
  Shard shard;
  bool timings = true;  // false: every `seconds` is 0 (outputs compare with cmp)
};

struct RunResults {
  Header header;
  std::vector<CaseRecord> cases;  // canonical order: suites in header order, then `n`
};

/// Writes atomically: a temp file in the same folder, then rename. Throws InputError when
/// the folder is not writable.
void write_results(const std::string& path, const RunResults& results);
/// The file's text (what write_results writes).
std::string results_text(const RunResults& results);

/// Reads a results file. Throws InputError "file:line:col: what was expected".
RunResults load_results(const std::string& path);
RunResults parse_results(const std::string& text, const std::string& source);

/// The lines of the file, without the newline: a JSON object each. Text that is not UTF-8
/// is replaced (U+FFFD), so reading a line back can differ from what was written.
std::string header_line(const Header& header);
std::string case_line(const CaseRecord& c);
/// Read one line back (`source` and `line_no` are for messages). Throw InputError.
Header parse_header_line(std::string_view line, const std::string& source, std::size_t line_no);
CaseRecord parse_case_line(std::string_view line, const std::string& source, std::size_t line_no);

/// fnv1a64 of bytes as 16 hex digits (file hashes in the header).
std::string fnv1a64_hex(const std::string& bytes);
/// fnv1a64 of a file's bytes; throws InputError when it cannot be read.
std::string hash_file(const std::string& path);

/// Sorts cases into canonical order (suite position in the header, then n).
void sort_canonical(RunResults& results);

}  // namespace treegate::results
