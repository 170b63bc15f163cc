// Scheme: the settings that decide which brackets count and how labels compare.
// The defaults follow the field's usual conventions (see README, "Scoring scheme").
// A plain value; the YAML loader lives in harness/suite (this library knows no YAML).
#pragma once

#include <cstddef>
#include <string>
#include <vector>

namespace treegate {

struct Scheme {
  /// Labels of a root wrapper that is not a bracket (the empty label is the unlabeled root).
  std::vector<std::string> root_labels{"", "TOP", "ROOT"};
  /// Word positions whose *gold* tag is one of these are left out of spans and tag accuracy.
  std::vector<std::string> ignored_tags{",", ":", "``", "''", "."};
  /// The tag of empty elements; they are removed, then constituents left without words.
  std::string empty_tag = "-NONE-";
  /// NP-SBJ-1 -> NP, NP=2 -> NP; labels that start with '-' (e.g. -LRB-) are kept whole.
  bool strip_function_tags = true;
  /// Each group counts as one label (reported under its first member).
  std::vector<std::vector<std::string>> equivalent_labels{{"ADVP", "PRT"}};
  /// Sentences up to this many words are also tallied apart ("cutoff" figures).
  std::size_t length_cutoff = 40;
  /// Whether a sentence without a parse counts (zero test brackets) or is left out.
  bool count_unparsed = true;
};

/// The label with function tags and indices removed (the rule of Scheme::strip_function_tags).
std::string strip_function_tags(const std::string& label);

}  // namespace treegate
