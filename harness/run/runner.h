// The runner: parses every case with a pool of worker threads (one SentenceParser and one
// Scorer per worker), scores it, applies its checks and returns one CaseRecord per case in
// input order, so the output does not depend on the number of workers.
#pragma once

#include <atomic>
#include <functional>
#include <vector>

#include "evaluator/parseval.h"
#include "evaluator/scheme.h"
#include "harness/results/results.h"
#include "harness/run/sentence_parser.h"
#include "harness/suite/suite.h"

namespace treegate::run {

struct WorkItem {
  const suite::Suite* suite;
  const suite::Case* item;
  std::size_t n;  // 1-based position in the suite
};

struct RunOptions {
  std::size_t jobs = 1;
  Scheme scheme;
  double case_min_f1 = 100;
  bool timings = true;
  const std::atomic<bool>* stop = nullptr;  // set: workers finish their sentence and stop
  std::function<void(std::size_t done, std::size_t total)> progress;  // called on this thread
};

/// Every case of `suites` in order (suites, then cases).
std::vector<WorkItem> all_cases(const std::vector<suite::Suite>& suites);

/// Runs `items`; returns their records in the same order. When stopped, the records of the
/// cases not run are missing (the caller must not write them as results).
std::vector<results::CaseRecord> run_cases(const std::vector<WorkItem>& items,
                                           const ParserFactory& parser, const RunOptions& options);

/// Builds the record of one case from the parser's outcome (scoring and checks).
results::CaseRecord record_case(const WorkItem& item, ParseOutcome outcome, Scorer& scorer,
                                const RunOptions& options);

}  // namespace treegate::run
