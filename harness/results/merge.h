// Merging the results files of the shards of one run (`treegate merge`): checks that they
// belong together (same grammar, parser, suites, scheme, gate; each shard once; no case
// missing or doubled) and combines them into the file an unsharded run would have written.
#pragma once

#include <string>
#include <vector>

#include "harness/results/results.h"

namespace treegate::results {

/// `names` are the files the parts came from (for messages). Throws InputError naming the
/// file and what does not fit.
RunResults merge_results(const std::vector<RunResults>& parts,
                         const std::vector<std::string>& names);

}  // namespace treegate::results
