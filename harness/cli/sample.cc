// treegate sample: draw trees from a grammar file, one bracketed tree per line.
#include <iostream>
#include <sstream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/pcfg/sample.h"
#include "harness/results/atomic_file.h"

namespace treegate::cli {
namespace {

int run_sample(int argc, char** argv) {
  const Usage usage{
      "sample", "--grammar GRAMMAR -n N [--seed S] [--max-depth D] [options]",
      "Draw N trees from the grammar's probability distribution (the same seed gives the same "
      "trees), one bracketed tree per line, in the treebank's labels unless --raw.",
      "treegate sample --grammar suites/demo/v1.pcfg -n 5 --seed 7",
      "0 done, 2 bad usage, unreadable grammar, or no tree within the limits"};
  std::string grammar_file, output;
  std::size_t n = 0;
  pcfg::SampleOptions options;
  po::options_description opts("options");
  opts.add_options()("grammar,g", po::value(&grammar_file)->required(), "grammar file (.pcfg)")(
      "count,n", po::value(&n)->required(), "number of trees")(
      "seed", po::value(&options.seed)->default_value(1), "random seed")(
      "max-depth", po::value(&options.max_depth)->default_value(500),
      "a draw nested deeper is discarded and drawn again")(
      "max-nodes", po::value(&options.max_nodes)->default_value(1000000),
      "a draw with more nodes is discarded and drawn again")(
      "max-attempts", po::value(&options.max_attempts)->default_value(1000),
      "give up after this many discarded draws in a row")(
      "raw", "print the grammar's own symbols (transforms in the header not undone)")(
      "output,o", po::value(&output),
      "write the trees to this file (atomically) instead of stdout");
  po::positional_options_description pos;
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  if (options.max_depth == 0) return fail("sample", "--max-depth must be at least 1");
  if (options.max_attempts == 0) return fail("sample", "--max-attempts must be at least 1");
  options.raw = vm.count("raw") > 0;
  try {
    const pcfg::Grammar grammar = pcfg::read_grammar_file(grammar_file);
    std::ostringstream buffer;
    std::ostream& out = output.empty() ? std::cout : buffer;
    const pcfg::SampleStats stats = pcfg::sample_trees(grammar, n, options, [&](const Tree& tree) {
      write_bracketed(out, tree);
      out << '\n';
    });
    if (!output.empty()) results::write_file_atomically(output, buffer.str());
    if (stats.discarded > 0) {
      std::cerr << "treegate sample: " << stats.discarded
                << " draws discarded for going past --max-depth " << options.max_depth
                << " or --max-nodes " << options.max_nodes
                << " (the trees shown are conditioned on staying within them)\n";
    }
  } catch (const InputError& e) {
    return fail("sample", e.what());
  }
  std::cout.flush();
  return std::cout ? kExitOk : fail("sample", "cannot write the output");
}

const Registration reg({"sample", "draw random trees from a grammar (seeded, reproducible)",
                        &run_sample});

}  // namespace
}  // namespace treegate::cli
