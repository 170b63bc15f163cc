// treegate score: PARSEVAL figures of a test file of trees against a gold file.
#include <fstream>
#include <iostream>

#include "evaluator/errors.h"
#include "evaluator/file_text.h"
#include "evaluator/score_streams.h"
#include "harness/cli/command.h"
#include "harness/report/score_report.h"
#include "harness/suite/scheme_yaml.h"

namespace treegate::cli {
namespace {

int run_score(int argc, char** argv) {
  const Usage usage{
      "score", "GOLD TEST [--scheme FILE] [--per-sentence] [--format text|json]",
      "Score the bracketed trees of TEST against those of GOLD (tree i with tree i) "
      "with labeled PARSEVAL.",
      "treegate score suites/examples/gold.trees suites/examples/test.trees --per-sentence"};
  po::options_description opts("options");
  std::string gold, test, scheme_file, format = "text";
  opts.add_options()("gold", po::value(&gold)->required(), "gold trees (bracketed)")(
      "test", po::value(&test)->required(), "test trees, same order; () means no parse")(
      "scheme", po::value(&scheme_file), "YAML file of scoring settings (see README)")(
      "per-sentence", "add a table with one row per sentence")("format", po::value(&format),
                                                               "text (default) or json");
  po::positional_options_description pos;
  pos.add("gold", 1).add("test", 1);
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  if (format != "text" && format != "json")
    return fail("score", "--format must be text or json, not '" + format + "'");
  try {
    const Scheme scheme = scheme_file.empty() ? Scheme{} : load_scheme_file(scheme_file);
    std::ifstream g = open_input_file(gold), t = open_input_file(test);
    std::vector<report::ScoredSentence> sentences;
    // Keep every sentence only when it is listed; otherwise only the errors (flat memory).
    const bool list_all = format == "json" || vm.count("per-sentence") > 0;
    auto keep = [&](std::size_t index, const SentenceScore& s) {
      if (list_all || s.status == SentenceStatus::kYieldMismatch ||
          s.status == SentenceStatus::kError) {
        sentences.push_back({index, s});
      }
    };
    Tally tally = score_streams(g, gold, t, test, scheme, keep);
    report::ScoreRun run{gold, test, std::move(tally), std::move(sentences)};
    std::cout << (format == "json" ? report::score_json(run)
                                   : report::score_text(run, vm.count("per-sentence") > 0));
  } catch (const InputError& e) {
    return fail("score", e.what());
  }
  return kExitOk;
}

const Registration reg({"score", "PARSEVAL figures of a file of test trees against gold trees",
                        &run_score});

}  // namespace
}  // namespace treegate::cli
