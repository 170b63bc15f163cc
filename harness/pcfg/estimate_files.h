// Feeding treebank files to an Estimator: file patterns (globs), bad trees reported with
// file:line:col while the rest of the file is still read, and the printed summary.
// Functions only; the Estimator passed in is the caller's (one thread at a time).
#pragma once

#include <string>
#include <vector>

#include "harness/pcfg/estimate.h"

namespace treegate::pcfg {

/// Expands each pattern ("-" and names without wildcards pass through unchanged; globs are
/// sorted). A glob that matches nothing throws InputError naming it.
std::vector<std::string> expand_treebank_patterns(const std::vector<std::string>& patterns);

/// Adds every tree of `path` ("-": standard input) to `estimator`. Each unreadable or
/// unusable tree appends one message "file:line:col: tree N: what was expected" to `errors`
/// and reading goes on. A file that cannot be opened throws InputError.
void add_treebank_file(Estimator& estimator, const std::string& path,
                       std::vector<std::string>& errors);

/// The 1-based line and column of node `node` (pre-order number) of the tree that starts on
/// `line` of `path`; {line, 0} when the file cannot be scanned.
std::pair<std::size_t, std::size_t> locate_node(const std::string& path, std::size_t line,
                                                NodeId node);

/// The summary `estimate` prints: one figure per line, with what it counts.
std::string summary_text(const EstimateSummary& summary, const TransformSpec& spec);

}  // namespace treegate::pcfg
