#include "harness/suite/suite_loader.h"

#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>

#include "evaluator/errors.h"
#include "harness/suite/config.h"

namespace ts = treegate::suite;

namespace {

const char* kSuite = R"Y(suite: pp
about: attachment
constructions: [pp]
min_f1: 90
cases:
  - id: a
    tree: "(S (NP (NN crane)) (VP (VB lifts) (NP (NN crate))))"
    text: crane lifts crate
    constructions: [pp-verb, pp]
    require: ["VP 2-3"]
    forbid: ["NP 1-3"]
  - id: b
    tree: "(S (NP (NN crane)) (VP (VB lifts)))"
    text: crane lifts crates
  - id: a
    tree: "(S (NN x))"
  - id: c
    tree: "(S (NN x)"
  - id: d
    tree: "(S (NN x))"
    require: ["PP 2-4"]
  - id: e
    tree: "(S (NN x))"
    known_failure: tagger
    min_f1: 50
)Y";

}  // namespace

TEST_CASE("suite loader: good cases load, each bad case keeps its own error") {
  const ts::Suite s = ts::load_suite_string(kSuite, "pp.yaml");
  CHECK(s.name == "pp");
  REQUIRE(s.cases.size() == 6);
  const ts::Case& a = s.cases[0];
  CHECK(a.load_error.empty());
  CHECK(a.words == std::vector<std::string>{"crane", "lifts", "crate"});
  CHECK(a.constructions == std::vector<std::string>{"pp", "pp-verb"});
  REQUIRE(a.require.size() == 1);
  CHECK(a.require[0].text() == "VP 2-3");
  CHECK(a.forbid[0].label == "NP");
  CHECK(a.source == "pp.yaml:6:5");
  CHECK(s.cases[1].load_error ==
        "pp.yaml:14:11: the text 'crane lifts crates' does not match the gold tree's words "
        "'crane lifts'");
  CHECK(s.cases[2].load_error == "pp.yaml:15:9: duplicate case id 'a' in suite 'pp'");
  CHECK(s.cases[2].id == "a (duplicate at pp.yaml:15:5)");
  CHECK(s.cases[3].load_error.rfind("pp.yaml:18:11: in the gold tree (column ", 0) == 0);
  CHECK(s.cases[4].load_error ==
        "pp.yaml:21:15: expected a bracket as LABEL FROM-TO (e.g. \"PP 6-8\"), found 'PP 2-4': "
        "the sentence has 1 word");
  CHECK(s.cases[5].known_failure == "tagger");
  CHECK(*s.cases[5].min_f1 == 50);
  CHECK(s.hash.size() == 16);
}

TEST_CASE("suite loader: a key given twice is an error at its second place") {
  const ts::Suite s = ts::load_suite_string(
      "suite: twice\ncases:\n  - id: a\n    tree: \"(S (NN a))\"\n    tree: \"(S (NN b))\"\n"
      "  - id: b\n    tree: \"(S (NN b))\"\n",
      "t.yaml");
  REQUIRE(s.cases.size() == 2);
  CHECK(s.cases[0].load_error == "t.yaml:5:5: key 'tree' given twice in a case");
  CHECK(s.cases[1].load_error.empty());  // the other case still runs
  CHECK_THROWS_WITH(ts::load_suite_string("suite: x\nsuite: y\ncases: []\n", "t.yaml"),
                    "t.yaml:2:1: key 'suite' given twice in a suite");
}

TEST_CASE("suite loader: whole-file problems throw with a position") {
  CHECK_THROWS_WITH(ts::load_suite_string("about: x\ncases: []\n", "s.yaml"),
                    "s.yaml:1:1: expected `suite:` (the suite's name)");
  CHECK_THROWS_WITH(ts::load_suite_string("suite: x\ncasse: []\n", "s.yaml"),
                    "s.yaml:2:1: unknown key 'casse' in a suite; did you mean 'cases'?");
  CHECK_THROWS_WITH(ts::load_suite_string("suite: a.b\ncases: []\n", "s.yaml"),
                    "s.yaml:1:8: expected a suite name without spaces or dots, e.g. pp-attachment");
  CHECK_THROWS_WITH(
      ts::load_suite_string("suite: x\ntreebank:\n  - files: ../held/*.trees\n", "s.yaml"),
      doctest::Contains("s.yaml:3:12: refusing '../held/*.trees'"));
  CHECK_THROWS_WITH(
      ts::load_suite_string("suite: x\ncases: []\n", "s.yaml"),
      "s.yaml:2:8: expected at least one case, found none (an empty suite tests nothing)");
  CHECK_THROWS_WITH(ts::load_suite_string("suite: x\ntreebank:\n  - files: /etc/*\n", "s.yaml"),
                    doctest::Contains("refusing '/etc/*'"));
}

namespace {

// A fresh temp folder with `s.yaml` and `held/part.trees`; returns the folder.
std::filesystem::path suite_folder(const std::string& name, const std::string& suite_yaml,
                                   const std::string& trees) {
  namespace fs = std::filesystem;
  const auto dir = fs::temp_directory_path() / name;
  fs::remove_all(dir);
  fs::create_directories(dir / "held");
  std::ofstream(dir / "held" / "part.trees") << trees;
  std::ofstream(dir / "s.yaml") << suite_yaml;
  return dir;
}

}  // namespace

TEST_CASE("suite loader: treebank cases get <stem>:<n> ids and bad trees stay errors") {
  namespace fs = std::filesystem;
  const auto dir = suite_folder("tg_suite_tb",
                                "suite: held\ntreebank:\n  - files: held/*.trees\n"
                                "    constructions: [ordinary]\n",
                                "(S (NN a))\n(S NN b))\n(S (NN c))\n");
  const ts::Suite s = ts::load_suite((dir / "s.yaml").string());
  REQUIRE(s.cases.size() == 3);
  CHECK(s.cases[0].id == "part:1");
  CHECK(s.cases[0].constructions == std::vector<std::string>{"ordinary"});
  CHECK(s.cases[2].id == "part:3");
  CHECK(s.cases[2].words == std::vector<std::string>{"c"});
  CHECK(!s.cases[1].load_error.empty());
  CHECK(s.cases[0].load_error.empty());
  fs::remove_all(dir);
}

TEST_CASE("suite loader: each case goes to the sink as it is read, and stays where it is") {
  namespace fs = std::filesystem;
  const auto dir = suite_folder("tg_suite_sink",
                                "suite: mixed\nconstructions: [t]\ncases:\n"
                                "  - {id: a, tree: \"(S (NN a))\"}\n"
                                "  - {id: b, tree: \"(S (NN b))\"}\n"
                                "treebank:\n  - files: held/*.trees\n",
                                "(S (NN c))\n(S (NN d))\n(S (NN e))\n");
  ts::Suite s;
  std::vector<const ts::Case*> seen;
  std::vector<std::size_t> positions;
  ts::load_suite_into((dir / "s.yaml").string(), {}, s,
                      [&](const ts::Suite& suite, const ts::Case& c, std::size_t n) {
                        CHECK(suite.name == "mixed");  // set before the first case
                        CHECK(suite.constructions == std::vector<std::string>{"t"});
                        seen.push_back(&c);
                        positions.push_back(n);
                      });
  REQUIRE(s.cases.size() == 5);
  CHECK(positions == std::vector<std::size_t>{1, 2, 3, 4, 5});
  for (std::size_t i = 0; i < 5; ++i) CHECK(seen[i] == &s.cases[i]);  // no case moved
  CHECK(s.cases[4].id == "part:3");
  CHECK(s.hash == ts::load_suite((dir / "s.yaml").string()).hash);
  fs::remove_all(dir);
}

TEST_CASE("config: keys, paths and errors") {
  const ts::ProjectConfig c = ts::load_config_string(
      "grammar: g.pcfg\nsuites: [suites/]\njobs: 2\nparser:\n  command: [./p, --fast]\n"
      "  mode: per-sentence\n  timeout_seconds: 5\ngate:\n  min_f1: 80\n"
      "  construction_min_f1: {pp: 70}\n  max_construction_drop: 2\n",
      "proj/treegate.yaml");
  CHECK(c.grammar == "proj/g.pcfg");
  CHECK(c.suites == std::vector<std::string>{"proj/suites/"});
  CHECK(c.jobs == 2);
  CHECK(!c.parser.builtin);
  CHECK(c.parser.command == std::vector<std::string>{"./p", "--fast"});
  CHECK(!c.parser.batch);
  CHECK(*c.gate.min_f1 == 80);
  CHECK(c.gate.construction_min_f1.at("pp") == 70);
  CHECK(*c.gate.max_construction_drop == 2);
  CHECK_THROWS_WITH(ts::load_config_string("gate:\n  min_f:  80\n", "t.yaml"),
                    "t.yaml:2:3: unknown key 'min_f' in the gate settings; did you mean 'min_f1'?");
  CHECK_THROWS_WITH(ts::load_config_string("gramar: g\n", "t.yaml"),
                    "t.yaml:1:1: unknown key 'gramar' in treegate.yaml; did you mean 'grammar'?");
  CHECK_THROWS_WITH(ts::load_config_string("parser:\n  command: ./p --fast\n", "t.yaml"),
                    doctest::Contains("t.yaml:2:12: expected the command as a list"));
}

TEST_CASE("config: the built-in parser's time limit and chart cap") {
  const ts::ProjectConfig d = ts::load_config_string("grammar: g.pcfg\n", "t.yaml");
  CHECK(d.parser.builtin);
  CHECK(d.parser.timeout_seconds == 60);
  CHECK(d.parser.max_chart_mb == 4096);
  const ts::ProjectConfig c = ts::load_config_string(
      "parser:\n  timeout_seconds: 2.5\n  max_chart_mb: 512\n  gold_tags: true\n", "t.yaml");
  CHECK(c.parser.builtin);
  CHECK(c.parser.timeout_seconds == 2.5);
  CHECK(c.parser.max_chart_mb == 512);
  CHECK(c.parser.gold_tags);
  CHECK_THROWS_WITH(ts::load_config_string("parser:\n  max_chart_mb: 0\n", "t.yaml"),
                    doctest::Contains("t.yaml:2:17:"));
  CHECK_THROWS_WITH(ts::load_config_string("parser:\n  timeout_seconds: -1\n", "t.yaml"),
                    "t.yaml:2:20: expected a positive number of seconds");
}
