// The worker pool: workers claim batches of consecutive cases from the feed and leave each
// parser outcome in the case's slot; the calling thread scores the slots in order, so the
// order of the output never depends on timing, and hands each record on.
#include "harness/run/runner.h"

#include <chrono>
#include <condition_variable>
#include <deque>
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

struct CaseFeed::State {
  struct Slot {
    explicit Slot(const WorkItem& i) : item(i) {}
    WorkItem item;
    ParseOutcome outcome;             // from a worker
    std::atomic<bool> filled{false};  // set (release) after `outcome` is written
    results::CaseRecord record;       // from the calling thread
  };
  std::mutex mutex;  // guards the fields below (a slot's contents are its claimer's)
  std::condition_variable changed;
  std::deque<Slot> slots;  // a slot stays at its address while more are added
  std::size_t next = 0;    // the first slot not yet claimed by a worker
  std::size_t waiting = 0;
  bool closed = false, complete = true;
};

CaseFeed::CaseFeed() : state_(std::make_unique<State>()) {}
CaseFeed::~CaseFeed() = default;

void CaseFeed::add(const WorkItem& item) {
  const std::lock_guard<std::mutex> lock(state_->mutex);
  state_->slots.emplace_back(item);
  if (state_->waiting) state_->changed.notify_all();  // no system call while all are busy
}

void CaseFeed::close(bool complete) {
  const std::lock_guard<std::mutex> lock(state_->mutex);
  state_->closed = true;
  state_->complete = complete;
  state_->changed.notify_all();
}

namespace {

using Slot = CaseFeed::State::Slot;

bool stopped(const RunOptions& o) { return o.stop && o.stop->load(); }

struct Shared {
  CaseFeed::State& feed;
  const ParserFactory& parser;
  const RunOptions& options;
  std::size_t batch, jobs;
  std::atomic<std::size_t> done{0};
  std::atomic<std::size_t> running{0};  // workers that have not returned yet
};

// The next batch of slots for a worker; empty when the feed is closed and drained, or the
// run stopped. A full batch is waited for until the feed is closed; then the rest is shared
// out in smaller batches, so that every worker stays busy.
std::vector<Slot*> claim(Shared& sh) {
  CaseFeed::State& f = sh.feed;
  std::unique_lock<std::mutex> lock(f.mutex);
  for (;;) {
    if (stopped(sh.options) || (f.closed && !f.complete)) return {};
    const std::size_t ready = f.slots.size() - f.next;
    std::size_t take = 0;
    if (f.closed) {
      if (ready == 0) return {};
      take = std::min(sh.batch, std::max<std::size_t>(1, (ready + sh.jobs - 1) / sh.jobs));
    } else if (ready >= sh.batch) {
      take = sh.batch;
    }
    if (take > 0) {
      std::vector<Slot*> out;
      for (std::size_t i = 0; i < take; ++i) out.push_back(&f.slots[f.next + i]);
      f.next += take;
      return out;
    }
    ++f.waiting;
    f.changed.wait_for(lock, std::chrono::milliseconds(50));  // also to see `stop`
    --f.waiting;
  }
}

void work_batches(Shared& sh) {
  std::unique_ptr<SentenceParser> parser = sh.parser.make();
  std::vector<std::vector<std::string>> tags;
  std::vector<ParseRequest> requests;
  std::vector<Slot*> parsed;
  for (;;) {
    const std::vector<Slot*> batch = claim(sh);
    if (batch.empty()) return;
    requests.clear();
    parsed.clear();
    tags.assign(batch.size(), {});
    for (std::size_t i = 0; i < batch.size(); ++i) {
      Slot& slot = *batch[i];
      const suite::Case& c = *slot.item.item;
      if (!c.load_error.empty()) {
        slot.filled.store(true, std::memory_order_release);
        continue;
      }
      ParseRequest req{&c.words, nullptr};
      if (sh.parser.wants_tags()) {
        for (auto t : c.gold.tags()) tags[i].emplace_back(t);
        req.tags = &tags[i];
      }
      requests.push_back(req);
      parsed.push_back(&slot);
    }
    if (!requests.empty()) {
      auto outcomes = parser->parse_batch(requests);
      if (stopped(sh.options)) return;
      for (std::size_t k = 0; k < parsed.size(); ++k) {
        parsed[k]->outcome = std::move(outcomes[k]);
        parsed[k]->filled.store(true, std::memory_order_release);
      }
    }
    sh.done.fetch_add(batch.size());
  }
}

void work(Shared& sh) {
  work_batches(sh);
  sh.running.fetch_sub(1);
}

// The slot at `index` once it is filled; nullptr while it is not (or does not exist yet).
Slot* filled_slot(CaseFeed::State& f, std::size_t index) {
  const std::lock_guard<std::mutex> lock(f.mutex);
  if (index >= f.slots.size()) return nullptr;
  Slot& slot = f.slots[index];
  return slot.filled.load(std::memory_order_acquire) ? &slot : nullptr;
}

std::size_t known_cases(CaseFeed::State& f) {
  const std::lock_guard<std::mutex> lock(f.mutex);
  return f.slots.size();
}

}  // namespace

std::vector<results::CaseRecord> run_cases(CaseFeed& feed, const ParserFactory& parser,
                                           const RunOptions& options) {
  CaseFeed::State& f = *feed.state_;
  const std::size_t jobs = std::max<std::size_t>(1, options.jobs);
  Shared sh{f, parser, options, std::max<std::size_t>(1, parser.batch_size()), jobs, {0}, {jobs}};
  std::vector<std::thread> workers;
  for (std::size_t j = 0; j < jobs; ++j) workers.emplace_back(work, std::ref(sh));
  std::size_t shown = SIZE_MAX, handed = 0;
  auto report = [&] {
    const std::size_t total = known_cases(f), d = std::min(sh.done.load(), total);
    if (options.progress && d != shown) options.progress(d, total);
    shown = d;
  };
  Scorer scorer(options.scheme);
  auto hand_over = [&] {  // scores and checks the cases parsed so far, in order
    while (Slot* slot = filled_slot(f, handed)) {
      slot->record = record_case(slot->item, std::move(slot->outcome), scorer, options);
      if (options.on_record) options.on_record(slot->record);
      ++handed;
    }
  };
  // Polled, not signalled: waking this thread after every case would cost the workers a
  // system call each (measured: about 25 us per case on a 2-core virtual machine).
  while (sh.running.load() > 0) {
    report();
    hand_over();
    std::this_thread::sleep_for(std::chrono::milliseconds(5));
  }
  for (auto& w : workers) w.join();
  report();
  if (!stopped(options)) hand_over();
  std::vector<results::CaseRecord> out;
  const std::lock_guard<std::mutex> lock(f.mutex);
  out.reserve(f.slots.size());
  for (std::size_t i = 0; i < handed; ++i) out.push_back(std::move(f.slots[i].record));
  return out;
}

std::vector<results::CaseRecord> run_cases(const std::vector<WorkItem>& items,
                                           const ParserFactory& parser, const RunOptions& options) {
  CaseFeed feed;
  for (const WorkItem& item : items) feed.add(item);
  feed.close();
  return run_cases(feed, parser, options);
}

}  // namespace treegate::run
