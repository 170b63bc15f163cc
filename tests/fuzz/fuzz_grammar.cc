// libFuzzer target: the grammar-file reader (.pcfg), the writer and grammar compilation.
// Properties: a grammar that reads writes back to text that reads to the same text again
// (write_grammar round-trips), and compiling any grammar that reads never crashes.
#include <exception>

#include "evaluator/errors.h"
#include "harness/pcfg/compiled_grammar.h"
#include "harness/pcfg/grammar.h"
#include "tests/fuzz/fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace treegate;
  pcfg::Grammar grammar;
  try {
    grammar = pcfg::read_grammar_string(fuzz::as_text(data, size), "fuzz.pcfg");
  } catch (const InputError& e) {
    fuzz::check(e.line() > 0, "grammar syntax errors carry a line");
    return 0;
  }
  const std::string once = pcfg::write_grammar(grammar);
  pcfg::Grammar again;
  try {
    again = pcfg::read_grammar_string(once, "round-trip.pcfg");
  } catch (const InputError& e) {
    std::fprintf(stderr, "%s\n--- written text:\n%s\n", e.what(), once.c_str());
    fuzz::check(false, "write_grammar output reads back");
  }
  fuzz::check(pcfg::write_grammar(again) == once, "write -> read -> write is stable");
  fuzz::check(again.rules.size() == grammar.rules.size(), "round trip keeps every rule");
  try {
    const pcfg::CompiledGrammar compiled(grammar);
    (void)compiled;
  } catch (const InputError&) {
    // a grammar that reads may still be refused when compiled (e.g. no start symbol)
  }
  return 0;
}
