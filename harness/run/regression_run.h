// One regression run from a project config: loads the suites, picks the cases of the shard,
// builds the parser, runs the cases and assembles the results (header included). The CLI
// only adds option parsing and output files. One call per run; no state kept between calls.
#pragma once

#include <atomic>
#include <functional>
#include <memory>
#include <string>
#include <vector>

#include "harness/results/results.h"
#include "harness/run/sentence_parser.h"
#include "harness/suite/config.h"

namespace treegate::run {

struct RunRequest {
  suite::ProjectConfig config;  // grammar, suites, scheme, parser, gate (already overridden)
  results::Shard shard;
  std::size_t jobs = 0;  // 0: config.jobs, else the number of cores
  bool timings = true;
  const std::atomic<bool>* stop = nullptr;
  std::function<void(std::size_t, std::size_t)> progress;
  std::function<void(const std::string&)> warn;  // one line each (the parser's warnings)
};

struct RunOutcome {
  /// Each case as the results file holds it: written to its line and read back (text that is
  /// not UTF-8 is replaced there), so reports from this and from the file are the same.
  results::RunResults results;
  std::string case_lines;    // the case lines of the results file, each ending in '\n'
  bool interrupted = false;  // `stop` ended the run early: the results are incomplete
};

/// Throws InputError for bad input that stops the run (unreadable suite file, two suites with
/// one name, no suites, no parser). Bad cases do not throw: they are error records.
RunOutcome execute_run(const RunRequest& request);

/// The parser the config asks for (external command, or the built-in PCFG parser).
std::unique_ptr<ParserFactory> make_parser(const suite::ProjectConfig& config,
                                           const std::atomic<bool>* stop);

}  // namespace treegate::run
