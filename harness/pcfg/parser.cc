// Chart filling for Parser: lexical cells, binary rules by left child with the right child
// found through presence bits, unary closure per cell, inside probabilities with a per-cell
// scale (no underflow on long sentences), counts exact modulo 2^64 plus a double estimate.
#include "harness/pcfg/parser.h"

#include <chrono>
#include <cmath>
#include <limits>

#include "harness/pcfg/chart.h"
#include "harness/pcfg/parse_outcome.h"
#include "harness/pcfg/signature.h"

namespace treegate::pcfg {
namespace {

constexpr double kNegInf = -std::numeric_limits<double>::infinity();

std::size_t bytes_per_entry() { return sizeof(Entry) + sizeof(Back); }

}  // namespace

std::size_t chart_bytes(const CompiledGrammar& grammar, std::size_t words) {
  const std::size_t cells = words * (words + 1) / 2;
  const std::size_t per_cell =
      grammar.num_symbols() * bytes_per_entry() + (grammar.num_symbols() + 63) / 64 * 16;
  return cells * per_cell;
}

Parser::Parser(std::shared_ptr<const CompiledGrammar> grammar)
    : grammar_(std::move(grammar)), chart_(std::make_unique<Chart>()) {
  Chart& c = *chart_;
  c.symbols = grammar_->num_symbols();
  c.words_per_cell = (c.symbols + 63) / 64;
  c.pre.resize(c.symbols);
  c.pre_rule.resize(c.symbols);
  c.pre_split.resize(c.symbols);
  c.stamp.assign(c.symbols, 0);
}

Parser::~Parser() = default;

namespace {

class Filler {
 public:
  Filler(Chart& chart, const CompiledGrammar& g) : c_(chart), g_(g) {}

  void start_cell() {
    if (++c_.stamp_now == 0) {
      std::fill(c_.stamp.begin(), c_.stamp.end(), 0);
      c_.stamp_now = 1;
    }
    c_.touched.clear();
  }

  Entry& touch(Symbol s) {
    if (c_.stamp[s] != c_.stamp_now) {
      c_.stamp[s] = c_.stamp_now;
      c_.pre[s] = {kNegInf, 0.0, 0.0, 0};
      c_.touched.push_back(s);
    }
    return c_.pre[s];
  }

  void lexical(std::size_t i, Symbol s, double logp, double p) {
    Entry& e = touch(s);
    if (logp > e.vit) {
      e.vit = logp;
      c_.pre_rule[s] = kLexical;
      c_.pre_split[s] = static_cast<std::uint32_t>(i);
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
    const Entry* entries = c_.entry.get();
    for (std::size_t k = i + 1; k < j; ++k) {
      const std::size_t left = c_.cell(i, k), right = c_.cell(k, j);
      if (c_.list_begin[left] == c_.list_end[left] || c_.list_begin[right] == c_.list_end[right])
        continue;
      const double factor = std::exp(c_.scale[left] + c_.scale[right] - top);
      const std::uint64_t* rbits = &c_.bits[right * c_.words_per_cell];
      const Entry* rentries = entries + right * c_.symbols;
      const auto split = static_cast<std::uint32_t>(k);
      for (std::uint32_t li = c_.list_begin[left]; li < c_.list_end[left]; ++li) {
        const Symbol b = c_.lists[li];
        const auto& groups = g_.groups(b);
        if (groups.empty()) continue;
        const Entry& lb = entries[left * c_.symbols + b];
        const double lins = lb.ins * factor;
        for (const RightGroup& grp : groups) {
          const Symbol r = grp.right;
          if (!((rbits[r >> 6] >> (r & 63)) & 1u)) continue;
          const Entry& rc = rentries[r];
          const double vit = lb.vit + rc.vit;
          const double ins = lins * rc.ins;
          const double cnt = lb.cnt * rc.cnt;
          const std::uint64_t cnt64 = lb.cnt64 * rc.cnt64;
          applications += grp.end - grp.begin;
          for (std::uint32_t t = grp.begin; t < grp.end; ++t) {
            const BinaryTarget& target = g_.target(t);
            Entry& e = touch(target.lhs);
            const double v = vit + target.logp;
            if (v > e.vit) {
              e.vit = v;
              c_.pre_rule[target.lhs] = t;
              c_.pre_split[target.lhs] = split;
            }
            e.ins += ins * target.p;
            e.cnt += cnt;
            e.cnt64 += cnt64;
          }
        }
      }
    }
    return applications;
  }

  /// Applies the unary closure to the touched pre-unary symbols, writing the cell.
  void close(std::size_t cell) {
    Entry* out = c_.entry.get() + cell * c_.symbols;
    Back* back = c_.back.get() + cell * c_.symbols;
    std::uint64_t* bits = &c_.bits[cell * c_.words_per_cell];
    std::uint64_t* prebits = &c_.prebits[cell * c_.words_per_cell];
    c_.list_begin[cell] = static_cast<std::uint32_t>(c_.lists.size());
    for (Symbol b : c_.touched) {
      const Entry& pre = c_.pre[b];
      prebits[b >> 6] |= std::uint64_t{1} << (b & 63);
      back[b].rule = c_.pre_rule[b];
      back[b].split = c_.pre_split[b];
      for (const UnaryLink& link : g_.unary_above(b)) {
        const Symbol a = link.top;
        Entry& e = out[a];
        if (!((bits[a >> 6] >> (a & 63)) & 1u)) {
          bits[a >> 6] |= std::uint64_t{1} << (a & 63);
          e = {kNegInf, 0.0, 0.0, 0};
          c_.lists.push_back(a);
        }
        const double v = pre.vit + link.logp;
        if (v > e.vit) {
          e.vit = v;
          back[a].bottom = b;
        }
        e.ins += pre.ins * link.p;
        e.cnt += pre.cnt * link.count;
        e.cnt64 += pre.cnt64 * link.count64;
      }
    }
    c_.list_end[cell] = static_cast<std::uint32_t>(c_.lists.size());
    double top = 0;
    for (std::uint32_t li = c_.list_begin[cell]; li < c_.list_end[cell]; ++li) {
      top = std::max(top, out[c_.lists[li]].ins);
    }
    if (top > 0 && std::isfinite(top)) {
      for (std::uint32_t li = c_.list_begin[cell]; li < c_.list_end[cell]; ++li)
        out[c_.lists[li]].ins /= top;
      c_.scale[cell] += std::log(top);
    }
  }

 private:
  Chart& c_;
  const CompiledGrammar& g_;
};

void prepare(Chart& c, std::size_t n) {
  c.n = n;
  const std::size_t cells = n * (n + 1) / 2;
  if (cells * c.symbols > c.capacity) {
    c.entry.reset();
    c.back.reset();
    c.capacity = cells * c.symbols;
    c.entry = std::make_unique_for_overwrite<Entry[]>(c.capacity);
    c.back = std::make_unique_for_overwrite<Back[]>(c.capacity);
  }
  c.bits.assign(cells * c.words_per_cell, 0);
  c.prebits.assign(cells * c.words_per_cell, 0);
  c.scale.assign(cells, 0.0);
  c.list_begin.assign(cells, 0);
  c.list_end.assign(cells, 0);
  c.lists.clear();
  c.lex.resize(n);
}

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
  prepare(c, n);
  Filler fill(c, g);
  for (std::size_t i = 0; i < n; ++i) {
    fill.start_cell();
    c.lex[i] = lexical_entries(g, words, tags, options, i);
    for (const LexEntry& e : c.lex[i]) fill.lexical(i, e.symbol, e.logp, e.p);
    fill.close(c.cell(i, i + 1));
  }
  for (std::size_t span = 2; span <= n; ++span) {
    for (std::size_t i = 0; i + span <= n; ++i) {
      const std::size_t cell = c.cell(i, i + span);
      fill.start_cell();
      result.binary_applications += fill.binary(i, i + span, cell);
      fill.close(cell);
    }
  }
  fill_outcome(c, g, words, options, result);
  return finish();
}

}  // namespace treegate::pcfg
