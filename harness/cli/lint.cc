// treegate lint: check a grammar file; optionally write a copy normalised per left-hand side.
#include <iostream>

#include "evaluator/errors.h"
#include "harness/cli/command.h"
#include "harness/pcfg/lint.h"
#include "harness/results/atomic_file.h"

namespace treegate::cli {
namespace {

int run_lint(int argc, char** argv) {
  const Usage usage{
      "lint", "GRAMMAR [--tolerance T] [--normalize OUT] [--strict]",
      "Check a grammar file: sums per left-hand side, duplicate rules, bad weights, "
      "start symbol, unreachable and unproductive symbols, unary cycles, symbols used "
      "as terminal and nonterminal, and consistency (spectral radius < 1).",
      "treegate lint suites/demo/v1.pcfg --strict",
      "0 clean (or warnings without --strict), 1 warnings with --strict, 2 bad usage or "
      "unreadable grammar"};
  po::options_description opts("options");
  std::string grammar_file, normalize_to;
  pcfg::LintOptions lint_options;
  opts.add_options()("grammar", po::value(&grammar_file)->required(), "grammar file (.pcfg)")(
      "tolerance", po::value(&lint_options.tolerance),
      "allowed |sum - 1| per left-hand side (default 1e-6)")(
      "normalize", po::value(&normalize_to),
      "write a copy with each left-hand side's weights divided by their sum")(
      "strict", "exit 1 when there is any warning");
  po::positional_options_description pos;
  pos.add("grammar", 1);
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  if (!(lint_options.tolerance >= 0)) return fail("lint", "--tolerance must be a number >= 0");
  pcfg::LintReport report;
  try {
    const pcfg::Grammar grammar = pcfg::read_grammar_file(grammar_file);
    report = pcfg::lint_grammar(grammar, lint_options);
    for (const pcfg::LintFinding& f : report.findings) {
      std::cout << format_position(grammar_file, f.line, 0) << ": warning [" << f.check
                << "]: " << f.message << "\n";
    }
    std::cout << grammar_file << ": " << report.rules << " rules, " << report.nonterminals
              << " left-hand sides, " << report.findings.size() << " warning"
              << (report.findings.size() == 1 ? "" : "s")
              << "; spectral radius of the mean-production matrix " << report.spectral_radius
              << (report.spectral_radius < 1 - 1e-9 ? " (consistent)" : "") << "\n";
    if (!normalize_to.empty()) {
      std::vector<std::size_t> dropped;
      const pcfg::Grammar fixed = pcfg::normalized(grammar, &dropped);
      results::write_file_atomically(normalize_to, pcfg::write_grammar(fixed));
      std::cout << "wrote " << normalize_to << " (" << fixed.rules.size() << " rules";
      if (!dropped.empty()) std::cout << "; dropped " << dropped.size() << " with unusable weights";
      std::cout << ")\n";
    }
  } catch (const InputError& e) {
    return fail("lint", e.what());
  }
  return vm.count("strict") && !report.findings.empty() ? kExitGateFailed : kExitOk;
}

const Registration reg({"lint", "check a grammar file for defects and consistency", &run_lint});

}  // namespace
}  // namespace treegate::cli
