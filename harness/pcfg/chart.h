// The CKY chart of a Parser (private to the parser's .cc files). Each cell keeps its present
// symbols in a compact list with their values (post unary closure). Symbols that are right
// children of binary rules (few: the grammar's right ids) are found through a small per-cell
// index; others by scanning the cell's list. Memory: ~44 bytes per present symbol plus
// ~4.1 bytes per (cell, right id). Owned by one Parser; not thread-safe.
#pragma once

#include <cstdint>
#include <memory>
#include <utility>
#include <vector>

#include "evaluator/tree.h"
#include "harness/pcfg/compiled_grammar.h"

namespace treegate::pcfg {

/// An allocator whose resize() leaves new elements of trivial types uninitialized: the
/// per-cell arrays of a long sentence can be gigabytes, and zero-filling them up front took
/// seconds before the first cell (and the time limit) was reached. Every cell's values are
/// written when the cell is closed, before anything reads them.
template <class T>
struct UninitializedAllocator : std::allocator<T> {
  template <class U>
  struct rebind {
    using other = UninitializedAllocator<U>;
  };
  UninitializedAllocator() = default;
  template <class U>
  explicit UninitializedAllocator(const UninitializedAllocator<U>&) noexcept {}
  template <class U>
  void construct(U* p) noexcept {
    ::new (static_cast<void*>(p)) U;  // default-initialization: no zeroing
  }
  template <class U, class... Args>
  void construct(U* p, Args&&... args) {
    ::new (static_cast<void*>(p)) U(std::forward<Args>(args)...);
  }
};
template <class T>
using CellArray = std::vector<T, UninitializedAllocator<T>>;

inline constexpr std::uint32_t kLexical = 0xffffffffu;  // Back::rule of a word's entry
inline constexpr std::uint32_t kNotPre = 0xfffffffeu;   // present only through a unary chain
inline constexpr std::uint32_t kAbsent = 0xffffffffu;   // slot of an absent symbol

/// A symbol's values in a cell after the unary closure.
struct Entry {
  double vit;           // best log probability
  double ins;           // inside probability, times exp(-cell scale)
  double cnt;           // number of trees (approximate; inf when infinite)
  std::uint64_t cnt64;  // number of trees modulo 2^64
};
/// Back pointers: the pre-unary derivation of the symbol (binary target and split, kLexical,
/// or kNotPre) and the bottom of the best unary chain above which the post-unary symbol sits.
struct Back {
  std::uint32_t rule;
  std::uint32_t split;  // absolute word index of the split
  Symbol bottom;
};

struct Chart {
  std::size_t n = 0;        // words
  std::size_t symbols = 0;  // grammar symbols
  const CompiledGrammar* grammar = nullptr;
  // Per cell, over the grammar's right ids (symbols that are right children): presence bits and
  // the index of the entry; rewritten whole when the cell is closed, so never reset.
  CellArray<std::uint64_t> right_bits;
  CellArray<std::uint32_t> right_slot;
  CellArray<double> scale;  // per cell: log of the inside scale factor
  CellArray<std::uint32_t> list_begin, list_end;
  std::vector<Symbol> lists;  // present symbols of every cell
  std::vector<Entry> entries;
  std::vector<Back> backs;
  std::vector<std::vector<LexEntry>> lex;  // pre-unary entries of each word
  // Scratch for the pre-unary values of the cell being filled.
  struct Pre {
    Entry value;
    std::uint32_t rule, split;
  };
  std::vector<Pre> pre;
  std::vector<std::uint32_t> stamp;
  std::vector<std::uint32_t> post_at, post_stamp;  // symbol -> its entry in the cell being closed
  std::uint32_t stamp_now = 0;
  std::vector<Symbol> touched;  // sized to the symbols; the first `touched_count` are used
  std::size_t touched_count = 0;

  std::size_t cell(std::size_t i, std::size_t j) const {
    return i * n - i * (i - 1) / 2 + (j - i - 1);
  }
  /// Index of (cell c, symbol s) in lists/entries/backs, or kAbsent.
  std::uint32_t index(std::size_t c, Symbol s) const {
    const std::uint32_t id = grammar->right_id(s);
    if (id != kNoSymbol) {
      const std::size_t words = grammar->right_words();
      if (!((right_bits[c * words + id / 64] >> (id % 64)) & 1u)) return kAbsent;
      return right_slot[c * grammar->num_right() + id];
    }
    for (std::uint32_t li = list_begin[c]; li < list_end[c]; ++li) {
      if (lists[li] == s) return li;
    }
    return kAbsent;
  }
  bool has(std::size_t c, Symbol s) const { return index(c, s) != kAbsent; }
  const Entry& entry(std::size_t c, Symbol s) const { return entries[index(c, s)]; }
  const Back& back(std::size_t c, Symbol s) const { return backs[index(c, s)]; }
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
