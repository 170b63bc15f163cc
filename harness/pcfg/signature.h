// word_signature: the unknown-word class of a word, shared by `estimate` (training the
// <unk:SIG> rules) and the parser (looking up words missing from the lexicon). Pure function.
#pragma once

#include <string>
#include <string_view>

namespace treegate::pcfg {

/// "SHAPE[-num][-hyph][-SUFFIX]", e.g. "cap-s", "lower-ing", "num", "cap-hyph".
/// SHAPE: cap (first letter upper, some lower), caps (all letters upper), lower (all letters
/// lower), num (no letters, a digit), other. Letters are ASCII; other bytes count for nothing.
/// -num: a digit and at least one letter. -hyph: contains '-'. SUFFIX: the longest of
/// ing ed s ly ion er est al able ive that the lower-cased word ends with, when the word has
/// at least 4 bytes.
std::string word_signature(std::string_view word);

}  // namespace treegate::pcfg
