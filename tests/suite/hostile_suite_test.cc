// Hostile suites at the loader level. Regression test for a gap found by the hostile-input
// tests: a suite with `cases: []` (or a treebank glob that matches nothing) loaded as an empty
// suite, and a run of it passed the gate with nothing tested.
#include <doctest/doctest.h>

#include <string>

#include "evaluator/errors.h"
#include "harness/suite/suite_loader.h"

namespace ts = treegate::suite;

TEST_CASE("empty_suite_passes_gate_regression: a suite without cases is an error") {
  CHECK_THROWS_WITH_AS(ts::load_suite_string("suite: empty\ncases: []\n", "empty.yaml"),
                       "empty.yaml:2:8: expected at least one case, found none (an empty suite "
                       "tests nothing)",
                       treegate::InputError);
}

TEST_CASE("hostile suite: a billion-laughs alias bomb is refused without expanding it") {
  std::string text = "suite: bomb\nconstructions:\n  - &a0 [lol, lol, lol, lol, lol, lol, lol]\n";
  for (int i = 1; i < 10; ++i) {
    text += "  - &a" + std::to_string(i) + " [";
    for (int k = 0; k < 9; ++k) text += (k ? ", *a" : "*a") + std::to_string(i - 1);
    text += "]\n";
  }
  text += "cases:\n  - id: x\n    tree: \"(S (NN a))\"\n";
  // 9^9 * 7 strings if expanded; the reader stops at the first item that is not a string.
  CHECK_THROWS_WITH_AS(ts::load_suite_string(text, "bomb.yaml"),
                       "bomb.yaml:3:5: expected a text value, found a list", treegate::InputError);
}

TEST_CASE("hostile suite: treebank paths outside the suite's folder are refused") {
  for (const char* pattern : {"../x/*.trees", "/etc/*.trees", "a/../../x.trees"}) {
    const std::string text = std::string("suite: out\ntreebank:\n  - files: ") + pattern + "\n";
    CHECK_THROWS_WITH_AS(
        ts::load_suite_string(text, "/tmp/s/out.yaml"),
        ("/tmp/s/out.yaml:3:12: refusing '" + std::string(pattern) +
         "': treebank paths must stay inside the suite's folder (no `..`, not absolute); set "
         "`allow_outside_paths: true` in treegate.yaml to allow it")
            .c_str(),
        treegate::InputError);
  }
}

TEST_CASE("yaml_error_message_newline_regression: YAML errors stay on one line") {
  // Found by fuzz_config: yaml-cpp quotes the offending character, here a newline after a
  // NUL byte, so the message had a line break. Every InputError is now one line.
  const std::string text("grammar: g.pcfg\n1#\0\n", 20);
  try {
    (void)ts::load_suite_string(text, "nul.yaml");
    FAIL("expected an InputError");
  } catch (const treegate::InputError& e) {
    CHECK(std::string(e.what()) == "nul.yaml:3:1: YAML syntax: unknown escape character: \\x0a");
  }
  // A quoted scalar with a newline, echoed in a type error.
  bool threw = false;
  try {
    (void)ts::load_suite_string("suite: x\nmin_f1: \"a\\nb\"\ncases: []\n", "f1.yaml");
  } catch (const treegate::InputError& e) {
    threw = true;
    CHECK(std::string(e.what()).find('\n') == std::string::npos);
    CHECK(std::string(e.what()).find("a\\x0ab") != std::string::npos);
  }
  CHECK(threw);
}

TEST_CASE("span_check_label_only_regression: a bracket check with a label and no span") {
  // Found by the CI fuzz smoke (fuzz_suite): "PP " (a label, then only spaces) threw
  // std::out_of_range from substr, which escaped the loader. It is now the case's own error.
  const ts::Suite s = ts::load_suite_string(
      "suite: s\ncases:\n  - {id: a, tree: \"(S (NN x))\", require: \"PP   \"}\n"
      "  - {id: b, tree: \"(S (NN y))\"}\n",
      "s.yaml");
  REQUIRE(s.cases.size() == 2);
  CHECK(s.cases[0].load_error ==
        "s.yaml:3:42: expected a bracket as LABEL FROM-TO (e.g. \"PP 6-8\"), found 'PP   ': no "
        "span after the label");
  CHECK(s.cases[1].load_error.empty());
}
