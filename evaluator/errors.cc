#include "evaluator/errors.h"

namespace treegate {

std::string format_position(const std::string& file, std::size_t line, std::size_t col) {
  std::string out = file.empty() ? std::string("<input>") : file;
  if (line > 0) out += ":" + std::to_string(line);
  if (line > 0 && col > 0) out += ":" + std::to_string(col);
  return out;
}

namespace {

// Messages are one line: control bytes that came with the user's text (a newline in a YAML
// scalar, a byte quoted by yaml-cpp) are shown as \xHH. Found by fuzzing the YAML readers.
std::string one_line(const std::string& text) {
  static const char* hex = "0123456789abcdef";
  std::string out;
  out.reserve(text.size());
  for (unsigned char c : text) {
    if (c < 0x20 || c == 0x7f) {
      out += "\\x";
      out += hex[c >> 4];
      out += hex[c & 15];
    } else {
      out += static_cast<char>(c);
    }
  }
  return out;
}

}  // namespace

InputError::InputError(std::string file, std::size_t line, std::size_t col,
                       const std::string& message)
    : std::runtime_error(one_line(format_position(file, line, col) + ": " + message)),
      file_(std::move(file)),
      line_(line),
      col_(col),
      bare_(one_line(message)) {}

InputError::InputError(const std::string& message)
    : std::runtime_error(one_line(message)), bare_(one_line(message)) {}

std::string quote_for_message(const std::string& text, std::size_t max) {
  static const char* hex = "0123456789abcdef";
  std::string out = "'";
  std::size_t n = 0;
  for (unsigned char c : text) {
    if (n++ == max) {
      out += "...";
      break;
    }
    if (c >= 0x20 && c < 0x7f && c != '\'') {
      out += static_cast<char>(c);
    } else if (c == '\'') {
      out += "\\'";
    } else if (c >= 0x80) {
      out += static_cast<char>(c);  // keep UTF-8 text readable; terminals show it
    } else {
      out += "\\x";
      out += hex[c >> 4];
      out += hex[c & 15];
    }
  }
  return out + "'";
}

}  // namespace treegate
