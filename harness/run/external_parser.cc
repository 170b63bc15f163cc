#include "harness/run/external_parser.h"

#include <chrono>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"

namespace treegate::run {
namespace {

std::vector<std::string> split_lines(const std::string& out, bool& partial_last) {
  std::vector<std::string> lines;
  std::size_t start = 0;
  while (start < out.size()) {
    const auto end = out.find('\n', start);
    if (end == std::string::npos) break;
    std::string line = out.substr(start, end - start);
    if (!line.empty() && line.back() == '\r') line.pop_back();
    lines.push_back(std::move(line));
    start = end + 1;
  }
  partial_last = start < out.size();
  return lines;
}

ParseOutcome outcome_of_line(const std::string& line, std::size_t line_no) {
  ParseOutcome o;
  const auto first = line.find_first_not_of(" \t");
  if (first == std::string::npos || line.compare(first, std::string::npos, "()") == 0) {
    o.status = ParseStatus::kNoParse;
    o.reason = "the parser found no parse";
    return o;
  }
  try {
    o.tree = parse_tree(line, "parser output line " + std::to_string(line_no));
    o.status = o.tree.empty() ? ParseStatus::kNoParse : ParseStatus::kParsed;
    if (o.tree.empty()) o.reason = "the parser found no parse";
  } catch (const InputError& e) {
    o.status = ParseStatus::kError;
    o.reason = std::string("the parser's output is not a tree: ") + e.what();
  }
  return o;
}

std::string stderr_hint(const ProcessResult& r) {
  auto last = r.err;
  while (!last.empty() && (last.back() == '\n' || last.back() == '\r')) last.pop_back();
  const auto nl = last.rfind('\n');
  if (nl != std::string::npos) last = last.substr(nl + 1);
  if (last.empty()) return "";
  return "; its stderr said " + quote_for_message(last, 120);
}

class ExternalParser : public SentenceParser {
 public:
  ExternalParser(const ExternalParserSettings& s, const std::atomic<bool>* stop)
      : s_(s), stop_(stop) {}

  ParseOutcome parse(const ParseRequest& request) override {
    return std::move(parse_batch(std::span<const ParseRequest>(&request, 1)).front());
  }

  std::vector<ParseOutcome> parse_batch(std::span<const ParseRequest> batch) override {
    std::vector<ParseOutcome> out(batch.size());
    std::size_t next = 0, fruitless = 0;
    while (next < batch.size()) {
      const std::size_t done = run_from(batch, next, out);
      fruitless = done == next ? fruitless + 1 : 0;
      next = done;
      if (fruitless > s_.max_restarts_without_progress && next < batch.size()) {
        for (std::size_t i = next; i < batch.size(); ++i) {
          out[i].reason = "not parsed: the parser failed " + std::to_string(fruitless) +
                          " times in a row on earlier sentences of its batch";
        }
        break;
      }
    }
    return out;
  }

 private:
  // Runs the command on batch[from..]; fills outcomes; returns the index to continue from.
  std::size_t run_from(std::span<const ParseRequest> batch, std::size_t from,
                       std::vector<ParseOutcome>& out) {
    std::string input;
    for (std::size_t i = from; i < batch.size(); ++i) {
      const auto& words = *batch[i].words;
      for (std::size_t w = 0; w < words.size(); ++w) input += (w ? " " : "") + words[w];
      input += '\n';
    }
    const std::size_t count = batch.size() - from;
    const auto t0 = std::chrono::steady_clock::now();
    const ProcessResult r =
        run_process(s_.command, input, {s_.timeout_seconds, 256u << 20, 4096}, stop_);
    const double seconds =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    std::size_t answered = 0;
    auto outcomes = read_parser_output(r, count, answered);
    for (std::size_t i = 0; i < count; ++i) {
      outcomes[i].seconds = seconds / static_cast<double>(std::max<std::size_t>(answered, 1));
      out[from + i] = std::move(outcomes[i]);
    }
    if (answered == count || !r.started || r.stopped) return batch.size();
    // The sentence after the last answered one is the one the parser failed on.
    out[from + answered].reason = r.failure() + " on this sentence" + stderr_hint(r);
    return from + answered + 1;
  }

  ExternalParserSettings s_;
  const std::atomic<bool>* stop_;
};

}  // namespace

std::vector<ParseOutcome> read_parser_output(const ProcessResult& r, std::size_t count,
                                             std::size_t& answered) {
  std::vector<ParseOutcome> out(count);
  answered = 0;
  if (!r.started || r.stopped) {
    for (auto& o : out) o.reason = r.failure();
    answered = count;  // nothing to retry
    return out;
  }
  bool partial = false;
  const auto lines = split_lines(r.out, partial);
  const bool clean = r.failure().empty();
  if (clean && (lines.size() != count || partial)) {
    const std::string reason =
        "the parser wrote " + std::to_string(lines.size() + (partial ? 1 : 0)) + " lines for " +
        std::to_string(count) + " sentences, so no line can be matched to its sentence";
    for (auto& o : out) o.reason = reason;
    answered = count;
    return out;
  }
  answered = std::min(lines.size(), count);
  for (std::size_t i = 0; i < answered; ++i) out[i] = outcome_of_line(lines[i], i + 1);
  if (!clean && lines.size() > count) {
    for (auto& o : out) {
      ParseOutcome fresh;  // not ParseOutcome{...}: clang refuses `{}` for Tree's explicit ctor
      fresh.status = ParseStatus::kError;
      fresh.reason = "the parser wrote more lines than sentences, then " + r.failure();
      o = std::move(fresh);
    }
  }
  return out;
}

ExternalParserFactory::ExternalParserFactory(ExternalParserSettings settings,
                                             const std::atomic<bool>* stop)
    : settings_(std::move(settings)), stop_(stop) {}

std::unique_ptr<SentenceParser> ExternalParserFactory::make() const {
  return std::make_unique<ExternalParser>(settings_, stop_);
}

std::string ExternalParserFactory::describe() const {
  std::string out = "command:";
  for (const auto& a : settings_.command) out += " " + a;
  return out + (settings_.batch ? " (batch)" : " (per-sentence)");
}

}  // namespace treegate::run
