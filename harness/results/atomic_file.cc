#include "harness/results/atomic_file.h"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>
#include <mutex>
#include <set>

#include "evaluator/errors.h"

namespace treegate::results {
namespace {

std::mutex pending_mutex;
std::set<std::string>& pending() {
  static std::set<std::string> names;
  return names;
}

std::string folder_of(const std::string& path) {
  const auto slash = path.rfind('/');
  return slash == std::string::npos ? std::string(".") : path.substr(0, slash + 1);
}

[[noreturn]] void fail(const std::string& path, const std::string& what) {
  throw InputError(path + ": cannot write file: " + what);
}

}  // namespace

void write_file_atomically(const std::string& path, const std::string& text) {
  write_file_atomically(path, std::vector<std::string_view>{text});
}

void write_file_atomically(const std::string& path, const std::vector<std::string_view>& pieces) {
  const auto slash = path.rfind('/');
  const std::string base = slash == std::string::npos ? path : path.substr(slash + 1);
  std::string tmp = (slash == std::string::npos ? std::string() : path.substr(0, slash + 1)) + "." +
                    base + ".tmp-XXXXXX";
  int fd = mkstemp(tmp.data());
  if (fd < 0) fail(path, std::string(std::strerror(errno)) + " (folder " + folder_of(path) + ")");
  {
    std::lock_guard lock(pending_mutex);
    pending().insert(tmp);
  }
  auto forget = [&] {
    std::lock_guard lock(pending_mutex);
    pending().erase(tmp);
  };
  for (const std::string_view piece : pieces) {
    const char* p = piece.data();
    std::size_t left = piece.size();
    while (left > 0) {
      const ssize_t n = ::write(fd, p, left);
      if (n < 0 && errno == EINTR) continue;
      if (n <= 0) {
        const std::string why = std::strerror(errno);
        ::close(fd);
        ::unlink(tmp.c_str());
        forget();
        fail(path, why);
      }
      p += n;
      left -= static_cast<std::size_t>(n);
    }
  }
  (void)::fchmod(fd, 0644);
  const bool synced = ::fsync(fd) == 0;
  ::close(fd);
  if (!synced || ::rename(tmp.c_str(), path.c_str()) != 0) {
    const std::string why = std::strerror(errno);
    ::unlink(tmp.c_str());
    forget();
    fail(path, why);
  }
  forget();
}

void remove_pending_temp_files() {
  std::lock_guard lock(pending_mutex);
  for (const auto& name : pending()) ::unlink(name.c_str());
  pending().clear();
}

}  // namespace treegate::results
