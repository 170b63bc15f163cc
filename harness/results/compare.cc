// Building a Comparison from two runs. Tested by tests/results/compare_test.cc.
#include "harness/results/compare.h"

#include <algorithm>
#include <map>
#include <unordered_map>

#include "evaluator/bracket_io.h"
#include "evaluator/buckets.h"
#include "evaluator/errors.h"
#include "evaluator/tally.h"
#include "harness/results/results_json.h"

namespace treegate::results {

const char* transition_name(Transition t) {
  switch (t) {
    case Transition::kFixed:
      return "fixed";
    case Transition::kBroken:
      return "broken";
    case Transition::kBetter:
      return "better";
    case Transition::kWorse:
      return "worse";
    case Transition::kChangedSameF1:
      return "changed_same_f1";
    case Transition::kUnchanged:
      return "unchanged";
  }
  return "unchanged";
}

double Prf::precision() const { return precision_pct(matched, test, gold); }
double Prf::recall() const { return recall_pct(matched, test, gold); }
double Prf::f1() const { return f1_pct(matched, test, gold); }
void Prf::add(std::uint64_t g, std::uint64_t t, std::uint64_t m) {
  ++cases;
  gold += g;
  test += t;
  matched += m;
}

namespace {

// Scores one side of a case; a side that is not scored (no parse, yield mismatch, unreadable
// tree) counts as no parse: gold brackets, nothing proposed.
struct Scored {
  SentenceScore score;
  BracketSets brackets;
  SentenceErrors errors;
};

class Builder {
 public:
  Builder(const Scheme& scheme, const CompareOptions& options)
      : scorer_(scheme, labels_), classifier_(scorer_, options.error_classes), options_(options) {}

  void add(const CaseRecord& o, const CaseRecord& n, Comparison& out);
  void finish(Comparison& out);
  std::vector<PairedCounts> paired;
  std::vector<double> old_seconds, new_seconds;

 private:
  Tree read(const std::string& text, const std::string& what, Comparison& out);
  Scored score_side(const Tree& gold, const Tree& test);
  std::vector<BracketDiff> diffs(const Tree& gold, const BracketSets& b);
  static void add_row(std::map<std::string, Row>& rows, const std::string& key, const Scored& o,
                      const Scored& n);

  LabelTable labels_;
  Scorer scorer_;
  ErrorClassifier classifier_;
  const CompareOptions& options_;
  std::map<std::string, Row> suites_, constructions_;
  std::map<LabelId, Row> labels_rows_;  // keyed by id: no string per bracket
  std::map<std::size_t, Row> lengths_;
  ErrorTally old_errors_, new_errors_;
  std::vector<std::string> suite_order_;
};

Tree Builder::read(const std::string& text, const std::string& what, Comparison& out) {
  if (text.empty()) return Tree(labels_);
  try {
    return parse_tree(text, what, labels_);
  } catch (const InputError& e) {
    out.warnings.push_back(std::string("unreadable tree: ") + e.what());
    return Tree(labels_);
  }
}

Scored Builder::score_side(const Tree& gold, const Tree& test) {
  Scored s;
  s.score = scorer_.score(gold, test, &s.brackets);
  if (s.score.status == SentenceStatus::kScored) {
    s.errors = classifier_.classify(gold, test, &s.score);
  } else {  // counted as no parse
    s.score.test_brackets = s.score.matched = 0;
    s.brackets.test.clear();
  }
  return s;
}

std::vector<BracketDiff> Builder::diffs(const Tree& gold, const BracketSets& b) {
  // Scored position -> word index of the full sentence (gold tags decide what is ignored).
  std::vector<std::uint32_t> word_of;
  const auto tags = gold.tags();
  const Scheme& sc = scorer_.scheme();
  for (std::size_t w = 0; w < tags.size(); ++w) {
    if (tags[w] == sc.empty_tag) continue;
    if (std::find(sc.ignored_tags.begin(), sc.ignored_tags.end(), tags[w]) !=
        sc.ignored_tags.end()) {
      continue;
    }
    word_of.push_back(static_cast<std::uint32_t>(w));
  }
  std::vector<BracketDiff> out;
  auto put = [&](const Bracket& x, bool missing) {
    if (x.matched || x.end == 0 || x.end > word_of.size()) return;
    out.push_back({std::string(labels_.name(x.label)), word_of[x.start] + 1, word_of[x.end - 1] + 1,
                   missing});
  };
  for (const Bracket& x : b.gold) put(x, true);
  for (const Bracket& x : b.test) put(x, false);
  return out;
}

void Builder::add_row(std::map<std::string, Row>& rows, const std::string& key, const Scored& o,
                      const Scored& n) {
  Row& r = rows[key];
  r.key = key;
  r.old_side.add(o.score.gold_brackets, o.score.test_brackets, o.score.matched);
  r.new_side.add(n.score.gold_brackets, n.score.test_brackets, n.score.matched);
}

void Builder::add(const CaseRecord& o, const CaseRecord& n, Comparison& out) {
  const std::string where = n.suite + "#" + n.id;
  const Tree gold = read(n.gold, where + " (gold)", out);
  if (gold.empty()) {
    out.warnings.push_back(where + ": no readable gold tree; left out of the figures");
    return;
  }
  if (o.gold != n.gold) out.warnings.push_back(where + ": the gold tree changed; NEW's is used");
  const Tree ot = read(o.predicted, where + " (old)", out);
  const Tree nt =
      o.predicted == n.predicted ? Tree(labels_) : read(n.predicted, where + " (new)", out);
  // Most cases keep their tree from one grammar version to the next: score those once.
  const Scored os = score_side(gold, ot);
  const Scored ns = o.predicted == n.predicted ? os : score_side(gold, nt);
  if (os.score.status == SentenceStatus::kError) {
    out.warnings.push_back(where + ": " + os.score.reason + "; left out of the figures");
    return;
  }
  CaseChange c{n.suite, n.id, n.constructions, ns.score.words, n.gold, Transition::kUnchanged,
               {},      {}};
  auto side = [&](const CaseRecord& r, const Scored& s) {
    return CaseSide{
        r.predicted, r.outcome,
        r.reason,    f1_pct(s.score.matched, s.score.test_brackets, s.score.gold_brackets),
        r.seconds,   diffs(gold, s.brackets)};
  };
  c.old_side = side(o, os);
  c.new_side = side(n, ns);
  const double d = c.new_side.f1 - c.old_side.f1;
  if (is_fix(o.outcome, n.outcome)) {
    c.transition = Transition::kFixed;
  } else if (is_regression(o.outcome, n.outcome)) {
    c.transition = Transition::kBroken;
  } else if (d > 1e-9) {
    c.transition = Transition::kBetter;
  } else if (d < -1e-9) {
    c.transition = Transition::kWorse;
  } else if (o.predicted != n.predicted) {
    c.transition = Transition::kChangedSameF1;
  }
  ++out.transition_counts[static_cast<int>(c.transition)];
  if (c.transition != Transition::kUnchanged) {  // the bracket lists are shown for these only
    c.old_side.wrong = diffs(gold, os.brackets);
    c.new_side.wrong = diffs(gold, ns.brackets);
  }
  ++out.paired;
  out.overall.old_side.add(os.score.gold_brackets, os.score.test_brackets, os.score.matched);
  out.overall.new_side.add(ns.score.gold_brackets, ns.score.test_brackets, ns.score.matched);
  if (!suites_.count(n.suite)) suite_order_.push_back(n.suite);
  add_row(suites_, n.suite, os, ns);
  for (const auto& tag : n.constructions) add_row(constructions_, tag, os, ns);
  Row& len = lengths_[length_bucket(ns.score.words)];
  len.old_side.add(os.score.gold_brackets, os.score.test_brackets, os.score.matched);
  len.new_side.add(ns.score.gold_brackets, ns.score.test_brackets, ns.score.matched);
  auto label_counts = [&](const BracketSets& b, bool is_new) {
    for (const Bracket& x : b.gold) {
      Row& r = labels_rows_[x.label];
      ++(is_new ? r.new_side : r.old_side).gold;
    }
    for (const Bracket& x : b.test) {
      Row& r = labels_rows_[x.label];
      Prf& p = is_new ? r.new_side : r.old_side;
      ++p.test;
      if (x.matched) ++p.matched;
    }
  };
  label_counts(os.brackets, false);
  label_counts(ns.brackets, true);
  old_errors_.add(os.errors, labels_, options_.error_classes);
  new_errors_.add(ns.errors, labels_, options_.error_classes);
  paired.push_back({os.score.matched, os.score.gold_brackets, os.score.test_brackets,
                    ns.score.matched, ns.score.gold_brackets, ns.score.test_brackets});
  old_seconds.push_back(o.seconds);
  new_seconds.push_back(n.seconds);
  out.cases.push_back(std::move(c));
}

SpeedSummary speed(std::vector<double> s) {
  SpeedSummary out;
  out.cases = s.size();
  if (s.empty()) return out;
  std::sort(s.begin(), s.end());
  for (double x : s) out.total += x;
  out.mean = out.total / static_cast<double>(s.size());
  out.median = s[s.size() / 2];
  out.p90 = s[std::min(s.size() - 1, s.size() * 9 / 10)];
  out.max = s.back();
  return out;
}

void Builder::finish(Comparison& out) {
  out.overall.key = "all";
  for (const auto& name : suite_order_) out.suites.push_back(suites_[name]);
  for (auto& [k, r] : constructions_) out.constructions.push_back(r);
  std::map<std::string, Row> by_name;
  for (auto& [id, r] : labels_rows_) {
    r.key = std::string(labels_.name(id));
    by_name[r.key] = r;
  }
  for (auto& [name, r] : by_name) out.labels.push_back(r);
  for (auto& [k, r] : lengths_) {
    r.key = std::string(kLengthBuckets[k]);
    out.lengths.push_back(r);
  }
  std::map<std::string, ErrorClassRow> classes;
  for (const auto& [name, c] : old_errors_.by_class()) classes[name].old_side = c;
  for (const auto& [name, c] : new_errors_.by_class()) classes[name].new_side = c;
  for (auto& [name, r] : classes) {
    r.name = name;
    out.error_classes.push_back(r);
  }
  out.significance = significance(paired, options_.significance);
  out.old_speed = speed(old_seconds);
  out.new_speed = speed(new_seconds);
}

}  // namespace

Comparison compare_runs(const RunResults& old_run, const std::string& old_name,
                        const RunResults& new_run, const std::string& new_name,
                        const CompareOptions& options) {
  Comparison out;
  out.old_name = old_name;
  out.new_name = new_name;
  out.old_header = old_run.header;
  out.new_header = new_run.header;
  if (scheme_to_json(old_run.header.scheme).dump() !=
      scheme_to_json(new_run.header.scheme).dump()) {
    out.warnings.push_back(
        "the two runs used different scoring schemes; both are re-scored with NEW's");
  }
  std::unordered_map<std::string, const CaseRecord*> old_cases;
  for (const CaseRecord& c : old_run.cases) old_cases.emplace(c.suite + '\n' + c.id, &c);
  Builder builder(new_run.header.scheme, options);
  std::unordered_map<std::string, bool> seen;
  for (const CaseRecord& n : new_run.cases) {
    auto it = old_cases.find(n.suite + '\n' + n.id);
    if (it == old_cases.end()) {
      ++out.only_new;
      out.only_new_ids.push_back(n.suite + "#" + n.id);
      continue;
    }
    seen.emplace(it->first, true);
    builder.add(*it->second, n, out);
  }
  for (const CaseRecord& o : old_run.cases) {
    if (!seen.count(o.suite + '\n' + o.id)) {
      ++out.only_old;
      out.only_old_ids.push_back(o.suite + "#" + o.id);
    }
  }
  builder.finish(out);
  return out;
}

}  // namespace treegate::results
