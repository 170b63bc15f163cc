// treegate estimate: read a PCFG off treebank files (relative frequencies after the chosen
// tree transforms) and write it as a grammar file, atomically.
#include <filesystem>
#include <iostream>

#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/pcfg/estimate_files.h"
#include "harness/results/atomic_file.h"

namespace treegate::cli {
namespace {

struct EstimateArgs {
  std::vector<std::string> treebanks;
  std::string output, start = "ROOT", horizontal = "none", empty_tag = "-NONE-";
  int parent = 1, rare_words = 1;
  std::size_t max_errors = 20;
};

// Checks option values and combinations; fills `spec`. Returns "" or the complaint.
std::string make_spec(const EstimateArgs& a, const po::variables_map& vm,
                      pcfg::TransformSpec& spec) {
  const bool plain = vm.count("plain") > 0;
  for (const char* name : {"parent", "horizontal", "collapse-unary", "rare-words"}) {
    if (plain && vm.count(name) && !vm[name].defaulted())
      return std::string("--plain and --") + name + " contradict each other";
  }
  if (vm.count("keep-empties") && !vm["empty-tag"].defaulted())
    return "--keep-empties and --empty-tag contradict each other";
  if (a.parent < 1 || a.parent > 3) return "--parent must be 1, 2 or 3";
  if (a.rare_words < 0) return "--rare-words must be 0 or more";
  if (a.start.empty() || a.start.find_first_of(" \t\"#<@()") != std::string::npos ||
      a.start.find_first_of(pcfg::kReservedMarks) != std::string::npos)
    return "--start must be a plain label (no spaces, quotes, parentheses or ^ ~ > # < @)";
  spec.strip_functions = vm.count("keep-functions") == 0 && !plain;
  spec.drop_empties = vm.count("keep-empties") == 0 && !plain;
  spec.empty_tag = a.empty_tag;
  spec.start = a.start;
  spec.parent = a.parent;
  spec.collapse_unary = vm.count("collapse-unary") > 0;
  spec.rare_words = plain ? 0 : a.rare_words;
  try {
    spec.horizontal = pcfg::from_pairs({{"horizontal", a.horizontal}}, "--horizontal").horizontal;
  } catch (const InputError&) {
    return "--horizontal must be none, all or a whole number, not '" + a.horizontal + "'";
  }
  return "";
}

// Refuses writing the grammar over one of the treebank files.
std::string check_output(const std::string& output, const std::vector<std::string>& inputs) {
  std::error_code ec;
  for (const std::string& in : inputs) {
    if (in != "-" && std::filesystem::equivalent(in, output, ec))
      return "-o " + output + " is one of the treebank files; choose another output";
  }
  return "";
}

int run_estimate(int argc, char** argv) {
  const Usage usage{
      "estimate", "TREEBANK... -o GRAMMAR [options]",
      "Read a PCFG off bracketed treebank files (relative frequencies, after the chosen tree "
      "transforms) and write it as a grammar file.",
      "treegate estimate 'suites/demo/treebank/*.trees' -o /tmp/demo.pcfg --parent 2 --horizontal "
      "1",
      "0 grammar written, 2 bad usage, unreadable or unusable trees (nothing written)"};
  EstimateArgs a;
  po::options_description opts("options");
  opts.add_options()("treebank", po::value(&a.treebanks)->required(),
                     "bracketed tree files or globs (- for stdin)")(
      "output,o", po::value(&a.output)->required(), "grammar file to write")(
      "start", po::value(&a.start)->default_value("ROOT"),
      "start symbol: root wrappers (ROOT, TOP, empty label) are renamed to it, other roots "
      "get it as a new parent")(
      "parent", po::value(&a.parent)->default_value(1),
      "vertical Markov order: 1 none, 2 parent, 3 parent and grandparent")(
      "horizontal", po::value(&a.horizontal)->default_value("none"),
      "binarize with this horizontal Markov order: none, 0, 1, 2, ... or all")(
      "collapse-unary", "merge unary chains of phrase nodes into one node (S~VP)")(
      "keep-functions", "keep function tags and indices (NP-SBJ-1)")("keep-empties",
                                                                     "keep empty elements")(
      "empty-tag", po::value(&a.empty_tag)->default_value("-NONE-"), "tag of empty elements")(
      "rare-words", po::value(&a.rare_words)->default_value(1),
      "words seen at most this often also train unknown-word classes (0: none)")(
      "plain", "no transforms: keep function tags and empties, no unknown-word classes")(
      "skip-bad-trees", "leave unusable trees out (reported) instead of refusing to write")(
      "max-errors", po::value(&a.max_errors)->default_value(20), "bad trees to list at most");
  po::positional_options_description pos;
  pos.add("treebank", -1);
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  pcfg::TransformSpec spec;
  if (std::string why = make_spec(a, vm, spec); !why.empty()) return fail("estimate", why);
  try {
    const std::vector<std::string> paths = pcfg::expand_treebank_patterns(a.treebanks);
    if (std::string why = check_output(a.output, paths); !why.empty()) return fail("estimate", why);
    pcfg::Estimator estimator(spec);
    std::vector<std::string> errors;
    for (const std::string& path : paths) pcfg::add_treebank_file(estimator, path, errors);
    for (std::size_t i = 0; i < errors.size() && i < a.max_errors; ++i)
      std::cerr << "treegate estimate: " << errors[i] << "\n";
    if (errors.size() > a.max_errors)
      std::cerr << "treegate estimate: ... and " << errors.size() - a.max_errors << " more\n";
    const pcfg::EstimateSummary summary = estimator.summary();
    if (!errors.empty() && vm.count("skip-bad-trees") == 0)
      return fail("estimate",
                  std::to_string(errors.size()) +
                      " unusable trees; nothing written (--skip-bad-trees leaves them out)");
    if (summary.trees_used == 0)
      return fail("estimate", "no usable trees in the input; nothing written");
    results::write_file_atomically(a.output, pcfg::write_grammar(estimator.grammar()));
    std::cout << "wrote " << a.output << " from " << paths.size() << " file(s)\n"
              << pcfg::summary_text(summary, spec);
  } catch (const InputError& e) {
    return fail("estimate", e.what());
  }
  return kExitOk;
}

const Registration reg({"estimate", "read a PCFG off treebank files (with tree transforms)",
                        &run_estimate});

}  // namespace
}  // namespace treegate::cli
