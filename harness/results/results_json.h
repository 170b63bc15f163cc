// JSON forms of the scoring scheme and the gate settings, as stored in the results header.
// Readers throw std::runtime_error with the key that was wrong; load_results adds the position.
#pragma once

#include <cstdint>
#include <limits>
#include <nlohmann/json.hpp>
#include <stdexcept>
#include <string>

#include "evaluator/scheme.h"
#include "harness/suite/gate_settings.h"

namespace treegate::results {

nlohmann::ordered_json scheme_to_json(const Scheme& scheme);
Scheme scheme_from_json(const nlohmann::json& j);
nlohmann::ordered_json gate_to_json(const suite::GateSettings& gate);
suite::GateSettings gate_from_json(const nlohmann::json& j);

/// Reads the whole number at `j[key]` into `out`. A float, a text or a number out of `T`'s range
/// is an error (nlohmann's own conversion would cast a huge float, which is undefined).
template <class T>
void get_whole(const nlohmann::json& j, const char* key, T& out) {
  const nlohmann::json& v = j.at(key);
  const bool fits =
      v.is_number_unsigned()
          ? v.get<std::uint64_t>() <= static_cast<std::uint64_t>(std::numeric_limits<T>::max())
          : v.is_number_integer() && v.get<std::int64_t>() >= 0 &&
                static_cast<std::uint64_t>(v.get<std::int64_t>()) <=
                    static_cast<std::uint64_t>(std::numeric_limits<T>::max());
  if (!fits) throw std::runtime_error(std::string("expected a whole number for \"") + key + "\"");
  out = static_cast<T>(v.get<std::int64_t>());
}

}  // namespace treegate::results
