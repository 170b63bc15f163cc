// Reads one case line of a results file straight into a CaseRecord with nlohmann's SAX
// interface (no JSON tree in between: loading 50,000 cases stays well under a second).
// Internal to harness/results; one reader per line, not shared between threads.
#pragma once

#include <string>
#include <string_view>

#include "harness/results/results.h"

namespace treegate::results::detail {

/// Fills `out` from `line`. Returns "" on success, else what was wrong; `col` gets the
/// 1-based column of a JSON syntax error (1 for a problem with the content).
std::string read_case_line(std::string_view line, CaseRecord& out, std::size_t& col);

}  // namespace treegate::results::detail
