// The runner: parses every case with a pool of worker threads (one SentenceParser per
// worker); the calling thread meanwhile scores the parsed cases in input order, applies their
// checks and hands each CaseRecord to an optional callback, so the output does not depend on
// the number of workers.
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
  // Called on this thread for each record, in input order, as soon as it and all before it
  // are parsed and scored: the caller's bookkeeping runs while later cases are being parsed.
  std::function<void(results::CaseRecord&)> on_record;
};

/// Every case of `suites` in order (suites, then cases).
std::vector<WorkItem> all_cases(const std::vector<suite::Suite>& suites);

/// Cases handed from the suite loader to the workers while loading goes on: the loader
/// add()s cases in run order (each must stay at its address for the whole run) and then
/// close()s the feed; the workers start on the first cases while later ones are being read.
/// Any thread may add or close; one run_cases() call consumes the feed.
class CaseFeed {
 public:
  CaseFeed();
  ~CaseFeed();
  CaseFeed(const CaseFeed&) = delete;
  CaseFeed& operator=(const CaseFeed&) = delete;
  void add(const WorkItem& item);
  /// No more cases. `complete` false: loading failed, so the workers stop early too.
  void close(bool complete = true);

  struct State;  // internal to the runner

 private:
  friend std::vector<results::CaseRecord> run_cases(CaseFeed& feed, const ParserFactory& parser,
                                                    const RunOptions& options);
  std::unique_ptr<State> state_;
};

/// Runs the cases of `feed` until it is closed and all are done; returns their records in
/// feed order. When stopped (or the feed closed incomplete), the records of the cases not
/// run are missing (the caller must not write them as results).
std::vector<results::CaseRecord> run_cases(CaseFeed& feed, const ParserFactory& parser,
                                           const RunOptions& options);
/// The same for a list of cases known beforehand.
std::vector<results::CaseRecord> run_cases(const std::vector<WorkItem>& items,
                                           const ParserFactory& parser, const RunOptions& options);

/// Builds the record of one case from the parser's outcome (scoring and checks).
results::CaseRecord record_case(const WorkItem& item, ParseOutcome outcome, Scorer& scorer,
                                const RunOptions& options);

}  // namespace treegate::run
