// Console and JSON forms of a Comparison (the layout is documented in docs/compare.md).
// Tested by tests/results/compare_test.cc and tests/e2e/compare_cli.sh.
#include <fmt/format.h>

#include <nlohmann/json.hpp>

#include "harness/results/compare.h"

namespace treegate::results {
namespace {

using ojson = nlohmann::ordered_json;

const char* transition_title(Transition t) {
  switch (t) {
    case Transition::kFixed:
      return "fixed (failed in OLD, passes in NEW)";
    case Transition::kBroken:
      return "broken (passed in OLD, fails in NEW)";
    case Transition::kBetter:
      return "better (F1 up, same pass state)";
    case Transition::kWorse:
      return "worse (F1 down, same pass state)";
    case Transition::kChangedSameF1:
      return "changed tree, same F1";
    case Transition::kUnchanged:
      return "unchanged";
  }
  return "";
}

std::string wrong_list(const std::vector<BracketDiff>& wrong) {
  if (wrong.empty()) return "none";
  std::string out;
  for (const BracketDiff& d : wrong) {
    if (!out.empty()) out += ", ";
    out += fmt::format("{} {} {}-{}", d.missing ? "missing" : "extra", d.label, d.first, d.last);
  }
  return out;
}

// `brackets`: the count column shows NEW's gold brackets instead of cases (per-label rows).
void table(std::string& out, const std::string& title, const std::vector<Row>& rows,
           bool brackets = false) {
  if (rows.empty()) return;
  std::size_t w = title.size();
  for (const Row& r : rows) w = std::max(w, r.key.size());
  out += fmt::format("\n{:<{}}  {:>6}  {:>6} {:>6} {:>6}  {:>6} {:>6} {:>6}  {:>7}\n", title, w,
                     brackets ? "gold" : "cases", "P old", "R old", "F1 old", "P new", "R new",
                     "F1 new", "F1 diff");
  for (const Row& r : rows) {
    out += fmt::format(
        "{:<{}}  {:>6}  {:>6.2f} {:>6.2f} {:>6.2f}  {:>6.2f} {:>6.2f} {:>6.2f}  {:>+7.2f}\n", r.key,
        w, r.new_side.cases, r.old_side.precision(), r.old_side.recall(), r.old_side.f1(),
        r.new_side.precision(), r.new_side.recall(), r.new_side.f1(), r.f1_delta());
  }
}

void speed_line(std::string& out, const char* side, const SpeedSummary& s) {
  out += fmt::format(
      "  {}: {} cases, {:.3f} s in all; per case mean {:.2f} ms, median {:.2f} ms, "
      "90th percentile {:.2f} ms, max {:.2f} ms\n",
      side, s.cases, s.total, s.mean * 1e3, s.median * 1e3, s.p90 * 1e3, s.max * 1e3);
}

}  // namespace

std::string comparison_text(const Comparison& c, std::size_t max_listed) {
  std::string out;
  out += fmt::format(
      "OLD: {} (grammar {}, {} cases)\nNEW: {} (grammar {}, {} cases)\n", c.old_name,
      c.old_header.grammar.empty() ? "-" : c.old_header.grammar, c.paired + c.only_old, c.new_name,
      c.new_header.grammar.empty() ? "-" : c.new_header.grammar, c.paired + c.only_new);
  out += fmt::format("compared: {} cases in both runs; {} only in OLD, {} only in NEW\n", c.paired,
                     c.only_old, c.only_new);
  for (const auto& w : c.warnings) out += "warning: " + w + "\n";
  out += "\ntransitions:";
  for (Transition t : kTransitions) {
    out += fmt::format(" {} {}{}", transition_name(t), c.transition_counts[static_cast<int>(t)],
                       t == Transition::kUnchanged ? "\n" : ",");
  }
  table(out, "overall", {c.overall});
  table(out, "suite", c.suites);
  table(out, "construction", c.constructions);
  table(out, "label", c.labels, true);
  table(out, "length", c.lengths);
  if (!c.error_classes.empty()) {
    out += fmt::format("\n{:<18}  {:>14}  {:>14}  {:>11}\n", "error class", "OLD errors (br)",
                       "NEW errors (br)", "errors diff");
    for (const ErrorClassRow& r : c.error_classes) {
      out += fmt::format(
          "{:<18}  {:>14}  {:>14}  {:>+11}\n", r.name,
          fmt::format("{} ({})", r.old_side.errors, r.old_side.brackets),
          fmt::format("{} ({})", r.new_side.errors, r.new_side.brackets),
          static_cast<long long>(r.new_side.errors) - static_cast<long long>(r.old_side.errors));
    }
  }
  out += "\nsignificance: " + significance_sentence(c.significance) + "\n";
  out += "\nparse time:\n";
  speed_line(out, "OLD", c.old_speed);
  speed_line(out, "NEW", c.new_speed);
  if (c.old_speed.total > 0) {
    out += fmt::format("  NEW/OLD total time: {:.2f}\n", c.new_speed.total / c.old_speed.total);
  }
  for (Transition t : kTransitions) {
    if (t == Transition::kUnchanged || c.transition_counts[static_cast<int>(t)] == 0) continue;
    out += fmt::format("\n{}: {}\n", transition_title(t), c.transition_counts[static_cast<int>(t)]);
    std::size_t shown = 0;
    for (const CaseChange& k : c.cases) {
      if (k.transition != t) continue;
      if (shown++ == max_listed) {
        out += fmt::format("  ... {} more (all are in --format json)\n",
                           c.transition_counts[static_cast<int>(t)] - max_listed);
        break;
      }
      out += fmt::format("  {}#{}  F1 {:.2f} -> {:.2f}  ({} -> {}), {:.1f} ms -> {:.1f} ms\n",
                         k.suite, k.id, k.old_side.f1, k.new_side.f1,
                         outcome_name(k.old_side.outcome), outcome_name(k.new_side.outcome),
                         k.old_side.seconds * 1e3, k.new_side.seconds * 1e3);
      out += "    gold: " + k.gold + "\n";
      out += "    old:  " + (k.old_side.tree.empty() ? "(no tree)" : k.old_side.tree) + "\n";
      out += "    new:  " + (k.new_side.tree.empty() ? "(no tree)" : k.new_side.tree) + "\n";
      out += "    old wrong: " + wrong_list(k.old_side.wrong) + "\n";
      out += "    new wrong: " + wrong_list(k.new_side.wrong) + "\n";
    }
  }
  out += c.gate.passed ? "\ngate: passed\n" : "\ngate: FAILED\n";
  for (const auto& r : c.gate.reasons) out += "  - " + r + "\n";
  return out;
}

namespace {

ojson prf_json(const Prf& p) {
  return ojson{{"cases", p.cases},
               {"gold", p.gold},
               {"test", p.test},
               {"matched", p.matched},
               {"precision", p.precision()},
               {"recall", p.recall()},
               {"f1", p.f1()}};
}

ojson rows_json(const std::vector<Row>& rows) {
  ojson out = ojson::object();
  for (const Row& r : rows) {
    out[r.key] = {
        {"old", prf_json(r.old_side)}, {"new", prf_json(r.new_side)}, {"f1_delta", r.f1_delta()}};
  }
  return out;
}

ojson side_json(const CaseSide& s) {
  ojson wrong = ojson::array();
  for (const BracketDiff& d : s.wrong) {
    wrong.push_back({{"label", d.label},
                     {"first", d.first},
                     {"last", d.last},
                     {"kind", d.missing ? "missing" : "extra"}});
  }
  return {{"tree", s.tree},       {"outcome", outcome_name(s.outcome)},
          {"reason", s.reason},   {"f1", s.f1},
          {"seconds", s.seconds}, {"wrong", wrong}};
}

ojson speed_json(const SpeedSummary& s) {
  return {{"cases", s.cases},   {"total", s.total}, {"mean", s.mean},
          {"median", s.median}, {"p90", s.p90},     {"max", s.max}};
}

}  // namespace

std::string comparison_json(const Comparison& c) {
  ojson j;
  j["old"] = {{"file", c.old_name},
              {"grammar", c.old_header.grammar},
              {"grammar_hash", c.old_header.grammar_hash}};
  j["new"] = {{"file", c.new_name},
              {"grammar", c.new_header.grammar},
              {"grammar_hash", c.new_header.grammar_hash}};
  j["paired"] = c.paired;
  j["only_old"] = c.only_old_ids;
  j["only_new"] = c.only_new_ids;
  j["warnings"] = c.warnings;
  ojson t = ojson::object();
  for (Transition x : kTransitions)
    t[transition_name(x)] = c.transition_counts[static_cast<int>(x)];
  j["transitions"] = t;
  j["overall"] = {{"old", prf_json(c.overall.old_side)},
                  {"new", prf_json(c.overall.new_side)},
                  {"f1_delta", c.overall.f1_delta()}};
  j["suites"] = rows_json(c.suites);
  j["constructions"] = rows_json(c.constructions);
  j["labels"] = rows_json(c.labels);
  j["lengths"] = rows_json(c.lengths);
  ojson ec = ojson::object();
  for (const ErrorClassRow& r : c.error_classes) {
    ec[r.name] = {{"old", {{"errors", r.old_side.errors}, {"brackets", r.old_side.brackets}}},
                  {"new", {{"errors", r.new_side.errors}, {"brackets", r.new_side.brackets}}},
                  {"errors_delta", static_cast<long long>(r.new_side.errors) -
                                       static_cast<long long>(r.old_side.errors)}};
  }
  j["error_classes"] = ec;
  const SignificanceResult& s = c.significance;
  j["significance"] = {{"method", method_name(s.method)},
                       {"iterations", s.iterations},
                       {"seed", s.seed},
                       {"level", s.level},
                       {"f1_old", s.f1_a},
                       {"f1_new", s.f1_b},
                       {"delta", s.delta},
                       {"at_least", s.at_least},
                       {"p", s.p},
                       {"significant", s.significant()},
                       {"sentence", significance_sentence(s)}};
  j["speed"] = {{"old", speed_json(c.old_speed)}, {"new", speed_json(c.new_speed)}};
  j["gate"] = {{"passed", c.gate.passed}, {"reasons", c.gate.reasons}};
  ojson cases = ojson::array();
  for (const CaseChange& k : c.cases) {
    if (k.transition == Transition::kUnchanged) continue;  // counted, not listed
    cases.push_back({{"suite", k.suite},
                     {"id", k.id},
                     {"constructions", k.constructions},
                     {"words", k.words},
                     {"transition", transition_name(k.transition)},
                     {"gold", k.gold},
                     {"old", side_json(k.old_side)},
                     {"new", side_json(k.new_side)}});
  }
  j["cases"] = std::move(cases);
  return j.dump(1) + "\n";
}

}  // namespace treegate::results
