#include "harness/pcfg/transforms_spec.h"

#include <charconv>

#include "evaluator/errors.h"

namespace treegate::pcfg {
namespace {

int read_int(const std::string& text, const std::string& key, int low, int high,
             const std::string& where) {
  int value = 0;
  const char* end = text.data() + text.size();
  auto [ptr, ec] = std::from_chars(text.data(), end, value);
  if (ec != std::errc() || ptr != end || value < low || value > high) {
    throw InputError(where + ": @transform " + key + "=" + quote_for_message(text) +
                     ": expected a whole number from " + std::to_string(low) + " to " +
                     std::to_string(high));
  }
  return value;
}

bool read_choice(const std::string& text, const std::string& key, const char* yes, const char* no,
                 const std::string& where) {
  if (text == yes) return true;
  if (text == no) return false;
  throw InputError(where + ": @transform " + key + "=" + quote_for_message(text) + ": expected " +
                   yes + " or " + no);
}

TransformSpec::Wrapper read_wrapper(const std::string& text, const std::string& where) {
  using W = TransformSpec::Wrapper;
  for (W w : {W::kRoot, W::kTop, W::kEmpty, W::kNone, W::kAsIs}) {
    if (text == wrapper_name(w)) return w;
  }
  throw InputError(where + ": @transform wrapper=" + quote_for_message(text) +
                   ": expected ROOT, TOP, empty, none or as-is");
}

int read_horizontal(const std::string& text, const std::string& where) {
  if (text == "none") return TransformSpec::kNoBinarize;
  if (text == "all") return TransformSpec::kUnlimited;
  return read_int(text, "horizontal", 0, 1000, where);
}

}  // namespace

const char* wrapper_name(TransformSpec::Wrapper wrapper) {
  switch (wrapper) {
    case TransformSpec::Wrapper::kRoot:
      return "ROOT";
    case TransformSpec::Wrapper::kTop:
      return "TOP";
    case TransformSpec::Wrapper::kEmpty:
      return "empty";
    case TransformSpec::Wrapper::kNone:
      return "none";
    case TransformSpec::Wrapper::kAsIs:
      return "as-is";
  }
  return "as-is";
}

TransformSpec identity_spec() {
  TransformSpec spec;
  spec.strip_functions = false;
  spec.drop_empties = false;
  spec.wrapper = TransformSpec::Wrapper::kAsIs;
  spec.parent = 1;
  spec.collapse_unary = false;
  spec.horizontal = TransformSpec::kNoBinarize;
  spec.rare_words = 0;
  return spec;
}

TransformPairs to_pairs(const TransformSpec& spec) {
  std::string horizontal = spec.horizontal == TransformSpec::kNoBinarize ? "none"
                           : spec.horizontal == TransformSpec::kUnlimited
                               ? "all"
                               : std::to_string(spec.horizontal);
  return {{"functions", spec.strip_functions ? "strip" : "keep"},
          {"empties", spec.drop_empties ? "drop" : "keep"},
          {"start", spec.start},
          {"wrapper", wrapper_name(spec.wrapper)},
          {"parent", std::to_string(spec.parent)},
          {"unary", spec.collapse_unary ? "collapse" : "keep"},
          {"horizontal", horizontal},
          {"rare-words", std::to_string(spec.rare_words)}};
}

TransformSpec from_pairs(const TransformPairs& pairs, const std::string& where) {
  TransformSpec spec = identity_spec();
  for (const auto& [key, value] : pairs) {
    if (key == "functions") {
      spec.strip_functions = read_choice(value, key, "strip", "keep", where);
    } else if (key == "empties") {
      spec.drop_empties = read_choice(value, key, "drop", "keep", where);
    } else if (key == "start") {
      spec.start = value;
    } else if (key == "wrapper") {
      spec.wrapper = read_wrapper(value, where);
    } else if (key == "parent") {
      spec.parent = read_int(value, key, 1, 3, where);
    } else if (key == "unary") {
      spec.collapse_unary = read_choice(value, key, "collapse", "keep", where);
    } else if (key == "horizontal") {
      spec.horizontal = read_horizontal(value, where);
    } else if (key == "rare-words") {
      spec.rare_words = read_int(value, key, 0, 1000000, where);
    } else {
      throw InputError(where + ": @transform has an unknown key " + quote_for_message(key) +
                       "; expected functions, empties, start, wrapper, parent, unary, "
                       "horizontal or rare-words");
    }
  }
  return spec;
}

}  // namespace treegate::pcfg
