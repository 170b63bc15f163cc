// Input checks, lexical entries and result assembly for Parser::parse.
#include "harness/pcfg/parse_outcome.h"

#include <cmath>
#include <cstdio>

#include "evaluator/errors.h"
#include "harness/pcfg/signature.h"
#include "harness/pcfg/transforms.h"

namespace treegate::pcfg {
namespace {

std::string mib(std::size_t bytes) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.0f MiB", static_cast<double>(bytes) / (1 << 20));
  return buffer;
}

std::string word_ref(const std::vector<std::string>& words, std::size_t i) {
  return quote_for_message(words[i]) + " (word " + std::to_string(i + 1) + ")";
}

}  // namespace

std::string check_input(const CompiledGrammar& g, const std::vector<std::string>& words,
                        const std::vector<std::string>* tags, const ParseOptions& options) {
  const std::size_t n = words.size();
  if (n == 0) return "error: empty sentence: expected at least one word";
  if (options.gold_tags && (tags == nullptr || tags->size() != n)) {
    return "error: " + std::to_string(tags ? tags->size() : 0) + " tags for " + std::to_string(n) +
           " words: expected one tag per word";
  }
  const std::size_t need = chart_bytes(g, n);
  if (need > options.max_chart_bytes) {
    return "error: sentence of " + std::to_string(n) + " words needs ~" + mib(need) +
           " of chart, over the cap of " + mib(options.max_chart_bytes) +
           "; raise --max-chart-mb (parser setting max_chart_mb)";
  }
  for (std::size_t i = 0; i < n; ++i) {
    if (options.gold_tags) {
      if (g.find((*tags)[i]) == kNoSymbol) {
        return "tag " + quote_for_message((*tags)[i]) + " of " + word_ref(words, i) +
               " is not a symbol of the grammar";
      }
      continue;
    }
    if (g.lexicon(words[i]) != nullptr) continue;
    // A word whose only rules have unusable weights is unknown to the parser; say so.
    const std::size_t skipped = g.skipped_line_of_word(words[i]);
    const std::string none = skipped == 0
                                 ? "no rule rewrites it"
                                 : "no rule with a usable weight rewrites it (the weight at line " +
                                       std::to_string(skipped) +
                                       " is not a positive finite number; see treegate lint)";
    if (!g.has_unknown_classes()) {
      return "unknown word " + word_ref(words, i) + ": " + none +
             " and the grammar has no unknown-word classes";
    }
    const std::string sig = word_signature(words[i]);
    if (g.unknown_class(sig) == nullptr) {
      return "unknown word " + word_ref(words, i) + ": " + none + " nor its class <unk:" + sig +
             ">";
    }
  }
  return "";
}

std::vector<LexEntry> lexical_entries(const CompiledGrammar& g,
                                      const std::vector<std::string>& words,
                                      const std::vector<std::string>* tags,
                                      const ParseOptions& options, std::size_t i) {
  const std::vector<LexEntry>* known = g.lexicon(words[i]);
  if (!options.gold_tags) {
    return known ? *known : *g.unknown_class(word_signature(words[i]));
  }
  // Gold tags: the tag with its lexical probability when the grammar has one (the word's own
  // rule, else its class), else probability 1; plus terminals used inside longer rules.
  const Symbol tag = g.find((*tags)[i]);
  std::vector<LexEntry> out;
  double logp = NAN, p = 1;
  for (const LexEntry& e : known ? *known : std::vector<LexEntry>{}) {
    if (e.symbol == tag) logp = e.logp, p = e.p;
    if (g.word_symbol(e.symbol)) out.push_back(e);
  }
  if (std::isnan(logp)) {
    if (const auto* cls = g.unknown_class(word_signature(words[i]))) {
      for (const LexEntry& e : *cls) {
        if (e.symbol == tag) logp = e.logp, p = e.p;
      }
    }
  }
  if (std::isnan(logp)) logp = 0, p = 1;
  out.push_back({tag, logp, p});
  return out;
}

namespace {

/// Why there is no tree: the widest pieces found, left to right.
std::string no_tree_reason(const Chart& c, const CompiledGrammar& g,
                           const std::vector<std::string>& words) {
  const std::size_t n = words.size();
  std::string pieces;
  std::size_t shown = 0;
  for (std::size_t i = 0; i < n;) {
    std::size_t best_j = i + 1;
    Symbol best = kNoSymbol;
    for (std::size_t j = n; j > i && best == kNoSymbol; --j) {
      const std::size_t cell = c.cell(i, j);
      double top = -INFINITY;
      for (std::uint32_t li = c.list_begin[cell]; li < c.list_end[cell]; ++li) {
        const Symbol s = c.lists[li];
        const double v = c.entries[li].vit;
        if (!g.internal(s) && v > top) top = v, best = s, best_j = j;
      }
    }
    if (shown++ < 8) {
      pieces += (pieces.empty() ? "" : ", ") + std::string("words ") + std::to_string(i + 1) + "-" +
                std::to_string(best_j) + " (" + (best == kNoSymbol ? "?" : g.name(best)) + ")";
    } else if (shown == 9) {
      pieces += ", ...";
    }
    i = best_j;
  }
  return "no tree of words 1-" + std::to_string(n) + " from " +
         quote_for_message(g.name(g.start())) + "; widest pieces found: " + pieces;
}

void set_count(const Entry& e, ParseResult& result) {
  constexpr double kTwo64 = 18446744073709551616.0;
  result.parses_infinite = std::isinf(e.cnt);
  result.parses_exact = !result.parses_infinite && e.cnt < kTwo64 * (1 - 1e-9);
  if (result.parses_exact) {
    result.parses = e.cnt64;
  } else if (result.parses_infinite || e.cnt >= kTwo64 * (1 + 1e-9)) {
    result.parses = UINT64_MAX;
  } else {
    result.parses = static_cast<std::uint64_t>(e.cnt * (1 - 1e-9));
  }
}

}  // namespace

void fill_outcome(const Chart& c, const CompiledGrammar& g, const std::vector<std::string>& words,
                  const ParseOptions& options, ParseResult& result) {
  const std::size_t n = words.size();
  const std::size_t root = c.cell(0, n);
  if (!c.has(root, g.start())) {
    result.status = ParseStatus::no_parse;
    result.reason = no_tree_reason(c, g, words);
    return;
  }
  const Entry& e = c.entry(root, g.start());
  result.status = ParseStatus::parsed;
  result.logprob = e.vit;
  result.inside_logprob = std::log(e.ins) + c.scale[root];
  set_count(e, result);
  result.tree = viterbi_tree(c, g, words, 0, n, g.start());
  undo_transforms(result.tree, g.header());
  if (options.kbest > 0) {
    result.kbest = kbest_trees(c, g, words, options.kbest);
    for (ScoredTree& t : result.kbest) undo_transforms(t.tree, g.header());
  }
}

}  // namespace treegate::pcfg
