// Helpers shared by every YAML reader: positions in messages, key checks with a suggestion of
// the nearest known key, typed scalar reads that name what was expected.
#pragma once

#include <yaml-cpp/yaml.h>

#include <string>
#include <vector>

namespace treegate::yaml {

/// Loads a YAML file; syntax errors become InputError with file:line:col.
YAML::Node load_file(const std::string& path);
YAML::Node load_string(const std::string& text, const std::string& source);

/// Throws InputError at `node`'s position: "file:line:col: message".
[[noreturn]] void fail_at(const std::string& file, const YAML::Node& node,
                          const std::string& message);

/// The known key nearest to `key` by edit distance, or "" when none is close.
std::string nearest(const std::string& key, const std::vector<std::string>& known);

/// Requires `node` to be a map whose keys are all in `known`, each once; otherwise an
/// InputError naming the key, its position and (when unknown) the nearest known key.
void check_keys(const std::string& file, const YAML::Node& node,
                const std::vector<std::string>& known, const std::string& what);

/// check_keys, and in the same pass the value of each known key: element i is the value of
/// known[i], an undefined node when the key is absent. (Looking keys up one by one costs a
/// scan of the map and a string conversion per key each time.)
std::vector<YAML::Node> read_keys(const std::string& file, const YAML::Node& node,
                                  const std::vector<std::string>& known, const std::string& what);

bool read_bool(const std::string& file, const YAML::Node& node);
long long read_int(const std::string& file, const YAML::Node& node, long long min, long long max);
double read_number(const std::string& file, const YAML::Node& node);
std::string read_string(const std::string& file, const YAML::Node& node);
std::vector<std::string> read_strings(const std::string& file, const YAML::Node& node);

}  // namespace treegate::yaml
