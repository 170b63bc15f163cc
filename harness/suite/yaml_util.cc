#include "harness/suite/yaml_util.h"

#include <algorithm>
#include <cmath>

#include "evaluator/errors.h"
#include "evaluator/file_text.h"

namespace treegate::yaml {
namespace {

std::size_t edit_distance(const std::string& a, const std::string& b) {
  std::vector<std::size_t> row(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) row[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    std::size_t diag = row[0];
    row[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const std::size_t up = row[j];
      row[j] = std::min({row[j] + 1, row[j - 1] + 1, diag + (a[i - 1] == b[j - 1] ? 0 : 1)});
      diag = up;
    }
  }
  return row[b.size()];
}

std::string kind_of(const YAML::Node& node) {
  switch (node.Type()) {
    case YAML::NodeType::Map:
      return "a map";
    case YAML::NodeType::Sequence:
      return "a list";
    case YAML::NodeType::Null:
      return "nothing";
    default:
      return "'" + node.Scalar() + "'";
  }
}

}  // namespace

YAML::Node load_string(const std::string& text, const std::string& source) {
  try {
    return YAML::Load(text);
  } catch (const YAML::Exception& e) {
    throw InputError(source, static_cast<std::size_t>(e.mark.line + 1),
                     static_cast<std::size_t>(e.mark.column + 1), "YAML syntax: " + e.msg);
  }
}

YAML::Node load_file(const std::string& path) { return load_string(read_file_text(path), path); }

void fail_at(const std::string& file, const YAML::Node& node, const std::string& message) {
  const YAML::Mark mark = node.Mark();
  if (mark.is_null()) throw InputError(file, 0, 0, message);
  throw InputError(file, static_cast<std::size_t>(mark.line + 1),
                   static_cast<std::size_t>(mark.column + 1), message);
}

std::string nearest(const std::string& key, const std::vector<std::string>& known) {
  std::string best;
  std::size_t best_d = std::max<std::size_t>(2, key.size() / 3) + 1;
  for (const auto& k : known) {
    const std::size_t d = edit_distance(key, k);
    if (d < best_d) {
      best_d = d;
      best = k;
    }
  }
  return best;
}

namespace {

[[noreturn]] void fail_unknown_key(const std::string& file, const YAML::Node& key,
                                   const std::vector<std::string>& known, const std::string& what) {
  std::string message = "unknown key '" + key.Scalar() + "' in " + what;
  const std::string near = nearest(key.Scalar(), known);
  if (!near.empty()) {
    message += "; did you mean '" + near + "'?";
  } else {
    std::string all;
    for (const auto& k : known) all += (all.empty() ? "" : ", ") + k;
    message += " (known keys: " + all + ")";
  }
  fail_at(file, key, message);
}

}  // namespace

std::vector<YAML::Node> read_keys(const std::string& file, const YAML::Node& node,
                                  const std::vector<std::string>& known, const std::string& what) {
  if (!node.IsMap())
    fail_at(file, node, "expected " + what + " as a map of keys, found " + kind_of(node));
  const YAML::Node absent(YAML::NodeType::Undefined);  // tests false, like node["absent-key"]
  std::vector<YAML::Node> values(known.size(), absent);
  for (const auto& kv : node) {
    if (!kv.first.IsScalar()) fail_at(file, kv.first, "expected a key name in " + what);
    const std::string& key = kv.first.Scalar();
    const auto at = std::find(known.begin(), known.end(), key);
    if (at == known.end()) fail_unknown_key(file, kv.first, known, what);
    YAML::Node& value = values[static_cast<std::size_t>(at - known.begin())];
    if (value) fail_at(file, kv.first, "key '" + key + "' given twice in " + what);
    value.reset(kv.second);  // rebinds; `=` would assign into it
  }
  return values;
}

void check_keys(const std::string& file, const YAML::Node& node,
                const std::vector<std::string>& known, const std::string& what) {
  read_keys(file, node, known, what);
}

bool read_bool(const std::string& file, const YAML::Node& node) {
  if (node.IsScalar()) {
    const std::string& s = node.Scalar();
    if (s == "true" || s == "yes" || s == "on") return true;
    if (s == "false" || s == "no" || s == "off") return false;
  }
  fail_at(file, node, "expected true or false, found " + kind_of(node));
}

double read_number(const std::string& file, const YAML::Node& node) {
  if (node.IsScalar()) {
    const std::string& s = node.Scalar();
    char* end = nullptr;
    const double v = std::strtod(s.c_str(), &end);
    if (!s.empty() && end == s.c_str() + s.size() && std::isfinite(v)) return v;
  }
  fail_at(file, node, "expected a finite number, found " + kind_of(node));
}

long long read_int(const std::string& file, const YAML::Node& node, long long min, long long max) {
  if (node.IsScalar()) {
    const std::string& s = node.Scalar();
    char* end = nullptr;
    errno = 0;
    const long long v = std::strtoll(s.c_str(), &end, 10);
    if (!s.empty() && end == s.c_str() + s.size() && errno == 0 && v >= min && v <= max) return v;
  }
  fail_at(file, node,
          "expected a whole number from " + std::to_string(min) + " to " + std::to_string(max) +
              ", found " + kind_of(node));
}

std::string read_string(const std::string& file, const YAML::Node& node) {
  if (node.IsScalar()) return node.Scalar();
  if (node.IsNull()) return "";
  fail_at(file, node, "expected a text value, found " + kind_of(node));
}

std::vector<std::string> read_strings(const std::string& file, const YAML::Node& node) {
  std::vector<std::string> out;
  if (node.IsScalar()) return {node.Scalar()};
  if (!node.IsSequence())
    fail_at(file, node, "expected a list of text values, found " + kind_of(node));
  for (const auto& item : node) out.push_back(read_string(file, item));
  return out;
}

}  // namespace treegate::yaml
