// treegate parse: parse tokenised sentences (one per line) with a grammar file.
#include <fstream>
#include <iostream>
#include <nlohmann/json.hpp>
#include <thread>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "evaluator/file_text.h"
#include "harness/cli/command.h"
#include "harness/pcfg/batch.h"

namespace treegate::cli {
namespace {

using pcfg::ParseResult;
using pcfg::ParseStatus;

const char* status_name(ParseStatus s) {
  return s == ParseStatus::parsed ? "parsed" : s == ParseStatus::no_parse ? "no_parse" : "error";
}

nlohmann::ordered_json to_json(std::size_t line, const ParseResult& r) {
  nlohmann::ordered_json j = {
      {"line", line}, {"status", status_name(r.status)}, {"reason", r.reason}};
  const bool ok = r.status == ParseStatus::parsed;
  j["tree"] = ok ? nlohmann::ordered_json(to_bracketed(r.tree)) : nlohmann::ordered_json(nullptr);
  j["logprob"] = ok ? nlohmann::ordered_json(r.logprob) : nlohmann::ordered_json(nullptr);
  j["inside_logprob"] =
      ok ? nlohmann::ordered_json(r.inside_logprob) : nlohmann::ordered_json(nullptr);
  j["parses"] = ok ? nlohmann::ordered_json(r.parses) : nlohmann::ordered_json(nullptr);
  j["parses_exact"] = ok && r.parses_exact;
  j["parses_infinite"] = ok && r.parses_infinite;
  j["kbest"] = nlohmann::ordered_json::array();
  for (const pcfg::ScoredTree& t : r.kbest) {
    j["kbest"].push_back({{"tree", to_bracketed(t.tree)}, {"logprob", t.logprob}});
  }
  j["seconds"] = r.seconds;
  return j;
}

void print_text(std::size_t line, const ParseResult& r, bool kbest) {
  if (r.status != ParseStatus::parsed) {
    std::cerr << "treegate parse: line " << line << ": " << status_name(r.status) << ": "
              << r.reason << "\n";
  }
  if (!kbest) {
    std::cout << (r.status == ParseStatus::parsed ? to_bracketed(r.tree) : "()") << "\n";
    return;
  }
  for (const pcfg::ScoredTree& t : r.kbest)
    std::cout << t.logprob << "\t" << to_bracketed(t.tree) << "\n";
  std::cout << "\n";
}

int run_parse(int argc, char** argv) {
  const Usage usage{
      "parse", "--grammar GRAMMAR [FILE|-] [options]",
      "Parse tokenised sentences, one per line, with the built-in exhaustive CKY "
      "parser; print the most probable tree of each.",
      "echo 'The crew lifted the crate with the torn label .' | treegate parse --grammar "
      "suites/demo/v1.pcfg --format json",
      "0 done (sentences without a parse included), 2 bad usage or unreadable grammar/input"};
  po::options_description opts("options");
  std::string grammar_file, input = "-", format = "text";
  std::size_t kbest = 0, max_chart_mb = 4096;
  double timeout_seconds = 60;
  unsigned jobs = 1;
  opts.add_options()("grammar,g", po::value(&grammar_file)->required(), "grammar file (.pcfg)")(
      "input", po::value(&input),
      "sentences, one per line, words separated by spaces (- for stdin)")(
      "kbest", po::value(&kbest), "also list the K most probable trees")(
      "tags", "tokens are WORD_TAG (split at the last '_'); the tags are fixed")(
      "format", po::value(&format), "text (default): one tree per line; json: one object per line")(
      "jobs,j", po::value(&jobs), "parse on N threads (output order stays the input order)")(
      "max-chart-mb", po::value(&max_chart_mb),
      "refuse sentences whose chart needs more (default 4096)")(
      "timeout-seconds", po::value(&timeout_seconds),
      "give up on a sentence after this long (default 60; 0: no limit)");
  po::positional_options_description pos;
  pos.add("input", 1);
  po::variables_map vm;
  if (int code = parse_command_line(argc, argv, usage, opts, pos, vm); code >= 0) return code;
  if (format != "text" && format != "json")
    return fail("parse", "--format must be text or json, not '" + format + "'");
  if (jobs == 0) jobs = std::max(1u, std::thread::hardware_concurrency());
  std::shared_ptr<const pcfg::CompiledGrammar> grammar;
  std::vector<pcfg::Sentence> sentences;
  const bool tagged = vm.count("tags") > 0;
  try {
    grammar = pcfg::load_compiled_grammar(grammar_file);
    std::ifstream file;
    if (input != "-") file = open_input_file(input);
    std::istream& in = input == "-" ? std::cin : file;
    std::size_t number = 0;
    for (std::string line; std::getline(in, line);)
      sentences.push_back(pcfg::read_sentence(line, ++number, tagged));
  } catch (const InputError& e) {
    return fail("parse", e.what());
  }
  if (const std::string w = grammar->skipped_rules_warning(); !w.empty())
    std::cerr << "treegate parse: warning: " << w << "\n";
  pcfg::ParseOptions options;
  options.gold_tags = tagged;
  options.kbest = kbest;
  options.max_chart_bytes = max_chart_mb << 20;
  if (!(timeout_seconds >= 0))
    return fail("parse", "--timeout-seconds must be 0 (no limit) or a positive number");
  options.max_seconds = timeout_seconds;
  std::cout.precision(17);
  pcfg::parse_in_order(grammar, sentences, options, jobs, [&](std::size_t i, ParseResult& r) {
    if (format == "json") {
      std::cout << to_json(sentences[i].line, r).dump() << "\n";
    } else {
      print_text(sentences[i].line, r, kbest > 0);
    }
  });
  std::cout.flush();
  return std::cout ? kExitOk : fail("parse", "cannot write the output");
}

const Registration reg({"parse", "parse sentences with a grammar file (CKY, Viterbi tree, k best)",
                        &run_parse});

}  // namespace
}  // namespace treegate::cli
