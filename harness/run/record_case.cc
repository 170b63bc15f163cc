// Scoring one case and applying its checks: threshold, required and forbidden brackets,
// known failure.
#include <cmath>

#include "evaluator/bracket_io.h"
#include "evaluator/parseval.h"
#include "evaluator/tally.h"
#include "harness/results/case_score.h"
#include "harness/run/runner.h"

namespace treegate::run {
namespace {

using results::CaseRecord;
using results::CheckOutcome;
using results::Outcome;

// "14.3" style numbers for messages (one decimal, trailing .0 dropped).
std::string num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", v);
  std::string s = buf;
  if (s.size() > 2 && s.ends_with(".0")) s.resize(s.size() - 2);
  return s;
}

struct Span {
  std::string label;
  std::uint32_t from, to;
};

// Labelled spans (1-based, inclusive, over the full yield) of every internal node.
std::vector<Span> spans_of(const Tree& tree, bool strip) {
  std::vector<Span> out;
  if (tree.empty()) return out;
  std::vector<std::uint32_t> first(tree.size(), UINT32_MAX), last(tree.size(), 0);
  // Children have larger ids than parents, so a reverse sweep sees children first.
  for (NodeId id = static_cast<NodeId>(tree.size()) - 1; id >= 0; --id) {
    const Node& n = tree.node(id);
    if (n.is_leaf()) first[id] = last[id] = static_cast<std::uint32_t>(n.word) + 1;
    if (n.parent != kNoNode && first[id] != UINT32_MAX) {
      first[n.parent] = std::min(first[n.parent], first[id]);
      last[n.parent] = std::max(last[n.parent], last[id]);
    }
  }
  for (NodeId id = 0; id < static_cast<NodeId>(tree.size()); ++id) {
    if (tree.node(id).is_leaf() || first[id] == UINT32_MAX) continue;
    std::string label(tree.label(id));
    out.push_back({strip ? strip_function_tags(label) : label, first[id], last[id]});
  }
  return out;
}

void apply_span_checks(const suite::Case& c, const Tree& predicted, bool strip, CaseRecord& r) {
  if (c.require.empty() && c.forbid.empty()) return;
  const auto spans = spans_of(predicted, strip);
  auto present = [&](const suite::SpanCheck& k) {
    const std::string want = strip ? strip_function_tags(k.label) : k.label;
    for (const auto& s : spans) {
      if (s.from == k.from && s.to == k.to && s.label == want) return true;
    }
    return false;
  };
  for (const auto& k : c.require) {
    const bool ok = present(k);
    r.checks.push_back(
        {"require " + k.text(), ok, ok ? "" : "required bracket " + k.text() + " is missing"});
  }
  for (const auto& k : c.forbid) {
    const bool ok = !present(k);
    r.checks.push_back(
        {"forbid " + k.text(), ok, ok ? "" : "forbidden bracket " + k.text() + " is present"});
  }
}

double threshold_of(const WorkItem& item, const RunOptions& options) {
  if (item.item->min_f1) return *item.item->min_f1;
  if (item.suite->min_f1) return *item.suite->min_f1;
  return options.case_min_f1;
}

void settle_outcome(const suite::Case& c, CaseRecord& r) {
  if (r.outcome != Outcome::kError) {
    r.outcome = Outcome::kPass;
    for (const auto& k : r.checks) {
      if (k.passed) continue;
      r.outcome = Outcome::kFail;
      r.reason += (r.reason.empty() ? "" : "; ") + k.detail;
    }
  }
  if (c.known_failure && c.load_error.empty()) {
    r.outcome = r.outcome == Outcome::kPass ? Outcome::kUnexpectedPass : Outcome::kExpectedFailure;
  }
}

}  // namespace

CaseRecord record_case(const WorkItem& item, ParseOutcome outcome, Scorer& scorer,
                       const RunOptions& options) {
  const suite::Case& c = *item.item;
  CaseRecord r;
  r.suite = item.suite->name;
  r.id = c.id;
  r.n = item.n;
  r.words = c.words;
  r.constructions = c.constructions;
  r.known_failure = c.known_failure;
  r.min_f1 = threshold_of(item, options);
  if (!c.load_error.empty()) {
    r.parse = "not_run";
    r.score = "error";
    r.outcome = Outcome::kError;
    r.reason = c.load_error;
    settle_outcome(c, r);
    return r;
  }
  r.gold = to_bracketed(c.gold);
  r.parse = parse_status_name(outcome.status);
  r.predicted = outcome.status == ParseStatus::kParsed ? to_bracketed(outcome.tree) : "";
  r.logprob = outcome.logprob;
  r.inside_logprob = outcome.inside_logprob;
  r.parses = outcome.parses;
  r.seconds = options.timings ? outcome.seconds : 0;
  if (outcome.status != ParseStatus::kParsed) outcome.tree.clear();
  const SentenceScore s = scorer.score(c.gold, outcome.tree);
  results::set_score(r, s);
  if (outcome.status != ParseStatus::kParsed) {
    r.f1 = 0;
    r.outcome = Outcome::kError;
    r.reason = outcome.reason.empty() ? "no parse" : outcome.reason;
  } else if (s.status != SentenceStatus::kScored) {
    r.f1 = 0;
    r.outcome = Outcome::kError;
    r.reason = s.status == SentenceStatus::kYieldMismatch
                   ? "the predicted tree's words differ from the gold words: " + s.reason
                   : s.reason;
  } else {
    r.outcome = Outcome::kPass;
    const bool ok = r.f1 + 1e-9 >= r.min_f1;
    r.checks.push_back({"min_f1 " + num(r.min_f1), ok,
                        ok ? "" : "F1 " + num(r.f1) + " is below the threshold " + num(r.min_f1)});
    apply_span_checks(c, outcome.tree, scorer.scheme().strip_function_tags, r);
  }
  settle_outcome(c, r);
  return r;
}

}  // namespace treegate::run
