// Fills the HTML report's view model from a comparison of two runs (harness/results/compare.h):
// the figures, breakdowns, error classes, transitions and significance that `compare` prints,
// and each case's old, new and gold trees. Used by `compare --html`. Thread-safe.
#pragma once

#include <string>

#include "harness/report/html_view.h"
#include "harness/results/compare.h"

namespace treegate::report::html {

ReportView view_of_comparison(const results::Comparison& comparison,
                              const results::RunResults& old_run,
                              const results::RunResults& new_run, const std::string& date);

/// The one call behind `compare --html` (date: now, UTC). Atomic write; throws InputError.
void write_compare_report(const std::string& path, const results::Comparison& comparison,
                          const results::RunResults& old_run, const results::RunResults& new_run);

}  // namespace treegate::report::html
