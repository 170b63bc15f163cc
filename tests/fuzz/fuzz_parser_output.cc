// libFuzzer target: reading an external parser's output. The first byte picks how many
// sentences were sent (1-16) and how the process ended; the rest is its stdout. Every
// sentence gets exactly one outcome, and a sentence without a tree has a reason.
#include "harness/run/external_parser.h"
#include "tests/fuzz/fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace treegate;
  if (size == 0) return 0;
  const std::size_t count = 1 + (data[0] & 15);
  run::ProcessResult result;
  result.started = true;
  result.exited = (data[0] & 16) == 0;
  result.exit_code = (data[0] & 32) ? 1 : 0;
  result.signal = result.exited ? 0 : 11;
  result.timed_out = (data[0] & 64) != 0;
  result.out = fuzz::as_text(data + 1, size - 1);
  std::size_t answered = 0;
  const std::vector<run::ParseOutcome> outcomes = run::read_parser_output(result, count, answered);
  fuzz::check(outcomes.size() == count, "one outcome per sentence");
  fuzz::check(answered <= count, "answered <= sentences sent");
  for (std::size_t i = 0; i < answered; ++i) {
    const run::ParseOutcome& o = outcomes[i];
    if (o.status == run::ParseStatus::kParsed) {
      fuzz::check(!o.tree.empty(), "a parsed sentence has a tree");
    } else {
      fuzz::check(!o.reason.empty(), "an answered sentence without a tree has a reason");
    }
    fuzz::check(o.reason.find('\n') == std::string::npos, "reasons are one line");
  }
  return 0;
}
