// treegate compare: two runs side by side (results files), with the gate of NEW against OLD.
#include <fstream>
#include <iostream>

#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/results/compare.h"

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

int run_compare(int argc, char** argv) {
  Usage usage{"compare", "OLD NEW [--format text|json] [--test randomization|bootstrap] ...",
              "Compare two runs case by case (each side a results file written by `treegate "
              "run --results`): transitions, figures with differences, error classes, "
              "significance, parse time; exit 1 when NEW fails the gate with OLD as baseline.",
              "treegate compare suites/demo/results-v1.jsonl suites/demo/results-v2.jsonl"};
  usage.exit_codes = "0 gate passed, 1 gate failed, 2 bad usage or unreadable input";
  po::options_description opts("options");
  std::string old_path, new_path, format = "text", test = "randomization";
  results::CompareOptions options;
  std::size_t listed = 20;
  opts.add_options()("old", po::value(&old_path)->required(), "the earlier run (results file)")(
      "new", po::value(&new_path)->required(), "the later run (results file)")(
      "format", po::value(&format), "text (default) or json")(
      "test", po::value(&test),
      "significance test: randomization (default; paired approximate randomization) or "
      "bootstrap (paired bootstrap)")(
      "iterations", po::value(&options.significance.iterations),
      "shuffles or resamples of the significance test (default 10000)")(
      "seed", po::value(&options.significance.seed), "random seed (default 20121)")(
      "level", po::value(&options.significance.level),
      "significance level the verdict refers to (default 0.05)")(
      "list", po::value(&listed), "cases listed per transition in text output (default 20)");
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
    for (const std::string* p : {&old_path, &new_path}) {
      if (!looks_like_results(*p)) {
        return fail("compare", *p + ": not a results file (expected a JSON header line); run "
                                    "`treegate run --results FILE` with each grammar first");
      }
    }
    const results::RunResults old_run = results::load_results(old_path);
    const results::RunResults new_run = results::load_results(new_path);
    const results::Comparison c =
        results::compare_runs(old_run, old_path, new_run, new_path, options);
    std::cout << (format == "json" ? results::comparison_json(c)
                                   : results::comparison_text(c, listed));
    return c.gate.passed ? kExitOk : kExitGateFailed;
  } catch (const InputError& e) {
    return fail("compare", e.what());
  }
}

const Registration reg({"compare", "compare two runs: transitions, differences, significance",
                        &run_compare});

}  // namespace
}  // namespace treegate::cli
