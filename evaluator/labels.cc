#include "evaluator/labels.h"

#include <mutex>

namespace treegate {

LabelTable::LabelTable() { intern(""); }

LabelId LabelTable::intern(std::string_view name) {
  {
    std::shared_lock lock(mutex_);
    auto it = ids_.find(name);
    if (it != ids_.end()) return it->second;
  }
  std::unique_lock lock(mutex_);
  auto it = ids_.find(name);
  if (it != ids_.end()) return it->second;
  const auto id = static_cast<LabelId>(names_.size());
  names_.emplace_back(name);
  ids_.emplace(names_.back(), id);
  return id;
}

LabelId LabelTable::find(std::string_view name) const {
  std::shared_lock lock(mutex_);
  auto it = ids_.find(name);
  return it == ids_.end() ? kNone : it->second;
}

std::string_view LabelTable::name(LabelId id) const {
  std::shared_lock lock(mutex_);
  return names_.at(id);
}

std::size_t LabelTable::size() const {
  std::shared_lock lock(mutex_);
  return names_.size();
}

LabelTable& LabelTable::shared() {
  static LabelTable table;
  return table;
}

}  // namespace treegate
