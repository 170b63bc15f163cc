// Grammar: the in-memory form of a `.pcfg` file (see docs/pcfg.md), exactly as written:
// header settings, then one Rule per rule line with its source line. A Grammar is a plain
// value (no sharing); read_grammar_* throw InputError with file:line:col on bad syntax.
#pragma once

#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

namespace treegate::pcfg {

enum class WeightKind { probabilities, counts };

struct GrammarHeader {
  std::string start;           // "" when the file has no @start line (lint reports it)
  std::size_t start_line = 0;  // line of @start (0: none)
  WeightKind weights = WeightKind::probabilities;
  std::vector<std::pair<std::string, std::string>> transforms;  // @transform KEY=VALUE, in order
  bool unknown_signatures = false;                              // @unknown signatures
};

enum class ItemKind : std::uint8_t { nonterminal, terminal, unknown_class };

struct RhsItem {
  ItemKind kind = ItemKind::nonterminal;
  std::string text;  // nonterminal name, terminal text (unescaped), or the signature of <unk:SIG>
  bool operator==(const RhsItem&) const = default;
};

struct Rule {
  std::string lhs;
  std::vector<RhsItem> rhs;            // never empty
  double weight = 0;                   // probability (counts are normalised per LHS on load)
  double written_weight = 0;           // the number as written in the file
  std::optional<std::uint64_t> count;  // count=N
  std::size_t line = 0;                // 1-based source line (0: built in memory)
};

struct Grammar {
  GrammarHeader header;
  std::vector<Rule> rules;
  std::string source;  // file name used in messages
};

/// Reads a grammar file. Throws InputError (also when the file cannot be opened).
Grammar read_grammar_file(const std::string& path);
/// Reads grammar text; `name` stands for the file in messages.
Grammar read_grammar_string(std::string_view text, const std::string& name);

/// The file form of `grammar`; read_grammar_string(write_grammar(g)) gives back g's header and
/// rules (weights written as the shortest decimal that reads back to the same double).
std::string write_grammar(const Grammar& grammar);

/// One right-hand-side item as written in a file: NP, "the \"x\"", <unk:lower-ing>.
std::string format_item(const RhsItem& item);
/// "LHS -> RHS..." without weight.
std::string format_rule(const Rule& rule);
/// Shortest decimal that reads back to `value`.
std::string format_weight(double value);

}  // namespace treegate::pcfg
