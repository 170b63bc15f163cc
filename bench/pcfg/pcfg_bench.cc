// pcfg_bench GRAMMAR SENTENCES [--tags] [--rounds N] [--baseline]: parses every line (WORD or
// WORD_TAG tokens) with one Parser on one thread; prints grammar size, sentences/s and
// binary-rule applications/s (CPU time of this thread, best of N rounds), coverage and peak
// memory. With --baseline, a straightforward dense CKY (dense_cky.cc) parses the same
// sentences in alternating rounds, its Viterbi scores are checked against the parser's, and
// the speed ratio is printed.
#include <sys/resource.h>

#include <cmath>
#include <cstring>
#include <ctime>
#include <fstream>
#include <iostream>

#include "dense_cky.h"
#include "evaluator/errors.h"
#include "harness/pcfg/batch.h"
#include "harness/pcfg/parse_outcome.h"

namespace {

using namespace treegate::pcfg;

double thread_cpu_seconds() {
  timespec ts{};
  clock_gettime(CLOCK_THREAD_CPUTIME_ID, &ts);
  return static_cast<double>(ts.tv_sec) + static_cast<double>(ts.tv_nsec) * 1e-9;
}

struct Round {
  double seconds = 0;
  std::uint64_t applications = 0;
  std::size_t parsed = 0;
  std::vector<double> best;
};

Round run_parser(Parser& parser, const std::vector<Sentence>& sentences, bool tagged) {
  ParseOptions options;
  options.gold_tags = tagged;
  Round round;
  const double start = thread_cpu_seconds();
  for (const Sentence& s : sentences) {
    ParseResult r = parser.parse(s.words, tagged ? &s.tags : nullptr, options);
    round.applications += r.binary_applications;
    round.parsed += r.status == ParseStatus::parsed;
    round.best.push_back(r.status == ParseStatus::parsed ? r.logprob : -INFINITY);
  }
  round.seconds = thread_cpu_seconds() - start;
  return round;
}

Round run_dense(const CompiledGrammar& g, const std::vector<Sentence>& sentences, bool tagged) {
  treegate::bench::DenseCky dense(g);
  ParseOptions options;
  options.gold_tags = tagged;
  Round round;
  const double start = thread_cpu_seconds();
  for (const Sentence& s : sentences) {
    std::vector<std::vector<LexEntry>> lexical;
    if (!check_input(g, s.words, tagged ? &s.tags : nullptr, options).empty()) {
      round.best.push_back(-INFINITY);
      continue;
    }
    for (std::size_t i = 0; i < s.words.size(); ++i) {
      lexical.push_back(lexical_entries(g, s.words, tagged ? &s.tags : nullptr, options, i));
    }
    const double best = dense.parse(lexical, round.applications);
    round.parsed += std::isfinite(best);
    round.best.push_back(best);
  }
  round.seconds = thread_cpu_seconds() - start;
  return round;
}

}  // namespace

int main(int argc, char** argv) {
  if (argc < 3) {
    std::cerr << "usage: pcfg_bench GRAMMAR SENTENCES [--tags] [--rounds N] [--baseline]\n";
    return 2;
  }
  bool tagged = false, baseline = false;
  int rounds = 1;
  for (int i = 3; i < argc; ++i) {
    if (std::strcmp(argv[i], "--tags") == 0) tagged = true;
    if (std::strcmp(argv[i], "--baseline") == 0) baseline = true;
    if (std::strcmp(argv[i], "--rounds") == 0 && i + 1 < argc)
      rounds = std::max(1, std::atoi(argv[++i]));
  }
  try {
    const double t0 = thread_cpu_seconds();
    auto grammar = load_compiled_grammar(argv[1]);
    const double load = thread_cpu_seconds() - t0;
    std::ifstream in(argv[2]);
    std::vector<Sentence> sentences;
    std::size_t number = 0, words = 0;
    for (std::string line; std::getline(in, line);) {
      sentences.push_back(read_sentence(line, ++number, tagged));
      words += sentences.back().words.size();
    }
    Parser parser(grammar);
    Round best, dense_best;
    for (int r = 0; r < rounds; ++r) {
      Round round = run_parser(parser, sentences, tagged);
      if (r == 0 || round.seconds < best.seconds) best = std::move(round);
      if (!baseline) continue;
      Round d = run_dense(*grammar, sentences, tagged);
      if (r == 0 || d.seconds < dense_best.seconds) dense_best = std::move(d);
    }
    rusage usage{};
    getrusage(RUSAGE_SELF, &usage);
    const double n = static_cast<double>(sentences.size());
    std::cout << "grammar: " << grammar->num_symbols() << " symbols, "
              << grammar->num_binary_rules() << " binary rules after binarization, loaded in "
              << load << " s\n"
              << "sentences: " << sentences.size() << ", " << words << " words, parsed "
              << best.parsed << "\n"
              << "treegate CKY: " << n / best.seconds << " sentences/s, "
              << static_cast<double>(best.applications) / best.seconds
              << " binary rule applications/s (" << best.seconds << " cpu s, best of " << rounds
              << ")\n";
    if (baseline) {
      std::size_t differ = 0;
      for (std::size_t i = 0; i < sentences.size(); ++i) {
        const double a = best.best[i], b = dense_best.best[i];
        if (!(a == b || std::abs(a - b) <= 1e-9 * std::abs(a))) ++differ;
      }
      std::cout << "dense CKY (Viterbi only): " << n / dense_best.seconds << " sentences/s, "
                << static_cast<double>(dense_best.applications) / dense_best.seconds
                << " binary rule applications/s (" << dense_best.seconds
                << " cpu s); Viterbi scores differing: " << differ << "\n"
                << "speed ratio treegate / dense: " << dense_best.seconds / best.seconds << "\n";
    }
    std::cout << "peak memory MiB: " << static_cast<double>(usage.ru_maxrss) / 1024 << "\n";
  } catch (const treegate::InputError& e) {
    std::cerr << "pcfg_bench: " << e.what() << "\n";
    return 2;
  }
  return 0;
}
