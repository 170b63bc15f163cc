// The external-command parser: tokenised sentences go to the command's stdin, one per line;
// it answers with one bracketed tree per line (an empty line or `()` for no parse). Batch
// mode keeps one process for many lines and restarts it after a crash or a hang; per-sentence
// mode starts a process per sentence. The factory is immutable and shared by all workers.
#pragma once

#include <atomic>
#include <string>
#include <vector>

#include "harness/run/sentence_parser.h"
#include "harness/run/subprocess.h"

namespace treegate::run {

struct ExternalParserSettings {
  std::vector<std::string> command;  // argv; never run by a shell
  bool batch = true;
  std::size_t batch_size = 64;
  double timeout_seconds = 60;  // the longest wait for the next line of output
  /// Restarts of one batch that produce no new line before the rest of it is given up.
  std::size_t max_restarts_without_progress = 3;
};

class ExternalParserFactory : public ParserFactory {
 public:
  ExternalParserFactory(ExternalParserSettings settings, const std::atomic<bool>* stop = nullptr);
  std::unique_ptr<SentenceParser> make() const override;
  std::string describe() const override;
  std::size_t batch_size() const override { return settings_.batch ? settings_.batch_size : 1; }

 private:
  ExternalParserSettings settings_;
  const std::atomic<bool>* stop_;
};

/// Turns the command's output for `count` sentences into outcomes (exported for tests).
/// `result` is how the process ended; outcomes for sentences after a crash are left kError
/// with an empty reason, and `answered` is set to the number of sentences that got a line.
std::vector<ParseOutcome> read_parser_output(const ProcessResult& result, std::size_t count,
                                             std::size_t& answered);

}  // namespace treegate::run
