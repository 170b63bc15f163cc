// TransformSpec: which tree transforms made a grammar, as chosen on the `estimate` command
// line and recorded in the grammar's `@transform` header (key=value pairs, see
// docs/estimate.md). Also the marker characters that annotated and intermediate labels use.
// Plain value; the functions are pure and thread-safe.
#pragma once

#include <string>
#include <utility>
#include <vector>

namespace treegate::pcfg {

/// Markers reserved for transformed labels; treebank labels containing one are refused.
inline constexpr char kParentMark = '^';        // NP^S^VP: NP under S under VP
inline constexpr char kUnaryMark = '~';         // S~VP: collapsed unary chain, top first
inline constexpr char kIntermediateMark = '>';  // NP>DT>JJ: binarization intermediate
inline constexpr const char* kReservedMarks = "^~>";

struct TransformSpec {
  // The treebank's root wrapper: (ROOT ..), (TOP ..), ( ..), none; kAsIs: inverse leaves it.
  enum class Wrapper { kRoot, kTop, kEmpty, kNone, kAsIs };
  static constexpr int kNoBinarize = -1;
  static constexpr int kUnlimited = -2;

  bool strip_functions = true;  // NP-SBJ-1 -> NP
  bool drop_empties = true;     // remove -NONE- and the constituents left empty
  std::string empty_tag = "-NONE-";
  std::string start = "ROOT";        // the start symbol: root wrapper relabelled, or added
  Wrapper wrapper = Wrapper::kRoot;  // restored on output trees by the inverse
  int parent = 1;                    // vertical Markov order v: 1 none, 2 parent, 3 grandparent
  bool collapse_unary = false;       // X -> Y (both phrasal) becomes one node X~Y
  int horizontal = kNoBinarize;      // h >= 0, kUnlimited, or kNoBinarize
  int rare_words = 0;                // words seen at most this often also train <unk:SIG>
};

using TransformPairs = std::vector<std::pair<std::string, std::string>>;

/// The header pairs, in a fixed order (every key is always written).
TransformPairs to_pairs(const TransformSpec& spec);
/// Reads header pairs. Unknown keys or values throw InputError naming `where` and the key;
/// missing keys keep the defaults of a grammar made without transforms (see .cc).
TransformSpec from_pairs(const TransformPairs& pairs, const std::string& where);
/// A spec that changes nothing (the grammar's symbols are the treebank's labels).
TransformSpec identity_spec();

const char* wrapper_name(TransformSpec::Wrapper wrapper);

}  // namespace treegate::pcfg
