// Writes the report files a run or `report` asks for (JUnit XML, summary JSON), each one
// atomically. Used by the run and report subcommands so both write the same bytes.
#pragma once

#include <string>

#include "harness/results/results.h"
#include "harness/run/gate.h"

namespace treegate::report {

struct OutputFiles {
  std::string junit;         // "" = not written
  std::string summary_json;  // "" = not written
};

/// Throws InputError when a file cannot be written.
void write_outputs(const results::RunResults& run, const run::RunSummary& summary,
                   const OutputFiles& files);

}  // namespace treegate::report
