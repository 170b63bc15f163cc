#include "harness/run/regression_run.h"

#include <deque>
#include <filesystem>
#include <future>
#include <set>
#include <thread>

#include "evaluator/errors.h"
#include "harness/run/external_parser.h"
#include "harness/run/runner.h"
#include "harness/run/shard.h"
#include "harness/suite/hash.h"
#include "harness/suite/suite_loader.h"
#include "treegate_version.h"

#ifdef TREEGATE_HAVE_PCFG
#include "harness/run/builtin_parser.h"
#endif

namespace treegate::run {
namespace {

struct LoadStopped {};  // thrown by the case sink when the run is stopped while loading

// Reads the suites into `suites`, handing each case of the shard to `feed` as soon as it is
// read, and closes the feed (incomplete when loading fails or is stopped). Returns the
// number of cases handed over.
std::size_t load_suites(const RunRequest& r, std::deque<suite::Suite>& suites, CaseFeed& feed) {
  std::size_t fed = 0;
  try {
    if (r.config.suites.empty()) {
      throw InputError("no suites: name them with --suite PATH or `suites:` in treegate.yaml");
    }
    suite::SuiteLoadOptions options;
    options.allow_outside_paths = r.config.allow_outside_paths;
    const auto sink = [&](const suite::Suite& s, const suite::Case& c, std::size_t n) {
      if (r.stop && r.stop->load()) throw LoadStopped{};
      if (in_shard(s.name, c.id, r.shard)) {
        feed.add({&s, &c, n});
        ++fed;
      }
    };
    std::set<std::string> names;
    for (const auto& path : suite::expand_suite_paths(r.config.suites)) {
      suite::Suite& s = suites.emplace_back();
      suite::load_suite_into(path, options, s, sink);
      if (!names.insert(s.name).second) {
        throw InputError(path + ": a second suite is named '" + s.name +
                         "'; suite names must be unique in a run");
      }
    }
  } catch (const LoadStopped&) {
    feed.close(false);
    return fed;
  } catch (...) {
    feed.close(false);
    throw;
  }
  feed.close();
  return fed;
}

results::Header make_header(const RunRequest& r, const std::deque<suite::Suite>& suites,
                            const ParserFactory& parser) {
  results::Header h;
  h.tool_version = TREEGATE_VERSION;
  h.grammar = r.config.grammar;
  std::error_code ec;
  if (!h.grammar.empty() && std::filesystem::is_regular_file(h.grammar, ec)) {
    h.grammar_hash = suite::hash_file(h.grammar);
  }
  h.parser = parser.describe();
  for (const auto& s : suites) h.suites.push_back({s.name, s.file, s.hash, s.cases.size()});
  h.scheme = r.config.scheme;
  h.gate = r.config.gate;
  h.case_min_f1 = r.config.case_min_f1;
  h.shard = r.shard;
  h.timings = r.timings;
  return h;
}

}  // namespace

std::unique_ptr<ParserFactory> make_parser(const suite::ProjectConfig& config,
                                           const std::atomic<bool>* stop) {
  const suite::ParserConfig& p = config.parser;
  if (!p.builtin) {
    ExternalParserSettings s;
    s.command = p.command;
    s.batch = p.batch;
    s.batch_size = p.batch_size;
    s.timeout_seconds = p.timeout_seconds;
    return std::make_unique<ExternalParserFactory>(s, stop);
  }
#ifdef TREEGATE_HAVE_PCFG
  if (config.grammar.empty()) {
    throw InputError("no grammar: give --grammar FILE or `grammar:` in treegate.yaml");
  }
  BuiltinSettings s;
  s.gold_tags = p.gold_tags;
  s.max_seconds = p.timeout_seconds;
  s.max_chart_bytes = p.max_chart_mb << 20;
  s.stop = stop;
  return make_builtin_parser(config.grammar, s);
#else
  throw InputError(
      "this build has no built-in parser; set `parser: {command: [...]}` in treegate.yaml");
#endif
}

RunOutcome execute_run(const RunRequest& request) {
  // The suites are read on one thread while the grammar loads (and compiles) on this one;
  // the workers start on the first cases while later ones are still being read. A suite
  // error is reported first, also when the grammar fails too.
  std::deque<suite::Suite> suites;
  CaseFeed feed;
  auto loading = std::async(std::launch::async, [&] { return load_suites(request, suites, feed); });
  std::unique_ptr<ParserFactory> parser;
  try {
    parser = make_parser(request.config, request.stop);
  } catch (...) {
    loading.get();  // throws the suite error, if there is one
    throw;
  }
  if (request.warn) {
    for (const std::string& w : parser->warnings()) request.warn(w);
  }
  RunOutcome out;
  RunOptions options;
  options.jobs = request.jobs ? request.jobs : request.config.jobs;
  if (options.jobs == 0) options.jobs = std::max(1u, std::thread::hardware_concurrency());
  options.scheme = request.config.scheme;
  options.case_min_f1 = request.config.case_min_f1;
  options.timings = request.timings;
  options.stop = request.stop;
  options.progress = request.progress;
  std::size_t line_no = 1;  // the header is line 1
  options.on_record = [&](results::CaseRecord& record) {
    const std::string line = results::case_line(record);
    record = results::parse_case_line(line, "(this run)", ++line_no);
    out.case_lines += line;
    out.case_lines += '\n';
  };
  ignore_sigpipe();
  out.results.cases = run_cases(feed, *parser, options);
  const std::size_t fed = loading.get();  // throws a suite error (the workers have stopped)
  out.results.header = make_header(request, suites, *parser);
  out.interrupted = out.results.cases.size() != fed || (request.stop && request.stop->load());
  return out;
}

}  // namespace treegate::run
