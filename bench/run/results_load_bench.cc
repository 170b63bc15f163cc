// Times load_results on a large results file: takes a results file written by `treegate run`,
// repeats its cases (with new ids) up to N cases, writes that file, and loads it 3 times.
// Usage: results_load_bench RESULTS N OUT   (prints cases, bytes, best and mean load seconds)
#include <sys/resource.h>

#include <chrono>
#include <cstdio>
#include <filesystem>
#include <string>

#include "evaluator/errors.h"
#include "harness/results/results.h"

static double cpu_seconds() {
  rusage u{};
  getrusage(RUSAGE_SELF, &u);
  return static_cast<double>(u.ru_utime.tv_sec + u.ru_stime.tv_sec) +
         static_cast<double>(u.ru_utime.tv_usec + u.ru_stime.tv_usec) / 1e6;
}

int main(int argc, char** argv) {
  if (argc != 4) {
    std::fprintf(stderr, "usage: results_load_bench RESULTS N OUT\n");
    return 2;
  }
  namespace tr = treegate::results;
  try {
    const tr::RunResults seed = tr::load_results(argv[1]);
    const std::size_t n = std::stoul(argv[2]);
    if (seed.cases.empty()) throw treegate::InputError(std::string(argv[1]) + ": no cases");
    tr::RunResults big;
    big.header = seed.header;
    big.header.suites.at(0).cases = n;
    for (std::size_t i = 0; i < n; ++i) {
      tr::CaseRecord c = seed.cases[i % seed.cases.size()];
      c.suite = big.header.suites[0].name;
      c.id = "r" + std::to_string(i);
      c.n = i + 1;
      big.cases.push_back(std::move(c));
    }
    tr::write_results(argv[3], big);
    double best = 1e9, sum = 0, best_cpu = 1e9;
    for (int k = 0; k < 3; ++k) {
      const double c0 = cpu_seconds();
      const auto t0 = std::chrono::steady_clock::now();
      const tr::RunResults back = tr::load_results(argv[3]);
      const double s = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
      if (back.cases.size() != n) throw treegate::InputError("loaded a different number of cases");
      best = std::min(best, s);
      best_cpu = std::min(best_cpu, cpu_seconds() - c0);
      sum += s;
    }
    std::printf(
        "results load: %zu cases, %ju bytes: best %.3f s wall (mean %.3f s), best %.3f s CPU "
        "(target < 1 s)\n",
        n, static_cast<std::uintmax_t>(std::filesystem::file_size(argv[3])), best, sum / 3,
        best_cpu);
  } catch (const std::exception& e) {
    std::fprintf(stderr, "%s\n", e.what());
    return 2;
  }
  return 0;
}
