#include "harness/report/score_report.h"

#include <fmt/format.h>

#include <nlohmann/json.hpp>

namespace treegate::report {
namespace {

using nlohmann::ordered_json;

ordered_json totals_json(const Counts& c) {
  const Figures f = figures(c);
  ordered_json j;
  j["sentences"] = c.sentences;
  j["scored"] = c.scored;
  j["errors"] = c.errors;
  j["unparsed"] = c.unparsed;
  j["gold_brackets"] = c.gold;
  j["test_brackets"] = c.test;
  j["matched"] = c.matched;
  j["precision"] = f.precision;
  j["recall"] = f.recall;
  j["f1"] = f.f1;
  j["exact_match"] = f.exact_match;
  j["crossing_avg"] = f.crossing_avg;
  j["zero_crossing_pct"] = f.zero_crossing_pct;
  j["le2_crossing_pct"] = f.le2_crossing_pct;
  j["tag_accuracy"] = f.tag_accuracy;
  return j;
}

std::string figure_rows(const Counts& all, const Counts& cut) {
  const Figures a = figures(all), b = figures(cut);
  std::string s;
  auto row = [&](const char* name, double x, double y, const char* unit) {
    s += fmt::format("  {:<22}{:>10.2f}{:<2}{:>12.2f}{}\n", name, x, unit, y, unit);
  };
  row("labeled precision", a.precision, b.precision, "");
  row("labeled recall", a.recall, b.recall, "");
  row("labeled F1", a.f1, b.f1, "");
  row("exact match", a.exact_match, b.exact_match, "%");
  row("crossing per sentence", a.crossing_avg, b.crossing_avg, "");
  row("no crossing", a.zero_crossing_pct, b.zero_crossing_pct, "%");
  row("2 or fewer crossing", a.le2_crossing_pct, b.le2_crossing_pct, "%");
  row("tag accuracy", a.tag_accuracy, b.tag_accuracy, "%");
  return s;
}

std::string per_sentence_json(const ScoreRun& run) {
  if (run.sentences.empty()) return "[]";
  fmt::memory_buffer out;
  fmt::format_to(std::back_inserter(out), "[");
  for (const auto& item : run.sentences) {
    const SentenceScore& x = item.score;
    fmt::format_to(std::back_inserter(out),
                   "{}\n    {{\"index\": {}, \"status\": \"{}\", \"gold_brackets\": {}, "
                   "\"test_brackets\": {}, \"matched\": {}, \"crossing\": {}, \"words\": {}, "
                   "\"tags_correct\": {}",
                   &item == &run.sentences.front() ? "" : ",", item.index, status_name(x.status),
                   x.gold_brackets, x.test_brackets, x.matched, x.crossing, x.words,
                   x.tags_correct);
    if (x.status != SentenceStatus::kScored && !x.reason.empty()) {
      fmt::format_to(
          std::back_inserter(out), ", \"reason\": {}",
          ordered_json(x.reason).dump(-1, ' ', false, ordered_json::error_handler_t::replace));
    }
    fmt::format_to(std::back_inserter(out), "}}");
  }
  fmt::format_to(std::back_inserter(out), "\n  ]");
  return fmt::to_string(out);
}

}  // namespace

std::string score_text(const ScoreRun& run, bool per_sentence) {
  const Counts& all = run.tally.all();
  const Counts& cut = run.tally.within_cutoff();
  std::string s = fmt::format("gold {}  |  test {}\n", run.gold_file, run.test_file);
  s += fmt::format("{} sentences: {} scored, {} errors, {} without a parse\n", all.sentences,
                   all.scored, all.errors, all.unparsed);
  s += fmt::format("brackets: {} gold, {} test, {} matched\n\n", all.gold, all.test, all.matched);
  s += fmt::format("  {:<22}{:>12}{:>14}\n", "", "all",
                   fmt::format("<= {} words", run.tally.scheme().length_cutoff));
  s += fmt::format("  {:<22}{:>12}{:>14}\n", "sentences counted", all.scored, cut.scored);
  s += figure_rows(all, cut);

  s += fmt::format("\n  {:<14}{:>8}{:>8}{:>8}{:>10}{:>10}{:>8}\n", "label", "gold", "test",
                   "matched", "precision", "recall", "F1");
  for (const auto& [label, lc] : run.tally.per_label()) {
    s += fmt::format(
        "  {:<14}{:>8}{:>8}{:>8}{:>10.2f}{:>10.2f}{:>8.2f}\n", std::string(run.labels->name(label)),
        lc.gold, lc.test, lc.matched, precision_pct(lc.matched, lc.test, lc.gold),
        recall_pct(lc.matched, lc.test, lc.gold), f1_pct(lc.matched, lc.test, lc.gold));
  }
  bool any_error = false;
  for (const auto& item : run.sentences) {
    const SentenceScore& x = item.score;
    if (x.status == SentenceStatus::kScored || x.status == SentenceStatus::kNoParse) continue;
    if (!any_error) s += "\nnot scored:\n";
    any_error = true;
    s += fmt::format("  sentence {}: {}: {}\n", item.index, status_name(x.status), x.reason);
  }
  if (per_sentence) {
    s += fmt::format("\n  {:>6} {:<15}{:>6}{:>6}{:>6}{:>8}{:>9}{:>6}{:>6}{:>8}\n", "#", "status",
                     "words", "gold", "test", "matched", "F1", "cross", "tags", "exact");
    for (const auto& item : run.sentences) {
      const SentenceScore& x = item.score;
      s += fmt::format("  {:>6} {:<15}{:>6}{:>6}{:>6}{:>8}{:>9.2f}{:>6}{:>6}{:>8}\n", item.index,
                       status_name(x.status), x.words, x.gold_brackets, x.test_brackets, x.matched,
                       f1_pct(x.matched, x.test_brackets, x.gold_brackets), x.crossing,
                       x.tags_correct,
                       x.counts(run.tally.scheme()) && x.exact_match() ? "yes" : "no");
    }
  }
  return s;
}

std::string score_json(const ScoreRun& run) {
  ordered_json j;
  j["totals"] = totals_json(run.tally.all());
  // The per-sentence list is the bulk of the output: written directly, one object per line.
  static const char* kSlot = "\u0001per_sentence";
  j["per_sentence"] = kSlot;
  ordered_json labels = ordered_json::object();
  for (const auto& [label, lc] : run.tally.per_label()) {
    ordered_json e;
    e["gold"] = lc.gold;
    e["test"] = lc.test;
    e["matched"] = lc.matched;
    e["precision"] = precision_pct(lc.matched, lc.test, lc.gold);
    e["recall"] = recall_pct(lc.matched, lc.test, lc.gold);
    e["f1"] = f1_pct(lc.matched, lc.test, lc.gold);
    labels[std::string(run.labels->name(label))] = std::move(e);
  }
  j["per_label"] = std::move(labels);
  ordered_json cut = totals_json(run.tally.within_cutoff());
  cut["max_length"] = run.tally.scheme().length_cutoff;
  j["cutoff"] = std::move(cut);
  std::string text = j.dump(2, ' ', false, ordered_json::error_handler_t::replace);
  const std::string slot = ordered_json(kSlot).dump();
  text.replace(text.find(slot), slot.size(), per_sentence_json(run));
  return text + "\n";
}

}  // namespace treegate::report
