// The CKY chart of a Parser (private to the parser's .cc files). One dense entry per (cell,
// symbol), written only where the symbol is present (presence bits and per-cell lists say
// where), so memory is n(n+1)/2 cells x symbols and a sentence touches only what it uses.
// Owned by one Parser; not thread-safe.
#pragma once

#include <cstdint>
#include <memory>
#include <vector>

#include "evaluator/tree.h"
#include "harness/pcfg/compiled_grammar.h"

namespace treegate::pcfg {

inline constexpr std::uint32_t kLexical = 0xffffffffu;

/// A symbol's values in a cell after the unary closure (post) .
struct Entry {
  double vit;           // best log probability
  double ins;           // inside probability, times exp(-cell scale)
  double cnt;           // number of trees (approximate; inf when infinite)
  std::uint64_t cnt64;  // number of trees modulo 2^64
};
/// Back pointers: the pre-unary derivation of a symbol (binary target, split) and the bottom
/// of the best unary chain above which the post-unary symbol sits.
struct Back {
  std::uint32_t rule;   // target index or kLexical
  std::uint32_t split;  // absolute word index of the split
  Symbol bottom;
};

struct Chart {
  std::size_t n = 0;        // words
  std::size_t symbols = 0;  // grammar symbols
  std::size_t words_per_cell = 0;
  std::size_t capacity = 0;  // entries allocated
  std::unique_ptr<Entry[]> entry;
  std::unique_ptr<Back[]> back;
  std::vector<std::uint64_t> bits;     // post-unary presence
  std::vector<std::uint64_t> prebits;  // pre-unary presence
  std::vector<double> scale;           // per cell: log of the inside scale factor
  std::vector<std::uint32_t> list_begin, list_end;
  std::vector<Symbol> lists;               // present symbols of every cell (post-unary)
  std::vector<std::vector<LexEntry>> lex;  // pre-unary entries of each word
  // Scratch for the pre-unary values of the cell being filled.
  std::vector<Entry> pre;
  std::vector<std::uint32_t> pre_rule, pre_split, stamp;
  std::uint32_t stamp_now = 0;
  std::vector<Symbol> touched;

  std::size_t cell(std::size_t i, std::size_t j) const {
    return i * n - i * (i - 1) / 2 + (j - i - 1);
  }
  std::size_t at(std::size_t c, Symbol s) const { return c * symbols + s; }
  bool has(std::size_t c, Symbol s) const {
    return (bits[c * words_per_cell + (s >> 6)] >> (s & 63)) & 1u;
  }
  bool has_pre(std::size_t c, Symbol s) const {
    return (prebits[c * words_per_cell + (s >> 6)] >> (s & 63)) & 1u;
  }
};

/// Best log probability of symbol s in cell (i, j) before the unary closure.
double pre_vit(const Chart& chart, const CompiledGrammar& grammar, std::size_t i, std::size_t j,
               Symbol s);

/// The Viterbi tree below (cell of i..j, symbol s, post-unary) with internal symbols removed.
Tree viterbi_tree(const Chart& chart, const CompiledGrammar& grammar,
                  const std::vector<std::string>& words, std::size_t i, std::size_t j, Symbol s);

struct ScoredTree;
/// The k best trees of the whole sentence from the start symbol (lazy k-best).
std::vector<ScoredTree> kbest_trees(const Chart& chart, const CompiledGrammar& grammar,
                                    const std::vector<std::string>& words, std::size_t k);

}  // namespace treegate::pcfg
