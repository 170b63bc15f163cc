// The summary JSON: the field names are a contract with users' scripts (docs/run.md).
#include <cmath>
#include <nlohmann/json.hpp>

#include "harness/report/run_reports.h"

namespace treegate::report {
namespace {

using ojson = nlohmann::ordered_json;

double round2(double v) { return std::round(v * 100.0) / 100.0; }

ojson delta(const std::optional<double>& d) { return d ? ojson(round2(*d)) : ojson(nullptr); }

ojson groups(const std::vector<run::GroupFigures>& list) {
  ojson out = ojson::object();
  for (const auto& g : list) {
    out[g.name] = {{"cases", g.cases},
                   {"passed", g.passed},
                   {"f1", round2(g.f1)},
                   {"f1_delta", delta(g.f1_delta)}};
  }
  return out;
}

ojson refs(const std::vector<run::CaseRef>& list) {
  ojson out = ojson::array();
  for (const auto& r : list) out.push_back({{"suite", r.suite}, {"id", r.id}});
  return out;
}

}  // namespace

std::string summary_json(const results::RunResults&, const run::RunSummary& s) {
  ojson j;
  j["grammar"] = s.grammar;
  j["cases"] = s.cases;
  j["passed"] = s.passed;
  j["failed"] = s.failed;
  j["errors"] = s.errors;
  j["expected_failures"] = s.expected_failures;
  j["unexpected_passes"] = s.unexpected_passes;
  j["gate"] = {{"passed", s.gate_passed}, {"reasons", s.gate_reasons}};
  const Figures& f = s.figures;
  j["totals"] = {{"precision", round2(f.precision)},
                 {"recall", round2(f.recall)},
                 {"f1", round2(f.f1)},
                 {"exact_match", round2(f.exact_match)},
                 {"crossing_avg", round2(f.crossing_avg)},
                 {"tag_accuracy", round2(f.tag_accuracy)}};
  j["suites"] = groups(s.suites);
  j["constructions"] = groups(s.constructions);
  j["regressions"] = refs(s.regressions);
  j["fixes"] = refs(s.fixes);
  return j.dump(2, ' ', false, nlohmann::json::error_handler_t::replace) + "\n";
}

}  // namespace treegate::report
