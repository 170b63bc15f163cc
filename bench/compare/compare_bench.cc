// Benchmark of `compare`: writes two results files of N generated cases (default 50,000; trees
// of 5-40 words, the two runs disagreeing on about a third of the cases), then times loading
// both, building the comparison (re-scoring, error classes, significance with 10,000
// iterations) and rendering text and JSON, on one thread. Prints the figures and the target.
#include <time.h>

#include <chrono>
#include <cstdio>
#include <random>
#include <string>

#include "harness/results/compare.h"

namespace {

using namespace treegate;

const char* kPhrases[] = {"NP", "VP", "PP", "S", "SBAR", "ADJP", "ADVP"};
const char* kTags[] = {"NN", "VB", "IN", "DT", "JJ", "RB", "NNS", "VBD"};

// A random tree over words [lo, hi); `drift` is the chance that a node of this run splits its
// words differently from gold (the generator's draws are shared with gold up to that point).
void tree(std::string& out, int lo, int hi, std::mt19937_64& shape, std::mt19937_64& own,
          double drift, const char* label) {
  out += "(";
  out += label;
  std::mt19937_64& rng = std::uniform_real_distribution<double>(0, 1)(own) < drift ? own : shape;
  if (hi - lo == 1) {
    out += " (";
    out += kTags[rng() % 8];
    out += " w" + std::to_string(lo) + ")";
  } else {
    const int parts = hi - lo >= 3 && rng() % 3 == 0 ? 3 : 2;
    int cut1 = lo + 1 + static_cast<int>(rng() % static_cast<unsigned>(hi - lo - 1));
    int cut2 = parts == 3 && hi - cut1 >= 2
                   ? cut1 + 1 + static_cast<int>(rng() % static_cast<unsigned>(hi - cut1 - 1))
                   : hi;
    const int bounds[] = {lo, cut1, cut2, hi};
    for (int k = 0; k < 3 && bounds[k] < hi; ++k) {
      const int a = bounds[k], b = bounds[k + 1];
      if (b <= a) continue;
      out += " ";
      if (b - a == 1) {
        out += "(";
        out += kTags[rng() % 8];
        out += " w" + std::to_string(a) + ")";
      } else {
        tree(out, a, b, shape, own, drift, kPhrases[rng() % 7]);
      }
    }
  }
  out += ")";
}

results::RunResults make_run(std::size_t n, double drift, std::uint64_t seed) {
  results::RunResults run;
  run.header.suites.push_back({"bench", "bench.yaml", "0", n});
  for (std::size_t i = 0; i < n; ++i) {
    results::CaseRecord c;
    c.suite = "bench";
    c.id = "case-" + std::to_string(i);
    c.n = i + 1;
    const int words = 5 + static_cast<int>(i * 7919 % 36);
    for (int w = 0; w < words; ++w) c.words.push_back("w" + std::to_string(w));
    c.constructions = {i % 3 == 0 ? "pp-attachment" : "ordinary"};
    std::mt19937_64 shape(i), none(0), own(seed * 1000003 + i);
    tree(c.gold, 0, words, shape, none, 0.0, "S");
    std::mt19937_64 shape2(i);
    tree(c.predicted, 0, words, shape2, own, i % 3 == 0 ? drift : 0.0, "S");
    c.parse = "parsed";
    c.score = "scored";
    c.outcome = c.predicted == c.gold ? results::Outcome::kPass : results::Outcome::kFail;
    c.seconds = 0.0001 * words;
    run.cases.push_back(std::move(c));
  }
  return run;
}

// Wall-clock and CPU seconds since a mark: the machine is shared, so CPU time of this one
// thread is the steadier figure; both are printed.
struct Mark {
  std::chrono::steady_clock::time_point wall = std::chrono::steady_clock::now();
  double cpu = cpu_now();
  static double cpu_now() {
    timespec ts{};
    clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &ts);
    return static_cast<double>(ts.tv_sec) + 1e-9 * static_cast<double>(ts.tv_nsec);
  }
  double wall_s() const {
    return std::chrono::duration<double>(std::chrono::steady_clock::now() - wall).count();
  }
  double cpu_s() const { return cpu_now() - cpu; }
};

}  // namespace

int main(int argc, char** argv) {
  const std::size_t n = argc > 1 ? std::stoul(argv[1]) : 50000;
  const std::string dir = argc > 2 ? argv[2] : "/tmp";
  const std::string a = dir + "/compare-bench-old.jsonl", b = dir + "/compare-bench-new.jsonl";
  results::write_results(a, make_run(n, 0.08, 1));
  results::write_results(b, make_run(n, 0.08, 2));
  const Mark t0;
  const results::RunResults old_run = results::load_results(a);
  const results::RunResults new_run = results::load_results(b);
  const double load = t0.wall_s(), load_cpu = t0.cpu_s();
  const Mark t1;
  const results::Comparison c = results::compare_runs(old_run, a, new_run, b);
  const double build = t1.wall_s(), build_cpu = t1.cpu_s();
  const Mark t2;
  const std::size_t text = results::comparison_text(c).size();
  const double render = t2.wall_s(), render_cpu = t2.cpu_s();
  const double total = t0.wall_s(), total_cpu = t0.cpu_s();
  const Mark t3;
  const std::size_t json = results::comparison_json(c).size();
  const double render_json = t3.wall_s(), json_cpu = t3.cpu_s();
  std::printf(
      "compare benchmark: %zu cases per file, %llu paired, %llu changed trees\n", n,
      static_cast<unsigned long long>(c.paired),
      static_cast<unsigned long long>(
          c.paired - c.transition_counts[static_cast<int>(results::Transition::kUnchanged)]));
  std::printf("  %-58s %8s %8s\n", "step (one thread)", "wall s", "CPU s");
  std::printf("  %-58s %8.3f %8.3f\n", "load both results files (run library's reader)", load,
              load_cpu);
  std::printf("  %-58s %8.3f %8.3f\n",
              "compare: re-score, error classes, significance (10,000 it.)", build, build_cpu);
  std::printf("  %-58s %8.3f %8.3f\n", "render the console text", render, render_cpu);
  std::printf("  %-58s %8.3f %8.3f\n", "total (load + compare + text)", total, total_cpu);
  std::printf("  %-58s %8.3f %8.3f\n", "render JSON instead (extra; not in the total)", render_json,
              json_cpu);
  std::printf("  target < 5 s: %s on CPU time (%.2f of the budget), %s on wall time (%.2f)\n",
              total_cpu < 5 ? "met" : "MISSED", total_cpu / 5, total < 5 ? "met" : "missed",
              total / 5);
  std::printf("  text %zu bytes, JSON %zu bytes\n", text, json);
  std::printf("  F1 %.2f -> %.2f, p = %.4g\n", c.overall.old_side.f1(), c.overall.new_side.f1(),
              c.significance.p);
  return 0;
}
