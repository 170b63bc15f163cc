#include "harness/pcfg/estimate_index.h"

#include <functional>

namespace treegate::pcfg {

std::pair<std::uint32_t, bool> StringIds::insert(std::string_view key) {
  if ((keys_.size() + 1) * 2 > slots_.size()) grow();  // load factor at most 1/2
  const std::uint64_t hash = std::hash<std::string_view>{}(key);
  const std::size_t mask = slots_.size() - 1;
  for (std::size_t i = hash & mask;; i = (i + 1) & mask) {
    const std::uint32_t slot = slots_[i];
    if (slot == 0) {
      const auto id = static_cast<std::uint32_t>(keys_.size());
      keys_.emplace_back(key);
      hashes_.push_back(hash);
      slots_[i] = id + 1;
      return {id, true};
    }
    if (hashes_[slot - 1] == hash && keys_[slot - 1] == key) return {slot - 1, false};
  }
}

void StringIds::grow() {
  slots_.assign(slots_.empty() ? 64 : slots_.size() * 2, 0);
  const std::size_t mask = slots_.size() - 1;
  for (std::uint32_t id = 0; id < keys_.size(); ++id) {
    std::size_t i = hashes_[id] & mask;
    while (slots_[i] != 0) i = (i + 1) & mask;
    slots_[i] = id + 1;
  }
}

}  // namespace treegate::pcfg
