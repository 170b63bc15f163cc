// Writing the results file: a fixed key order (nlohmann::ordered_json) so that files diff well.
#include <unistd.h>

#include <cstdio>
#include <fstream>
#include <nlohmann/json.hpp>

#include "evaluator/errors.h"
#include "harness/results/atomic_file.h"
#include "harness/results/results.h"
#include "harness/results/results_json.h"
#include "harness/suite/hash.h"

namespace treegate::results {

using ojson = nlohmann::ordered_json;

const char* outcome_name(Outcome outcome) {
  switch (outcome) {
    case Outcome::kPass:
      return "pass";
    case Outcome::kFail:
      return "fail";
    case Outcome::kError:
      return "error";
    case Outcome::kExpectedFailure:
      return "expected_failure";
    case Outcome::kUnexpectedPass:
      return "unexpected_pass";
  }
  return "error";
}

std::optional<Outcome> outcome_from_name(const std::string& name) {
  for (Outcome o : {Outcome::kPass, Outcome::kFail, Outcome::kError, Outcome::kExpectedFailure,
                    Outcome::kUnexpectedPass}) {
    if (name == outcome_name(o)) return o;
  }
  return std::nullopt;
}

namespace {

template <class T>
ojson opt(const std::optional<T>& v) {
  return v ? ojson(*v) : ojson(nullptr);
}

ojson header_json(const Header& h) {
  ojson j;
  j["treegate_results"] = h.format;
  j["tool_version"] = h.tool_version;
  j["grammar"] = h.grammar;
  j["grammar_hash"] = h.grammar_hash;
  j["parser"] = h.parser;
  ojson suites = ojson::array();
  for (const auto& s : h.suites) {
    suites.push_back({{"name", s.name}, {"file", s.file}, {"hash", s.hash}, {"cases", s.cases}});
  }
  j["suites"] = suites;
  j["scheme"] = scheme_to_json(h.scheme);
  j["gate"] = gate_to_json(h.gate);
  j["case_min_f1"] = h.case_min_f1;
  j["shard"] = {{"index", h.shard.index}, {"count", h.shard.count}};
  j["timings"] = h.timings;
  return j;
}

ojson case_json(const CaseRecord& c) {
  ojson j;
  j["suite"] = c.suite;
  j["id"] = c.id;
  j["n"] = c.n;
  j["words"] = c.words;
  j["constructions"] = c.constructions;
  j["gold"] = c.gold;
  j["predicted"] = c.predicted;
  j["parse"] = c.parse;
  j["score"] = c.score;
  j["outcome"] = outcome_name(c.outcome);
  j["reason"] = c.reason;
  j["logprob"] = opt(c.logprob);
  j["inside_logprob"] = opt(c.inside_logprob);
  j["parses"] = opt(c.parses);
  j["gold_brackets"] = c.gold_brackets;
  j["test_brackets"] = c.test_brackets;
  j["matched"] = c.matched;
  j["crossing"] = c.crossing;
  j["scored_words"] = c.scored_words;
  j["tags_correct"] = c.tags_correct;
  j["f1"] = c.f1;
  j["min_f1"] = c.min_f1;
  j["known_failure"] = opt(c.known_failure);
  ojson checks = ojson::array();
  for (const auto& k : c.checks) {
    checks.push_back({{"check", k.check}, {"passed", k.passed}, {"detail", k.detail}});
  }
  j["checks"] = checks;
  j["seconds"] = c.seconds;
  return j;
}

// Bytes that are not valid UTF-8 become U+FFFD, so every line is valid JSON.
constexpr auto kReplace = nlohmann::json::error_handler_t::replace;

}  // namespace

std::string header_line(const Header& header) {
  return header_json(header).dump(-1, ' ', false, kReplace);
}

std::string case_line(const CaseRecord& c) { return case_json(c).dump(-1, ' ', false, kReplace); }

std::string results_text(const RunResults& results) {
  std::string out = header_line(results.header);
  out += '\n';
  for (const auto& c : results.cases) {
    out += case_line(c);
    out += '\n';
  }
  return out;
}

void write_results(const std::string& path, const RunResults& results) {
  write_file_atomically(path, results_text(results));
}

std::string fnv1a64_hex(const std::string& bytes) { return suite::fnv1a64_hex(bytes); }
std::string hash_file(const std::string& path) { return suite::hash_file(path); }

}  // namespace treegate::results
