// treegate run: parse every case of the suites, score it, check it, compare with a baseline,
// write the results and reports, and decide the gate.
#include <signal.h>
#include <unistd.h>

#include <atomic>
#include <cstdio>
#include <iostream>

#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/report/html_from_results.h"
#include "harness/report/outputs.h"
#include "harness/report/run_reports.h"
#include "harness/results/atomic_file.h"
#include "harness/results/results.h"
#include "harness/run/gate.h"
#include "harness/run/regression_run.h"
#include "harness/run/shard.h"

namespace treegate::cli {
namespace {

std::atomic<bool> interrupted{false};

extern "C" void on_interrupt(int) { interrupted.store(true); }

void catch_interrupts() {
  struct sigaction sa {};
  sa.sa_handler = on_interrupt;
  sa.sa_flags = SA_RESETHAND;  // a second Ctrl-C ends the process at once
  sigemptyset(&sa.sa_mask);
  sigaction(SIGINT, &sa, nullptr);
  sigaction(SIGTERM, &sa, nullptr);
}

void draw_progress(std::size_t done, std::size_t total) {
  const std::size_t width = 40;
  const std::size_t filled = total ? done * width / total : width;
  std::fprintf(stderr, "\r[%s%s] %zu/%zu", std::string(filled, '#').c_str(),
               std::string(width - filled, ' ').c_str(), done, total);
  if (done == total) std::fputs("\n", stderr);
  std::fflush(stderr);
}

struct Options {
  std::string config, grammar, baseline, results, junit, summary_json, html, shard;
  std::vector<std::string> suites;
  std::size_t jobs = 0;
  bool no_timings = false;
};

suite::ProjectConfig load_project(const Options& o) {
  const std::string file = o.config.empty() ? suite::find_config() : o.config;
  suite::ProjectConfig c = file.empty() ? suite::ProjectConfig{} : suite::load_config(file);
  if (!o.grammar.empty()) c.grammar = o.grammar;
  if (!o.suites.empty()) c.suites = o.suites;
  return c;
}

int run_run(int argc, char** argv) {
  const Usage usage{
      "run", "[--config F] [--grammar G] [--suite PATH]... [--baseline RESULTS] [options]",
      "Parse every case of the suites, score and check it, compare with a baseline, write the "
      "results file and reports, and decide the gate.",
      "treegate run --config suites/demo/treegate.yaml --results results.jsonl --junit junit.xml",
      "0 gate passed, 1 gate failed (the reasons are printed), 2 bad usage, bad input or "
      "interrupted"};
  Options o;
  po::options_description opts("options");
  opts.add_options()("config", po::value(&o.config),
                     "project config (default: ./treegate.yaml when present)")(
      "grammar", po::value(&o.grammar), "grammar file (overrides the config's `grammar`)")(
      "suite", po::value(&o.suites)->composing(),
      "suite file, folder or glob; repeatable (overrides `suites`)")(
      "baseline", po::value(&o.baseline), "results file of an earlier run to compare with")(
      "results", po::value(&o.results),
      "write the results file here (default: the config's `results`)")("junit", po::value(&o.junit),
                                                                       "write JUnit XML here")(
      "summary-json", po::value(&o.summary_json), "write the summary JSON here")(
      "html", po::value(&o.html), "write the HTML report here (one self-contained file)")(
      "jobs", po::value(&o.jobs),
      "parallel workers (default: the config's `jobs`, else the cores)")(
      "shard", po::value(&o.shard),
      "run only shard K of N (K/N), for parallel CI jobs; see `merge`")(
      "no-timings", po::bool_switch(&o.no_timings),
      "leave timings out, so two runs compare byte for byte");
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, {}, vm); code >= 0) return code;
  catch_interrupts();  // before loading anything: Ctrl-C while suites load stops the run too
  try {
    run::RunRequest req;
    req.config = load_project(o);
    if (o.results.empty()) o.results = req.config.results;
    if (!o.shard.empty()) req.shard = run::parse_shard(o.shard);
    req.jobs = o.jobs;
    req.timings = !o.no_timings;
    req.stop = &interrupted;
    if (isatty(STDERR_FILENO)) req.progress = draw_progress;
    req.warn = [](const std::string& w) { std::cerr << "treegate run: warning: " << w << "\n"; };
    results::RunResults baseline;
    if (!o.baseline.empty()) baseline = results::load_results(o.baseline);
    run::RunOutcome outcome = run::execute_run(req);
    if (outcome.interrupted || interrupted.load()) {
      std::cerr << "treegate run: interrupted; no results or reports were written\n";
      return kExitBadInput;
    }
    // Reports are rendered from what the results file holds (text that is not UTF-8 is
    // replaced there; execute_run did so for the cases), so `run` and a later `report`
    // print the same bytes.
    results::RunResults& run = outcome.results;
    const std::string header = results::header_line(run.header);
    run.header = results::parse_header_line(header, "(this run)", 1);
    const run::RunSummary summary = run::summarize(run, o.baseline.empty() ? nullptr : &baseline);
    report::ConsoleOptions console;
    console.color = isatty(STDOUT_FILENO) && std::getenv("NO_COLOR") == nullptr;
    console.timings = req.timings;
    std::cout << report::console_summary(run, summary, console) << std::flush;
    if (!o.results.empty()) {
      results::write_file_atomically(o.results, {header, "\n", outcome.case_lines});
    }
    report::write_outputs(run, summary, {o.junit, o.summary_json});
    if (!o.html.empty()) {
      report::html::write_run_report(o.html, run, o.baseline.empty() ? nullptr : &baseline,
                                     summary);
    }
    return summary.gate_passed ? kExitOk : kExitGateFailed;
  } catch (const InputError& e) {
    return fail("run", e.what());
  }
}

const Registration reg({"run", "run the suites against a grammar and decide the gate", &run_run});

}  // namespace
}  // namespace treegate::cli
