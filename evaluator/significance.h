// Significance of a corpus-F1 difference between two systems scored on the same sentences:
// paired approximate randomization (Noreen 1989; Yeh 2000) and the paired bootstrap
// (Berg-Kirkpatrick, Burkett & Klein 2012). Pure functions over per-sentence counts; seeded
// and reproducible (std::mt19937_64 is fully specified by the C++ standard). Thread-safe.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

namespace treegate {

/// One sentence's bracket counts under the two systems (A = old, B = new).
struct PairedCounts {
  std::uint32_t matched_a = 0, gold_a = 0, test_a = 0;
  std::uint32_t matched_b = 0, gold_b = 0, test_b = 0;
};

enum class SignificanceMethod { kApproximateRandomization, kPairedBootstrap };

struct SignificanceOptions {
  SignificanceMethod method = SignificanceMethod::kApproximateRandomization;
  std::uint64_t iterations = 10000;
  std::uint64_t seed = 20121;
  double level = 0.05;  // the significance level the verdict in words refers to
};

struct SignificanceResult {
  SignificanceMethod method;
  std::uint64_t iterations = 0;
  std::uint64_t seed = 0;
  double level = 0.05;
  double f1_a = 0, f1_b = 0;   // corpus F1 in percent
  double delta = 0;            // f1_b - f1_a, in points
  std::uint64_t at_least = 0;  // iterations whose statistic reached the observed one
  double p = 1;
  bool significant() const { return p < level; }
};

/// Corpus F1 (percent) of summed counts, with the evaluator's conventions (tally.h).
double corpus_f1(std::uint64_t matched, std::uint64_t gold, std::uint64_t test);

/// Approximate randomization: each iteration swaps the two systems' counts of each sentence
/// with probability 1/2 and recomputes |F1(B) - F1(A)|; p = (c + 1) / (R + 1), where c counts
/// iterations with a difference at least the observed one. Identical systems give p = 1.
SignificanceResult approximate_randomization(const std::vector<PairedCounts>& sentences,
                                             std::uint64_t iterations, std::uint64_t seed);

/// Paired bootstrap: R samples of n sentences drawn with replacement; c counts samples whose
/// difference (in the observed direction) exceeds twice the observed one; p = c / R.
/// With no observed difference p = 1.
SignificanceResult paired_bootstrap(const std::vector<PairedCounts>& sentences,
                                    std::uint64_t iterations, std::uint64_t seed);

/// Runs the method the options name, and records the level.
SignificanceResult significance(const std::vector<PairedCounts>& sentences,
                                const SignificanceOptions& options);

const char* method_name(SignificanceMethod method);  // "approximate randomization", ...

/// One sentence in words, e.g. "The F1 difference of +0.84 points is significant at the 0.05
/// level (p = 0.0021; approximate randomization, 10000 iterations, seed 20121)."
std::string significance_sentence(const SignificanceResult& result);

}  // namespace treegate
