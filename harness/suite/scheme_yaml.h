// Reads scoring-scheme settings from YAML (a file of their own, or the `scoring:` section of
// the project config). Keys not given keep their defaults.
#pragma once

#include <yaml-cpp/yaml.h>

#include <string>

#include "evaluator/scheme.h"

namespace treegate {

/// Applies the keys of `node` (a map) to `scheme`. Throws InputError naming file:line:col.
void apply_scheme_yaml(const std::string& file, const YAML::Node& node, Scheme& scheme);
Scheme load_scheme_file(const std::string& path);

}  // namespace treegate
