// Chart filling for Parser: lexical cells, binary rules by left child with the right child
// found through the right cell's slot index, unary closure per cell, inside probabilities with
// a per-cell scale (no underflow on long sentences), counts exact modulo 2^64 plus a double
// estimate that tells whether they fit.
#include "harness/pcfg/parser.h"

#include <bit>
#include <chrono>
#include <cmath>
#include <limits>
#include <string>

#include "harness/pcfg/chart.h"
#include "harness/pcfg/parse_outcome.h"

namespace treegate::pcfg {
namespace {

constexpr double kNegInf = -std::numeric_limits<double>::infinity();
constexpr std::size_t kPresentBytes = sizeof(Symbol) + sizeof(Entry) + sizeof(Back);

}  // namespace

std::size_t chart_bytes(const CompiledGrammar& grammar, std::size_t words) {
  // The right-id index is dense; present symbols are estimated as a tenth of all (treebank
  // grammars fill less); the fill stops when the real size passes the cap.
  const std::size_t cells = words * (words + 1) / 2;
  return cells * (grammar.num_right() * sizeof(std::uint32_t) + grammar.right_words() * 8 +
                  grammar.num_symbols() * kPresentBytes / 10);
}

Parser::Parser(std::shared_ptr<const CompiledGrammar> grammar)
    : grammar_(std::move(grammar)), chart_(std::make_unique<Chart>()) {
  Chart& c = *chart_;
  c.symbols = grammar_->num_symbols();
  c.pre.resize(c.symbols);
  c.stamp.assign(c.symbols, 0);
  c.post_at.assign(c.symbols, 0);
  c.post_stamp.assign(c.symbols, 0);
  c.grammar = grammar_.get();
  c.touched.resize(c.symbols);
}

Parser::~Parser() = default;

namespace {

class Filler {
 public:
  Filler(Chart& chart, const CompiledGrammar& g) : c_(chart), g_(g) {}

  void start_cell() {
    if (++c_.stamp_now == 0) {
      std::fill(c_.stamp.begin(), c_.stamp.end(), 0);
      std::fill(c_.post_stamp.begin(), c_.post_stamp.end(), 0);
      c_.stamp_now = 1;
    }
    c_.touched_count = 0;
  }

  Chart::Pre& touch(Symbol s) {
    if (c_.stamp[s] != c_.stamp_now) {
      c_.stamp[s] = c_.stamp_now;
      c_.pre[s].value = {kNegInf, 0.0, 0.0, 0};
      c_.touched[c_.touched_count++] = s;
    }
    return c_.pre[s];
  }

  void lexical(std::size_t i, Symbol s, double logp, double p) {
    Chart::Pre& pre = touch(s);
    Entry& e = pre.value;
    if (logp > e.vit) {
      e.vit = logp;
      pre.rule = kLexical;
      pre.split = static_cast<std::uint32_t>(i);
    }
    e.ins += p;
    e.cnt = 1;
    e.cnt64 = 1;
  }

  /// Binary rules for cell (i, j): every split, every left symbol, its right groups.
  std::uint64_t binary(std::size_t i, std::size_t j, std::size_t cell_ij) {
    double top = kNegInf;
    for (std::size_t k = i + 1; k < j; ++k) {
      top = std::max(top, c_.scale[c_.cell(i, k)] + c_.scale[c_.cell(k, j)]);
    }
    c_.scale[cell_ij] = top;
    std::uint64_t applications = 0;
    const Entry* entries = c_.entries.data();
    const Symbol* lists = c_.lists.data();
    const BinaryTarget* targets = g_.targets();
    Chart::Pre* pre = c_.pre.data();
    std::uint32_t* stamp = c_.stamp.data();
    Symbol* touched = c_.touched.data();
    std::size_t touched_count = c_.touched_count;
    const std::uint32_t now = c_.stamp_now;
    const std::size_t words = g_.right_words();
    for (std::size_t k = i + 1; k < j; ++k) {
      const std::size_t left = c_.cell(i, k), right = c_.cell(k, j);
      if (c_.list_begin[left] == c_.list_end[left] || c_.list_begin[right] == c_.list_end[right])
        continue;
      const double factor = std::exp(c_.scale[left] + c_.scale[right] - top);
      const std::uint64_t* rbits = c_.right_bits.data() + right * words;
      const std::uint32_t* rslot = c_.right_slot.data() + right * g_.num_right();
      const auto split = static_cast<std::uint32_t>(k);
      for (std::uint32_t li = c_.list_begin[left]; li < c_.list_end[left]; ++li) {
        const Symbol b = lists[li];
        const RightGroup* groups = g_.groups(b).data();
        if (groups == nullptr) continue;
        const std::uint64_t* mask = g_.right_mask(b);
        const Entry& lb = entries[li];
        const double lins = lb.ins * factor;
        std::uint32_t base = 0;
        for (std::size_t w = 0; w < words; ++w) {
          const std::uint64_t gw = mask[w];
          for (std::uint64_t m = gw & rbits[w]; m != 0; m &= m - 1) {
            const int bit = std::countr_zero(m);
            const RightGroup& grp = groups[base + static_cast<std::uint32_t>(std::popcount(
                                                      gw & ((std::uint64_t{1} << bit) - 1)))];
            const Entry& rc = entries[rslot[w * 64 + static_cast<std::size_t>(bit)]];
            const double vit = lb.vit + rc.vit;
            const double ins = lins * rc.ins;
            const double cnt = lb.cnt * rc.cnt;
            const std::uint64_t cnt64 = lb.cnt64 * rc.cnt64;
            applications += grp.end - grp.begin;
            for (std::uint32_t t = grp.begin; t < grp.end; ++t) {
              const BinaryTarget& target = targets[t];
              const Symbol a = target.lhs;
              Chart::Pre& p = pre[a];
              if (stamp[a] != now) {
                stamp[a] = now;
                p.value = {kNegInf, 0.0, 0.0, 0};
                touched[touched_count++] = a;
              }
              const double v = vit + target.logp;
              if (v > p.value.vit) {
                p.value.vit = v;
                p.rule = t;
                p.split = split;
              }
              p.value.ins += ins * target.p;
              p.value.cnt += cnt;
              p.value.cnt64 += cnt64;
            }
          }
          base += static_cast<std::uint32_t>(std::popcount(gw));
        }
      }
    }
    c_.touched_count = touched_count;
    return applications;
  }

  /// Applies the unary closure to the touched pre-unary symbols, appending the cell's list.
  void close(std::size_t cell) {
    std::uint32_t* post_at = c_.post_at.data();
    std::uint32_t* post_stamp = c_.post_stamp.data();
    const std::uint32_t now = c_.stamp_now;
    std::uint64_t* rbits = c_.right_bits.data() + cell * g_.right_words();
    std::uint32_t* rslot = c_.right_slot.data() + cell * g_.num_right();
    std::fill_n(rbits, g_.right_words(), 0);
    const auto begin = static_cast<std::uint32_t>(c_.lists.size());
    c_.list_begin[cell] = begin;
    for (std::size_t ti = 0; ti < c_.touched_count; ++ti) {
      const Symbol b = c_.touched[ti];
      const Entry pre = c_.pre[b].value;
      for (const UnaryLink& link : g_.unary_above(b)) {
        const Symbol a = link.top;
        std::uint32_t at = post_at[a];
        if (post_stamp[a] != now) {
          post_stamp[a] = now;
          at = post_at[a] = static_cast<std::uint32_t>(c_.lists.size());
          if (const std::uint32_t id = g_.right_id(a); id != kNoSymbol) {
            rbits[id / 64] |= std::uint64_t{1} << (id % 64);
            rslot[id] = at;
          }
          c_.lists.push_back(a);
          c_.entries.push_back({kNegInf, 0.0, 0.0, 0});
          c_.backs.push_back({kNotPre, 0, a});
        }
        Entry& e = c_.entries[at];
        const double v = pre.vit + link.logp;
        if (v > e.vit) {
          e.vit = v;
          c_.backs[at].bottom = b;
        }
        e.ins += pre.ins * link.p;
        e.cnt += pre.cnt * link.count;
        e.cnt64 += pre.cnt64 * link.count64;
      }
      Back& back = c_.backs[post_at[b]];  // the empty chain made b present
      back.rule = c_.pre[b].rule;
      back.split = c_.pre[b].split;
    }
    const auto end = static_cast<std::uint32_t>(c_.lists.size());
    c_.list_end[cell] = end;
    double top = 0;
    for (std::uint32_t li = begin; li < end; ++li) top = std::max(top, c_.entries[li].ins);
    if (top > 0 && std::isfinite(top)) {
      for (std::uint32_t li = begin; li < end; ++li) c_.entries[li].ins /= top;
      c_.scale[cell] += std::log(top);
    }
  }

 private:
  Chart& c_;
  const CompiledGrammar& g_;
};

void prepare(Chart& c, const CompiledGrammar& g, std::size_t n) {
  c.n = n;
  const std::size_t cells = n * (n + 1) / 2;
  // Grown, never zero-filled (chart.h): close() writes every cell before it is read.
  c.right_bits.resize(std::max(c.right_bits.size(), cells * g.right_words()));
  c.right_slot.resize(std::max(c.right_slot.size(), cells * g.num_right()));
  c.scale.resize(std::max(c.scale.size(), cells));
  c.list_begin.resize(std::max(c.list_begin.size(), cells));
  c.list_end.resize(std::max(c.list_end.size(), cells));
  c.lists.clear();
  c.entries.clear();
  c.backs.clear();
  c.lex.resize(n);
}

std::string over_cap(std::size_t n, std::size_t bytes, std::size_t cap, std::size_t span) {
  auto mib = [](std::size_t b) { return std::to_string((b + (1 << 19)) >> 20) + " MiB"; };
  return "sentence of " + std::to_string(n) + " words needs over " + mib(bytes) +
         " of chart (stopped at spans of " + std::to_string(span) + " words), over the cap of " +
         mib(cap) + "; raise --max-chart-mb (parser setting max_chart_mb)";
}

std::string over_time(std::size_t n, double limit, std::size_t span) {
  std::string seconds = std::to_string(limit);
  seconds.erase(seconds.find_last_not_of('0') + 1);
  if (seconds.back() == '.') seconds.pop_back();
  return "sentence of " + std::to_string(n) + " words not parsed within the time limit of " +
         seconds + " s (stopped at spans of " + std::to_string(span) +
         " words); raise --timeout-seconds (parser setting timeout_seconds)";
}

/// Watches the clock and the stop flag between cells. Reading the clock costs tens of
/// nanoseconds, far below the work in one cell of any sentence long enough to matter.
class Deadline {
 public:
  Deadline(std::chrono::steady_clock::time_point start, const ParseOptions& options)
      : stop_(options.stop), limited_(options.max_seconds > 0) {
    if (limited_)
      end_ = start + std::chrono::duration_cast<std::chrono::steady_clock::duration>(
                         std::chrono::duration<double>(options.max_seconds));
  }
  bool passed() const {
    if (stop_ != nullptr && stop_->load(std::memory_order_relaxed)) return true;
    return limited_ && std::chrono::steady_clock::now() > end_;
  }

 private:
  const std::atomic<bool>* stop_;
  bool limited_;
  std::chrono::steady_clock::time_point end_{};
};

}  // namespace

ParseResult Parser::parse(const std::vector<std::string>& words,
                          const std::vector<std::string>* tags, const ParseOptions& options) {
  const auto started = std::chrono::steady_clock::now();
  ParseResult result;
  const CompiledGrammar& g = *grammar_;
  const std::size_t n = words.size();
  auto finish = [&]() -> ParseResult {
    result.seconds =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count();
    return std::move(result);
  };
  if (std::string why = check_input(g, words, tags, options); !why.empty()) {
    result.status = why.rfind("error:", 0) == 0 ? ParseStatus::error : ParseStatus::no_parse;
    result.reason = why.rfind("error:", 0) == 0 ? why.substr(7) : why;
    return finish();
  }
  Chart& c = *chart_;
  prepare(c, g, n);
  Filler fill(c, g);
  for (std::size_t i = 0; i < n; ++i) {
    c.lex[i] = lexical_entries(g, words, tags, options, i);
    fill.start_cell();
    for (const LexEntry& e : c.lex[i]) fill.lexical(i, e.symbol, e.logp, e.p);
    c.scale[c.cell(i, i + 1)] = 0;  // binary() sets the scale of longer spans
    fill.close(c.cell(i, i + 1));
  }
  const std::size_t dense = c.right_slot.size() * sizeof(std::uint32_t) + c.right_bits.size() * 8;
  const Deadline deadline(started, options);
  for (std::size_t span = 2; span <= n; ++span) {
    for (std::size_t i = 0; i + span <= n; ++i) {
      if (deadline.passed()) {
        result.status = ParseStatus::error;
        const bool stopped = options.stop != nullptr && options.stop->load();
        result.reason =
            stopped ? "stopped before the parse was done" : over_time(n, options.max_seconds, span);
        return finish();
      }
      const std::size_t cell = c.cell(i, i + span);
      fill.start_cell();
      result.binary_applications += fill.binary(i, i + span, cell);
      fill.close(cell);
    }
    const std::size_t bytes = dense + c.lists.capacity() * kPresentBytes;
    if (bytes > options.max_chart_bytes) {
      result.status = ParseStatus::error;
      result.reason = over_cap(n, bytes, options.max_chart_bytes, span);
      return finish();
    }
  }
  fill_outcome(c, g, words, options, result);
  return finish();
}

}  // namespace treegate::pcfg
