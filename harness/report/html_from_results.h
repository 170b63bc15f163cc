// Fills the HTML report's view model from a results file (and a baseline results file):
// totals, per-suite, per-construction, per-label and per-length-bucket figures, per-case
// transitions, and the cases with their trees. Used by `run --html` and `report --html`.
// Pure function of its inputs; thread-safe.
#pragma once

#include <string>
#include <vector>

#include "harness/report/html_view.h"
#include "harness/results/results.h"
#include "harness/run/gate.h"

namespace treegate::report::html {

struct GateOutcome {
  bool passed = true;
  std::vector<std::string> reasons;  // one line per broken rule
};

/// `baseline` may be null. `date` is shown as given (e.g. "2026-12-01 21:40 UTC").
ReportView view_of_run(const results::RunResults& run, const results::RunResults* baseline,
                       const GateOutcome& gate, const std::string& date);

/// The one call behind `run --html` and `report --html`: the gate decision and the counts come
/// from `summary` (so every report of a run agrees); the date is now (UTC), left out when the
/// run was made without timings so that two such reports compare byte for byte. Atomic write;
/// throws InputError when the file cannot be written.
void write_run_report(const std::string& path, const results::RunResults& run,
                      const results::RunResults* baseline, const run::RunSummary& summary);

/// The current time as "YYYY-MM-DD HH:MM UTC".
std::string utc_now();

/// The length bucket of a sentence of `words` scored words: "1–10", ..., "41+".
std::string length_bucket(std::size_t words);

/// The change of one case against its baseline: fixed, broken, better, worse, changed,
/// unchanged (empty without a baseline case).
std::string transition(const results::CaseRecord& before, const results::CaseRecord& after);

}  // namespace treegate::report::html
