// treegate explain: why the grammar prefers its parse over a gold tree.
#include <iostream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/pcfg/explain.h"
#include "harness/suite/suite_loader.h"

namespace treegate::cli {
namespace {

// "suites/demo/pp-verb.yaml#moor-east-pier" -> the case's gold tree.
Tree case_tree(const std::string& ref) {
  const auto hash = ref.rfind('#');
  if (hash == std::string::npos || hash == 0 || hash + 1 == ref.size()) {
    throw InputError(
        "expected SUITE_FILE#CASE_ID, e.g. suites/demo/pp-verb.yaml#moor-east-pier, "
        "not " +
        quote_for_message(ref));
  }
  const std::string file = ref.substr(0, hash), id = ref.substr(hash + 1);
  const suite::Suite s = suite::load_suite(file);
  for (const suite::Case& c : s.cases) {
    if (c.id != id) continue;
    if (!c.load_error.empty()) throw InputError(file + ": case " + id + ": " + c.load_error);
    return c.gold;
  }
  throw InputError(file + ": no case with id " + quote_for_message(id));
}

int run_explain(int argc, char** argv) {
  Usage usage{"explain", "--grammar G (SUITE_FILE#CASE_ID | --tree TREE) [--kbest K] [--tags]",
              "Explain why the grammar's best parse differs from a gold tree: both trees, log "
              "probabilities, the gap, missing rules or the rules that tip the balance.",
              "treegate explain --grammar suites/demo/v2.pcfg "
              "suites/demo/pp-verb.yaml#moor-east-pier"};
  po::options_description opts("options");
  std::string grammar, ref, tree;
  pcfg::ExplainOptions options;
  opts.add_options()("grammar", po::value(&grammar)->required(), "grammar file (.pcfg)")(
      "case", po::value(&ref), "SUITE_FILE#CASE_ID: the gold tree of a suite case")(
      "tree", po::value(&tree), "the gold tree, bracketed, instead of a suite case")(
      "kbest", po::value(&options.kbest),
      "look for gold among this many best trees (default 10; 0: do not look)")(
      "tags", po::bool_switch(&options.gold_tags), "parse with the gold tree's tags fixed");
  po::positional_options_description pos;
  pos.add("case", 1);
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  if (ref.empty() == tree.empty()) {
    return fail("explain", "give either SUITE_FILE#CASE_ID or --tree TREE (one of them)");
  }
  try {
    const auto compiled = pcfg::load_compiled_grammar(grammar);
    const Tree gold = tree.empty() ? case_tree(ref) : parse_tree(tree, "--tree");
    if (gold.num_words() == 0) return fail("explain", "the gold tree has no words");
    std::cout << pcfg::explanation_text(pcfg::explain_tree(compiled, gold, options));
  } catch (const InputError& e) {
    return fail("explain", e.what());
  }
  return kExitOk;
}

const Registration reg({"explain", "why the grammar prefers its parse over a gold tree",
                        &run_explain});

}  // namespace
}  // namespace treegate::cli
