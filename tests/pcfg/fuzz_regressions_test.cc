// Regression tests for inputs found by fuzzing (tests/fuzz), named after what went wrong.
#include <doctest/doctest.h>

#include "harness/pcfg/grammar.h"

namespace treegate::pcfg {

TEST_CASE("grammar_stray_cr_roundtrip_regression: a CR inside a line is blank, as at its end") {
  // Found by fuzz_grammar: "@start S\r   " kept "S\r" as the start symbol, so writing and
  // reading again gave "S" and the round trip was not stable.
  const Grammar g = read_grammar_string("@start S\r      \nS -> \"x\" 1\r\n", "g.pcfg");
  CHECK(g.header.start == "S");
  CHECK(write_grammar(read_grammar_string(write_grammar(g), "again.pcfg")) == write_grammar(g));
}

}  // namespace treegate::pcfg
