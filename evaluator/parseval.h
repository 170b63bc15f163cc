// PARSEVAL scoring of one sentence: labeled brackets of a test tree against a gold tree under a
// Scheme. A Scorer caches label mappings, so it is not thread-safe: use one per thread.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "evaluator/scheme.h"
#include "evaluator/tree.h"

namespace treegate {

enum class SentenceStatus {
  kScored,         // both trees scored
  kNoParse,        // the test tree is empty: zero test brackets (counted when the scheme says so)
  kYieldMismatch,  // gold and test words differ: an error, not scored
  kError,          // the gold tree is unusable (e.g. no words): an error, not scored
};
const char* status_name(SentenceStatus status);

/// A labeled span over scored word positions [start, end) (ignored tokens removed).
struct Bracket {
  LabelId label;  // canonical label: function tags stripped, equivalence classes merged
  std::uint32_t start;
  std::uint32_t end;
  bool matched = false;  // set on both sides for brackets that are in the matched multiset
  friend bool operator<(const Bracket& a, const Bracket& b) {
    if (a.start != b.start) return a.start < b.start;
    if (a.end != b.end) return a.end > b.end;  // wider first: parents before children
    return a.label < b.label;
  }
};

/// Whether two spans overlap with neither inside the other (Black et al. 1991).
inline bool crosses(const Bracket& a, const Bracket& b) {
  return (a.start < b.start && b.start < a.end && a.end < b.end) ||
         (b.start < a.start && a.start < b.end && b.end < a.end);
}

struct SentenceScore {
  SentenceStatus status = SentenceStatus::kScored;
  std::string reason;  // for errors and no-parse: what happened
  std::uint32_t gold_brackets = 0;
  std::uint32_t test_brackets = 0;
  std::uint32_t matched = 0;
  std::uint32_t crossing = 0;      // test brackets that cross at least one gold bracket
  std::uint32_t words = 0;         // scored word positions (the sentence length)
  std::uint32_t tags_correct = 0;  // scored positions whose test tag equals the gold tag

  /// Counted in corpus figures (scored, or unparsed when the scheme counts those).
  bool counts(const Scheme& scheme) const;
  bool exact_match() const { return matched == gold_brackets && matched == test_brackets; }
};

/// The brackets behind a score, for per-label tallies, error classes and reports.
struct BracketSets {
  std::vector<Bracket> gold;  // sorted (see Bracket::operator<)
  std::vector<Bracket> test;
};

class Scorer {
 public:
  /// Trees given to this scorer must use `labels` for their labels.
  explicit Scorer(Scheme scheme, LabelTable& labels = LabelTable::shared());

  SentenceScore score(const Tree& gold, const Tree& test, BracketSets* brackets = nullptr);
  /// The brackets of one tree alone (positions from its own tags), e.g. for checks.
  std::vector<Bracket> brackets_of(const Tree& tree);

  const Scheme& scheme() const { return scheme_; }
  /// Canonical label for a raw label id (interning stripped forms as needed).
  LabelId canonical(LabelId raw);

 private:
  struct Words {
    std::vector<LabelId> tag;        // raw tag of each word (kEmpty when untagged)
    std::vector<std::int32_t> kept;  // indices of words that are not empty elements
  };
  void collect_words(const Tree& tree, Words& out);
  void collect_brackets(const Tree& tree, const std::vector<std::int32_t>& position,
                        std::vector<Bracket>& out);

  Scheme scheme_;
  LabelTable* labels_;
  std::vector<LabelId> canonical_;  // raw id -> canonical id, LabelTable::kNone when unknown
  std::vector<std::uint8_t> kind_;  // raw id -> bit 1 ignored tag, bit 2 empty tag, bit 4 root
  // Scratch space reused from sentence to sentence.
  Words gold_words_, test_words_;
  std::vector<std::int32_t> gold_pos_, kept_pos_, test_pos_, start_, end_;
  std::vector<std::int64_t> crossing_scratch_;
};

}  // namespace treegate
