// The HTML report's input: a small "view model" of plain values that the run and compare code
// fill (see html_from_results.h for runs read from results files). The renderer reads nothing
// else, so it stays independent of how results are stored. Plain values; no shared state.
#pragma once

#include <cmath>
#include <cstdint>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "evaluator/scheme.h"

namespace treegate::report::html {

/// A figure of the new run with, when there is one, the same figure of the baseline.
struct Figure {
  double value = std::nan("");
  std::optional<double> before;
};

struct SummaryView {
  Figure precision, recall, f1;  // percent, micro-averaged
  Figure exact_match;            // percent of scored sentences
  Figure crossing_avg;           // crossing brackets per sentence
  Figure tag_accuracy;           // percent of scored words
};

struct CountsView {
  std::size_t cases = 0, passed = 0, failed = 0, errors = 0;
  std::size_t expected_failures = 0, unexpected_passes = 0;
  std::optional<std::size_t> fixed, broken;  // only against a baseline
};

/// One row of a breakdown table (a suite, a construction, a label or a length bucket).
struct GroupRow {
  std::string name;
  std::size_t cases = 0;  // sentences (for labels: gold brackets)
  std::optional<std::size_t> passed;
  Figure precision, recall, f1;
};

struct Breakdown {
  std::string id;     // "suites", "constructions", "labels", "lengths" (an HTML id)
  std::string title;  // "Suites"
  std::string key;    // heading of the first column: "suite"
  std::string count;  // heading of the count column: "cases", "gold brackets"
  std::vector<GroupRow> rows;
  std::string note;  // shown under the table
};

struct ErrorClassRow {
  std::string name;  // "PP attachment"
  std::optional<std::uint64_t> before;
  std::uint64_t count = 0;
};

struct CaseView {
  std::string suite, id;
  std::vector<std::string> constructions;
  std::string status;      // pass, fail, error, expected_failure, unexpected_pass
  std::string transition;  // against a baseline: fixed, broken, better, worse, changed, unchanged
  std::string reason;      // one line: why it failed or erred
  std::vector<std::string> failed_checks;
  double f1 = 0;
  std::optional<double> f1_before;
  std::string gold;                             // bracketed, one line
  std::string predicted;                        // bracketed; "" when there is no tree
  std::optional<std::string> predicted_before;  // comparisons: the baseline's tree
  std::optional<double> logprob;
  double seconds = 0;
};

struct ReportView {
  std::string title = "treegate report";
  std::string tool_version, date;
  std::vector<std::pair<std::string, std::string>> grammars;  // (role, path): ("grammar", "g.pcfg")
  bool comparison = false;  // cases show baseline beside new beside gold
  std::string before_name = "baseline", after_name = "this run";
  bool gate_passed = true;
  std::vector<std::string> gate_reasons;  // why the gate failed (or notes when it passed)
  std::vector<std::string> notes;         // further sentences (significance, timings, ...)
  SummaryView summary;
  CountsView counts;
  std::vector<Breakdown> tables;
  std::vector<GroupRow> lengths;  // F1 by length bucket (also drawn as a chart)
  std::vector<ErrorClassRow> error_classes;
  std::string error_classes_note;  // e.g. why there are none
  std::vector<CaseView> cases;
  Scheme scheme;  // how the trees are compared for the highlights
};

}  // namespace treegate::report::html
