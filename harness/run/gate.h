// The run's figures and the gate decision, computed from results files only (so `report` and
// `run` agree): totals, per-suite and per-construction F1 with deltas against a baseline,
// regressions and fixes, and which gate rules failed. Plain values; no shared state.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "evaluator/tally.h"
#include "harness/results/results.h"

namespace treegate::run {

struct GroupFigures {
  std::string name;
  std::size_t cases = 0;
  std::size_t passed = 0;  // outcome pass or unexpected_pass
  Counts counts;
  double f1 = 0;
  std::optional<double> baseline_f1;  // set when the baseline has this group
  std::optional<double> f1_delta;
};

struct ConstructionGate {
  std::string name;
  double f1 = 0;
  std::optional<double> min_f1;    // gate.construction_min_f1
  std::optional<double> f1_delta;  // against the baseline
  std::optional<double> max_drop;  // gate.max_construction_drop
  bool passed = true;
  std::string detail;  // one line: F1 against its gate
};

struct CaseRef {
  std::size_t index;  // into RunResults::cases
  std::string suite, id;
};

struct RunSummary {
  std::string grammar;
  std::size_t cases = 0, passed = 0, failed = 0, errors = 0, expected_failures = 0,
              unexpected_passes = 0;
  Counts totals;
  Figures figures;
  std::optional<Figures> baseline_figures;
  std::vector<GroupFigures> suites;                     // header order
  std::vector<GroupFigures> constructions;              // sorted by name
  std::vector<ConstructionGate> construction_gates;     // one per construction
  std::vector<CaseRef> regressions;                     // passed in the baseline, fail now
  std::vector<CaseRef> fixes;                           // failed in the baseline, pass now
  std::vector<std::optional<double>> baseline_case_f1;  // per case of the run; null: not there
  bool has_baseline = false;
  bool gate_passed = true;
  std::vector<std::string> gate_reasons;  // one line per failed rule
};

/// Summarizes `run` (gate settings from its header) against `baseline` (may be null).
RunSummary summarize(const results::RunResults& run, const results::RunResults* baseline);

/// Adds a record's counts to a tally (the record's score status decides how it counts).
void add_record(Counts& counts, const results::CaseRecord& record, const Scheme& scheme);

}  // namespace treegate::run
