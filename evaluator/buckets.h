// Sentence-length buckets for tallies and reports: 1-10, 11-20, 21-30, 31-40, 41+ words
// (a sentence's length is its scored word count, see the scoring scheme). Pure functions.
#pragma once

#include <array>
#include <cstdint>
#include <string_view>

namespace treegate {

inline constexpr std::array<std::string_view, 5> kLengthBuckets{"1-10", "11-20", "21-30", "31-40",
                                                                "41+"};

/// Index into kLengthBuckets; a sentence of 0 scored words goes with 1-10.
inline std::size_t length_bucket(std::uint32_t words) {
  return words <= 10 ? 0 : words <= 20 ? 1 : words <= 30 ? 2 : words <= 40 ? 3 : 4;
}

}  // namespace treegate
