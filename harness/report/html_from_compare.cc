#include "harness/report/html_from_compare.h"

#include <map>

#include <fmt/format.h>

#include "evaluator/significance.h"
#include "harness/report/html_from_results.h"
#include "harness/report/html_page.h"

namespace treegate::report::html {
namespace {

Breakdown breakdown(const char* id, const char* title, const char* key, const char* count,
                    const std::vector<results::Row>& rows) {
  Breakdown b{id, title, key, count, {}, ""};
  for (const auto& r : rows) {
    GroupRow g{r.key, static_cast<std::size_t>(r.new_side.cases), std::nullopt, {}, {}, {}};
    if (std::string(id) == "labels") g.cases = static_cast<std::size_t>(r.new_side.gold);
    g.precision = {r.new_side.precision(), r.old_side.precision()};
    g.recall = {r.new_side.recall(), r.old_side.recall()};
    g.f1 = {r.new_side.f1(), r.old_side.f1()};
    b.rows.push_back(std::move(g));
  }
  return b;
}

std::string speed(const char* side, const results::SpeedSummary& s) {
  return fmt::format(
      "{}: {} cases, {:.4f} s per case on average (median {:.4f} s, slowest {:.4f} s)", side,
      s.cases, s.mean, s.median, s.max);
}

}  // namespace

ReportView view_of_comparison(const results::Comparison& c, const results::RunResults& old_run,
                              const results::RunResults& new_run, const std::string& date) {
  ReportView v = view_of_run(new_run, &old_run, {c.gate.passed, c.gate.reasons}, date);
  v.title = "treegate compare";
  v.grammars = {{"old", c.old_name}, {"new", c.new_name}};
  if (!c.old_header.grammar.empty()) v.grammars.push_back({"old grammar", c.old_header.grammar});
  if (!c.new_header.grammar.empty()) v.grammars.push_back({"new grammar", c.new_header.grammar});
  v.before_name = "old";
  v.after_name = "new";
  v.comparison = true;

  v.notes = c.warnings;
  v.notes.push_back(significance_sentence(c.significance));
  if (c.only_old || c.only_new) {
    v.notes.push_back(fmt::format("{} cases paired; {} only in old, {} only in new.", c.paired,
                                  c.only_old, c.only_new));
  }
  v.notes.push_back("Parse time, " + speed("old", c.old_speed) + "; " + speed("new", c.new_speed) +
                    ".");

  v.tables.clear();
  v.tables.push_back(breakdown("suites", "By suite", "suite", "cases", c.suites));
  if (!c.constructions.empty()) {
    v.tables.push_back(
        breakdown("constructions", "By construction", "construction", "cases", c.constructions));
  }
  v.tables.push_back(breakdown("labels", "By label", "label", "gold brackets", c.labels));
  v.tables.back().note = "Both runs scored again under the new run's scoring scheme.";
  v.lengths = breakdown("lengths", "", "", "", c.lengths).rows;

  v.error_classes.clear();
  for (const auto& e : c.error_classes)
    v.error_classes.push_back({e.name, e.old_side.errors, e.new_side.errors});
  v.error_classes_note = "No wrong brackets on either side.";

  v.counts.fixed = c.transition_counts[static_cast<int>(results::Transition::kFixed)];
  v.counts.broken = c.transition_counts[static_cast<int>(results::Transition::kBroken)];
  std::map<std::pair<std::string, std::string>, const results::CaseChange*> changes;
  for (const auto& ch : c.cases) changes[{ch.suite, ch.id}] = &ch;
  for (auto& cv : v.cases) {
    const auto it = changes.find({cv.suite, cv.id});
    if (it == changes.end()) {
      cv.transition = "only in new";
      cv.predicted_before.reset();
      continue;
    }
    const results::CaseChange& ch = *it->second;
    cv.transition = results::transition_name(ch.transition);
    cv.f1_before = ch.old_side.f1;
    if (ch.old_side.tree != ch.new_side.tree) {
      cv.predicted_before = ch.old_side.tree;
    } else {
      cv.predicted_before.reset();
    }
  }
  return v;
}

void write_compare_report(const std::string& path, const results::Comparison& c,
                          const results::RunResults& old_run, const results::RunResults& new_run) {
  write_html_report(path, view_of_comparison(c, old_run, new_run, utc_now()));
}

}  // namespace treegate::report::html
