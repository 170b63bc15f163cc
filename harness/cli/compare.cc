// treegate compare: two runs side by side (results files), with the gate of NEW against OLD.
#include <fstream>
#include <iostream>

#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/report/html_from_compare.h"
#include "harness/results/compare.h"
#include "harness/run/gate.h"
#include "harness/run/regression_run.h"
#include "harness/suite/config.h"

namespace treegate::cli {
namespace {

// A results file starts with the JSON header line; anything else is taken for a grammar.
bool looks_like_results(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  char c = 0;
  while (in.get(c) && (c == ' ' || c == '\n' || c == '\r' || c == '\t')) {
  }
  return in && c == '{';
}

// A results file is read; a grammar is run first on the suites of the project config.
results::RunResults load_side(const std::string& path, const std::string& config_file,
                              std::size_t jobs) {
  if (looks_like_results(path)) return results::load_results(path);
  const std::string file = config_file.empty() ? suite::find_config() : config_file;
  if (file.empty()) {
    throw InputError(path +
                     ": not a results file, so it is taken for a grammar; running it needs a "
                     "project config (treegate.yaml here, or --config FILE) that names the suites");
  }
  run::RunRequest request;
  request.config = suite::load_config(file);
  request.config.grammar = path;
  request.jobs = jobs;
  std::cerr << "treegate compare: running the suites of " << file << " with " << path << "\n";
  return run::execute_run(request).results;
}

int run_compare(int argc, char** argv) {
  Usage usage{"compare", "OLD NEW [--format text|json] [--test randomization|bootstrap] ...",
              "Compare two runs case by case (each side a results file written by `treegate "
              "run --results`, or a grammar: then the config's suites are run with it first): "
              "transitions, figures with differences, error classes, "
              "significance, parse time; exit 1 when NEW fails the gate with OLD as baseline.",
              "treegate compare --config suites/demo/treegate.yaml suites/demo/v1.pcfg "
              "suites/demo/v2.pcfg"};
  usage.exit_codes = "0 gate passed, 1 gate failed, 2 bad usage or unreadable input";
  po::options_description opts("options");
  std::string old_path, new_path, format = "text", test = "randomization", html;
  results::CompareOptions options;
  std::size_t listed = 20;
  std::string config;
  std::size_t jobs = 0;
  opts.add_options()("old", po::value(&old_path)->required(), "the earlier run (results file)")(
      "new", po::value(&new_path)->required(), "the later run (results file)")(
      "format", po::value(&format), "text (default) or json")(
      "html", po::value(&html), "also write the HTML report here (one self-contained file)")(
      "test", po::value(&test),
      "significance test: randomization (default; paired approximate randomization) or "
      "bootstrap (paired bootstrap)")(
      "iterations", po::value(&options.significance.iterations),
      "shuffles or resamples of the significance test (default 10000)")(
      "seed", po::value(&options.significance.seed), "random seed (default 20121)")(
      "level", po::value(&options.significance.level),
      "significance level the verdict refers to (default 0.05)")(
      "list", po::value(&listed), "cases listed per transition in text output (default 20)")(
      "config", po::value(&config),
      "project config whose suites are run when a side is a grammar (default ./treegate.yaml)")(
      "jobs", po::value(&jobs), "parallel workers when a side is a grammar (default: cores)");
  po::positional_options_description pos;
  pos.add("old", 1).add("new", 1);
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  if (format != "text" && format != "json") {
    return fail("compare", "--format must be text or json, not '" + format + "'");
  }
  if (test != "randomization" && test != "bootstrap") {
    return fail("compare", "--test must be randomization or bootstrap, not '" + test + "'");
  }
  if (options.significance.iterations == 0) return fail("compare", "--iterations must be > 0");
  if (test == "bootstrap") {
    options.significance.method = SignificanceMethod::kPairedBootstrap;
  }
  try {
    const results::RunResults old_run = load_side(old_path, config, jobs);
    const results::RunResults new_run = load_side(new_path, config, jobs);
    results::Comparison c = results::compare_runs(old_run, old_path, new_run, new_path, options);
    const run::RunSummary gate = run::summarize(new_run, &old_run);
    c.gate = {gate.gate_passed, gate.gate_reasons};
    std::cout << (format == "json" ? results::comparison_json(c)
                                   : results::comparison_text(c, listed));
    if (!html.empty()) report::html::write_compare_report(html, c, old_run, new_run);
    return c.gate.passed ? kExitOk : kExitGateFailed;
  } catch (const InputError& e) {
    return fail("compare", e.what());
  }
}

const Registration reg({"compare", "compare two runs: transitions, differences, significance",
                        &run_compare});

}  // namespace
}  // namespace treegate::cli
