// libFuzzer target: the project config loader (treegate.yaml), including the scoring scheme,
// parser and gate sections. Any input is a ProjectConfig or a one-line InputError.
#include "evaluator/errors.h"
#include "harness/suite/config.h"
#include "tests/fuzz/fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace treegate;
  try {
    const suite::ProjectConfig c =
        suite::load_config_string(fuzz::as_text(data, size), "/nonexistent-fuzz/treegate.yaml");
    fuzz::check(c.parser.builtin || !c.parser.command.empty(), "an external parser has a command");
  } catch (const InputError& e) {
    fuzz::check(std::string(e.what()).find('\n') == std::string::npos,
                "config errors are one line");
  }
  return 0;
}
