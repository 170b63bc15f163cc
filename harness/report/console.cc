// The console summary of a run: counts, overall figures, per-suite and per-construction F1
// with deltas, the failing and regressed cases with their trees, and the gate decision.
#include <fmt/format.h>

#include <set>

#include "harness/report/bracket_diff.h"
#include "harness/report/run_reports.h"

namespace treegate::report {
namespace {

using results::CaseRecord;
using results::Outcome;

// Control characters from the data would move the cursor or recolour the terminal: show them
// as \xHH instead.
std::string shown(const std::string& text) {
  std::string out;
  for (unsigned char c : text) {
    if (c < 0x20 || c == 0x7f) {
      out += fmt::format("\\x{:02x}", c);
    } else {
      out += static_cast<char>(c);
    }
  }
  return out;
}

struct Paint {
  bool on;
  std::string operator()(const std::string& text, const char* code) const {
    return on ? std::string("\x1b[") + code + "m" + text + "\x1b[0m" : text;
  }
};

std::string delta(const std::optional<double>& d) {
  if (!d) return "";
  return fmt::format("{:+.2f}", *d);
}

void group_table(std::string& out, const char* title,
                 const std::vector<run::GroupFigures>& groups) {
  if (groups.empty()) return;
  std::size_t width = std::string_view(title).size();
  for (const auto& g : groups) width = std::max(width, g.name.size());
  out += fmt::format("\n{:<{}}  {:>6}  {:>6}  {:>7}  {:>7}\n", title, width, "cases", "passed",
                     "F1", "change");
  for (const auto& g : groups) {
    std::string line = fmt::format("{:<{}}  {:>6}  {:>6}  {:>7.2f}  {:>7}", shown(g.name), width,
                                   g.cases, g.passed, g.f1, delta(g.f1_delta));
    while (!line.empty() && line.back() == ' ') line.pop_back();
    out += line + "\n";
  }
}

void case_block(std::string& out, const CaseRecord& c, const char* tag,
                const results::RunResults& run, const std::optional<double>& base_f1,
                const Paint& paint) {
  out += fmt::format("  {} {}/{}: {}\n", paint(tag, "1;31"), shown(c.suite), shown(c.id),
                     shown(c.reason.empty() ? "passes" : c.reason));
  out += fmt::format("    F1 {:.2f} (threshold {:.2f}{})\n", c.f1, c.min_f1,
                     base_f1 ? fmt::format(", baseline {:.2f}", *base_f1) : "");
  out += "    gold:      " + (c.gold.empty() ? std::string("(none)") : shown(c.gold)) + "\n";
  out +=
      "    predicted: " + (c.predicted.empty() ? std::string("(none)") : shown(c.predicted)) + "\n";
  if (!c.gold.empty() && !c.predicted.empty()) {
    const BracketDiff d = bracket_diff(c, run.header.scheme);
    out += "    missing:   " + shown(join_brackets(d.missing)) + "\n";
    out += "    extra:     " + shown(join_brackets(d.extra)) + "\n";
  }
}

void case_lists(std::string& out, const results::RunResults& run, const run::RunSummary& s,
                const ConsoleOptions& o, const Paint& paint) {
  std::set<std::size_t> regressed;
  for (const auto& r : s.regressions) regressed.insert(r.index);
  std::size_t shown = 0, failing = 0;
  for (std::size_t i = 0; i < run.cases.size(); ++i) {
    const CaseRecord& c = run.cases[i];
    if (!results::is_failing(c.outcome)) continue;
    if (failing++ == 0) out += "\nfailing cases\n";
    if (shown++ >= o.max_cases_shown) continue;
    const char* tag = regressed.count(i)             ? "REGRESSED"
                      : c.outcome == Outcome::kError ? "ERROR"
                                                     : "FAIL";
    case_block(out, c, tag, run, s.baseline_case_f1[i], paint);
  }
  if (shown > o.max_cases_shown) {
    out += fmt::format("  ... and {} more (see the results file)\n", shown - o.max_cases_shown);
  }
  if (!s.fixes.empty()) {
    out += "\nfixed cases (failed in the baseline, pass now)\n";
    for (const auto& r : s.fixes)
      out += "  " + paint("FIXED", "1;32") + " " + r.suite + "/" + r.id + "\n";
  }
  bool news = false;
  for (const auto& c : run.cases) {
    if (c.outcome != Outcome::kUnexpectedPass) continue;
    if (!news) out += "\nknown failures that now pass (remove their known_failure markers)\n";
    news = true;
    out += "  " + paint("NEWS", "1;33") + " " + c.suite + "/" + c.id + " (" +
           c.known_failure.value_or("") + ")\n";
  }
}

}  // namespace

std::string console_summary(const results::RunResults& run, const run::RunSummary& s,
                            const ConsoleOptions& o) {
  const Paint paint{o.color};
  std::string out;
  out += fmt::format("grammar {}; parser {}; {} cases in {} suites",
                     s.grammar.empty() ? "(none)" : s.grammar, run.header.parser, s.cases,
                     s.suites.size());
  if (run.header.shard.count > 1)
    out += fmt::format(" (shard {}/{})", run.header.shard.index, run.header.shard.count);
  out +=
      fmt::format("\npassed {}, failed {}, errors {}, expected failures {}, unexpected passes {}\n",
                  s.passed, s.failed, s.errors, s.expected_failures, s.unexpected_passes);
  const Figures& f = s.figures;
  out += fmt::format("\noverall: precision {:.2f}  recall {:.2f}  F1 {:.2f}", f.precision, f.recall,
                     f.f1);
  if (s.baseline_figures) out += fmt::format(" ({:+.2f})", f.f1 - s.baseline_figures->f1);
  out += fmt::format("  exact match {:.2f}%  crossing per sentence {:.2f}  tag accuracy {:.2f}%\n",
                     f.exact_match, f.crossing_avg, f.tag_accuracy);
  group_table(out, "suite", s.suites);
  group_table(out, "construction", s.constructions);
  case_lists(out, run, s, o, paint);
  if (s.has_baseline) {
    out += fmt::format("\nagainst the baseline: {} regressions, {} fixes\n", s.regressions.size(),
                       s.fixes.size());
  }
  if (o.timings) {
    double seconds = 0;
    for (const auto& c : run.cases) seconds += c.seconds;
    out += fmt::format("\nparse time {:.3f} s in total, {:.4f} s per case\n", seconds,
                       s.cases ? seconds / static_cast<double>(s.cases) : 0.0);
  }
  out += "\ngate: " + (s.gate_passed ? paint("PASSED", "1;32") : paint("FAILED", "1;31")) + "\n";
  for (const auto& r : s.gate_reasons) out += "  - " + r + "\n";
  return out;
}

}  // namespace treegate::report
