// libFuzzer target: the YAML suite loader. Whole-file problems are InputErrors with a
// position or a file name; per-case problems stay in the case. Treebank globs in fuzzed text
// point into a folder that does not exist, so nothing outside is read.
#include "evaluator/errors.h"
#include "harness/suite/suite_loader.h"
#include "tests/fuzz/fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace treegate;
  try {
    const suite::Suite s =
        suite::load_suite_string(fuzz::as_text(data, size), "/nonexistent-fuzz/suite.yaml");
    (void)s;
  } catch (const InputError& e) {
    fuzz::check(std::string(e.what()).find('\n') == std::string::npos, "suite errors are one line");
  }
  return 0;
}
