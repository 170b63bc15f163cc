#include "harness/pcfg/estimate_files.h"

#include <glob.h>

#include <fstream>
#include <iostream>
#include <sstream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "evaluator/file_text.h"

namespace treegate::pcfg {
namespace {

bool has_wildcard(const std::string& pattern) {
  return pattern.find_first_of("*?[") != std::string::npos;
}

bool is_space(char c) {
  return c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' || c == '\v';
}

void add_from_stream(Estimator& estimator, std::istream& in, const std::string& name, bool seekable,
                     std::vector<std::string>& errors) {
  BracketReader reader(in, name);
  Tree tree;
  for (;;) {
    try {
      if (!reader.next(tree)) break;
    } catch (const InputError& e) {
      errors.push_back(e.what());
      continue;
    }
    const auto problem = estimator.add(tree);
    if (!problem) continue;
    std::size_t line = reader.tree_line(), col = 0;
    if (seekable) std::tie(line, col) = locate_node(name, line, problem->node);
    errors.push_back(format_position(name, line, col) + ": tree " +
                     std::to_string(reader.trees_started()) + ": " + problem->message);
  }
}

}  // namespace

std::vector<std::string> expand_treebank_patterns(const std::vector<std::string>& patterns) {
  std::vector<std::string> paths;
  for (const std::string& pattern : patterns) {
    if (pattern == "-" || !has_wildcard(pattern)) {
      paths.push_back(pattern);
      continue;
    }
    glob_t found{};
    const int rc = ::glob(pattern.c_str(), 0, nullptr, &found);
    if (rc == 0) {
      for (std::size_t i = 0; i < found.gl_pathc; ++i) paths.emplace_back(found.gl_pathv[i]);
    }
    globfree(&found);
    if (rc != 0) throw InputError(pattern + ": no file matches this pattern");
  }
  return paths;
}

void add_treebank_file(Estimator& estimator, const std::string& path,
                       std::vector<std::string>& errors) {
  if (path == "-") {
    add_from_stream(estimator, std::cin, "<stdin>", false, errors);
    return;
  }
  std::ifstream in = open_input_file(path);
  add_from_stream(estimator, in, path, true, errors);
}

std::pair<std::size_t, std::size_t> locate_node(const std::string& path, std::size_t line,
                                                NodeId node) {
  std::ifstream in(path, std::ios::binary);
  std::string text;
  for (std::size_t i = 1; i < line && std::getline(in, text);) ++i;
  if (!in || node == kNoNode) return {line, node == kNoNode && in ? 1 : 0};
  // Count nodes in pre-order: '(' opens an internal node, an atom not right after '(' is a word.
  NodeId seen = -1;
  bool after_open = false;
  std::size_t at_line = line;
  while (std::getline(in, text)) {
    for (std::size_t i = 0; i < text.size();) {
      const char c = text[i];
      if (is_space(c)) {
        ++i;
      } else if (c == '(' || c == ')') {
        if (c == '(' && ++seen == node) return {at_line, i + 1};
        after_open = c == '(';
        ++i;
      } else {
        const std::size_t start = i;
        while (i < text.size() && !is_space(text[i]) && text[i] != '(' && text[i] != ')') ++i;
        if (!after_open && ++seen == node) return {at_line, start + 1};
        after_open = false;
      }
    }
    ++at_line;
  }
  return {line, 0};
}

std::string summary_text(const EstimateSummary& s, const TransformSpec& spec) {
  std::ostringstream out;
  auto row = [&](const char* what, std::size_t value, const std::string& note = "") {
    out << "  " << what << std::string(30 - std::string(what).size(), ' ') << value;
    if (!note.empty()) out << "  (" << note << ")";
    out << "\n";
  };
  row("trees read", s.trees_read);
  row("trees used", s.trees_used);
  row("words", s.words);
  row("phrase labels before", s.nonterminals_before, "distinct labels above the tags");
  row("tags before", s.preterminals_before);
  row("phrase symbols after", s.nonterminals_after, "left-hand sides of phrase rules");
  row("tags after", s.preterminals_after, "left-hand sides of word rules");
  row("rule types", s.rule_types);
  row("  phrase rules", s.phrasal_rule_types);
  row("  word rules", s.word_rule_types);
  row("  unknown-word rules", s.unknown_rule_types);
  row("rule types seen once", s.rules_seen_once, "phrase and word rules");
  row("lexicon", s.lexicon, "distinct words");
  row("rare words", s.rare_words,
      "seen at most " + std::to_string(spec.rare_words) +
          (spec.rare_words == 1 ? " time" : " times"));
  row("unknown-word classes", s.unknown_classes, "distinct signatures");
  return out.str();
}

}  // namespace treegate::pcfg
