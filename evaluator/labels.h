// LabelTable: interns node labels (constituent labels and tags) as small integers.
// Words are not interned (see Tree). A table only grows; ids stay valid for its lifetime.
// Thread-safe: any number of threads may intern and look up at once.
#pragma once

#include <cstdint>
#include <deque>
#include <shared_mutex>
#include <string>
#include <string_view>
#include <unordered_map>

namespace treegate {

using LabelId = std::uint32_t;

class LabelTable {
 public:
  LabelTable();
  LabelTable(const LabelTable&) = delete;
  LabelTable& operator=(const LabelTable&) = delete;

  /// Returns the id of `name`, adding it when new. The empty label has id 0.
  LabelId intern(std::string_view name);
  /// Returns the id of `name`, or `kNone` when it was never interned.
  LabelId find(std::string_view name) const;
  /// The label's text; the view stays valid as long as the table.
  std::string_view name(LabelId id) const;
  std::size_t size() const;

  /// The table shared by code that has no reason for a table of its own.
  static LabelTable& shared();

  static constexpr LabelId kEmpty = 0;
  static constexpr LabelId kNone = 0xffffffffu;

 private:
  mutable std::shared_mutex mutex_;
  std::deque<std::string> names_;  // deque: element addresses never move
  std::unordered_map<std::string_view, LabelId> ids_;
};

}  // namespace treegate
