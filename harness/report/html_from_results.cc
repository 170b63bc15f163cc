#include "harness/report/html_from_results.h"

#include <chrono>
#include <cmath>
#include <ctime>
#include <map>
#include <set>

#include <fmt/format.h>

#include "evaluator/bracket_io.h"
#include "evaluator/error_classes.h"
#include "evaluator/errors.h"
#include "evaluator/tally.h"
#include "harness/report/html_page.h"
#include "harness/results/case_score.h"

namespace treegate::report::html {
namespace {

using results::CaseRecord;
using results::RunResults;

const char* const kBuckets[] = {
    "1\xE2\x80\x93"
    "10",
    "11\xE2\x80\x93"
    "20",
    "21\xE2\x80\x93"
    "30",
    "31\xE2\x80\x93"
    "40",
    "41+"};

// Tallies of one run: overall, and by suite, construction, length bucket and label.
struct RunTallies {
  Counts all;
  std::map<std::string, Counts> suite, construction, length;
  std::map<std::string, std::size_t> suite_passed, construction_passed, suite_cases,
      construction_cases, length_cases;
  std::map<std::string, LabelCounts> label;
  ErrorTally errors;
};

RunTallies tally(const RunResults& run) {
  RunTallies t;
  const Scheme& scheme = run.header.scheme;
  LabelTable labels;
  Scorer scorer(scheme, labels);
  ErrorClassifier classifier(scorer);
  for (const CaseRecord& c : run.cases) {
    const SentenceScore s = results::sentence_score(c);
    const bool pass = results::is_passing(c.outcome);
    t.all.add(s, scheme);
    t.suite[c.suite].add(s, scheme);
    ++t.suite_cases[c.suite];
    t.suite_passed[c.suite] += pass;
    for (const auto& k : c.constructions) {
      t.construction[k].add(s, scheme);
      ++t.construction_cases[k];
      t.construction_passed[k] += pass;
    }
    if (s.counts(scheme) && s.words > 0) {
      const std::string bucket = length_bucket(s.words);
      t.length[bucket].add(s, scheme);
      ++t.length_cases[bucket];
    }
    if (s.status != SentenceStatus::kScored) continue;
    try {  // per-label counts need the brackets: score the two trees again
      const Tree gold = parse_tree(c.gold, "gold", labels);
      const Tree test = parse_tree(c.predicted, "predicted", labels);
      BracketSets sets;
      scorer.score(gold, test, &sets);
      for (const auto& b : sets.gold) {
        auto& lc = t.label[std::string(labels.name(b.label))];
        ++lc.gold;
        lc.matched += b.matched;
      }
      for (const auto& b : sets.test) ++t.label[std::string(labels.name(b.label))].test;
      t.errors.add(classifier.classify(gold, test), labels);
    } catch (const InputError&) {
      // A tree the run could score but we cannot read again: left out of the label table.
    }
  }
  return t;
}

Figure figure(double now, std::optional<double> before) { return Figure{now, before}; }

std::optional<double> f1_of(const std::map<std::string, Counts>* m, const std::string& key) {
  if (!m) return std::nullopt;
  const auto it = m->find(key);
  if (it == m->end() || it->second.scored == 0) return std::nullopt;
  return figures(it->second).f1;
}

Breakdown groups(const char* id, const char* title, const char* key,
                 const std::map<std::string, Counts>& now, const std::map<std::string, Counts>* old,
                 const std::map<std::string, std::size_t>& cases,
                 const std::map<std::string, std::size_t>& passed) {
  Breakdown b{id, title, key, "cases", {}, ""};
  for (const auto& [name, c] : now) {
    const Figures f = figures(c);
    GroupRow r{name, cases.at(name), passed.at(name), {}, {}, {}};
    const bool any = c.scored > 0;
    r.precision.value = any ? f.precision : std::nan("");
    r.recall.value = any ? f.recall : std::nan("");
    r.f1 = figure(any ? f.f1 : std::nan(""), f1_of(old, name));
    b.rows.push_back(std::move(r));
  }
  return b;
}

void fill_summary(ReportView& v, const RunTallies& now, const RunTallies* old) {
  const Figures f = figures(now.all);
  std::optional<Figures> o;
  if (old) o = figures(old->all);
  auto pick = [&](double Figures::*m) {
    return Figure{f.*m, o ? std::optional<double>((*o).*m) : std::nullopt};
  };
  v.summary.precision = pick(&Figures::precision);
  v.summary.recall = pick(&Figures::recall);
  v.summary.f1 = pick(&Figures::f1);
  v.summary.exact_match = pick(&Figures::exact_match);
  v.summary.crossing_avg = pick(&Figures::crossing_avg);
  v.summary.tag_accuracy = pick(&Figures::tag_accuracy);
}

void fill_tables(ReportView& v, const RunTallies& now, const RunTallies* old) {
  v.tables.push_back(groups("suites", "By suite", "suite", now.suite, old ? &old->suite : nullptr,
                            now.suite_cases, now.suite_passed));
  if (!now.construction.empty()) {
    v.tables.push_back(groups("constructions", "By construction", "construction", now.construction,
                              old ? &old->construction : nullptr, now.construction_cases,
                              now.construction_passed));
  }
  Breakdown labels{"labels", "By label", "label", "gold brackets", {}, ""};
  for (const auto& [name, lc] : now.label) {
    GroupRow r{name, lc.gold, std::nullopt, {}, {}, {}};
    r.precision.value = precision_pct(lc.matched, lc.test, lc.gold);
    r.recall.value = recall_pct(lc.matched, lc.test, lc.gold);
    r.f1.value = f1_pct(lc.matched, lc.test, lc.gold);
    if (old) {
      if (const auto it = old->label.find(name); it != old->label.end()) {
        r.f1.before = f1_pct(it->second.matched, it->second.test, it->second.gold);
      }
    }
    labels.rows.push_back(std::move(r));
  }
  labels.note =
      "Labels as the scoring scheme compares them (function tags stripped, "
      "equivalent labels merged); counts over scored sentences.";
  v.tables.push_back(std::move(labels));
  for (const char* bucket : kBuckets) {
    GroupRow r{bucket, 0, std::nullopt, {}, {}, {}};
    const auto it = now.length.find(bucket);
    r.cases = it == now.length.end() ? 0 : now.length_cases.at(bucket);
    const Figures f = it == now.length.end() ? Figures{} : figures(it->second);
    const bool any = r.cases > 0;
    r.precision.value = any ? f.precision : std::nan("");
    r.recall.value = any ? f.recall : std::nan("");
    r.f1 = figure(any ? f.f1 : std::nan(""), f1_of(old ? &old->length : nullptr, bucket));
    v.lengths.push_back(std::move(r));
  }
}

void fill_error_classes(ReportView& v, const RunTallies& now, const RunTallies* old) {
  std::map<std::string, ErrorClassRow> rows;
  for (const auto& [name, count] : now.errors.by_class()) rows[name].count = count.errors;
  if (old) {
    for (auto& [name, row] : rows) row.before = 0;
    for (const auto& [name, count] : old->errors.by_class()) rows[name].before = count.errors;
  }
  for (auto& [name, row] : rows) {
    row.name = name;
    v.error_classes.push_back(row);
  }
  v.error_classes_note = "No wrong brackets: nothing to classify.";
}

}  // namespace

std::string length_bucket(std::size_t words) {
  return kBuckets[std::min<std::size_t>(4, words == 0 ? 0 : (words - 1) / 10)];
}

std::string transition(const CaseRecord& before, const CaseRecord& after) {
  const bool was = results::is_passing(before.outcome), is = results::is_passing(after.outcome);
  if (!was && is) return "fixed";
  if (was && !is) return "broken";
  if (after.f1 > before.f1 + 1e-9) return "better";
  if (after.f1 < before.f1 - 1e-9) return "worse";
  if (after.predicted != before.predicted) return "changed_same_f1";
  return "unchanged";
}

ReportView view_of_run(const RunResults& run, const RunResults* baseline, const GateOutcome& gate,
                       const std::string& date) {
  ReportView v;
  v.title = baseline ? "treegate run against a baseline" : "treegate run";
  v.tool_version = run.header.tool_version;
  v.date = date;
  v.grammars.push_back(
      {"grammar", run.header.grammar.empty() ? run.header.parser : run.header.grammar});
  if (baseline) v.grammars.push_back({"baseline grammar", baseline->header.grammar});
  v.comparison = baseline != nullptr;
  v.gate_passed = gate.passed;
  v.gate_reasons = gate.reasons;
  v.scheme = run.header.scheme;
  if (run.header.shard.count > 1) {
    v.notes.push_back(fmt::format("This is shard {} of {}: only its cases are shown.",
                                  run.header.shard.index, run.header.shard.count));
  }
  const RunTallies now = tally(run);
  std::optional<RunTallies> old;
  if (baseline) old = tally(*baseline);
  fill_summary(v, now, old ? &*old : nullptr);
  fill_tables(v, now, old ? &*old : nullptr);
  fill_error_classes(v, now, old ? &*old : nullptr);

  std::map<std::pair<std::string, std::string>, const CaseRecord*> before;
  if (baseline) {
    for (const auto& c : baseline->cases) before[{c.suite, c.id}] = &c;
    v.counts.fixed = 0;
    v.counts.broken = 0;
  }
  for (const CaseRecord& c : run.cases) {
    CaseView cv;
    cv.suite = c.suite;
    cv.id = c.id;
    cv.constructions = c.constructions;
    cv.status = results::outcome_name(c.outcome);
    cv.reason = c.reason;
    for (const auto& check : c.checks) {
      if (!check.passed) cv.failed_checks.push_back(check.check + ": " + check.detail);
    }
    cv.f1 = c.f1;
    cv.gold = c.gold;
    cv.predicted = c.predicted;
    cv.logprob = c.logprob;
    cv.seconds = c.seconds;
    if (const auto it = before.find({c.suite, c.id}); it != before.end()) {
      const CaseRecord& b = *it->second;
      cv.f1_before = b.f1;
      cv.transition = transition(b, c);
      if (b.predicted != c.predicted) cv.predicted_before = b.predicted;
      if (cv.transition == "fixed") ++*v.counts.fixed;
      if (cv.transition == "broken") ++*v.counts.broken;
    } else if (baseline) {
      cv.transition = "only in new";
    }
    ++v.counts.cases;
    switch (c.outcome) {
      case results::Outcome::kPass:
        ++v.counts.passed;
        break;
      case results::Outcome::kFail:
        ++v.counts.failed;
        break;
      case results::Outcome::kError:
        ++v.counts.errors;
        break;
      case results::Outcome::kExpectedFailure:
        ++v.counts.expected_failures;
        break;
      case results::Outcome::kUnexpectedPass:
        ++v.counts.unexpected_passes;
        break;
    }
    v.cases.push_back(std::move(cv));
  }
  return v;
}

std::string utc_now() {
  const std::time_t now = std::chrono::system_clock::to_time_t(std::chrono::system_clock::now());
  std::tm utc{};
  gmtime_r(&now, &utc);
  char text[32];
  std::strftime(text, sizeof text, "%Y-%m-%d %H:%M UTC", &utc);
  return text;
}

void write_run_report(const std::string& path, const RunResults& run, const RunResults* baseline,
                      const run::RunSummary& summary) {
  const std::string date = run.header.timings ? utc_now() : "";
  ReportView v = view_of_run(run, baseline, {summary.gate_passed, summary.gate_reasons}, date);
  v.counts.cases = summary.cases;
  v.counts.passed = summary.passed;
  v.counts.failed = summary.failed;
  v.counts.errors = summary.errors;
  v.counts.expected_failures = summary.expected_failures;
  v.counts.unexpected_passes = summary.unexpected_passes;
  if (summary.has_baseline) {
    v.counts.fixed = summary.fixes.size();
    v.counts.broken = summary.regressions.size();
    // The run's own lists decide which cases are fixed or broken (a known failure that now
    // passes is news, not a fix), so the badges agree with the counts and the summary JSON.
    std::set<std::pair<std::string, std::string>> fixed, broken;
    for (const auto& r : summary.fixes) fixed.insert({r.suite, r.id});
    for (const auto& r : summary.regressions) broken.insert({r.suite, r.id});
    for (auto& c : v.cases) {
      const bool is_fixed = fixed.count({c.suite, c.id}) > 0;
      const bool is_broken = broken.count({c.suite, c.id}) > 0;
      if (is_fixed) c.transition = "fixed";
      if (is_broken) c.transition = "broken";
      if ((c.transition == "fixed" && !is_fixed) || (c.transition == "broken" && !is_broken)) {
        c.transition = !c.f1_before || c.f1 == *c.f1_before
                           ? (c.predicted_before ? "changed_same_f1" : "unchanged")
                           : (c.f1 > *c.f1_before ? "better" : "worse");
      }
    }
  }
  write_html_report(path, v);
}

}  // namespace treegate::report::html
