#include "harness/report/outputs.h"

#include "harness/report/run_reports.h"
#include "harness/results/atomic_file.h"

namespace treegate::report {

void write_outputs(const results::RunResults& run, const run::RunSummary& summary,
                   const OutputFiles& files) {
  if (!files.junit.empty()) results::write_file_atomically(files.junit, junit_xml(run, summary));
  if (!files.summary_json.empty()) {
    results::write_file_atomically(files.summary_json, summary_json(run, summary));
  }
}

}  // namespace treegate::report
