// Sampler: draws trees from a PCFG top-down (each nonterminal expanded by a rule chosen with
// its probability), iteratively, from a seeded generator so that runs are reproducible.
// A Sampler is immutable after construction; draw() may run on many threads with own RNGs.
#pragma once

#include <cstdint>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "evaluator/tree.h"
#include "harness/pcfg/grammar.h"

namespace treegate::pcfg {

struct SampleOptions {
  std::uint64_t seed = 1;
  std::size_t max_depth = 500;      // a draw nested deeper is thrown away and drawn again
  std::size_t max_nodes = 1000000;  // likewise for a draw with more nodes
  std::size_t max_attempts = 1000;  // draws thrown away in a row before giving up
  bool raw = false;                 // keep the grammar's own symbols (no undo_transforms)
};

/// A small deterministic generator (splitmix64): the same seed gives the same trees on every
/// platform, unlike the standard distributions.
class SampleRng {
 public:
  explicit SampleRng(std::uint64_t seed) : state_(seed) {}
  std::uint64_t next();
  /// Uniform in [0, 1).
  double unit() { return static_cast<double>(next() >> 11) * 0x1.0p-53; }

 private:
  std::uint64_t state_;
};

class Sampler {
 public:
  /// Throws InputError when the start symbol has no rules, or a right-hand side names a
  /// nonterminal without rules (file:line of the rule).
  explicit Sampler(const Grammar& grammar, const LabelTable& labels = LabelTable::shared());

  /// One draw; nullopt when it went past options.max_depth or options.max_nodes.
  std::optional<Tree> draw(SampleRng& rng, const SampleOptions& options) const;

 private:
  struct Choice {
    double cumulative;              // running sum of the LHS's probabilities (normalised)
    std::vector<std::int32_t> rhs;  // >= 0 nonterminal index; < 0: -(terminal index) - 1
  };
  std::vector<std::string> nonterminals_;
  std::vector<LabelId> labels_;
  std::vector<std::string> terminals_;
  std::vector<std::vector<Choice>> choices_;  // by nonterminal
  std::int32_t start_ = 0;
  const LabelTable* table_;
};

struct SampleStats {
  std::size_t trees = 0;
  std::size_t discarded = 0;  // draws thrown away for depth or size
};

/// Draws `n` trees (transforms undone unless options.raw) and hands each to `emit`.
/// Throws InputError when options.max_attempts draws in a row are thrown away.
SampleStats sample_trees(const Grammar& grammar, std::size_t n, const SampleOptions& options,
                         const std::function<void(const Tree&)>& emit);

}  // namespace treegate::pcfg
