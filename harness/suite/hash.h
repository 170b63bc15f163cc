// FNV-1a 64-bit hashes of bytes and files, as 16 hex digits: they detect that a suite, grammar
// or treebank file changed between runs; they are not a security measure. Pure functions.
#pragma once

#include <string>

namespace treegate::suite {

std::string fnv1a64_hex(const std::string& bytes);
/// Throws InputError when the file cannot be read.
std::string hash_file(const std::string& path);

}  // namespace treegate::suite
