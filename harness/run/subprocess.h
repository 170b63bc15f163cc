// Runs a program with an argument list (fork + execve, never a shell), feeds it stdin, collects
// stdout and a capped part of stderr, with a timeout that restarts whenever a full output
// line arrives. The child gets its own process group, which is killed on timeout or stop, and
// dies with the calling thread if treegate is killed (parent-death signal);
// the child is always reaped. Each call is independent; safe to call from many threads.
#pragma once

#include <atomic>
#include <string>
#include <vector>

namespace treegate::run {

struct ProcessLimits {
  double idle_timeout_seconds = 60;           // longest wait for the next output line
  std::size_t max_stdout_bytes = 256u << 20;  // more: killed, reported
  std::size_t max_stderr_kept = 4096;         // the rest is read and dropped
};

struct ProcessResult {
  bool started = false;
  std::string start_error;  // why it could not be started
  std::string out;          // stdout
  std::string err;          // the first max_stderr_kept bytes of stderr
  bool timed_out = false, stopped = false, too_much_output = false;
  bool exited = false;
  int exit_code = 0;
  int signal = 0;  // the signal that ended it (0 when it exited)
  /// One line describing how it ended when that was not a clean exit 0; "" otherwise.
  std::string failure() const;
};

ProcessResult run_process(const std::vector<std::string>& argv, const std::string& input,
                          const ProcessLimits& limits, const std::atomic<bool>* stop = nullptr);

/// Ignores SIGPIPE in this process (a child that exits early must not kill us).
void ignore_sigpipe();

}  // namespace treegate::run
