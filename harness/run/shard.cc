#include "harness/run/shard.h"

#include <charconv>

#include "evaluator/errors.h"

namespace treegate::run {

results::Shard parse_shard(const std::string& text) {
  results::Shard s;
  const auto slash = text.find('/');
  const char* b = text.data();
  const char* e = b + text.size();
  bool ok = slash != std::string::npos;
  if (ok) {
    auto r1 = std::from_chars(b, b + slash, s.index);
    auto r2 = std::from_chars(b + slash + 1, e, s.count);
    ok = r1.ec == std::errc() && r1.ptr == b + slash && r2.ec == std::errc() && r2.ptr == e &&
         s.count >= 1 && s.index >= 1 && s.index <= s.count;
  }
  if (!ok)
    throw InputError("--shard: expected K/N with 1 <= K <= N (e.g. 2/3), found '" + text + "'");
  return s;
}

bool in_shard(const std::string& suite, const std::string& id, const results::Shard& shard) {
  if (shard.count <= 1) return true;
  std::string key = suite;
  key += '\0';
  key += id;
  std::uint64_t h = 14695981039346656037ull;
  for (unsigned char ch : key) {
    h ^= ch;
    h *= 1099511628211ull;
  }
  return h % shard.count == shard.index - 1;
}

}  // namespace treegate::run
