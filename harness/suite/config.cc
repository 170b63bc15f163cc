#include "harness/suite/config.h"

#include <filesystem>

#include "evaluator/errors.h"
#include "evaluator/file_text.h"
#include "harness/suite/scheme_yaml.h"
#include "harness/suite/yaml_util.h"

namespace treegate::suite {
namespace {

namespace fs = std::filesystem;

std::string resolve(const std::string& folder, const std::string& path) {
  if (folder.empty() || path.empty() || path.starts_with('/')) return path;
  return folder + "/" + path;
}

double read_f1(const std::string& file, const YAML::Node& node) {
  const double v = yaml::read_number(file, node);
  if (v < 0 || v > 100) yaml::fail_at(file, node, "expected an F1 value from 0 to 100");
  return v;
}

std::map<std::string, double> read_f1_map(const std::string& file, const YAML::Node& node,
                                          const std::string& what) {
  if (!node.IsMap()) yaml::fail_at(file, node, "expected " + what + " as a map of name: F1");
  std::map<std::string, double> out;
  for (const auto& kv : node) out[yaml::read_string(file, kv.first)] = read_f1(file, kv.second);
  return out;
}

GateSettings read_gate(const std::string& file, const YAML::Node& node) {
  yaml::check_keys(file, node,
                   {"min_f1", "suite_min_f1", "construction_min_f1", "allowed_new_failures",
                    "max_construction_drop", "fail_on_unexpected_pass"},
                   "the gate settings");
  GateSettings g;
  if (node["min_f1"]) g.min_f1 = read_f1(file, node["min_f1"]);
  if (node["suite_min_f1"])
    g.suite_min_f1 = read_f1_map(file, node["suite_min_f1"], "suite_min_f1");
  if (node["construction_min_f1"]) {
    g.construction_min_f1 = read_f1_map(file, node["construction_min_f1"], "construction_min_f1");
  }
  if (node["allowed_new_failures"]) {
    g.allowed_new_failures =
        static_cast<std::size_t>(yaml::read_int(file, node["allowed_new_failures"], 0, 1000000000));
  }
  if (node["max_construction_drop"])
    g.max_construction_drop = read_f1(file, node["max_construction_drop"]);
  if (node["fail_on_unexpected_pass"]) {
    g.fail_on_unexpected_pass = yaml::read_bool(file, node["fail_on_unexpected_pass"]);
  }
  return g;
}

ParserConfig read_parser(const std::string& file, const YAML::Node& node) {
  ParserConfig p;
  if (node.IsScalar()) {
    if (node.Scalar() != "builtin") {
      yaml::fail_at(file, node,
                    "expected `builtin` or a map with `command: [program, args...]`, found '" +
                        node.Scalar() + "'");
    }
    return p;
  }
  yaml::check_keys(
      file, node, {"command", "mode", "timeout_seconds", "batch_size", "gold_tags", "max_chart_mb"},
      "the parser settings");
  if (node["command"]) {
    const YAML::Node cmd = node["command"];
    if (!cmd.IsSequence()) {
      yaml::fail_at(file, cmd,
                    "expected the command as a list [program, arg, ...]; it is never given to a "
                    "shell, so write each argument as its own item");
    }
    p.command = yaml::read_strings(file, cmd);
    if (p.command.empty() || p.command[0].empty())
      yaml::fail_at(file, cmd, "expected a program name");
    p.builtin = false;
  }
  if (node["mode"]) {
    const std::string mode = yaml::read_string(file, node["mode"]);
    if (mode != "batch" && mode != "per-sentence") {
      yaml::fail_at(file, node["mode"], "expected `batch` or `per-sentence`, found '" + mode + "'");
    }
    p.batch = mode == "batch";
  }
  if (node["timeout_seconds"]) {
    p.timeout_seconds = yaml::read_number(file, node["timeout_seconds"]);
    if (p.timeout_seconds <= 0)
      yaml::fail_at(file, node["timeout_seconds"], "expected a positive number of seconds");
  }
  if (node["batch_size"]) {
    p.batch_size = static_cast<std::size_t>(yaml::read_int(file, node["batch_size"], 1, 1000000));
  }
  if (node["gold_tags"]) p.gold_tags = yaml::read_bool(file, node["gold_tags"]);
  if (node["max_chart_mb"]) {
    p.max_chart_mb =
        static_cast<std::size_t>(yaml::read_int(file, node["max_chart_mb"], 1, 1 << 24));
  }
  return p;
}

}  // namespace

ProjectConfig load_config_string(const std::string& text, const std::string& path) {
  const YAML::Node root = yaml::load_string(text, path);
  ProjectConfig c;
  c.file = path;
  if (root.IsNull()) return c;
  yaml::check_keys(path, root,
                   {"grammar", "suites", "scoring", "parser", "jobs", "case_min_f1",
                    "allow_outside_paths", "gate", "results"},
                   "treegate.yaml");
  const std::string folder = fs::path(path).parent_path().string();
  if (root["grammar"]) c.grammar = resolve(folder, yaml::read_string(path, root["grammar"]));
  if (root["suites"]) {
    for (const auto& s : yaml::read_strings(path, root["suites"]))
      c.suites.push_back(resolve(folder, s));
  }
  if (root["scoring"]) apply_scheme_yaml(path, root["scoring"], c.scheme);
  if (root["parser"]) c.parser = read_parser(path, root["parser"]);
  if (root["jobs"]) c.jobs = static_cast<std::size_t>(yaml::read_int(path, root["jobs"], 0, 1024));
  if (root["case_min_f1"]) c.case_min_f1 = read_f1(path, root["case_min_f1"]);
  if (root["allow_outside_paths"])
    c.allow_outside_paths = yaml::read_bool(path, root["allow_outside_paths"]);
  if (root["gate"]) c.gate = read_gate(path, root["gate"]);
  if (root["results"]) c.results = resolve(folder, yaml::read_string(path, root["results"]));
  return c;
}

ProjectConfig load_config(const std::string& path) {
  return load_config_string(read_file_text(path), path);
}

std::string find_config() {
  std::error_code ec;
  return fs::is_regular_file("treegate.yaml", ec) ? "treegate.yaml" : "";
}

}  // namespace treegate::suite
