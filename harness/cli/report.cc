// treegate report: re-render the console summary, JUnit XML and summary JSON of a results
// file (optionally against a baseline) without parsing again.
#include <unistd.h>

#include <iostream>

#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/report/html_from_results.h"
#include "harness/report/outputs.h"
#include "harness/report/run_reports.h"
#include "harness/run/gate.h"

namespace treegate::cli {
namespace {

int run_report(int argc, char** argv) {
  const Usage usage{
      "report",
      "RESULTS [--baseline RESULTS] [--junit F] [--summary-json F] [--html F] [--no-timings]",
      "Render the reports of a results file again (the gate is decided again too).",
      "treegate report out/results.jsonl --junit out/junit.xml",
      "0 gate passed, 1 gate failed, 2 bad usage or unreadable input"};
  std::string file, baseline_file, junit, summary_json, html;
  bool no_timings = false;
  po::options_description opts("options");
  opts.add_options()("results", po::value(&file)->required(),
                     "results file written by `run` or `merge`")(
      "baseline", po::value(&baseline_file), "results file of an earlier run to compare with")(
      "junit", po::value(&junit), "write JUnit XML here")("summary-json", po::value(&summary_json),
                                                          "write the summary JSON here")(
      "html", po::value(&html), "write the HTML report here (one self-contained file)")(
      "no-timings", po::bool_switch(&no_timings), "leave the time line out of the console summary");
  po::positional_options_description pos;
  pos.add("results", 1);
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  try {
    const results::RunResults run = results::load_results(file);
    results::RunResults baseline;
    if (!baseline_file.empty()) baseline = results::load_results(baseline_file);
    const run::RunSummary summary =
        run::summarize(run, baseline_file.empty() ? nullptr : &baseline);
    report::ConsoleOptions console;
    console.color = isatty(STDOUT_FILENO) && std::getenv("NO_COLOR") == nullptr;
    console.timings = !no_timings && run.header.timings;
    std::cout << report::console_summary(run, summary, console) << std::flush;
    report::write_outputs(run, summary, {junit, summary_json});
    if (!html.empty()) {
      report::html::write_run_report(html, run, baseline_file.empty() ? nullptr : &baseline,
                                     summary);
    }
    return summary.gate_passed ? kExitOk : kExitGateFailed;
  } catch (const InputError& e) {
    return fail("report", e.what());
  }
}

const Registration reg({"report", "render the reports of a results file again", &run_report});

}  // namespace
}  // namespace treegate::cli
