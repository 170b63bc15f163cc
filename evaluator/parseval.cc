#include "evaluator/parseval.h"

#include <algorithm>
#include <climits>
#include <cstdint>

#include "evaluator/errors.h"

namespace treegate {
namespace {

constexpr std::uint8_t kIgnoredTag = 1;
constexpr std::uint8_t kEmptyTag = 2;
constexpr std::uint8_t kRootLabel = 4;

bool contains(const std::vector<std::string>& list, std::string_view s) {
  return std::find(list.begin(), list.end(), s) != list.end();
}

// Marks the matched brackets of two sorted lists (multiset intersection); returns the count.
std::uint32_t match(std::vector<Bracket>& gold, std::vector<Bracket>& test) {
  std::uint32_t matched = 0;
  auto g = gold.begin();
  auto t = test.begin();
  while (g != gold.end() && t != test.end()) {
    if (*g < *t) {
      ++g;
    } else if (*t < *g) {
      ++t;
    } else {
      g->matched = t->matched = true;
      ++matched;
      ++g;
      ++t;
    }
  }
  return matched;
}

// Sorts brackets that come nearly in order (see collect_brackets): insertion sort while it
// stays cheap, std::sort for whatever is left when it does not.
void sort_nearly_sorted(std::vector<Bracket>& b) {
  std::size_t budget = 4 * b.size() + 16;  // element moves before giving up
  for (std::size_t i = 1; i < b.size(); ++i) {
    if (!(b[i] < b[i - 1])) continue;
    const Bracket x = b[i];
    std::size_t j = i;
    for (; j > 0 && x < b[j - 1] && budget > 0; --j, --budget) b[j] = b[j - 1];
    b[j] = x;
    if (budget == 0) {
      std::sort(b.begin(), b.end());
      return;
    }
  }
}

// Range maximum over positions 0..n-1 (an iterative segment tree), for count_crossing. Uses
// storage owned by the caller, so that scoring a sentence allocates nothing.
class RangeMax {
 public:
  RangeMax(std::size_t n, std::int64_t* t) : n_(n), t_(t) { std::fill_n(t_, 2 * n, INT64_MIN); }
  void raise(std::size_t i, std::int64_t v) { t_[n_ + i] = std::max(t_[n_ + i], v); }
  void build() {
    for (std::size_t i = n_; i-- > 1;) t_[i] = std::max(t_[2 * i], t_[2 * i + 1]);
  }
  std::int64_t max(std::size_t l, std::size_t r) const {  // over [l, r)
    std::int64_t m = INT64_MIN;
    for (l += n_, r += n_; l < r; l /= 2, r /= 2) {
      if (l & 1) m = std::max(m, t_[l++]);
      if (r & 1) m = std::max(m, t_[--r]);
    }
    return m;
  }

 private:
  std::size_t n_;
  std::int64_t* t_;
};

// Test bracket [a,b) crosses gold [c,d) when a<c<b<d or c<a<d<b (see crosses()). So it crosses
// some gold bracket when one starting inside (a,b) ends after b, or one ending inside (a,b)
// starts before a: two range-maximum queries, O((gold + test) log n), never gold x test.
std::uint32_t count_crossing(const std::vector<Bracket>& gold, const std::vector<Bracket>& test,
                             std::vector<std::int64_t>& scratch) {
  if (gold.empty() || test.empty()) return 0;
  std::size_t n = 1;
  for (const Bracket& g : gold) n = std::max<std::size_t>(n, g.end + 1);
  for (const Bracket& t : test) n = std::max<std::size_t>(n, t.end + 1);
  if (scratch.size() < 4 * n) scratch.resize(4 * n);
  RangeMax end_by_start(n, scratch.data()), minus_start_by_end(n, scratch.data() + 2 * n);
  for (const Bracket& g : gold) {
    end_by_start.raise(g.start, g.end);
    minus_start_by_end.raise(g.end, -static_cast<std::int64_t>(g.start));
  }
  end_by_start.build();
  minus_start_by_end.build();
  std::uint32_t crossing = 0;
  for (const Bracket& t : test) {
    if (t.end <= t.start + 1) continue;
    if (end_by_start.max(t.start + 1, t.end) > t.end ||
        minus_start_by_end.max(t.start + 1, t.end) > -static_cast<std::int64_t>(t.start)) {
      ++crossing;
    }
  }
  return crossing;
}

}  // namespace

const char* status_name(SentenceStatus status) {
  switch (status) {
    case SentenceStatus::kScored:
      return "scored";
    case SentenceStatus::kNoParse:
      return "no_parse";
    case SentenceStatus::kYieldMismatch:
      return "yield_mismatch";
    case SentenceStatus::kError:
      return "error";
  }
  return "error";
}

std::string strip_function_tags(const std::string& label) {
  if (label.empty() || label[0] == '-') return label;
  const auto cut = label.find_first_of("-=", 1);
  return cut == std::string::npos ? label : label.substr(0, cut);
}

bool SentenceScore::counts(const Scheme& scheme) const {
  return status == SentenceStatus::kScored ||
         (status == SentenceStatus::kNoParse && scheme.count_unparsed);
}

Scorer::Scorer(Scheme scheme, LabelTable& labels) : scheme_(std::move(scheme)), labels_(&labels) {}

LabelId Scorer::canonical(LabelId raw) {
  if (raw >= canonical_.size()) {
    canonical_.resize(raw + 1, LabelTable::kNone);
    kind_.resize(raw + 1, 0);
  }
  if (canonical_[raw] != LabelTable::kNone) return canonical_[raw];
  const std::string name(labels_->name(raw));
  std::uint8_t kind = 0;
  if (contains(scheme_.ignored_tags, name)) kind |= kIgnoredTag;
  if (name == scheme_.empty_tag) kind |= kEmptyTag;
  if (contains(scheme_.root_labels, name)) kind |= kRootLabel;
  std::string canon = scheme_.strip_function_tags ? strip_function_tags(name) : name;
  for (const auto& group : scheme_.equivalent_labels) {
    if (!group.empty() && contains(group, canon)) canon = group.front();
  }
  const LabelId id = labels_->intern(canon);
  canonical_[raw] = id;
  kind_[raw] = kind;
  return id;
}

void Scorer::collect_words(const Tree& tree, Words& out) {
  out.tag.assign(tree.num_words(), LabelTable::kEmpty);
  out.kept.clear();
  for (std::size_t i = 0; i < tree.size(); ++i) {
    const Node& n = tree.node(static_cast<NodeId>(i));
    if (n.is_leaf() && n.parent != kNoNode) {
      const LabelId tag = tree.node(n.parent).label;
      out.tag[static_cast<std::size_t>(n.word)] = tag;
      canonical(tag);  // fills kind_
    }
  }
  for (std::size_t w = 0; w < out.tag.size(); ++w) {
    if (!(kind_[out.tag[w]] & kEmptyTag)) out.kept.push_back(static_cast<std::int32_t>(w));
  }
}

void Scorer::collect_brackets(const Tree& tree, const std::vector<std::int32_t>& position,
                              std::vector<Bracket>& out) {
  out.clear();
  const std::size_t n = tree.size();
  std::vector<std::int32_t>& start = start_;
  std::vector<std::int32_t>& end = end_;
  start.assign(n, INT_MAX);
  end.assign(n, -1);
  // Children always have larger ids than their parents, so one backward pass is post-order.
  // Trees read from text number their nodes in pre-order, so the brackets come out in reverse
  // order of (start, wider first): reversed, only labels of equal spans may be out of order.
  for (std::size_t i = n; i-- > 0;) {
    const Node& node = tree.node(static_cast<NodeId>(i));
    if (node.is_leaf()) {
      const std::int32_t p = position[static_cast<std::size_t>(node.word)];
      if (p >= 0) {
        start[i] = p;
        end[i] = p + 1;
      }
    } else if (start[i] < end[i] && !tree.is_preterminal(static_cast<NodeId>(i))) {
      const LabelId label = canonical(node.label);
      const bool wrapper = i == 0 && (kind_[node.label] & kRootLabel);
      if (!wrapper) {
        out.push_back(
            {label, static_cast<std::uint32_t>(start[i]), static_cast<std::uint32_t>(end[i])});
      }
    }
    if (node.parent != kNoNode && start[i] < end[i]) {
      const auto p = static_cast<std::size_t>(node.parent);
      start[p] = std::min(start[p], start[i]);
      end[p] = std::max(end[p], end[i]);
    }
  }
  std::reverse(out.begin(), out.end());
  sort_nearly_sorted(out);
}

std::vector<Bracket> Scorer::brackets_of(const Tree& tree) {
  Words words;
  collect_words(tree, words);
  std::vector<std::int32_t> position(tree.num_words(), -1);
  std::int32_t next = 0;
  for (std::int32_t w : words.kept) {
    if (!(kind_[words.tag[static_cast<std::size_t>(w)]] & kIgnoredTag)) {
      position[static_cast<std::size_t>(w)] = next++;
    }
  }
  std::vector<Bracket> out;
  collect_brackets(tree, position, out);
  return out;
}

SentenceScore Scorer::score(const Tree& gold, const Tree& test, BracketSets* sets) {
  SentenceScore s;
  BracketSets local;
  BracketSets& b = sets ? *sets : local;
  b.gold.clear();
  b.test.clear();
  Words& gw = gold_words_;
  collect_words(gold, gw);
  if (gw.kept.empty()) {
    s.status = SentenceStatus::kError;
    s.reason = "the gold tree has no words";
    return s;
  }
  // Gold positions: scored index of each gold word, -1 for empty elements and ignored tokens.
  std::vector<std::int32_t>& gpos = gold_pos_;
  std::vector<std::int32_t>& kept_pos = kept_pos_;
  gpos.assign(gold.num_words(), -1);
  kept_pos.assign(gw.kept.size(), -1);
  std::int32_t next = 0;
  for (std::size_t k = 0; k < gw.kept.size(); ++k) {
    const auto w = static_cast<std::size_t>(gw.kept[k]);
    if (!(kind_[gw.tag[w]] & kIgnoredTag)) kept_pos[k] = gpos[w] = next++;
  }
  s.words = static_cast<std::uint32_t>(next);
  collect_brackets(gold, gpos, b.gold);
  s.gold_brackets = static_cast<std::uint32_t>(b.gold.size());

  if (test.num_words() == 0) {
    s.status = SentenceStatus::kNoParse;
    s.reason = "no parse";
    return s;
  }
  Words& tw = test_words_;
  collect_words(test, tw);
  const std::size_t common = std::min(gw.kept.size(), tw.kept.size());
  for (std::size_t k = 0; k <= common; ++k) {
    if (k == common) {
      if (gw.kept.size() == tw.kept.size()) break;
      s.status = SentenceStatus::kYieldMismatch;
      s.reason = "gold has " + std::to_string(gw.kept.size()) + " words, test has " +
                 std::to_string(tw.kept.size()) + "; they agree up to word " +
                 std::to_string(common);
      return s;
    }
    const auto gword = gold.word(static_cast<std::size_t>(gw.kept[k]));
    const auto tword = test.word(static_cast<std::size_t>(tw.kept[k]));
    if (gword != tword) {
      s.status = SentenceStatus::kYieldMismatch;
      s.reason = "word " + std::to_string(k + 1) + " differs: gold " +
                 quote_for_message(std::string(gword)) + ", test " +
                 quote_for_message(std::string(tword));
      return s;
    }
  }
  std::vector<std::int32_t>& tpos = test_pos_;
  tpos.assign(test.num_words(), -1);
  for (std::size_t k = 0; k < tw.kept.size(); ++k) {
    tpos[static_cast<std::size_t>(tw.kept[k])] = kept_pos[k];
    if (kept_pos[k] >= 0 && tw.tag[static_cast<std::size_t>(tw.kept[k])] ==
                                gw.tag[static_cast<std::size_t>(gw.kept[k])]) {
      ++s.tags_correct;
    }
  }
  collect_brackets(test, tpos, b.test);
  s.test_brackets = static_cast<std::uint32_t>(b.test.size());
  s.matched = match(b.gold, b.test);
  s.crossing = count_crossing(b.gold, b.test, crossing_scratch_);
  return s;
}

}  // namespace treegate
