// Corpus tallies of PARSEVAL scores: micro-averaged figures (sums of matched, gold and test
// brackets), exact match, crossing brackets, tag accuracy, per label, and the same within the
// scheme's length cutoff. Plain values; merge() combines tallies made on different threads.
#pragma once

#include <cstdint>
#include <map>
#include <string>
#include <vector>

#include "evaluator/parseval.h"

namespace treegate {

/// Precision, recall and F1 in percent. With nothing to find and nothing proposed the
/// figure is 100 (nothing is wrong); with a zero denominator otherwise it is 0.
double precision_pct(std::uint64_t matched, std::uint64_t test, std::uint64_t gold);
double recall_pct(std::uint64_t matched, std::uint64_t test, std::uint64_t gold);
double f1_pct(std::uint64_t matched, std::uint64_t test, std::uint64_t gold);

struct Counts {
  std::uint64_t sentences = 0;  // every sentence seen
  std::uint64_t scored = 0;     // counted in the figures (unparsed included when the scheme says)
  std::uint64_t errors = 0;     // yield mismatches and unusable gold trees
  std::uint64_t unparsed = 0;   // test tree empty
  std::uint64_t gold = 0, test = 0, matched = 0;
  std::uint64_t exact = 0;
  std::uint64_t crossing = 0, zero_crossing = 0, le2_crossing = 0;
  std::uint64_t words = 0, tags_correct = 0;

  void add(const SentenceScore& s, const Scheme& scheme);
  void merge(const Counts& other);
};

struct Figures {
  double precision = 0, recall = 0, f1 = 0;
  double exact_match = 0;  // % of scored sentences
  double crossing_avg = 0;
  double zero_crossing_pct = 0, le2_crossing_pct = 0;
  double tag_accuracy = 0;  // % of scored word positions
};
Figures figures(const Counts& c);

struct LabelCounts {
  std::uint64_t gold = 0, test = 0, matched = 0;
};

class Tally {
 public:
  explicit Tally(Scheme scheme) : scheme_(std::move(scheme)) {}
  void add(const SentenceScore& s, const BracketSets& brackets);
  void merge(const Tally& other);

  const Counts& all() const { return all_; }
  const Counts& within_cutoff() const { return cutoff_; }
  /// Keyed by canonical label id (of the scorer's label table); labels never seen are left out.
  std::map<LabelId, LabelCounts> per_label() const;
  const Scheme& scheme() const { return scheme_; }

 private:
  Scheme scheme_;
  Counts all_, cutoff_;
  LabelCounts& slot(LabelId label);

  std::vector<LabelCounts> per_label_;  // indexed by label id
};

}  // namespace treegate
