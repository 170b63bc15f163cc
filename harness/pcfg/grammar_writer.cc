// write_grammar and the item/rule/weight formatting shared with lint and messages.
#include <charconv>

#include "harness/pcfg/grammar.h"

namespace treegate::pcfg {

std::string format_weight(double value) {
  char buffer[64];
  auto [ptr, ec] = std::to_chars(buffer, buffer + sizeof buffer, value);
  return ec == std::errc() ? std::string(buffer, ptr) : std::string("nan");
}

std::string format_item(const RhsItem& item) {
  switch (item.kind) {
    case ItemKind::nonterminal:
      return item.text;
    case ItemKind::unknown_class:
      return "<unk:" + item.text + ">";
    case ItemKind::terminal:
      break;
  }
  std::string out = "\"";
  for (char c : item.text) {
    if (c == '"' || c == '\\') out += '\\';
    out += c;
  }
  return out + "\"";
}

std::string format_rule(const Rule& rule) {
  std::string out = rule.lhs + " ->";
  for (const RhsItem& item : rule.rhs) out += " " + format_item(item);
  return out;
}

std::string write_grammar(const Grammar& grammar) {
  const GrammarHeader& h = grammar.header;
  std::string out;
  if (!h.start.empty()) out += "@start " + h.start + "\n";
  if (h.weights == WeightKind::counts) out += "@weights counts\n";
  for (const auto& [key, value] : h.transforms) out += "@transform " + key + "=" + value + "\n";
  if (h.unknown_signatures) out += "@unknown signatures\n";
  for (const Rule& rule : grammar.rules) {
    out += format_rule(rule) + " " + format_weight(rule.written_weight);
    if (rule.count) out += " count=" + std::to_string(*rule.count);
    out += "\n";
  }
  return out;
}

}  // namespace treegate::pcfg
