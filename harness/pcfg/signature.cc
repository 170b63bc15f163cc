#include "harness/pcfg/signature.h"

#include <array>

namespace treegate::pcfg {
namespace {

bool is_upper(char c) { return c >= 'A' && c <= 'Z'; }
bool is_lower(char c) { return c >= 'a' && c <= 'z'; }

std::string_view longest_suffix(std::string_view word) {
  static constexpr std::array<std::string_view, 10> kSuffixes = {
      "able", "ing", "ion", "est", "ive", "ed", "ly", "er", "al", "s"};  // longest first
  if (word.size() < 4) return {};
  for (std::string_view suffix : kSuffixes) {
    if (word.size() <= suffix.size()) continue;
    bool match = true;
    for (std::size_t i = 0; i < suffix.size() && match; ++i) {
      char c = word[word.size() - suffix.size() + i];
      if (is_upper(c)) c = static_cast<char>(c - 'A' + 'a');
      match = c == suffix[i];
    }
    if (match) return suffix;
  }
  return {};
}

}  // namespace

std::string word_signature(std::string_view word) {
  int upper = 0, lower = 0, digits = 0;
  bool hyphen = false;
  for (char c : word) {
    upper += is_upper(c);
    lower += is_lower(c);
    digits += c >= '0' && c <= '9';
    hyphen = hyphen || c == '-';
  }
  std::string sig;
  if (upper + lower == 0) {
    sig = digits > 0 ? "num" : "other";
  } else if (lower == 0) {
    sig = "caps";
  } else if (upper == 0) {
    sig = "lower";
  } else {
    sig = !word.empty() && is_upper(word[0]) ? "cap" : "other";
  }
  if (digits > 0 && upper + lower > 0) sig += "-num";
  if (hyphen) sig += "-hyph";
  std::string_view suffix = longest_suffix(word);
  if (!suffix.empty()) sig += "-" + std::string(suffix);
  return sig;
}

}  // namespace treegate::pcfg
