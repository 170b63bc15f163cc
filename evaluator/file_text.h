// Reading a whole file into memory: one place, one message for a file that cannot be read.
#pragma once

#include <fstream>
#include <string>

namespace treegate {

/// The bytes of the file at `path` (any kind of file: a pipe is read to its end). Throws
/// InputError "PATH: cannot open file for reading" (or "is a folder; expected a file", or
/// "cannot read the file").
std::string read_file_text(const std::string& path);

/// Opens the file at `path` for streaming, with the same messages as read_file_text (a folder
/// would otherwise read as an empty file).
std::ifstream open_input_file(const std::string& path);

}  // namespace treegate
