#include "harness/report/html_diff.h"

#include <algorithm>
#include <climits>
#include <map>
#include <tuple>

#include <fmt/format.h>

#include "harness/report/html_tree.h"

namespace treegate::report::html {
namespace {

using Key = std::tuple<LabelId, std::uint32_t, std::uint32_t>;

bool listed(const std::vector<std::string>& list, std::string_view s) {
  return std::find(list.begin(), list.end(), s) != list.end();
}

std::string_view tag_of(const Tree& tree, NodeId leaf) {
  const NodeId parent = tree.node(leaf).parent;
  return parent == kNoNode ? std::string_view() : tree.label(parent);
}

// Scored position of each word of `tree` (-1: empty element or ignored token). Positions come
// from the gold tree's tags, as in the scorer: the k-th non-empty word of the test tree takes
// the position of the k-th non-empty gold word.
std::vector<std::int32_t> positions(const Tree& tree, const Tree& gold, const Scheme& scheme) {
  auto kept_words = [&](const Tree& t) {
    std::vector<std::int32_t> kept;
    std::vector<std::string_view> tag(t.num_words());
    for (std::size_t i = 0; i < t.size(); ++i) {
      const auto id = static_cast<NodeId>(i);
      if (t.node(id).is_leaf()) tag[static_cast<std::size_t>(t.node(id).word)] = tag_of(t, id);
    }
    for (std::size_t w = 0; w < tag.size(); ++w) {
      if (tag[w] != scheme.empty_tag) kept.push_back(static_cast<std::int32_t>(w));
    }
    return std::pair{kept, tag};
  };
  const auto [gkept, gtag] = kept_words(gold);
  const auto [tkept, ttag] = kept_words(tree);
  std::vector<std::int32_t> pos(tree.num_words(), -1);
  std::int32_t next = 0;
  for (std::size_t k = 0; k < gkept.size(); ++k) {
    const auto gw = static_cast<std::size_t>(gkept[k]);
    if (listed(scheme.ignored_tags, std::string(gtag[gw]))) continue;
    if (k < tkept.size()) pos[static_cast<std::size_t>(tkept[k])] = next;
    ++next;
  }
  return pos;
}

struct NodeBracket {
  NodeId node;
  Key key;
  std::int32_t first_word, last_word;  // full-yield indices, for messages
};

// The brackets of `tree` with the node each comes from (same rules as the scorer).
std::vector<NodeBracket> node_brackets(const Tree& tree, const std::vector<std::int32_t>& pos,
                                       Scorer& scorer) {
  const std::size_t n = tree.size();
  std::vector<std::int32_t> start(n, INT_MAX), end(n, -1), lo(n, INT_MAX), hi(n, -1);
  std::vector<NodeBracket> out;
  const auto& roots = scorer.scheme().root_labels;
  for (std::size_t i = n; i-- > 0;) {
    const auto id = static_cast<NodeId>(i);
    const Node& node = tree.node(id);
    if (node.is_leaf()) {
      lo[i] = hi[i] = node.word;
      const std::int32_t p = pos[static_cast<std::size_t>(node.word)];
      if (p >= 0) start[i] = p, end[i] = p + 1;
    } else if (start[i] < end[i] && !tree.is_preterminal(id) &&
               !(i == 0 && listed(roots, std::string(tree.label(id))))) {
      out.push_back({id,
                     {scorer.canonical(node.label), static_cast<std::uint32_t>(start[i]),
                      static_cast<std::uint32_t>(end[i])},
                     lo[i],
                     hi[i]});
    }
    if (node.parent != kNoNode) {
      const auto p = static_cast<std::size_t>(node.parent);
      start[p] = std::min(start[p], start[i]);
      end[p] = std::max(end[p], end[i]);
      lo[p] = std::min(lo[p], lo[i]);
      hi[p] = std::max(hi[p], hi[i]);
    }
  }
  std::reverse(out.begin(), out.end());  // pre-order (ids ascending)
  return out;
}

std::map<Key, std::uint32_t> matched_counts(const std::vector<Bracket>& brackets) {
  std::map<Key, std::uint32_t> m;
  for (const Bracket& b : brackets) {
    if (b.matched) ++m[{b.label, b.start, b.end}];
  }
  return m;
}

std::string describe(const Tree& tree, const NodeBracket& b) {
  std::string words;
  for (std::int32_t w = b.first_word; w <= b.last_word; ++w) {
    if (w - b.first_word == 8) {
      words += " \xE2\x80\xA6";
      break;
    }
    if (!words.empty()) words += ' ';
    words += tree.word(static_cast<std::size_t>(w));
  }
  return fmt::format("{} {}\xE2\x80\x93{} ({})", tree.label(b.node), b.first_word + 1,
                     b.last_word + 1, words);
}

// Marks `tree`'s brackets: the first `matched` of each key are matched, the rest get `miss`.
void mark(const Tree& tree, const std::vector<NodeBracket>& brackets,
          std::map<Key, std::uint32_t> matched, std::uint8_t miss, std::vector<std::uint8_t>& marks,
          std::vector<std::string>& list) {
  for (const NodeBracket& b : brackets) {
    auto& left = matched[b.key];
    if (left > 0) {
      --left;
      marks[static_cast<std::size_t>(b.node)] |= kMatched;
    } else {
      marks[static_cast<std::size_t>(b.node)] |= miss;
      list.push_back(describe(tree, b));
    }
  }
}

}  // namespace

TreeDiff diff_trees(const Tree& gold, const Tree& test, Scorer& scorer) {
  TreeDiff d;
  BracketSets sets;
  d.score = scorer.score(gold, test, &sets);
  d.gold_marks.assign(gold.size(), 0);
  d.test_marks.assign(test.size(), 0);
  if (d.score.status != SentenceStatus::kScored && d.score.status != SentenceStatus::kNoParse) {
    return d;
  }
  const Scheme& scheme = scorer.scheme();
  const auto gold_brackets = node_brackets(gold, positions(gold, gold, scheme), scorer);
  mark(gold, gold_brackets, matched_counts(sets.gold), kMissing, d.gold_marks, d.missing);
  if (d.score.status == SentenceStatus::kNoParse) return d;
  const auto test_brackets = node_brackets(test, positions(test, gold, scheme), scorer);
  mark(test, test_brackets, matched_counts(sets.test), kWrong, d.test_marks, d.wrong);
  // Tags: compare the k-th non-empty word's tag in both trees, as the scorer does.
  std::vector<NodeId> gold_pre, test_pre;
  for (std::size_t i = 0; i < gold.size(); ++i) {
    const auto id = static_cast<NodeId>(i);
    if (gold.node(id).is_leaf() && tag_of(gold, id) != scheme.empty_tag) {
      gold_pre.push_back(gold.node(id).parent);
    }
  }
  for (std::size_t i = 0; i < test.size(); ++i) {
    const auto id = static_cast<NodeId>(i);
    if (test.node(id).is_leaf() && tag_of(test, id) != scheme.empty_tag) {
      test_pre.push_back(test.node(id).parent);
    }
  }
  for (std::size_t k = 0; k < std::min(gold_pre.size(), test_pre.size()); ++k) {
    if (gold_pre[k] == kNoNode || test_pre[k] == kNoNode) continue;
    if (gold.label(gold_pre[k]) != test.label(test_pre[k]) && test.is_preterminal(test_pre[k])) {
      d.test_marks[static_cast<std::size_t>(test_pre[k])] |= kTagWrong;
    }
  }
  return d;
}

}  // namespace treegate::report::html
