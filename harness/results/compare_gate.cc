// The gate of a comparison: NEW judged with OLD as its baseline, under NEW's gate settings.
// Tested by tests/results/compare_test.cc.
#include <fmt/format.h>

#include "harness/results/compare.h"

namespace treegate::results {

GateVerdict compare_gate(const Comparison& c) {
  GateVerdict v;
  const suite::GateSettings& g = c.new_header.gate;
  auto fail = [&](std::string reason) {
    v.passed = false;
    v.reasons.push_back(std::move(reason));
  };
  if (g.min_f1 && c.overall.new_side.f1() < *g.min_f1) {
    fail(fmt::format("overall F1 {:.2f} is below min_f1 {:g}", c.overall.new_side.f1(), *g.min_f1));
  }
  for (const Row& r : c.suites) {
    auto it = g.suite_min_f1.find(r.key);
    if (it != g.suite_min_f1.end() && r.new_side.f1() < it->second) {
      fail(fmt::format("suite {} F1 {:.2f} is below its minimum {:g}", r.key, r.new_side.f1(),
                       it->second));
    }
  }
  for (const Row& r : c.constructions) {
    auto it = g.construction_min_f1.find(r.key);
    if (it != g.construction_min_f1.end() && r.new_side.f1() < it->second) {
      fail(fmt::format("construction {} F1 {:.2f} is below its minimum {:g}", r.key,
                       r.new_side.f1(), it->second));
    }
    if (g.max_construction_drop && -r.f1_delta() > *g.max_construction_drop + 1e-9) {
      fail(fmt::format("construction {} lost {:.2f} F1 points (at most {:g} allowed)", r.key,
                       -r.f1_delta(), *g.max_construction_drop));
    }
  }
  std::size_t new_failures = 0, unexpected = 0;
  for (const CaseChange& k : c.cases) {
    if (is_failing(k.new_side.outcome) && !is_failing(k.old_side.outcome)) ++new_failures;
    if (k.new_side.outcome == Outcome::kUnexpectedPass) ++unexpected;
  }
  if (new_failures > g.allowed_new_failures) {
    fail(fmt::format("{} case(s) fail that passed in OLD ({} allowed)", new_failures,
                     g.allowed_new_failures));
  }
  if (g.fail_on_unexpected_pass && unexpected > 0) {
    fail(
        fmt::format("{} known failure(s) now pass: remove their known_failure marker", unexpected));
  }
  return v;
}

}  // namespace treegate::results
