#include "harness/results/results.h"

#include <doctest/doctest.h>

#include <algorithm>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <fstream>

#include "evaluator/errors.h"

namespace tr = treegate::results;

namespace {

tr::RunResults sample() {
  tr::RunResults r;
  r.header.tool_version = "0.1.0";
  r.header.grammar = "g.pcfg";
  r.header.grammar_hash = tr::fnv1a64_hex("abc");
  r.header.parser = "builtin";
  r.header.suites = {{"pp", "pp.yaml", "0123456789abcdef", 2}};
  r.header.gate.min_f1 = 80;
  r.header.gate.construction_min_f1["pp-verb"] = 90;
  tr::CaseRecord c;
  c.suite = "pp";
  c.id = "crane \"hook\" <&>";
  c.n = 1;
  c.words = {"The", "crane", "caf\xc3\xa9"};
  c.gold = "(S (NP (DT The) (NN crane)) (VP (VB caf\xc3\xa9)))";
  c.predicted = c.gold;
  c.parse = "parsed";
  c.score = "scored";
  c.outcome = tr::Outcome::kPass;
  c.logprob = -3.25;
  c.parses = 2;
  c.gold_brackets = c.test_brackets = c.matched = 2;
  c.f1 = 100;
  c.checks.push_back({"require NP 1-2", true, ""});
  r.cases.push_back(c);
  c.n = 2;
  c.id = "second";
  c.outcome = tr::Outcome::kExpectedFailure;
  c.known_failure = "tagger";
  c.logprob.reset();
  r.cases.push_back(c);
  return r;
}

}  // namespace

TEST_CASE("results: text round-trips through parse_results") {
  const tr::RunResults r = sample();
  const std::string text = tr::results_text(r);
  const tr::RunResults back = tr::parse_results(text, "r.jsonl");
  CHECK(tr::results_text(back) == text);
  REQUIRE(back.cases.size() == 2);
  CHECK(back.cases[0].id == "crane \"hook\" <&>");
  CHECK(back.cases[1].outcome == tr::Outcome::kExpectedFailure);
  CHECK(!back.cases[1].logprob.has_value());
  CHECK(back.header.gate.construction_min_f1.at("pp-verb") == 90);
  // One line per case plus the header.
  CHECK(std::count(text.begin(), text.end(), '\n') == 3);
}

TEST_CASE("results: a case line read back replaces text that is not UTF-8") {
  tr::CaseRecord c;
  c.suite = "s";
  c.id = "bad\xff";
  c.n = 1;
  c.words = {"caf\xc3\xa9", "x\xc3"};
  c.f1 = 2.0 / 3.0;
  c.logprob = -1e-300;
  const std::string line = tr::case_line(c);
  CHECK(line.find('\n') == std::string::npos);
  const tr::CaseRecord back = tr::parse_case_line(line, "r.jsonl", 7);
  CHECK(back.id == "bad\xef\xbf\xbd");  // U+FFFD
  CHECK(back.words == std::vector<std::string>{"caf\xc3\xa9", "x\xef\xbf\xbd"});
  CHECK(back.f1 == c.f1);  // numbers come back exactly
  CHECK(back.logprob == c.logprob);
  CHECK_THROWS_WITH(tr::parse_case_line("{\"suite\": 1}", "r.jsonl", 7),
                    doctest::Contains("r.jsonl:7:"));
  CHECK_THROWS_WITH(tr::parse_header_line("{}", "r.jsonl", 1),
                    doctest::Contains("r.jsonl:1:1: expected a results header"));
}

TEST_CASE("results: bad lines name file:line:col") {
  const std::string header = tr::results_text(tr::RunResults{});
  try {
    tr::parse_results(header + "{\"suite\" \"x\"}\n", "bad.jsonl");
    FAIL("no error");
  } catch (const treegate::InputError& e) {
    CHECK(std::string(e.what()) == "bad.jsonl:2:10: expected one JSON object per line");
  }
  CHECK_THROWS_WITH(tr::parse_results(header + "{\"suite\": 3}\n", "bad.jsonl"),
                    "bad.jsonl:2:1: unexpected number at key 'suite'");
  try {
    tr::parse_results(header + "{\"suite\": \"x\"}\n", "bad.jsonl");
    FAIL("no error");
  } catch (const treegate::InputError& e) {
    CHECK(std::string(e.what()).rfind("bad.jsonl:2:1: expected a results case: ", 0) == 0);
  }
  CHECK_THROWS_WITH(tr::parse_results("{\"a\":1}\n", "x.jsonl"),
                    doctest::Contains("x.jsonl:1:1: expected a results header"));
}

TEST_CASE("results: write_results replaces the file atomically") {
  const auto dir = std::filesystem::temp_directory_path() / "tg_results_test";
  std::filesystem::remove_all(dir);
  std::filesystem::create_directories(dir);
  const std::string path = (dir / "r.jsonl").string();
  tr::write_results(path, sample());
  tr::write_results(path, sample());
  CHECK(tr::load_results(path).cases.size() == 2);
  // Nothing but the file itself is left in the folder (no temp files).
  std::size_t files = 0;
  for (const auto& e : std::filesystem::directory_iterator(dir)) files += e.is_regular_file();
  CHECK(files == 1);
  CHECK_THROWS_AS(tr::write_results((dir / "no/such/dir/r.jsonl").string(), sample()),
                  treegate::InputError);
  std::filesystem::remove_all(dir);
}

TEST_CASE("results: fnv1a64 matches the published test vectors") {
  // Fowler/Noll/Vo FNV-1a 64-bit test vectors (isthe.com/chongo/tech/comp/fnv, "FNV test
  // vectors"; values recalled from memory): "" -> cbf29ce484222325, "a" -> af63dc4c8601ec8c.
  CHECK(tr::fnv1a64_hex("") == "cbf29ce484222325");
  CHECK(tr::fnv1a64_hex("a") == "af63dc4c8601ec8c");
}

TEST_CASE("results_huge_float_count_regression: whole-number fields refuse floats out of range") {
  // Found by fuzz_results: a suite's "cases" of 7.7e54 was cast to an integer (undefined).
  std::string text = tr::results_text(sample());
  const std::string key = "\"cases\":";
  const auto at = text.find(key);
  REQUIRE(at != std::string::npos);
  const auto end = text.find_first_of(",}", at);
  text.replace(at + key.size(), end - at - key.size(), "7.77778e+54");
  CHECK_THROWS(tr::parse_results(text, "r.jsonl"));
}

TEST_CASE("results_number_overflow_regression: a number too large for a double is an input error") {
  // Found by fuzz_results: nlohmann's out_of_range for "-4.3e1111111" escaped as a crash.
  CHECK_THROWS_AS(tr::parse_results("{\"treegate_results\":1,\"x\":-4.3e1111111}\n", "r.jsonl"),
                  treegate::InputError);
}

TEST_CASE("results_case_count_regression: a case's counts must be whole numbers in range") {
  // Found by the CI fuzz smoke (fuzz_results): a case's "n" of 1e300 was cast to an integer
  // (undefined behaviour). Counts that are negative, fractional or too large are input errors.
  for (const char* bad : {"1e300", "-1", "2.5"}) {
    for (const char* key : {"\"n\":", "\"matched\":"}) {
      std::string text = tr::results_text(sample());
      const auto at = text.rfind(key);
      REQUIRE(at != std::string::npos);
      const auto end = text.find_first_of(",}", at);
      text.replace(at + std::strlen(key), end - at - std::strlen(key), bad);
      CAPTURE(bad);
      CAPTURE(key);
      CHECK_THROWS_AS(tr::parse_results(text, "r.jsonl"), treegate::InputError);
    }
  }
}
