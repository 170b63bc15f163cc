// The grammar of the worked example in Manning & Schuetze, "Foundations of Statistical Natural
// Language Processing" (1999), ch. 11, "astronomers saw stars with ears" — recalled from the
// book, not copied. Shared by the parser, sampling and explain tests.
#pragma once

namespace treegate::testdata {

inline constexpr const char* kAstronomers = R"(@start S
S -> NP VP 1.0
PP -> P NP 1.0
VP -> V NP 0.7
VP -> VP PP 0.3
P -> "with" 1.0
V -> "saw" 1.0
NP -> NP PP 0.4
NP -> "astronomers" 0.1
NP -> "ears" 0.18
NP -> "saw" 0.04
NP -> "stars" 0.18
NP -> "telescopes" 0.1
)";

}  // namespace treegate::testdata
