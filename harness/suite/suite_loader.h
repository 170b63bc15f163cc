// Reads suite files (YAML) into the suite model. Problems with the whole file (bad YAML, no
// `suite:` name) throw InputError; a problem with one case is kept in that case's `load_error`
// so the other cases still run. Stateless functions; safe to call from any thread.
#pragma once

#include <functional>
#include <string>
#include <vector>

#include "harness/suite/suite.h"

namespace treegate::suite {

struct SuiteLoadOptions {
  /// Treebank globs that are absolute or climb with `..` are refused unless this is set.
  bool allow_outside_paths = false;
};

Suite load_suite(const std::string& path, const SuiteLoadOptions& options = {});
Suite load_suite_string(const std::string& text, const std::string& path,
                        const SuiteLoadOptions& options = {});

/// Called with each case as soon as it is read (`n`: its 1-based position in the suite),
/// while the rest of the suite is still being read; the suite's name, tags and threshold are
/// set by then, and the case stays at its address (Suite::cases is a deque).
using CaseSink = std::function<void(const Suite& suite, const Case& c, std::size_t n)>;
/// Reads the suite file at `path` into `out` (which must be empty), calling `sink` per case.
void load_suite_into(const std::string& path, const SuiteLoadOptions& options, Suite& out,
                     const CaseSink& sink);

/// Expands suite arguments: a file is kept, a folder gives its *.yaml and *.yml files (sorted,
/// not recursive), anything else is a glob. A pattern that matches nothing is an InputError.
std::vector<std::string> expand_suite_paths(const std::vector<std::string>& patterns);

/// True when `pattern` is absolute or has a `..` component.
bool leaves_folder(const std::string& pattern);

}  // namespace treegate::suite
