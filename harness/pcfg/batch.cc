#include "harness/pcfg/batch.h"

#include <atomic>
#include <condition_variable>
#include <mutex>
#include <optional>
#include <thread>

#include "evaluator/errors.h"

namespace treegate::pcfg {

Sentence read_sentence(std::string_view text, std::size_t line, bool tagged) {
  Sentence s;
  s.line = line;
  if (!text.empty() && text.back() == '\r') text.remove_suffix(1);
  std::size_t i = 0;
  while (i < text.size()) {
    if (text[i] == ' ' || text[i] == '\t') {
      ++i;
      continue;
    }
    const std::size_t start = i;
    while (i < text.size() && text[i] != ' ' && text[i] != '\t') ++i;
    std::string_view token = text.substr(start, i - start);
    if (token.find_first_of("()") != std::string_view::npos) {
      if (s.error.empty()) {
        s.error = "column " + std::to_string(start + 1) + ": a word may not contain '(' or ')' " +
                  "(bracketed trees could not show it; treebanks write -LRB- and -RRB-)";
      }
      continue;
    }
    if (!tagged) {
      s.words.emplace_back(token);
      continue;
    }
    const std::size_t sep = token.rfind(kTagSeparator);
    if (sep == std::string_view::npos || sep == 0 || sep + 1 == token.size()) {
      if (s.error.empty()) {
        s.error = "column " + std::to_string(start + 1) + ": expected WORD_TAG, not " +
                  quote_for_message(std::string(token));
      }
      continue;
    }
    s.words.emplace_back(token.substr(0, sep));
    s.tags.emplace_back(token.substr(sep + 1));
  }
  return s;
}

void parse_in_order(const std::shared_ptr<const CompiledGrammar>& grammar,
                    const std::vector<Sentence>& sentences, const ParseOptions& options,
                    unsigned jobs, const std::function<void(std::size_t, ParseResult&)>& deliver) {
  const std::size_t n = sentences.size();
  const std::size_t window = std::max<std::size_t>(64, 16 * std::size_t{jobs});
  std::vector<std::optional<ParseResult>> done(n);
  std::mutex mutex;
  std::condition_variable ready, room;
  std::atomic<std::size_t> next{0};
  std::size_t delivered = 0;
  auto work = [&] {
    Parser parser(grammar);
    for (;;) {
      const std::size_t i = next++;
      if (i >= n) return;
      {
        std::unique_lock lock(mutex);
        room.wait(lock, [&] { return i < delivered + window; });
      }
      const Sentence& s = sentences[i];
      ParseResult r;
      if (!s.error.empty()) {
        r.status = ParseStatus::error;
        r.reason = s.error;
      } else {
        try {
          r = parser.parse(s.words, options.gold_tags ? &s.tags : nullptr, options);
        } catch (const std::exception& e) {
          r = ParseResult();
          r.status = ParseStatus::error;
          r.reason = std::string("parser failed: ") + e.what();
        }
      }
      std::lock_guard lock(mutex);
      done[i] = std::move(r);
      ready.notify_all();
    }
  };
  std::vector<std::thread> threads;
  for (unsigned t = 0; t < std::max(1u, jobs); ++t) threads.emplace_back(work);
  for (std::size_t i = 0; i < n; ++i) {
    ParseResult r;
    {
      std::unique_lock lock(mutex);
      ready.wait(lock, [&] { return done[i].has_value(); });
      r = std::move(*done[i]);
      done[i].reset();
      delivered = i + 1;
      room.notify_all();
    }
    deliver(i, r);
  }
  for (std::thread& t : threads) t.join();
}

}  // namespace treegate::pcfg
