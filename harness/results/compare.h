// Comparison of two runs (results files) case by case: transitions, P/R/F1 per suite,
// construction, label and length bucket, error classes, significance, speed, and the gate of
// NEW against OLD. `Comparison` is a plain value that the console, JSON and HTML renderers
// read; building one re-scores both runs' trees under NEW's scheme. The gate is decided by
// the run library (harness/run/gate.h), which depends on this one. No shared state.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "evaluator/error_classes.h"
#include "evaluator/significance.h"
#include "harness/results/results.h"

namespace treegate::results {

enum class Transition { kFixed, kBroken, kBetter, kWorse, kChangedSameF1, kUnchanged };
inline constexpr Transition kTransitions[] = {Transition::kFixed,         Transition::kBroken,
                                              Transition::kBetter,        Transition::kWorse,
                                              Transition::kChangedSameF1, Transition::kUnchanged};
const char* transition_name(Transition t);  // "fixed", "broken", ..., "changed_same_f1"

/// Summed bracket counts and the figures they give (percent).
struct Prf {
  std::uint64_t cases = 0, gold = 0, test = 0, matched = 0;
  double precision() const;
  double recall() const;
  double f1() const;
  void add(std::uint64_t g, std::uint64_t t, std::uint64_t m);
};

/// One line of a breakdown table: a key (suite, construction, label or bucket), both sides.
struct Row {
  std::string key;
  Prf old_side, new_side;
  double f1_delta() const { return new_side.f1() - old_side.f1(); }
};

/// A bracket one side got wrong: "missing" (gold has it) or "extra" (the side has it).
struct BracketDiff {
  std::string label;
  std::uint32_t first = 0, last = 0;  // 1-based word positions over the full sentence
  bool missing = false;
};

struct CaseSide {
  std::string tree;  // bracketed, one line ("" when there is none)
  Outcome outcome = Outcome::kError;
  std::string reason;
  double f1 = 0;
  double seconds = 0;
  std::vector<BracketDiff> wrong;  // against gold
};

struct CaseChange {
  std::string suite, id;
  std::vector<std::string> constructions;
  std::uint32_t words = 0;
  std::string gold;
  Transition transition = Transition::kUnchanged;
  CaseSide old_side, new_side;
};

struct ErrorClassRow {
  std::string name;  // error_class_name()
  ClassCount old_side, new_side;
};

struct SpeedSummary {
  std::uint64_t cases = 0;
  double total = 0, mean = 0, median = 0, p90 = 0, max = 0;  // seconds per case
};

struct GateVerdict {
  bool passed = true;
  std::vector<std::string> reasons;  // one line per broken rule
};

struct Comparison {
  std::string old_name, new_name;  // file paths as given
  Header old_header, new_header;
  std::vector<std::string> warnings;  // e.g. the two runs used different scoring schemes
  std::uint64_t paired = 0, only_old = 0, only_new = 0;
  std::vector<std::string> only_old_ids, only_new_ids;  // "suite#id"
  std::uint64_t transition_counts[6] = {};
  std::vector<CaseChange> cases;  // every paired case, canonical order of NEW
  Row overall;
  std::vector<Row> suites, constructions, labels, lengths;
  std::vector<ErrorClassRow> error_classes;
  SignificanceResult significance{};
  SpeedSummary old_speed, new_speed;
  GateVerdict gate;  // filled by the caller (the run library's gate: NEW with OLD as baseline)
};

struct CompareOptions {
  SignificanceOptions significance;
  ErrorClassOptions error_classes;
};

/// Builds the comparison; never throws on a bad case (its trees are reported as unreadable).
Comparison compare_runs(const RunResults& old_run, const std::string& old_name,
                        const RunResults& new_run, const std::string& new_name,
                        const CompareOptions& options = {});

std::string comparison_text(const Comparison& comparison, std::size_t max_listed = 20);
std::string comparison_json(const Comparison& comparison);

}  // namespace treegate::results
