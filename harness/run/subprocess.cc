#include "harness/run/subprocess.h"

#include <fcntl.h>
#include <poll.h>
#include <signal.h>
#include <sys/prctl.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include <pthread.h>
#include <algorithm>
#include <cerrno>
#include <chrono>
#include <cstdlib>
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

// The file a command names: itself when it contains a '/', else the first executable regular
// file of that name on PATH (as a shell or execvp would find it). "" when there is none.
std::string find_program(const std::string& name) {
  if (name.find('/') != std::string::npos) return name;
  const char* env = std::getenv("PATH");
  const std::string path = env != nullptr && *env != '\0' ? env : "/usr/local/bin:/usr/bin:/bin";
  std::size_t begin = 0;
  for (;;) {
    const std::size_t end = std::min(path.find(':', begin), path.size());
    const std::string dir = end > begin ? path.substr(begin, end - begin) : ".";
    const std::string file = dir + "/" + name;
    struct stat st {};
    if (::stat(file.c_str(), &st) == 0 && S_ISREG(st.st_mode) && ::access(file.c_str(), X_OK) == 0)
      return file;
    if (end == path.size()) return "";
    begin = end + 1;
  }
}

// In the child between fork and exec: only async-signal-safe calls. The child gets its own
// process group, default signal dispositions, an empty signal mask, and SIGKILL when the
// thread that started it dies, so a parser never outlives a killed treegate.
[[noreturn]] void exec_child(const char* program, char* const* args, pid_t parent, Pipe& in,
                             Pipe& out, Pipe& err, int report) {
  ::setpgid(0, 0);
  ::prctl(PR_SET_PDEATHSIG, SIGKILL);
  if (::getppid() != parent) ::_exit(127);  // treegate died before prctl took effect
  ::dup2(in.fd[0], 0);
  ::dup2(out.fd[1], 1);
  ::dup2(err.fd[1], 2);
  struct sigaction dfl {};
  dfl.sa_handler = SIG_DFL;
  for (int sig : {SIGPIPE, SIGINT, SIGTERM}) ::sigaction(sig, &dfl, nullptr);
  sigset_t none;
  sigemptyset(&none);
  ::pthread_sigmask(SIG_SETMASK, &none, nullptr);
  ::execve(program, args, environ);
  const int e = errno;
  [[maybe_unused]] const ssize_t k = ::write(report, &e, sizeof e);
  ::_exit(127);
}

// Starts `argv` with stdin/stdout/stderr on the pipes (see exec_child). Returns the pid, or -1
// with errno in `error` (also when exec fails: the child reports it through a pipe).
pid_t spawn(const std::vector<std::string>& argv, Pipe& in, Pipe& out, Pipe& err, int& error) {
  const std::string program = find_program(argv[0]);
  if (program.empty()) {
    error = ENOENT;
    return -1;
  }
  std::vector<char*> args;
  for (const auto& a : argv) args.push_back(const_cast<char*>(a.c_str()));
  args.push_back(nullptr);
  Pipe report;
  if (!report.open()) {
    error = errno;
    return -1;
  }
  const pid_t parent = ::getpid();
  const pid_t pid = ::fork();
  if (pid < 0) {
    error = errno;
    return -1;
  }
  if (pid == 0) exec_child(program.c_str(), args.data(), parent, in, out, err, report.fd[1]);
  ::setpgid(pid, pid);  // also here, so the group exists before anyone signals it
  report.close_end(1);
  int e = 0;
  ssize_t k = 0;
  do {
    k = ::read(report.fd[0], &e, sizeof e);
  } while (k < 0 && errno == EINTR);
  if (k == static_cast<ssize_t>(sizeof e)) {  // exec failed: reap the child, report why
    int status = 0;
    while (::waitpid(pid, &status, 0) < 0 && errno == EINTR) {
    }
    error = e;
    return -1;
  }
  error = 0;
  return pid;
}

// write() that cannot raise SIGPIPE in a program that has not ignored it: the signal is
// blocked in this thread for the call, and one raised by it is taken off the pending set.
// A parser that exits without reading its input then gives EPIPE, not a dead treegate.
ssize_t write_no_sigpipe(int fd, const char* data, std::size_t size) {
  sigset_t pipe_only, old;
  sigemptyset(&pipe_only);
  sigaddset(&pipe_only, SIGPIPE);
  ::pthread_sigmask(SIG_BLOCK, &pipe_only, &old);
  const ssize_t k = ::write(fd, data, size);
  const int saved = errno;
  if (k < 0 && saved == EPIPE) {
    const timespec now{0, 0};
    while (::sigtimedwait(&pipe_only, nullptr, &now) < 0 && errno == EINTR) {
    }
  }
  ::pthread_sigmask(SIG_SETMASK, &old, nullptr);
  errno = saved;
  return k;
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
        const ssize_t k = write_no_sigpipe(fd, input.data() + written, input.size() - written);
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
