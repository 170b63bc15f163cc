#include "harness/run/regression_run.h"

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

std::vector<suite::Suite> load_suites(const suite::ProjectConfig& config) {
  if (config.suites.empty()) {
    throw InputError("no suites: name them with --suite PATH or `suites:` in treegate.yaml");
  }
  suite::SuiteLoadOptions options;
  options.allow_outside_paths = config.allow_outside_paths;
  std::vector<suite::Suite> suites;
  std::set<std::string> names;
  for (const auto& path : suite::expand_suite_paths(config.suites)) {
    suites.push_back(suite::load_suite(path, options));
    if (!names.insert(suites.back().name).second) {
      throw InputError(path + ": a second suite is named '" + suites.back().name +
                       "'; suite names must be unique in a run");
    }
  }
  return suites;
}

results::Header make_header(const RunRequest& r, const std::vector<suite::Suite>& suites,
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

results::RunResults execute_run(const RunRequest& request, bool& interrupted) {
  // The grammar loads (and compiles) on a second thread while the suites are read; a suite
  // error is still reported first (the grammar thread is then waited for and its result
  // dropped).
  auto loading =
      std::async(std::launch::async, [&] { return make_parser(request.config, request.stop); });
  const std::vector<suite::Suite> suites = load_suites(request.config);
  const std::unique_ptr<ParserFactory> parser = loading.get();
  if (request.warn) {
    for (const std::string& w : parser->warnings()) request.warn(w);
  }
  std::vector<WorkItem> items;
  for (const auto& item : all_cases(suites)) {
    if (in_shard(item.suite->name, item.item->id, request.shard)) items.push_back(item);
  }
  RunOptions options;
  options.jobs = request.jobs ? request.jobs : request.config.jobs;
  if (options.jobs == 0) options.jobs = std::max(1u, std::thread::hardware_concurrency());
  options.scheme = request.config.scheme;
  options.case_min_f1 = request.config.case_min_f1;
  options.timings = request.timings;
  options.stop = request.stop;
  options.progress = request.progress;
  ignore_sigpipe();
  results::RunResults out;
  out.header = make_header(request, suites, *parser);
  out.cases = run_cases(items, *parser, options);
  interrupted = out.cases.size() != items.size() || (request.stop && request.stop->load());
  return out;
}

}  // namespace treegate::run
