#include "harness/suite/suite_loader.h"

#include <glob.h>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <set>
#include <sstream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "evaluator/file_text.h"
#include "harness/suite/hash.h"
#include "harness/suite/yaml_util.h"

namespace treegate::suite {
namespace {

namespace fs = std::filesystem;

std::string position(const std::string& file, const YAML::Node& node) {
  const YAML::Mark m = node.Mark();
  if (m.is_null()) return file;
  return format_position(file, static_cast<std::size_t>(m.line + 1),
                         static_cast<std::size_t>(m.column + 1));
}

void add_tags(std::vector<std::string>& to, const std::vector<std::string>& tags) {
  for (const auto& t : tags) {
    if (std::find(to.begin(), to.end(), t) == to.end()) to.push_back(t);
  }
}

std::string join_words(const std::vector<std::string>& words) {
  std::string out;
  for (const auto& w : words) out += (out.empty() ? "" : " ") + w;
  return out;
}

std::optional<double> read_threshold(const std::string& file, const YAML::Node& node) {
  const double v = yaml::read_number(file, node);
  if (v < 0 || v > 100) yaml::fail_at(file, node, "expected an F1 threshold from 0 to 100");
  return v;
}

std::vector<SpanCheck> read_checks(const std::string& file, const YAML::Node& node,
                                   std::size_t words) {
  std::vector<SpanCheck> out;
  if (!node) return out;
  const YAML::Node list = node.IsScalar() ? YAML::Node() : node;
  if (node.IsScalar()) {
    const YAML::Mark m = node.Mark();
    out.push_back(parse_span_check(node.Scalar(), words, file, m.line + 1, m.column + 1));
    return out;
  }
  if (!node.IsSequence()) yaml::fail_at(file, node, "expected a list of brackets like \"PP 6-8\"");
  for (const auto& item : node) {
    const YAML::Mark m = item.Mark();
    out.push_back(
        parse_span_check(yaml::read_string(file, item), words, file, m.line + 1, m.column + 1));
  }
  return out;
}

// The keys of a case, in the order of kCaseKeys.
enum CaseKey { kId, kTree, kText, kConstructions, kMinF1, kRequire, kForbid, kKnownFailure };
const std::vector<std::string> kCaseKeys = {"id",     "tree",    "text",   "constructions",
                                            "min_f1", "require", "forbid", "known_failure"};

// Fills `c` from a case map; throws InputError for the first problem found.
void read_case(const std::string& file, const YAML::Node& node, Case& c) {
  const std::vector<YAML::Node> keys = yaml::read_keys(file, node, kCaseKeys, "a case");
  const YAML::Node& tree_node = keys[kTree];
  if (!tree_node) yaml::fail_at(file, node, "expected a `tree:` (the gold tree, bracketed)");
  const std::string text = yaml::read_string(file, tree_node);
  try {
    c.gold = parse_tree(text, "tree");
  } catch (const InputError& e) {
    yaml::fail_at(file, tree_node,
                  "in the gold tree (column " + std::to_string(e.col()) + "): " + e.bare());
  }
  if (c.gold.num_words() == 0) yaml::fail_at(file, tree_node, "expected a gold tree with words");
  c.words.clear();
  for (auto w : c.gold.words()) c.words.emplace_back(w);
  if (keys[kText]) {
    const std::string given = yaml::read_string(file, keys[kText]);
    std::istringstream in(given);
    std::vector<std::string> words;
    for (std::string w; in >> w;) words.push_back(w);
    if (words != c.words) {
      yaml::fail_at(file, keys[kText],
                    "the text " + quote_for_message(given, 80) +
                        " does not match the gold tree's words " +
                        quote_for_message(join_words(c.words), 80));
    }
  }
  if (keys[kConstructions])
    add_tags(c.constructions, yaml::read_strings(file, keys[kConstructions]));
  if (keys[kMinF1]) c.min_f1 = read_threshold(file, keys[kMinF1]);
  c.require = read_checks(file, keys[kRequire], c.words.size());
  c.forbid = read_checks(file, keys[kForbid], c.words.size());
  if (keys[kKnownFailure]) {
    c.known_failure = yaml::read_string(file, keys[kKnownFailure]);
    if (c.known_failure->empty()) {
      yaml::fail_at(file, keys[kKnownFailure], "expected a reason why the case fails today");
    }
  }
}

void add_case(Suite& suite, Case&& c, const CaseSink& sink) {
  suite.cases.push_back(std::move(c));
  if (sink) sink(suite, suite.cases.back(), suite.cases.size());
}

void read_cases(const std::string& file, const YAML::Node& list, Suite& suite,
                std::set<std::string>& ids, const CaseSink& sink) {
  if (!list.IsSequence()) yaml::fail_at(file, list, "expected `cases:` as a list of cases");
  std::size_t index = 0;
  for (const auto& node : list) {
    ++index;
    Case c;
    c.source = position(file, node);
    c.constructions = suite.constructions;
    const YAML::Node id = node.IsMap() ? node["id"] : YAML::Node();
    if (id && id.IsScalar() && !id.Scalar().empty()) {
      c.id = id.Scalar();
    } else {
      c.id = "case-" + std::to_string(index);
      c.load_error = c.source + ": expected an `id:` for this case";
    }
    if (c.load_error.empty() && !ids.insert(c.id).second) {
      c.load_error =
          position(file, id) + ": duplicate case id '" + c.id + "' in suite '" + suite.name + "'";
      c.id += " (duplicate at " + c.source + ")";
    }
    if (c.load_error.empty()) {
      try {
        if (!node.IsMap()) yaml::fail_at(file, node, "expected a case as a map of keys");
        read_case(file, node, c);
      } catch (const InputError& e) {
        c.load_error = e.what();
      }
    }
    add_case(suite, std::move(c), sink);
  }
}

std::vector<std::string> glob_files(const std::string& pattern) {
  glob_t g{};
  std::vector<std::string> out;
  if (::glob(pattern.c_str(), GLOB_NOSORT, nullptr, &g) == 0) {
    for (std::size_t i = 0; i < g.gl_pathc; ++i) {
      if (fs::is_regular_file(g.gl_pathv[i])) out.emplace_back(g.gl_pathv[i]);
    }
  }
  globfree(&g);
  std::sort(out.begin(), out.end());
  return out;
}

void read_treebank_file(const std::string& path, const std::vector<std::string>& tags, Suite& suite,
                        std::set<std::string>& ids, const CaseSink& sink) {
  suite.hash += hash_file(path);  // combined with the suite text's hash by the caller
  std::ifstream in = open_input_file(path);
  const std::string stem = fs::path(path).stem().string();
  BracketReader reader(in, path);
  for (;;) {
    Case c;
    c.constructions = tags;
    bool more = true;
    try {
      more = reader.next(c.gold);
      if (more && c.gold.num_words() == 0)
        throw InputError(path, reader.tree_line(), 1, "expected a tree with words");
    } catch (const InputError& e) {
      c.load_error = e.what();
    }
    if (!more) break;
    c.id = stem + ":" + std::to_string(reader.trees_started());
    c.source = format_position(path, c.load_error.empty() ? reader.tree_line() : 0, 0);
    for (auto w : c.gold.words()) c.words.emplace_back(w);
    if (!ids.insert(c.id).second) {
      c.load_error = c.source + ": duplicate case id '" + c.id + "' in suite '" + suite.name +
                     "' (two treebank files with the same name?)";
      c.id += " (duplicate from " + path + ")";
    }
    add_case(suite, std::move(c), sink);
  }
}

void read_treebanks(const std::string& file, const YAML::Node& list,
                    const SuiteLoadOptions& options, Suite& suite, std::set<std::string>& ids,
                    const CaseSink& sink) {
  if (!list.IsSequence())
    yaml::fail_at(file, list, "expected `treebank:` as a list of {files: GLOB}");
  const std::string folder = fs::path(file).parent_path().string();
  for (const auto& item : list) {
    yaml::check_keys(file, item, {"files", "constructions"}, "a treebank entry");
    if (!item["files"]) yaml::fail_at(file, item, "expected `files:` (a glob of .trees files)");
    const std::string pattern = yaml::read_string(file, item["files"]);
    if (leaves_folder(pattern) && !options.allow_outside_paths) {
      yaml::fail_at(file, item["files"],
                    "refusing '" + pattern +
                        "': treebank paths must stay inside the suite's folder (no `..`, not "
                        "absolute); set `allow_outside_paths: true` in treegate.yaml to allow it");
    }
    std::vector<std::string> tags = suite.constructions;
    if (item["constructions"]) add_tags(tags, yaml::read_strings(file, item["constructions"]));
    const std::string full =
        pattern.starts_with('/') || folder.empty() ? pattern : folder + "/" + pattern;
    const auto files = glob_files(full);
    if (files.empty()) yaml::fail_at(file, item["files"], "no file matches '" + pattern + "'");
    for (const auto& f : files) read_treebank_file(f, tags, suite, ids, sink);
  }
}

}  // namespace

bool leaves_folder(const std::string& pattern) {
  if (pattern.starts_with('/')) return true;
  for (const auto& part : fs::path(pattern)) {
    if (part == "..") return true;
  }
  return false;
}

namespace {

void read_suite(const std::string& text, const std::string& path, const SuiteLoadOptions& options,
                Suite& suite, const CaseSink& sink) {
  const YAML::Node root = yaml::load_string(text, path);
  if (!root.IsMap())
    yaml::fail_at(path, root, "expected a suite: a map with `suite:` and `cases:`");
  yaml::check_keys(path, root, {"suite", "about", "constructions", "min_f1", "cases", "treebank"},
                   "a suite");
  suite.file = path;
  if (!root["suite"]) yaml::fail_at(path, root, "expected `suite:` (the suite's name)");
  suite.name = yaml::read_string(path, root["suite"]);
  if (suite.name.empty() || suite.name.find_first_of(" \t\r\n.") != std::string::npos) {
    yaml::fail_at(path, root["suite"],
                  "expected a suite name without spaces or dots, e.g. pp-attachment");
  }
  if (root["about"]) suite.about = yaml::read_string(path, root["about"]);
  if (root["constructions"]) suite.constructions = yaml::read_strings(path, root["constructions"]);
  if (root["min_f1"]) suite.min_f1 = read_threshold(path, root["min_f1"]);
  if (!root["cases"] && !root["treebank"]) {
    yaml::fail_at(path, root, "expected `cases:` or `treebank:` (a suite needs cases)");
  }
  std::set<std::string> ids;
  if (root["cases"]) read_cases(path, root["cases"], suite, ids, sink);
  if (root["treebank"]) read_treebanks(path, root["treebank"], options, suite, ids, sink);
  if (suite.cases.empty()) {  // an empty suite would pass any gate unnoticed
    yaml::fail_at(path,
                  root["cases"]      ? root["cases"]
                  : root["treebank"] ? root["treebank"]
                                     : root,
                  "expected at least one case, found none (an empty suite tests nothing)");
  }
  suite.hash = fnv1a64_hex(text + suite.hash);  // the suite text and its treebank files
}

}  // namespace

Suite load_suite_string(const std::string& text, const std::string& path,
                        const SuiteLoadOptions& options) {
  Suite suite;
  read_suite(text, path, options, suite, nullptr);
  return suite;
}

Suite load_suite(const std::string& path, const SuiteLoadOptions& options) {
  return load_suite_string(read_file_text(path), path, options);
}

void load_suite_into(const std::string& path, const SuiteLoadOptions& options, Suite& out,
                     const CaseSink& sink) {
  read_suite(read_file_text(path), path, options, out, sink);
}

std::vector<std::string> expand_suite_paths(const std::vector<std::string>& patterns) {
  std::vector<std::string> out;
  for (const auto& p : patterns) {
    std::error_code ec;
    if (fs::is_regular_file(p, ec)) {
      out.push_back(p);
    } else if (fs::is_directory(p, ec)) {
      std::vector<std::string> found;
      for (const auto& e : fs::directory_iterator(p, ec)) {
        const auto ext = e.path().extension();
        if (e.is_regular_file() && (ext == ".yaml" || ext == ".yml"))
          found.push_back(e.path().string());
      }
      std::sort(found.begin(), found.end());
      if (found.empty()) throw InputError(p + ": no suite files (*.yaml, *.yml) in this folder");
      out.insert(out.end(), found.begin(), found.end());
    } else {
      const auto found = glob_files(p);
      if (found.empty()) throw InputError(p + ": no suite file matches this path");
      out.insert(out.end(), found.begin(), found.end());
    }
  }
  return out;
}

}  // namespace treegate::suite
