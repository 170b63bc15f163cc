#include "evaluator/file_text.h"

#include <filesystem>
#include <fstream>

#include "evaluator/errors.h"

namespace treegate {

std::ifstream open_input_file(const std::string& path) {
  std::error_code ec;
  if (std::filesystem::is_directory(path, ec)) {
    throw InputError(path + ": is a folder; expected a file");
  }
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(path + ": cannot open file for reading");
  return in;
}

std::string read_file_text(const std::string& path) {
  std::ifstream in = open_input_file(path);
  std::string text;
  std::error_code ec;
  const auto size = std::filesystem::file_size(path, ec);  // fails for pipes: then grow
  if (!ec) text.reserve(static_cast<std::size_t>(size));
  char chunk[1 << 16];
  while (in.read(chunk, sizeof chunk) || in.gcount() > 0) {
    text.append(chunk, static_cast<std::size_t>(in.gcount()));
  }
  if (in.bad()) throw InputError(path + ": cannot read the file");
  return text;
}

}  // namespace treegate
