// The built-in parser adapter: the PCFG helper's exhaustive CKY parser behind the runner's
// SentenceParser interface. The compiled grammar is loaded once and shared (read-only) by
// every worker; each worker gets its own pcfg::Parser (chart buffers are per thread).
#pragma once

#include <memory>
#include <string>

#include "harness/run/sentence_parser.h"

namespace treegate::run {

/// Loads and compiles `grammar_path` (InputError on a bad grammar).
std::unique_ptr<ParserFactory> make_builtin_parser(const std::string& grammar_path, bool gold_tags);

}  // namespace treegate::run
