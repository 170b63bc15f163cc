// StringIds: gives each distinct byte string a dense id (0, 1, 2, ...) in first-seen order.
// An open-addressing table over one vector of keys: the Estimator's symbols, words and rule
// keys go through it once per tree node, where node-based hash maps cost cache misses.
// Not thread-safe; owned by one Estimator.
#pragma once

#include <cstdint>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

namespace treegate::pcfg {

class StringIds {
 public:
  /// The id of `key`, adding it when new; `second` is true when it was added.
  std::pair<std::uint32_t, bool> insert(std::string_view key);
  const std::string& key(std::uint32_t id) const { return keys_[id]; }
  std::size_t size() const { return keys_.size(); }

 private:
  void grow();

  std::vector<std::string> keys_;
  std::vector<std::uint64_t> hashes_;  // by id
  std::vector<std::uint32_t> slots_;   // id + 1; 0 is an empty slot
};

}  // namespace treegate::pcfg
