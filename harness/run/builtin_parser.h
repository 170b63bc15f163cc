// The built-in parser adapter: the PCFG helper's exhaustive CKY parser behind the runner's
// SentenceParser interface. The compiled grammar is loaded once and shared (read-only) by
// every worker; each worker gets its own pcfg::Parser (chart buffers are per thread).
#pragma once

#include <atomic>
#include <memory>
#include <string>

#include "harness/run/sentence_parser.h"

namespace treegate::run {

struct BuiltinSettings {
  bool gold_tags = false;   // take the gold tags as the only preterminals
  double max_seconds = 60;  // per sentence; 0: no limit
  std::size_t max_chart_bytes = std::size_t{4} << 30;
  const std::atomic<bool>* stop = nullptr;  // a running parse gives up when this turns true
};

/// Loads and compiles `grammar_path` (InputError on a bad grammar).
std::unique_ptr<ParserFactory> make_builtin_parser(const std::string& grammar_path,
                                                   const BuiltinSettings& settings);

}  // namespace treegate::run
