// The project config `treegate.yaml`: grammar, suites, scoring scheme, parser, jobs, the
// per-case threshold and the gate. A plain value; relative paths in it are resolved against
// the config file's folder when it is loaded.
#pragma once

#include <string>
#include <vector>

#include "evaluator/scheme.h"
#include "harness/suite/gate_settings.h"

namespace treegate::suite {

struct ParserConfig {
  bool builtin = true;
  std::vector<std::string> command;  // argv of an external parser (never run by a shell)
  bool batch = true;                 // false: one process per sentence
  double timeout_seconds = 60;       // per sentence (a batch gets this times its size)
  std::size_t max_chart_mb = 4096;   // built-in parser: refuse sentences whose chart is bigger
  std::size_t batch_size = 64;       // sentences per process in batch mode
  bool gold_tags = false;            // built-in parser: take the gold tags as given
};

struct ProjectConfig {
  std::string file;  // "" when no config file was read
  std::string grammar;
  std::vector<std::string> suites;  // files, folders or globs
  Scheme scheme;
  ParserConfig parser;
  std::size_t jobs = 0;  // 0: the number of cores
  double case_min_f1 = 100;
  bool allow_outside_paths = false;
  GateSettings gate;
  std::string results;  // where `run` writes results when --results is not given ("" none)
};

/// Reads a config file. Throws InputError (file:line:col; unknown keys name the nearest key).
ProjectConfig load_config(const std::string& path);
ProjectConfig load_config_string(const std::string& text, const std::string& path);

/// `treegate.yaml` in the current folder when it exists, else "".
std::string find_config();

}  // namespace treegate::suite
