// InputError: the one way treegate reports bad input. Every reader throws it with the
// position in the user's file; callers that handle many cases catch it per case.
#pragma once

#include <cstddef>
#include <stdexcept>
#include <string>

namespace treegate {

class InputError : public std::runtime_error {
 public:
  /// `line` and `col` are 1-based; 0 means "no position" and is left out of the message.
  InputError(std::string file, std::size_t line, std::size_t col, const std::string& message);
  /// An error about a whole file or an option, without a position.
  explicit InputError(const std::string& message);

  const std::string& file() const { return file_; }
  std::size_t line() const { return line_; }
  std::size_t col() const { return col_; }
  /// The message without the "file:line:col: " prefix.
  const std::string& bare() const { return bare_; }

 private:
  std::string file_;
  std::size_t line_ = 0;
  std::size_t col_ = 0;
  std::string bare_;
};

/// "file:line:col" (or fewer parts when they are unknown).
std::string format_position(const std::string& file, std::size_t line, std::size_t col);

/// Shows `text` for a message: printable ASCII kept, other bytes as \xHH, cut at `max` bytes.
std::string quote_for_message(const std::string& text, std::size_t max = 40);

}  // namespace treegate
