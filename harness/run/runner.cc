// The worker pool: workers take batches of consecutive cases from a shared counter and write
// each record into its slot, so the order of the output never depends on timing.
#include "harness/run/runner.h"

#include <chrono>
#include <mutex>
#include <thread>

#include "evaluator/parseval.h"

namespace treegate::run {

std::vector<WorkItem> all_cases(const std::vector<suite::Suite>& suites) {
  std::vector<WorkItem> items;
  for (const auto& s : suites) {
    for (std::size_t i = 0; i < s.cases.size(); ++i) items.push_back({&s, &s.cases[i], i + 1});
  }
  return items;
}

namespace {

struct Shared {
  const std::vector<WorkItem>& items;
  const ParserFactory& parser;
  const RunOptions& options;
  std::size_t batch;
  std::atomic<std::size_t> next{0};
  std::atomic<std::size_t> done{0};
  std::vector<results::CaseRecord> records;
  std::vector<char> filled;
};

bool stopped(const RunOptions& o) { return o.stop && o.stop->load(); }

void work(Shared& sh) {
  std::unique_ptr<SentenceParser> parser = sh.parser.make();
  Scorer scorer(sh.options.scheme);
  std::vector<std::vector<std::string>> tags;
  std::vector<ParseRequest> requests;
  std::vector<std::size_t> slots;
  for (;;) {
    if (stopped(sh.options)) return;
    const std::size_t begin = sh.next.fetch_add(sh.batch);
    if (begin >= sh.items.size()) return;
    const std::size_t end = std::min(begin + sh.batch, sh.items.size());
    requests.clear();
    slots.clear();
    tags.assign(end - begin, {});
    for (std::size_t i = begin; i < end; ++i) {
      const suite::Case& c = *sh.items[i].item;
      if (!c.load_error.empty()) {
        sh.records[i] = record_case(sh.items[i], ParseOutcome(), scorer, sh.options);
        sh.filled[i] = 1;
        continue;
      }
      ParseRequest req{&c.words, nullptr};
      if (sh.parser.wants_tags()) {
        for (auto t : c.gold.tags()) tags[i - begin].emplace_back(t);
        req.tags = &tags[i - begin];
      }
      requests.push_back(req);
      slots.push_back(i);
    }
    if (!requests.empty()) {
      auto outcomes = parser->parse_batch(requests);
      if (stopped(sh.options)) return;
      for (std::size_t k = 0; k < slots.size(); ++k) {
        sh.records[slots[k]] =
            record_case(sh.items[slots[k]], std::move(outcomes[k]), scorer, sh.options);
        sh.filled[slots[k]] = 1;
      }
    }
    sh.done.fetch_add(end - begin);
  }
}

}  // namespace

std::vector<results::CaseRecord> run_cases(const std::vector<WorkItem>& items,
                                           const ParserFactory& parser, const RunOptions& options) {
  Shared sh{items,
            parser,
            options,
            std::max<std::size_t>(1, parser.batch_size()),
            {0},
            {0},
            std::vector<results::CaseRecord>(items.size()),
            std::vector<char>(items.size(), 0)};
  // With few cases, smaller batches keep every worker busy.
  const std::size_t jobs = std::max<std::size_t>(1, options.jobs);
  if (sh.batch > 1 && items.size() < sh.batch * jobs) {
    sh.batch = std::max<std::size_t>(1, (items.size() + jobs - 1) / jobs);
  }
  std::vector<std::thread> workers;
  for (std::size_t j = 0; j < jobs; ++j) workers.emplace_back(work, std::ref(sh));
  std::size_t shown = SIZE_MAX;
  auto report = [&] {
    const std::size_t d = std::min(sh.done.load(), items.size());
    if (options.progress && d != shown) options.progress(d, items.size());
    shown = d;
  };
  while (sh.done.load() < items.size() && !stopped(options)) {
    report();
    std::this_thread::sleep_for(std::chrono::milliseconds(50));
  }
  for (auto& w : workers) w.join();
  report();
  std::vector<results::CaseRecord> out;
  out.reserve(items.size());
  for (std::size_t i = 0; i < items.size(); ++i) {
    if (sh.filled[i]) out.push_back(std::move(sh.records[i]));
  }
  return out;
}

}  // namespace treegate::run
