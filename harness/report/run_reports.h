// Reports of a regression run, rendered from a results file and its summary (so `run` and
// `report` print the same): the console summary, the summary JSON for scripts, and JUnit XML
// for CI servers. Pure functions of their inputs.
#pragma once

#include <string>

#include "harness/results/results.h"
#include "harness/run/gate.h"

namespace treegate::report {

struct ConsoleOptions {
  bool color = false;   // ANSI colours (never when NO_COLOR is set; the caller decides)
  bool timings = true;  // print the time line
  std::size_t max_cases_shown = 50;  // failing/regressed cases printed in full
};

std::string console_summary(const results::RunResults& run, const run::RunSummary& summary,
                            const ConsoleOptions& options);

/// The summary JSON contract (see docs/run.md).
std::string summary_json(const results::RunResults& run, const run::RunSummary& summary);

/// JUnit XML valid against the JUnit 10 schema (see docs/run.md for the mapping).
std::string junit_xml(const results::RunResults& run, const run::RunSummary& summary);

/// The fixed word before the dot in every JUnit classname.
inline constexpr const char* kJunitProjectWord = "treegate";

}  // namespace treegate::report
