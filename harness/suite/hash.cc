#include "harness/suite/hash.h"

#include <cstdint>
#include <cstdio>
#include <fstream>
#include <iterator>

#include "evaluator/errors.h"

namespace treegate::suite {

std::string fnv1a64_hex(const std::string& bytes) {
  std::uint64_t h = 14695981039346656037ull;
  for (unsigned char ch : bytes) {
    h ^= ch;
    h *= 1099511628211ull;
  }
  char buf[17];
  std::snprintf(buf, sizeof buf, "%016llx", static_cast<unsigned long long>(h));
  return buf;
}

std::string hash_file(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(path + ": cannot open file for reading");
  std::string bytes((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  return fnv1a64_hex(bytes);
}

}  // namespace treegate::suite
