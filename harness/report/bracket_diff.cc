#include "harness/report/bracket_diff.h"

#include <algorithm>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "evaluator/parseval.h"

namespace treegate::report {
namespace {

// Full-yield positions of the scored word positions (ignored and empty tokens left out by
// the scheme, decided by the gold tags).
std::vector<std::uint32_t> scored_positions(const Tree& gold, const Scheme& scheme) {
  std::vector<std::uint32_t> out;
  const auto tags = gold.tags();
  for (std::uint32_t i = 0; i < tags.size(); ++i) {
    const std::string tag(tags[i]);
    const bool skip = tag == scheme.empty_tag ||
                      std::find(scheme.ignored_tags.begin(), scheme.ignored_tags.end(), tag) !=
                          scheme.ignored_tags.end();
    if (!skip) out.push_back(i + 1);
  }
  return out;
}

std::string describe(const Bracket& b, const std::vector<std::uint32_t>& pos,
                     const LabelTable& labels) {
  std::string label(labels.name(b.label));
  if (b.end == 0 || b.end > pos.size() || b.start >= b.end) return label + " ?";
  return label + " " + std::to_string(pos[b.start]) + "-" + std::to_string(pos[b.end - 1]);
}

}  // namespace

BracketDiff bracket_diff(const results::CaseRecord& record, const Scheme& scheme) {
  BracketDiff diff;
  if (record.gold.empty() || record.predicted.empty()) return diff;
  try {
    LabelTable& labels = LabelTable::shared();
    const Tree gold = parse_tree(record.gold, "gold", labels);
    const Tree test = parse_tree(record.predicted, "predicted", labels);
    Scorer scorer(scheme, labels);
    BracketSets sets;
    const SentenceScore s = scorer.score(gold, test, &sets);
    if (s.status != SentenceStatus::kScored) return diff;
    const auto pos = scored_positions(gold, scheme);
    for (const auto& b : sets.gold) {
      if (!b.matched) diff.missing.push_back(describe(b, pos, labels));
    }
    for (const auto& b : sets.test) {
      if (!b.matched) diff.extra.push_back(describe(b, pos, labels));
    }
  } catch (const InputError&) {
    return {};
  }
  return diff;
}

std::string join_brackets(const std::vector<std::string>& brackets) {
  if (brackets.empty()) return "none";
  std::string out;
  for (const auto& b : brackets) out += (out.empty() ? "" : ", ") + b;
  return out;
}

}  // namespace treegate::report
