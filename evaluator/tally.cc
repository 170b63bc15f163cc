#include "evaluator/tally.h"

namespace treegate {
namespace {

double pct(std::uint64_t num, std::uint64_t den) {
  return den == 0 ? 0.0 : 100.0 * static_cast<double>(num) / static_cast<double>(den);
}

}  // namespace

double precision_pct(std::uint64_t matched, std::uint64_t test, std::uint64_t gold) {
  if (test == 0) return gold == 0 ? 100.0 : 0.0;
  return pct(matched, test);
}

double recall_pct(std::uint64_t matched, std::uint64_t test, std::uint64_t gold) {
  if (gold == 0) return test == 0 ? 100.0 : 0.0;
  return pct(matched, gold);
}

double f1_pct(std::uint64_t matched, std::uint64_t test, std::uint64_t gold) {
  const double p = precision_pct(matched, test, gold);
  const double r = recall_pct(matched, test, gold);
  return p + r == 0.0 ? 0.0 : 2.0 * p * r / (p + r);
}

void Counts::add(const SentenceScore& s, const Scheme& scheme) {
  ++sentences;
  if (s.status == SentenceStatus::kNoParse) ++unparsed;
  if (s.status == SentenceStatus::kYieldMismatch || s.status == SentenceStatus::kError) ++errors;
  if (!s.counts(scheme)) return;
  ++scored;
  gold += s.gold_brackets;
  test += s.test_brackets;
  matched += s.matched;
  if (s.exact_match()) ++exact;
  crossing += s.crossing;
  if (s.crossing == 0) ++zero_crossing;
  if (s.crossing <= 2) ++le2_crossing;
  words += s.words;
  tags_correct += s.tags_correct;
}

void Counts::merge(const Counts& o) {
  sentences += o.sentences;
  scored += o.scored;
  errors += o.errors;
  unparsed += o.unparsed;
  gold += o.gold;
  test += o.test;
  matched += o.matched;
  exact += o.exact;
  crossing += o.crossing;
  zero_crossing += o.zero_crossing;
  le2_crossing += o.le2_crossing;
  words += o.words;
  tags_correct += o.tags_correct;
}

Figures figures(const Counts& c) {
  Figures f;
  f.precision = precision_pct(c.matched, c.test, c.gold);
  f.recall = recall_pct(c.matched, c.test, c.gold);
  f.f1 = f1_pct(c.matched, c.test, c.gold);
  f.exact_match = pct(c.exact, c.scored);
  f.crossing_avg =
      c.scored == 0 ? 0.0 : static_cast<double>(c.crossing) / static_cast<double>(c.scored);
  f.zero_crossing_pct = pct(c.zero_crossing, c.scored);
  f.le2_crossing_pct = pct(c.le2_crossing, c.scored);
  f.tag_accuracy = pct(c.tags_correct, c.words);
  return f;
}

void Tally::add(const SentenceScore& s, const BracketSets& brackets) {
  all_.add(s, scheme_);
  if (s.words <= scheme_.length_cutoff) cutoff_.add(s, scheme_);
  if (!s.counts(scheme_)) return;
  for (const Bracket& b : brackets.gold) ++slot(b.label).gold;
  for (const Bracket& b : brackets.test) {
    LabelCounts& lc = slot(b.label);
    ++lc.test;
    if (b.matched) ++lc.matched;
  }
}

LabelCounts& Tally::slot(LabelId label) {
  if (label >= per_label_.size()) per_label_.resize(label + 1);
  return per_label_[label];
}

std::map<LabelId, LabelCounts> Tally::per_label() const {
  std::map<LabelId, LabelCounts> out;
  for (std::size_t i = 0; i < per_label_.size(); ++i) {
    const LabelCounts& lc = per_label_[i];
    if (lc.gold + lc.test > 0) out[static_cast<LabelId>(i)] = lc;
  }
  return out;
}

void Tally::merge(const Tally& o) {
  all_.merge(o.all_);
  cutoff_.merge(o.cutoff_);
  for (const auto& [label, lc] : o.per_label()) {
    LabelCounts& mine = slot(label);
    mine.gold += lc.gold;
    mine.test += lc.test;
    mine.matched += lc.matched;
  }
}

}  // namespace treegate
