// Error classification; the definitions are written out in docs/compare.md ("Error classes").
// Tested by tests/evaluator/error_classes_test.cc.
#include "evaluator/error_classes.h"

#include <algorithm>
#include <climits>
#include <set>
#include <tuple>

namespace treegate {
namespace {

bool listed(const std::vector<std::string>& list, std::string_view s) {
  return std::find(list.begin(), list.end(), s) != list.end();
}

constexpr std::int32_t kNone = -1;

struct Con {
  LabelId label = 0;
  std::uint32_t start = 0, end = 0;
  std::int32_t parent = kNone;        // nearest enclosing bracket (may have the same span)
  std::int32_t wider_parent = kNone;  // nearest enclosing bracket with a wider span
  bool coordination = false;          // has a coordinating-conjunction child
  bool np_inside = false;             // some NP bracket lies below it
  bool matched = false;
  std::int32_t partner = kNone;  // the matched bracket on the other side
  std::int32_t owner = kNone;    // the error that accounts for it (wrong brackets only)
  std::int32_t first_child = kNone, next_sibling = kNone;  // bracket children, linked
};

using Span = std::pair<std::uint32_t, std::uint32_t>;

}  // namespace

struct ErrorClassifier::Work {
  std::vector<Con> side[2];  // 0 gold, 1 test
  std::uint32_t words = 0;
  std::vector<ClassifiedError> errors;
  // Every bracket as (label, start, end), sorted (a set's answers without a node per bracket).
  std::vector<std::tuple<LabelId, std::uint32_t, std::uint32_t>> all[2];
  bool has(int s, LabelId label, Span at) const {
    return std::binary_search(
        all[s].begin(), all[s].end(),
        std::tuple<LabelId, std::uint32_t, std::uint32_t>{label, at.first, at.second});
  }
  std::map<std::uint32_t, std::vector<std::int32_t>> wrong_by_start[2], wrong_by_end[2];

  Span span(int s, std::int32_t i) const {
    return {side[s][static_cast<std::size_t>(i)].start, side[s][static_cast<std::size_t>(i)].end};
  }
  Con& con(int s, std::int32_t i) { return side[s][static_cast<std::size_t>(i)]; }
  // The nearest ancestor whose span is strictly larger; kNone at the top.
  std::int32_t strict_parent(int s, std::int32_t i) const {
    return side[s][static_cast<std::size_t>(i)].wider_parent;
  }
  Span parent_span(int s, std::int32_t p) const { return p == kNone ? Span{0, words} : span(s, p); }
  bool free_wrong(int s, std::int32_t i) const {
    const Con& c = side[s][static_cast<std::size_t>(i)];
    return !c.matched && c.owner == kNone;
  }
  void claim(int s, std::int32_t i, std::size_t error) {
    Con& c = con(s, i);
    c.owner = static_cast<std::int32_t>(error);
    errors[error].brackets.push_back({s == 0, c.label, c.start, c.end});
  }
  std::size_t open(ErrorKind kind, LabelId label, Span at) {
    errors.push_back({kind, label, at.first, at.second, {}});
    return errors.size() - 1;
  }
};

namespace {

// Spans of every bracket of `tree` over scored positions, with parents, as the Scorer counts them.
std::vector<Con> constituents(const Tree& tree, const std::vector<std::int32_t>& position,
                              Scorer& scorer, const ErrorClassOptions& opt) {
  const std::size_t n = tree.size();
  const LabelTable& labels = tree.labels();
  std::vector<std::int32_t> start(n, INT_MAX), end(n, -1), index(n, kNone), up(n, kNone);
  for (std::size_t i = n; i-- > 0;) {
    const Node& node = tree.node(static_cast<NodeId>(i));
    if (node.is_leaf()) {
      const std::int32_t p = position[static_cast<std::size_t>(node.word)];
      if (p >= 0) start[i] = p, end[i] = p + 1;
    }
    if (node.parent != kNoNode && start[i] < end[i]) {
      const auto p = static_cast<std::size_t>(node.parent);
      start[p] = std::min(start[p], start[i]);
      end[p] = std::max(end[p], end[i]);
    }
  }
  std::vector<Con> out;
  for (std::size_t i = 0; i < n; ++i) {
    const auto id = static_cast<NodeId>(i);
    const Node& node = tree.node(id);
    const auto p = node.parent;
    up[i] = p == kNoNode
                ? kNone
                : (index[static_cast<std::size_t>(p)] != kNone ? index[static_cast<std::size_t>(p)]
                                                               : up[static_cast<std::size_t>(p)]);
    if (node.is_leaf()) continue;
    const LabelId canon = scorer.canonical(node.label);
    if (p != kNoNode && index[static_cast<std::size_t>(p)] != kNone &&
        listed(opt.coordination_labels, labels.name(canon))) {
      out[static_cast<std::size_t>(index[static_cast<std::size_t>(p)])].coordination = true;
    }
    const bool wrapper = i == 0 && listed(scorer.scheme().root_labels, labels.name(node.label));
    if (start[i] < end[i] && !tree.is_preterminal(id) && !wrapper) {
      index[i] = static_cast<std::int32_t>(out.size());
      Con c;
      c.label = canon;
      c.start = static_cast<std::uint32_t>(start[i]);
      c.end = static_cast<std::uint32_t>(end[i]);
      c.parent = up[i];
      if (up[i] != kNone) {  // parents come first in `out`, so theirs is known
        const Con& q = out[static_cast<std::size_t>(up[i])];
        c.wider_parent = q.start == c.start && q.end == c.end ? q.wider_parent : up[i];
      }
      if (up[i] != kNone) {  // prepend: the order of children does not matter here
        Con& q = out[static_cast<std::size_t>(up[i])];
        c.next_sibling = q.first_child;
        q.first_child = index[i];
      }
      out.push_back(c);
    }
  }
  return out;
}

// Multiset matching of (label, start, end), the Scorer's rule; records partners.
void match(std::vector<Con>& gold, std::vector<Con>& test) {
  auto order = [](const std::vector<Con>& v) {
    std::vector<std::int32_t> idx(v.size());
    for (std::size_t i = 0; i < v.size(); ++i) idx[i] = static_cast<std::int32_t>(i);
    std::sort(idx.begin(), idx.end(), [&](std::int32_t a, std::int32_t b) {
      const Con& x = v[static_cast<std::size_t>(a)];
      const Con& y = v[static_cast<std::size_t>(b)];
      return std::tuple(x.start, -static_cast<std::int64_t>(x.end), x.label, a) <
             std::tuple(y.start, -static_cast<std::int64_t>(y.end), y.label, b);
    });
    return idx;
  };
  const auto g = order(gold), t = order(test);
  std::size_t i = 0, j = 0;
  while (i < g.size() && j < t.size()) {
    Con& a = gold[static_cast<std::size_t>(g[i])];
    Con& b = test[static_cast<std::size_t>(t[j])];
    const auto ka = std::tuple(a.start, -static_cast<std::int64_t>(a.end), a.label);
    const auto kb = std::tuple(b.start, -static_cast<std::int64_t>(b.end), b.label);
    if (ka < kb) {
      ++i;
    } else if (kb < ka) {
      ++j;
    } else {
      a.matched = b.matched = true;
      a.partner = t[j];
      b.partner = g[i];
      ++i, ++j;
    }
  }
}

}  // namespace

ErrorClassifier::ErrorClassifier(Scorer& scorer, ErrorClassOptions options)
    : scorer_(&scorer), options_(std::move(options)) {}

namespace {

// Word positions as the Scorer computes them: gold tags decide what is ignored; test words map
// to the gold position of the same non-empty word.
void positions(const Tree& gold, const Tree& test, const Scheme& scheme,
               std::vector<std::int32_t>& gpos, std::vector<std::int32_t>& tpos,
               std::uint32_t& words) {
  auto tag_of = [](const Tree& t) {
    std::vector<std::string_view> tags = t.tags();
    return tags;
  };
  const auto gt = tag_of(gold), tt = tag_of(test);
  gpos.assign(gold.num_words(), -1);
  tpos.assign(test.num_words(), -1);
  std::vector<std::int32_t> kept_pos;
  std::int32_t next = 0;
  for (std::size_t w = 0; w < gt.size(); ++w) {
    if (gt[w] == scheme.empty_tag) continue;
    const bool ignored = listed(scheme.ignored_tags, gt[w]);
    kept_pos.push_back(ignored ? -1 : next);
    if (!ignored) gpos[w] = next++;
  }
  words = static_cast<std::uint32_t>(next);
  std::size_t k = 0;
  for (std::size_t w = 0; w < tt.size() && k < kept_pos.size(); ++w) {
    if (tt[w] == scheme.empty_tag) continue;
    tpos[w] = kept_pos[k++];
  }
}

}  // namespace

SentenceErrors ErrorClassifier::classify(const Tree& gold, const Tree& test,
                                         const SentenceScore* score) {
  SentenceErrors result;
  const SentenceStatus status = score ? score->status : scorer_->score(gold, test).status;
  if (status != SentenceStatus::kScored) return result;
  result.classified = true;
  if (score && score->exact_match()) return result;  // nothing wrong to classify
  Work w;
  std::vector<std::int32_t> gpos, tpos;
  positions(gold, test, scorer_->scheme(), gpos, tpos, w.words);
  w.side[0] = constituents(gold, gpos, *scorer_, options_);
  w.side[1] = constituents(test, tpos, *scorer_, options_);
  match(w.side[0], w.side[1]);
  const LabelTable& labels = gold.labels();
  auto is_np = [&](LabelId l) { return listed(options_.noun_phrase_labels, labels.name(l)); };
  for (int s = 0; s < 2; ++s) {
    for (std::size_t i = 0; i < w.side[s].size(); ++i) {
      const Con& c = w.side[s][i];
      w.all[s].emplace_back(c.label, c.start, c.end);
      if (c.matched) continue;
      w.wrong_by_start[s][c.start].push_back(static_cast<std::int32_t>(i));
      w.wrong_by_end[s][c.end].push_back(static_cast<std::int32_t>(i));
    }
  }
  for (auto& all : w.all) std::sort(all.begin(), all.end());
  // Base NPs of gold (NP brackets with no NP below): mark every ancestor of an NP once.
  for (std::size_t i = w.side[0].size(); i-- > 0;) {
    const Con& c = w.side[0][i];
    if (!is_np(c.label) && !c.np_inside) continue;
    for (std::int32_t p = c.parent; p != kNone && !w.con(0, p).np_inside; p = w.con(0, p).parent) {
      w.con(0, p).np_inside = true;
    }
  }
  std::vector<Span> base_nps;
  for (const Con& c : w.side[0]) {
    if (is_np(c.label) && !c.np_inside) base_nps.push_back({c.start, c.end});
  }
  std::sort(base_nps.begin(), base_nps.end());

  // 1. Coordination: a wrong bracket with a conjunction child; with it go its wrong children
  //    and the other tree's wrong brackets that cross it.
  for (int s = 0; s < 2; ++s) {
    for (std::size_t i = 0; i < w.side[s].size(); ++i) {
      const auto ci = static_cast<std::int32_t>(i);
      if (!w.side[s][i].coordination || !w.free_wrong(s, ci)) continue;
      const Span at = w.span(s, ci);
      const std::size_t e = w.open(ErrorKind::kCoordination, w.side[s][i].label, at);
      w.claim(s, ci, e);
      for (std::int32_t k = w.side[s][i].first_child; k != kNone; k = w.con(s, k).next_sibling) {
        if (w.free_wrong(s, k)) w.claim(s, k, e);
      }
      const Bracket cb{0, at.first, at.second};
      for (std::size_t j = 0; j < w.side[1 - s].size(); ++j) {
        const Con& o = w.side[1 - s][j];
        if (w.free_wrong(1 - s, static_cast<std::int32_t>(j)) &&
            crosses(cb, Bracket{0, o.start, o.end})) {
          w.claim(1 - s, static_cast<std::int32_t>(j), e);
        }
      }
    }
  }

  // 2. Attachment: a bracket in both trees whose parents (nearest strictly wider brackets)
  //    differ. With it go the wrong brackets above it up to the first right one, in both trees,
  //    and the other tree's wrong brackets that differ from one of those only by its words.
  auto attach = [&](std::int32_t gi, std::int32_t gp, std::int32_t tp) {
    const Con& g = w.con(0, gi);
    auto coord_parent = [&](int s, std::int32_t p) {
      return p != kNone && !w.con(s, p).matched && w.con(s, p).coordination;
    };
    if (coord_parent(0, gp) || coord_parent(1, tp)) return;  // part of a coordination error
    const Span x{g.start, g.end};
    const std::size_t e = w.open(ErrorKind::kAttachment, g.label, x);
    const std::int32_t parents[2] = {gp, tp};
    for (int s = 0; s < 2; ++s) {
      for (std::int32_t p = parents[s]; p != kNone && w.free_wrong(s, p); p = w.con(s, p).parent) {
        w.claim(s, p, e);
      }
    }
    // Wrong brackets with an edge at X's edges that turn into a bracket of the other tree
    // when X's words are added to or taken from that end.
    for (int s = 0; s < 2; ++s) {
      for (const std::uint32_t at : {x.first, x.second}) {
        for (const auto* index : {&w.wrong_by_start[s], &w.wrong_by_end[s]}) {
          auto it = index->find(at);
          if (it == index->end()) continue;
          for (const std::int32_t j : it->second) {
            if (!w.free_wrong(s, j)) continue;
            const Con& c = w.con(s, j);
            Span other{0, 0};
            if (c.end == x.first) other = {c.start, x.second};
            if (c.start == x.second) other = {x.first, c.end};
            if (c.start == x.first && c.end > x.second) other = {x.second, c.end};
            if (c.end == x.second && c.start < x.first) other = {c.start, x.first};
            if (other.first < other.second && w.has(1 - s, c.label, other)) {
              w.claim(s, j, e);
            }
          }
        }
      }
    }
    if (w.errors[e].brackets.empty()) w.errors.pop_back();  // nothing wrong left to explain
  };
  //    A bracket that is the base of an adjunction (its wrong parent has its label and shares an
  //    edge with it, as NP in NP -> NP PP) is tried last: the adjoined sibling is what moved.
  auto adjunction_base = [&](int s, std::int32_t i, std::int32_t p) {
    if (p == kNone || w.con(s, p).matched) return false;
    const Con& c = w.con(s, i);
    const Con& q = w.con(s, p);
    return q.label == c.label && (q.start == c.start || q.end == c.end);
  };
  for (int pass = 0; pass < 2; ++pass) {
    for (std::size_t i = 0; i < w.side[0].size(); ++i) {
      const Con& g = w.side[0][i];
      if (!g.matched) continue;
      const auto gi = static_cast<std::int32_t>(i);
      const std::int32_t gp = w.strict_parent(0, gi);
      const std::int32_t tp = w.strict_parent(1, g.partner);
      if (w.parent_span(0, gp) == w.parent_span(1, tp)) continue;
      const bool base = adjunction_base(0, gi, gp) || adjunction_base(1, g.partner, tp);
      if (base != (pass == 1)) continue;
      attach(gi, gp, tp);
    }
  }

  // 3-6. The rest, bracket by bracket: label, unary, NP-internal, other.
  std::map<Span, std::vector<std::int32_t>> at_span[2];
  std::vector<Span> all_spans[2];  // sorted; only asked whether a span is there
  for (int s = 0; s < 2; ++s) {
    all_spans[s].reserve(w.side[s].size());
    for (std::size_t i = 0; i < w.side[s].size(); ++i) {
      const auto ci = static_cast<std::int32_t>(i);
      all_spans[s].push_back(w.span(s, ci));
      if (w.free_wrong(s, ci)) at_span[s][w.span(s, ci)].push_back(ci);
    }
    std::sort(all_spans[s].begin(), all_spans[s].end());
  }
  for (auto& [sp, gold_list] : at_span[0]) {
    auto it = at_span[1].find(sp);
    if (it == at_span[1].end()) continue;
    auto& test_list = it->second;
    const std::size_t pairs = std::min(gold_list.size(), test_list.size());
    for (std::size_t k = 0; k < pairs; ++k) {
      const std::size_t e = w.open(ErrorKind::kLabel, w.con(0, gold_list[k]).label, sp);
      w.claim(0, gold_list[k], e);
      w.claim(1, test_list[k], e);
    }
  }
  // The gold base NP that strictly contains `sp` ({0, 0} when none). Base NPs do not nest.
  auto base_np_around = [&](Span sp) {
    auto it = std::upper_bound(base_nps.begin(), base_nps.end(), Span{sp.first, UINT32_MAX});
    if (it == base_nps.begin()) return Span{0, 0};
    --it;
    return it->second >= sp.second && *it != sp ? *it : Span{0, 0};
  };
  std::map<Span, std::size_t> np_error;  // one NP-internal error per base NP
  for (int s = 0; s < 2; ++s) {
    for (std::size_t i = 0; i < w.side[s].size(); ++i) {
      const auto ci = static_cast<std::int32_t>(i);
      if (!w.free_wrong(s, ci)) continue;
      const Span sp = w.span(s, ci);
      const LabelId label = w.con(s, ci).label;
      if (sp.second - sp.first == 1 ||
          std::binary_search(all_spans[1 - s].begin(), all_spans[1 - s].end(), sp)) {
        w.claim(s, ci, w.open(ErrorKind::kUnary, label, sp));
      } else if (const Span np = base_np_around(sp); np.second > np.first) {
        auto [it, fresh] = np_error.try_emplace(np, w.errors.size());
        if (fresh) w.open(ErrorKind::kNpInternal, label, np);
        w.claim(s, ci, it->second);
      } else {
        w.claim(s, ci, w.open(ErrorKind::kOther, label, sp));
      }
    }
  }
  result.errors = std::move(w.errors);
  return result;
}

std::string error_class_name(const ClassifiedError& error, const LabelTable& labels,
                             const ErrorClassOptions& options) {
  switch (error.kind) {
    case ErrorKind::kAttachment: {
      const std::string label(labels.name(error.label));
      if (listed(options.clause_labels, label)) return "clause attachment";
      return label + " attachment";
    }
    case ErrorKind::kCoordination:
      return "coordination";
    case ErrorKind::kNpInternal:
      return "NP-internal";
    case ErrorKind::kLabel:
      return "label";
    case ErrorKind::kUnary:
      return "unary";
    case ErrorKind::kOther:
      return "other";
  }
  return "other";
}

void ErrorTally::add(const SentenceErrors& sentence, const LabelTable& labels,
                     const ErrorClassOptions& options) {
  if (!sentence.classified) return;
  ++sentences_;
  for (const ClassifiedError& e : sentence.errors) {
    ClassCount& c = by_class_[error_class_name(e, labels, options)];
    ++c.errors;
    c.brackets += e.brackets.size();
  }
}

void ErrorTally::merge(const ErrorTally& other) {
  sentences_ += other.sentences_;
  for (const auto& [name, c] : other.by_class_) {
    by_class_[name].errors += c.errors;
    by_class_[name].brackets += c.brackets;
  }
}

}  // namespace treegate
