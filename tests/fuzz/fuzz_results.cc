// libFuzzer target: the results-file reader (JSON Lines). Property: results that load are
// written back by results_text to text that loads to the same text again.
#include "evaluator/errors.h"
#include "harness/results/results.h"
#include "tests/fuzz/fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace treegate;
  results::RunResults r;
  try {
    r = results::parse_results(fuzz::as_text(data, size), "fuzz.results");
  } catch (const InputError& e) {
    fuzz::check(std::string(e.what()).find('\n') == std::string::npos,
                "results errors are one line");
    return 0;
  }
  const std::string once = results::results_text(r);
  results::RunResults again;
  try {
    again = results::parse_results(once, "round-trip.results");
  } catch (const InputError& e) {
    std::fprintf(stderr, "%s\n", e.what());
    fuzz::check(false, "results_text output loads back");
  }
  fuzz::check(results::results_text(again) == once, "write -> load -> write is stable");
  return 0;
}
