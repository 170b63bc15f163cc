#include "harness/run/gate.h"
#include "harness/results/case_score.h"

#include <cstdio>
#include <map>
#include <set>

namespace treegate::run {
namespace {

using results::CaseRecord;
using results::Outcome;
using results::RunResults;

std::string num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2f", v);
  return buf;
}

// Groups of a run: per suite (header order) and per construction (by name).
struct Groups {
  std::vector<GroupFigures> suites;
  std::map<std::string, GroupFigures> constructions;
};

Groups group(const RunResults& run) {
  Groups g;
  std::map<std::string, std::size_t> suite_index;
  for (const auto& s : run.header.suites) {
    suite_index.emplace(s.name, g.suites.size());
    g.suites.emplace_back().name = s.name;
  }
  for (const auto& c : run.cases) {
    auto it = suite_index.find(c.suite);
    if (it == suite_index.end()) {
      it = suite_index.emplace(c.suite, g.suites.size()).first;
      g.suites.emplace_back().name = c.suite;
    }
    std::vector<GroupFigures*> targets{&g.suites[it->second]};
    for (const auto& t : c.constructions) {
      auto& f = g.constructions[t];
      f.name = t;
      targets.push_back(&f);
    }
    for (GroupFigures* f : targets) {
      ++f->cases;
      if (results::is_passing(c.outcome)) ++f->passed;
      add_record(f->counts, c, run.header.scheme);
    }
  }
  for (auto& s : g.suites) s.f1 = figures(s.counts).f1;
  for (auto& [name, f] : g.constructions) f.f1 = figures(f.counts).f1;
  return g;
}

std::string key(const CaseRecord& c) { return c.suite + '\0' + c.id; }

void compare_cases(const RunResults& run, const RunResults* base, RunSummary& s) {
  std::map<std::string, const CaseRecord*> by_key;
  std::map<std::string, Outcome> before;
  if (base) {
    for (const auto& c : base->cases) by_key.emplace(key(c), &c);
    for (const auto& c : base->cases) before.emplace(key(c), c.outcome);
  }
  s.baseline_case_f1.resize(run.cases.size());
  for (std::size_t i = 0; i < run.cases.size(); ++i) {
    const CaseRecord& c = run.cases[i];
    if (auto b = by_key.find(key(c)); b != by_key.end()) s.baseline_case_f1[i] = b->second->f1;
    const auto it = before.find(key(c));
    if (it == before.end()) continue;
    if (results::is_regression(it->second, c.outcome)) s.regressions.push_back({i, c.suite, c.id});
    if (results::is_fix(it->second, c.outcome)) s.fixes.push_back({i, c.suite, c.id});
  }
}

void count_outcomes(const RunResults& run, RunSummary& s) {
  for (const auto& c : run.cases) {
    ++s.cases;
    switch (c.outcome) {
      case Outcome::kPass:
        ++s.passed;
        break;
      case Outcome::kFail:
        ++s.failed;
        break;
      case Outcome::kError:
        ++s.errors;
        break;
      case Outcome::kExpectedFailure:
        ++s.expected_failures;
        break;
      case Outcome::kUnexpectedPass:
        ++s.unexpected_passes;
        break;
    }
    add_record(s.totals, c, run.header.scheme);
  }
  s.figures = figures(s.totals);
}

void construction_gates(const suite::GateSettings& gate, RunSummary& s) {
  for (const auto& f : s.constructions) {
    ConstructionGate g;
    g.name = f.name;
    g.f1 = f.f1;
    if (auto it = gate.construction_min_f1.find(f.name); it != gate.construction_min_f1.end()) {
      g.min_f1 = it->second;
    }
    g.f1_delta = f.f1_delta;
    g.max_drop = gate.max_construction_drop;
    g.detail = "F1 " + num(f.f1);
    if (g.min_f1) {
      g.detail += ", gate minimum " + num(*g.min_f1);
      if (f.f1 + 1e-9 < *g.min_f1) g.passed = false;
    }
    if (g.f1_delta) {
      g.detail += ", change against the baseline " + std::string(*g.f1_delta >= 0 ? "+" : "") +
                  num(*g.f1_delta);
      if (g.max_drop) {
        g.detail += " (largest drop allowed " + num(*g.max_drop) + ")";
        if (-*g.f1_delta > *g.max_drop + 1e-9) g.passed = false;
      }
    }
    if (!g.min_f1 && !(g.f1_delta && g.max_drop))
      g.detail += " (no gate rule for this construction)";
    s.construction_gates.push_back(std::move(g));
  }
}

void decide(const suite::GateSettings& gate, RunSummary& s) {
  auto fail = [&](std::string reason) {
    s.gate_passed = false;
    s.gate_reasons.push_back(std::move(reason));
  };
  if (gate.min_f1 && s.figures.f1 + 1e-9 < *gate.min_f1) {
    fail("overall F1 " + num(s.figures.f1) + " is below gate.min_f1 " + num(*gate.min_f1));
  }
  for (const auto& f : s.suites) {
    const auto it = gate.suite_min_f1.find(f.name);
    if (it != gate.suite_min_f1.end() && f.f1 + 1e-9 < it->second) {
      fail("suite " + f.name + ": F1 " + num(f.f1) + " is below gate.suite_min_f1 " +
           num(it->second));
    }
  }
  for (const auto& g : s.construction_gates) {
    if (g.min_f1 && g.f1 + 1e-9 < *g.min_f1) {
      fail("construction " + g.name + ": F1 " + num(g.f1) + " is below gate.construction_min_f1 " +
           num(*g.min_f1));
    }
    if (g.f1_delta && g.max_drop && -*g.f1_delta > *g.max_drop + 1e-9) {
      fail("construction " + g.name + ": F1 fell by " + num(-*g.f1_delta) +
           " against the baseline, more than gate.max_construction_drop " + num(*g.max_drop));
    }
  }
  if (s.regressions.size() > gate.allowed_new_failures) {
    fail(std::to_string(s.regressions.size()) +
         (s.regressions.size() == 1 ? " case that passed in the baseline fails now"
                                    : " cases that passed in the baseline fail now") +
         " (gate.allowed_new_failures " + std::to_string(gate.allowed_new_failures) + ")");
  }
  if (gate.fail_on_unexpected_pass && s.unexpected_passes > 0) {
    fail(std::to_string(s.unexpected_passes) +
         " known failures now pass (gate.fail_on_unexpected_pass); remove their known_failure "
         "markers");
  }
}

}  // namespace

void add_record(Counts& counts, const CaseRecord& r, const Scheme& scheme) {
  counts.add(results::sentence_score(r), scheme);
}

RunSummary summarize(const RunResults& run, const RunResults* baseline) {
  RunSummary s;
  s.grammar = run.header.grammar;
  s.has_baseline = baseline != nullptr;
  count_outcomes(run, s);
  Groups now = group(run);
  if (baseline) {
    Counts base_totals;
    for (const auto& c : baseline->cases) add_record(base_totals, c, baseline->header.scheme);
    s.baseline_figures = figures(base_totals);
    Groups before = group(*baseline);
    std::map<std::string, double> suite_f1;
    for (const auto& f : before.suites) suite_f1[f.name] = f.f1;
    for (auto& f : now.suites) {
      if (auto it = suite_f1.find(f.name); it != suite_f1.end()) {
        f.baseline_f1 = it->second;
        f.f1_delta = f.f1 - it->second;
      }
    }
    for (auto& [name, f] : now.constructions) {
      if (auto it = before.constructions.find(name); it != before.constructions.end()) {
        f.baseline_f1 = it->second.f1;
        f.f1_delta = f.f1 - it->second.f1;
      }
    }
  }
  s.suites = std::move(now.suites);
  for (auto& [name, f] : now.constructions) s.constructions.push_back(std::move(f));
  compare_cases(run, baseline, s);
  construction_gates(run.header.gate, s);
  decide(run.header.gate, s);
  return s;
}

}  // namespace treegate::run
