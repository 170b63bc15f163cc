// Sharding: `--shard K/N` keeps the cases whose stable hash of (suite, id) falls in shard K,
// so parallel CI jobs split a run and `merge` puts the pieces back together. Pure functions.
#pragma once

#include <string>

#include "harness/results/results.h"

namespace treegate::run {

/// Reads "K/N" (1 <= K <= N). Throws InputError naming the option on a bad value.
results::Shard parse_shard(const std::string& text);

/// True when the case (suite, id) belongs to `shard`: FNV-1a 64 of "suite\0id" mod N == K-1.
bool in_shard(const std::string& suite, const std::string& id, const results::Shard& shard);

}  // namespace treegate::run
