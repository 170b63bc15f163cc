#include "harness/run/runner.h"

#include <doctest/doctest.h>

#include <chrono>
#include <map>
#include <thread>

#include "evaluator/bracket_io.h"
#include "harness/run/external_parser.h"
#include "harness/run/gate.h"
#include "harness/run/shard.h"
#include "harness/suite/suite_loader.h"

namespace tr = treegate::run;
namespace res = treegate::results;

namespace {

// Answers from a table keyed by the sentence; unknown sentences get no parse.
class TableParser : public tr::SentenceParser {
 public:
  explicit TableParser(const std::map<std::string, std::string>* table) : table_(table) {}
  tr::ParseOutcome parse(const tr::ParseRequest& r) override {
    std::string key;
    for (const auto& w : *r.words) key += (key.empty() ? "" : " ") + w;
    tr::ParseOutcome o;
    const auto it = table_->find(key);
    if (it == table_->end()) {
      o.status = tr::ParseStatus::kNoParse;
      o.reason = "not in the table";
      return o;
    }
    o.status = tr::ParseStatus::kParsed;
    o.tree = treegate::parse_tree(it->second);
    o.logprob = -1.5;
    o.seconds = 0.25;
    return o;
  }

 private:
  const std::map<std::string, std::string>* table_;
};

class TableFactory : public tr::ParserFactory {
 public:
  explicit TableFactory(std::map<std::string, std::string> t) : table_(std::move(t)) {}
  std::unique_ptr<tr::SentenceParser> make() const override {
    return std::make_unique<TableParser>(&table_);
  }
  std::string describe() const override { return "table"; }
  std::size_t batch_size() const override { return 3; }

 private:
  std::map<std::string, std::string> table_;
};

const char* kSuite = R"Y(suite: s
constructions: [all]
cases:
  - id: exact
    tree: "(S (NP (DT a) (NN b)) (VP (VB c) (NP (NN d))))"
    require: ["VP 3-4"]
  - id: wrong
    tree: "(S (NP (DT a) (NN b)) (VP (VB e) (NP (NN d))))"
    constructions: [verb]
    forbid: ["NP 2-4"]
  - id: loose
    tree: "(S (NP (DT a) (NN b)) (VP (VB f) (NP (NN d))))"
    min_f1: 50
  - id: known
    tree: "(S (NP (DT a) (NN b)) (VP (VB g) (NP (NN d))))"
    known_failure: tagger
  - id: known-ok
    tree: "(S (NP (DT a) (NN b)) (VP (VB h) (NP (NN d))))"
    known_failure: was broken
  - id: none
    tree: "(S (NN z))"
)Y";

std::map<std::string, std::string> table() {
  return {{"a b c d", "(S (NP (DT a) (NN b)) (VP (VB c) (NP (NN d))))"},
          {"a b e d", "(S (DT a) (NP (NN b) (VP (VB e) (NP (NN d)))))"},
          {"a b f d", "(S (DT a) (NP (NN b) (VP (VB f) (NP (NN d)))))"},
          {"a b g d", "(S (DT a) (NN b) (VB g) (NN d))"},
          {"a b h d", "(S (NP (DT a) (NN b)) (VP (VB h) (NP (NN d))))"}};
}

res::RunResults run_with(const TableFactory& parser, std::size_t jobs,
                         const treegate::suite::Suite& s) {
  tr::RunOptions o;
  o.jobs = jobs;
  o.timings = false;
  std::vector<treegate::suite::Suite> suites{s};
  res::RunResults r;
  r.header.suites = {{s.name, s.file, s.hash, s.cases.size()}};
  r.cases = tr::run_cases(tr::all_cases(suites), parser, o);
  return r;
}

}  // namespace

TEST_CASE("runner: outcomes of checks, thresholds and known failures") {
  const auto suite = treegate::suite::load_suite_string(kSuite, "s.yaml");
  const TableFactory parser(table());
  const res::RunResults r = run_with(parser, 2, suite);
  REQUIRE(r.cases.size() == 6);
  CHECK(r.cases[0].outcome == res::Outcome::kPass);
  CHECK(r.cases[1].outcome == res::Outcome::kFail);
  // By hand: gold S 1-4, NP 1-2, VP 3-4, NP 4-4; test S 1-4, NP 2-4, VP 3-4, NP 4-4: 3 of 4
  // match, so precision = recall = F1 = 75.
  CHECK(r.cases[1].reason ==
        "F1 75 is below the threshold 100; forbidden bracket NP 2-4 is present");
  CHECK(r.cases[2].outcome == res::Outcome::kPass);  // 75 >= 50
  CHECK(r.cases[3].outcome == res::Outcome::kExpectedFailure);
  CHECK(r.cases[4].outcome == res::Outcome::kUnexpectedPass);
  CHECK(r.cases[5].outcome == res::Outcome::kError);
  CHECK(r.cases[5].reason == "not in the table");
  CHECK(r.cases[1].constructions == std::vector<std::string>{"all", "verb"});
  CHECK(r.cases[0].seconds == 0);  // timings left out
}

TEST_CASE("runner: the same bytes for any number of workers") {
  std::string text = "suite: big\ncases:\n";
  std::map<std::string, std::string> t;
  for (int i = 0; i < 200; ++i) {
    const std::string w = "w" + std::to_string(i);
    text += "  - {id: c" + std::to_string(i) + ", tree: \"(S (NP (NN " + w + ")) (VP (VB x)))\"}\n";
    if (i % 3)
      t["" + w + " x"] =
          i % 2 ? "(S (NP (NN " + w + ")) (VP (VB x)))" : "(S (NN " + w + ") (VB x))";
  }
  const auto suite = treegate::suite::load_suite_string(text, "big.yaml");
  const TableFactory parser(t);
  const std::string one = res::results_text(run_with(parser, 1, suite));
  CHECK(res::results_text(run_with(parser, 2, suite)) == one);
  CHECK(res::results_text(run_with(parser, 7, suite)) == one);
}

TEST_CASE("runner: cases fed while the run goes on all run, and reach on_record in order") {
  std::string text = "suite: fed\ncases:\n";
  std::map<std::string, std::string> t;
  for (int i = 0; i < 60; ++i) {
    const std::string w = "w" + std::to_string(i);
    text += "  - {id: c" + std::to_string(i) + ", tree: \"(S (NN " + w + "))\"}\n";
    if (i % 4) t[w] = "(S (NN " + w + "))";
  }
  const auto suite = treegate::suite::load_suite_string(text, "fed.yaml");
  const TableFactory parser(t);  // batches of 3
  tr::RunOptions o;
  o.jobs = 2;
  o.timings = false;
  std::vector<std::string> handed;
  o.on_record = [&](res::CaseRecord& r) { handed.push_back(r.id); };
  tr::CaseFeed feed;
  std::thread loader([&] {  // a slow loader: the workers wait for cases, then for a full batch
    for (std::size_t i = 0; i < suite.cases.size(); ++i) {
      feed.add({&suite, &suite.cases[i], i + 1});
      std::this_thread::sleep_for(std::chrono::milliseconds(1));
    }
    feed.close();
  });
  const auto records = tr::run_cases(feed, parser, o);
  loader.join();
  REQUIRE(records.size() == 60);
  REQUIRE(handed.size() == 60);
  for (std::size_t i = 0; i < 60; ++i) {
    CHECK(records[i].id == "c" + std::to_string(i));
    CHECK(handed[i] == records[i].id);
  }
  CHECK(records[0].outcome == res::Outcome::kError);  // c0 is not in the table
  CHECK(records[1].outcome == res::Outcome::kPass);
  // The same records as from a list known beforehand.
  o.on_record = nullptr;
  res::RunResults streamed, listed;
  streamed.cases = records;
  std::vector<treegate::suite::Suite> suites{suite};
  listed.cases = tr::run_cases(tr::all_cases(suites), parser, o);
  CHECK(res::results_text(streamed) == res::results_text(listed));
}

TEST_CASE("runner: a feed closed incomplete (loading failed) ends the run early") {
  const auto suite = treegate::suite::load_suite_string(kSuite, "s.yaml");
  const TableFactory parser(table());
  tr::RunOptions o;
  o.jobs = 2;
  tr::CaseFeed feed;
  feed.add({&suite, &suite.cases[0], 1});
  feed.close(false);
  const auto records = tr::run_cases(feed, parser, o);  // returns: no worker waits for more
  CHECK(records.size() <= 1);
}

TEST_CASE("gate: regressions, fixes and the rule that failed") {
  const auto suite = treegate::suite::load_suite_string(kSuite, "s.yaml");
  auto t = table();
  const res::RunResults before = run_with(TableFactory(t), 1, suite);
  t["a b c d"] = "(S (DT a) (NN b) (VB c) (NN d))";                 // exact -> broken
  t["a b e d"] = "(S (NP (DT a) (NN b)) (VP (VB e) (NP (NN d))))";  // wrong -> fixed
  res::RunResults now = run_with(TableFactory(t), 1, suite);
  now.header.gate.max_construction_drop = 5;
  now.header.gate.allowed_new_failures = 0;
  const tr::RunSummary s = tr::summarize(now, &before);
  REQUIRE(s.regressions.size() == 1);
  CHECK(s.regressions[0].id == "exact");
  REQUIRE(s.fixes.size() == 1);
  CHECK(s.fixes[0].id == "wrong");
  CHECK(!s.gate_passed);
  CHECK(s.gate_reasons ==
        std::vector<std::string>{
            "1 case that passed in the baseline fails now (gate.allowed_new_failures 0)"});
  // Without a baseline no case passed before, so none counts against allowed_new_failures.
  const tr::RunSummary alone = tr::summarize(now, nullptr);
  CHECK(alone.gate_passed);
  CHECK(alone.failed + alone.errors == 2);
  CHECK(alone.passed + alone.failed + alone.errors + alone.expected_failures +
            alone.unexpected_passes ==
        6);
}

TEST_CASE("external parser output: wrong line counts and garbage become per-case errors") {
  tr::ProcessResult clean;
  clean.started = clean.exited = true;
  clean.out = "(S (NN a))\n()\n(((\n";
  std::size_t answered = 0;
  auto out = tr::read_parser_output(clean, 3, answered);
  CHECK(answered == 3);
  CHECK(out[0].status == tr::ParseStatus::kParsed);
  CHECK(out[1].status == tr::ParseStatus::kNoParse);
  CHECK(out[2].status == tr::ParseStatus::kError);
  CHECK(out[2].reason.rfind("the parser's output is not a tree: parser output line 3:", 0) == 0);
  out = tr::read_parser_output(clean, 2, answered);
  CHECK(out[0].reason ==
        "the parser wrote 3 lines for 2 sentences, so no line can be matched to its sentence");
  tr::ProcessResult crashed = clean;
  crashed.exited = false;
  crashed.signal = 11;
  crashed.out = "(S (NN a))\n(S (NN";
  out = tr::read_parser_output(crashed, 3, answered);
  CHECK(answered == 1);  // the partial line does not count
  CHECK(out[0].status == tr::ParseStatus::kParsed);
}

TEST_CASE("external parser: a real process, argument list kept whole, timeout") {
  tr::ExternalParserSettings s;
  // printf prints its argument once; the argument keeps its spaces and `;` because no shell
  // is involved.
  s.command = {"printf", "(S (NN a;b))\\n"};
  s.batch = false;
  s.timeout_seconds = 5;
  tr::ExternalParserFactory f(s);
  auto p = f.make();
  const std::vector<std::string> words{"a;b"};
  const auto o = p->parse({&words, nullptr});
  CHECK(o.status == tr::ParseStatus::kParsed);
  CHECK(treegate::to_bracketed(o.tree) == "(S (NN a;b))");
  s.command = {"sleep", "5"};
  s.timeout_seconds = 0.3;
  const auto t = tr::ExternalParserFactory(s).make()->parse({&words, nullptr});
  CHECK(t.status == tr::ParseStatus::kError);
  CHECK(t.reason.rfind("parser timed out on this sentence", 0) == 0);
  s.command = {"/no/such/program"};
  const auto m = tr::ExternalParserFactory(s).make()->parse({&words, nullptr});
  CHECK(m.reason.rfind("could not start the parser: '/no/such/program': ", 0) == 0);
}

TEST_CASE("shards: every case in exactly one shard") {
  CHECK(tr::parse_shard("2/3").index == 2);
  CHECK_THROWS_WITH(tr::parse_shard("4/3"),
                    "--shard: expected K/N with 1 <= K <= N (e.g. 2/3), found '4/3'");
  CHECK_THROWS(tr::parse_shard("1/0"));
  std::size_t per[3] = {0, 0, 0};
  for (int i = 0; i < 300; ++i) {
    int hits = 0;
    for (std::size_t k = 1; k <= 3; ++k) {
      if (tr::in_shard("s", "c" + std::to_string(i), {k, 3})) {
        ++hits;
        ++per[k - 1];
      }
    }
    CHECK(hits == 1);
  }
  for (auto n : per) CHECK(n > 50);  // roughly even
}
