// The gate rules of a run (the `gate:` section of treegate.yaml). A plain value shared by the
// config loader, the gate and the results file header; no YAML here.
#pragma once

#include <map>
#include <optional>
#include <string>

namespace treegate::suite {

struct GateSettings {
  std::optional<double> min_f1;                       // corpus F1 of the whole run
  std::map<std::string, double> suite_min_f1;         // suite name -> minimum F1
  std::map<std::string, double> construction_min_f1;  // tag -> minimum F1
  std::size_t allowed_new_failures = 0;         // failing cases that did not fail in the baseline
  std::optional<double> max_construction_drop;  // F1 points a construction may lose
  bool fail_on_unexpected_pass = false;         // a known failure that passes fails the gate
};

}  // namespace treegate::suite
