// pcfg_bench GRAMMAR SENTENCES [--tags] [--repeat N]: parses every line (WORD or WORD_TAG
// tokens) with one Parser on one thread and prints grammar size, sentences/s and binary-rule
// applications/s (CPU time of this thread), coverage, and the process's peak memory.
#include <sys/resource.h>

#include <cstring>
#include <ctime>
#include <fstream>
#include <iostream>

#include "evaluator/errors.h"
#include "harness/pcfg/batch.h"

namespace {

double thread_cpu_seconds() {
  timespec ts{};
  clock_gettime(CLOCK_THREAD_CPUTIME_ID, &ts);
  return static_cast<double>(ts.tv_sec) + static_cast<double>(ts.tv_nsec) * 1e-9;
}

}  // namespace

int main(int argc, char** argv) {
  using namespace treegate::pcfg;
  if (argc < 3) {
    std::cerr << "usage: pcfg_bench GRAMMAR SENTENCES [--tags] [--repeat N]\n";
    return 2;
  }
  bool tagged = false;
  int repeat = 1;
  for (int i = 3; i < argc; ++i) {
    if (std::strcmp(argv[i], "--tags") == 0) tagged = true;
    if (std::strcmp(argv[i], "--repeat") == 0 && i + 1 < argc) repeat = std::atoi(argv[++i]);
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
    ParseOptions options;
    options.gold_tags = tagged;
    std::uint64_t applications = 0;
    std::size_t parsed = 0;
    const double start = thread_cpu_seconds();
    for (int r = 0; r < repeat; ++r) {
      for (const Sentence& s : sentences) {
        ParseResult result = parser.parse(s.words, tagged ? &s.tags : nullptr, options);
        applications += result.binary_applications;
        parsed += result.status == ParseStatus::parsed;
      }
    }
    const double seconds = thread_cpu_seconds() - start;
    rusage usage{};
    getrusage(RUSAGE_SELF, &usage);
    const double n = static_cast<double>(sentences.size()) * repeat;
    std::cout << "grammar: " << grammar->num_symbols() << " symbols, "
              << grammar->num_binary_rules() << " binary rules after binarization, loaded in "
              << load << " s\n"
              << "sentences: " << sentences.size() << " x " << repeat << ", " << words
              << " words, parsed " << parsed << "\n"
              << "cpu seconds: " << seconds << "\n"
              << "sentences/s: " << n / seconds << "\n"
              << "binary rule applications/s: " << static_cast<double>(applications) / seconds
              << "\n"
              << "peak memory MiB: " << static_cast<double>(usage.ru_maxrss) / 1024 << "\n";
  } catch (const treegate::InputError& e) {
    std::cerr << "pcfg_bench: " << e.what() << "\n";
    return 2;
  }
  return 0;
}
