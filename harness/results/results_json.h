// JSON forms of the scoring scheme and the gate settings, as stored in the results header.
// Readers throw std::runtime_error with the key that was wrong; load_results adds the position.
#pragma once

#include <nlohmann/json.hpp>

#include "evaluator/scheme.h"
#include "harness/suite/gate_settings.h"

namespace treegate::results {

nlohmann::ordered_json scheme_to_json(const Scheme& scheme);
Scheme scheme_from_json(const nlohmann::json& j);
nlohmann::ordered_json gate_to_json(const suite::GateSettings& gate);
suite::GateSettings gate_from_json(const nlohmann::json& j);

}  // namespace treegate::results
