// run_process on real processes: a child that exits without reading its input must not kill
// the caller with SIGPIPE, even when the caller has not ignored that signal (a library user,
// or this test binary under ctest, which starts tests with SIGPIPE at its default).
#include "harness/run/subprocess.h"

#include <doctest/doctest.h>
#include <signal.h>

#include <string>

namespace tr = treegate::run;

TEST_CASE("subprocess: a child that ignores its input gives EPIPE, not SIGPIPE") {
  struct sigaction dfl {
  }, old{};
  dfl.sa_handler = SIG_DFL;
  sigemptyset(&dfl.sa_mask);
  REQUIRE(sigaction(SIGPIPE, &dfl, &old) == 0);
  // 4 MB is far more than a pipe holds, so the writer is still writing when `true` exits.
  const std::string input(4u << 20, 'x');
  for (int i = 0; i < 3; ++i) {
    const tr::ProcessResult r = tr::run_process({"true"}, input, {5, 1u << 20, 4096}, nullptr);
    CHECK(r.started);
    CHECK(r.exited);
    CHECK(r.exit_code == 0);
    CHECK(r.failure().empty());
  }
  sigaction(SIGPIPE, &old, nullptr);
}

TEST_CASE("subprocess: a program that is not there is a start error, reaped") {
  const tr::ProcessResult r =
      tr::run_process({"no-such-program-here"}, "", {5, 1024, 1024}, nullptr);
  CHECK_FALSE(r.started);
  CHECK(r.failure() ==
        "could not start the parser: 'no-such-program-here': No such file or directory");
}
