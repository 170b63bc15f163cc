#include "harness/run/subprocess.h"

#include <fcntl.h>
#include <poll.h>
#include <signal.h>
#include <spawn.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cerrno>
#include <chrono>
#include <cstring>

extern char** environ;

namespace treegate::run {
namespace {

using Clock = std::chrono::steady_clock;

struct Pipe {
  int fd[2] = {-1, -1};
  bool open() { return ::pipe2(fd, O_CLOEXEC) == 0; }
  void close_end(int i) {
    if (fd[i] >= 0) ::close(fd[i]);
    fd[i] = -1;
  }
  ~Pipe() {
    close_end(0);
    close_end(1);
  }
};

// Spawns `argv` with stdin/stdout/stderr on the pipes, in a new process group, with default
// signal dispositions and an empty signal mask. Returns the pid or -1 (errno in `error`).
pid_t spawn(const std::vector<std::string>& argv, Pipe& in, Pipe& out, Pipe& err, int& error) {
  posix_spawn_file_actions_t actions;
  posix_spawnattr_t attr;
  posix_spawn_file_actions_init(&actions);
  posix_spawnattr_init(&attr);
  posix_spawn_file_actions_adddup2(&actions, in.fd[0], 0);
  posix_spawn_file_actions_adddup2(&actions, out.fd[1], 1);
  posix_spawn_file_actions_adddup2(&actions, err.fd[1], 2);
  sigset_t none, defaults;
  sigemptyset(&none);
  sigemptyset(&defaults);
  sigaddset(&defaults, SIGPIPE);
  sigaddset(&defaults, SIGINT);
  sigaddset(&defaults, SIGTERM);
  posix_spawnattr_setsigmask(&attr, &none);
  posix_spawnattr_setsigdefault(&attr, &defaults);
  posix_spawnattr_setpgroup(&attr, 0);
  posix_spawnattr_setflags(&attr,
                           POSIX_SPAWN_SETSIGMASK | POSIX_SPAWN_SETSIGDEF | POSIX_SPAWN_SETPGROUP);
  std::vector<char*> args;
  for (const auto& a : argv) args.push_back(const_cast<char*>(a.c_str()));
  args.push_back(nullptr);
  pid_t pid = -1;
  error = posix_spawnp(&pid, args[0], &actions, &attr, args.data(), environ);
  posix_spawn_file_actions_destroy(&actions);
  posix_spawnattr_destroy(&attr);
  return error == 0 ? pid : -1;
}

void set_nonblocking(int fd) { ::fcntl(fd, F_SETFL, ::fcntl(fd, F_GETFL) | O_NONBLOCK); }

// Reaps `pid`; kills its group first when `kill_first` or when it does not exit in time.
void reap(pid_t pid, bool kill_first, ProcessResult& r) {
  if (kill_first) ::kill(-pid, SIGKILL);
  int status = 0;
  const auto give_up = Clock::now() + std::chrono::seconds(2);
  for (;;) {
    const pid_t w = ::waitpid(pid, &status, kill_first ? 0 : WNOHANG);
    if (w == pid) break;
    if (w < 0 && errno != EINTR) return;
    if (w == 0 && Clock::now() > give_up) {
      kill_first = true;
      ::kill(-pid, SIGKILL);
    } else if (w == 0) {
      ::usleep(2000);
    }
  }
  if (WIFEXITED(status)) {
    r.exited = true;
    r.exit_code = WEXITSTATUS(status);
  } else if (WIFSIGNALED(status)) {
    r.signal = WTERMSIG(status);
  }
}

}  // namespace

void ignore_sigpipe() { ::signal(SIGPIPE, SIG_IGN); }

std::string ProcessResult::failure() const {
  if (!started) return "could not start the parser: " + start_error;
  if (stopped) return "stopped (interrupted)";
  if (timed_out) return "parser timed out";
  if (too_much_output) return "parser wrote too much output";
  if (signal != 0)
    return std::string("parser crashed (signal ") + std::to_string(signal) + ", " +
           strsignal(signal) + ")";
  if (exited && exit_code != 0) return "parser exited with status " + std::to_string(exit_code);
  return "";
}

ProcessResult run_process(const std::vector<std::string>& argv, const std::string& input,
                          const ProcessLimits& limits, const std::atomic<bool>* stop) {
  ProcessResult r;
  Pipe in, out, err;
  if (argv.empty() || !in.open() || !out.open() || !err.open()) {
    r.start_error = argv.empty() ? "empty command" : std::strerror(errno);
    return r;
  }
  int error = 0;
  const pid_t pid = spawn(argv, in, out, err, error);
  in.close_end(0);
  out.close_end(1);
  err.close_end(1);
  if (pid < 0) {
    r.start_error = "'" + argv[0] + "': " + std::strerror(error);
    return r;
  }
  r.started = true;
  set_nonblocking(in.fd[1]);
  std::size_t written = 0;
  if (input.empty()) in.close_end(1);
  const auto idle = std::chrono::duration_cast<Clock::duration>(
      std::chrono::duration<double>(limits.idle_timeout_seconds));
  auto deadline = Clock::now() + idle;
  char buf[65536];
  bool failed = false;
  while (out.fd[0] >= 0 || err.fd[0] >= 0) {
    if (stop && stop->load()) {
      r.stopped = failed = true;
      break;
    }
    pollfd fds[3];
    nfds_t n = 0;
    if (out.fd[0] >= 0) fds[n++] = {out.fd[0], POLLIN, 0};
    if (err.fd[0] >= 0) fds[n++] = {err.fd[0], POLLIN, 0};
    if (in.fd[1] >= 0) fds[n++] = {in.fd[1], POLLOUT, 0};
    const int ready = ::poll(fds, n, 100);
    if (ready < 0 && errno != EINTR) break;
    if (Clock::now() > deadline) {
      r.timed_out = failed = true;
      break;
    }
    for (nfds_t i = 0; i < n && ready > 0; ++i) {
      if (fds[i].revents == 0) continue;
      const int fd = fds[i].fd;
      if (fd == in.fd[1]) {
        const ssize_t k = ::write(fd, input.data() + written, input.size() - written);
        if (k > 0) written += static_cast<std::size_t>(k);
        if ((k < 0 && errno != EAGAIN && errno != EINTR) || written == input.size())
          in.close_end(1);
        continue;
      }
      const ssize_t k = ::read(fd, buf, sizeof buf);
      if (k < 0 && (errno == EAGAIN || errno == EINTR)) continue;
      if (k <= 0) {
        (fd == out.fd[0] ? out : err).close_end(0);
        continue;
      }
      if (fd == out.fd[0]) {
        if (std::memchr(buf, '\n', static_cast<std::size_t>(k))) deadline = Clock::now() + idle;
        r.out.append(buf, static_cast<std::size_t>(k));
        if (r.out.size() > limits.max_stdout_bytes) r.too_much_output = failed = true;
      } else if (r.err.size() < limits.max_stderr_kept) {
        r.err.append(buf, std::min<std::size_t>(static_cast<std::size_t>(k),
                                                limits.max_stderr_kept - r.err.size()));
      }
    }
    if (failed) break;
  }
  reap(pid, failed, r);
  return r;
}

}  // namespace treegate::run
