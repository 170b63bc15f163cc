// Scoring settings from YAML: every key, defaults kept, and exact messages for bad values.
#include <doctest/doctest.h>

#include "evaluator/errors.h"
#include "harness/suite/scheme_yaml.h"
#include "harness/suite/yaml_util.h"

using namespace treegate;

namespace {

Scheme from(const std::string& text) {
  Scheme s;
  apply_scheme_yaml("s.yaml", yaml::load_string(text, "s.yaml"), s);
  return s;
}

std::string error_of(const std::string& text) {
  try {
    from(text);
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

}  // namespace

TEST_CASE("every scoring setting is read; missing ones keep the defaults") {
  const Scheme d = from("length_cutoff: 25\n");
  CHECK(d.length_cutoff == 25);
  CHECK(d.root_labels == std::vector<std::string>{"", "TOP", "ROOT"});
  CHECK(d.strip_function_tags);
  const Scheme s = from(
      "root_labels: [S1]\n"
      "skip_tags: [\",\", PUNCT]\n"
      "empty_tag: EMPTY\n"
      "strip_functions: false\n"
      "same_label: [[ADVP, PRT, RB], [NX, NP]]\n"
      "count_unparsed: no\n");
  CHECK(s.root_labels == std::vector<std::string>{"S1"});
  CHECK(s.ignored_tags == std::vector<std::string>{",", "PUNCT"});
  CHECK(s.empty_tag == "EMPTY");
  CHECK(!s.strip_function_tags);
  REQUIRE(s.equivalent_labels.size() == 2);
  CHECK(s.equivalent_labels[1] == std::vector<std::string>{"NX", "NP"});
  CHECK(!s.count_unparsed);
}

TEST_CASE("bad scoring settings: position, what was expected, the nearest key") {
  CHECK(error_of("strip_function: true\n") ==
        "s.yaml:1:1: unknown key 'strip_function' in the scoring settings; did you mean "
        "'strip_functions'?");
  CHECK(error_of("length_cutoff: forty\n") ==
        "s.yaml:1:16: expected a whole number from 1 to 1000000, found 'forty'");
  CHECK(error_of("count_unparsed: maybe\n") ==
        "s.yaml:1:17: expected true or false, found 'maybe'");
  CHECK(error_of("same_label: ADVP\n") ==
        "s.yaml:1:13: expected a list of label groups, e.g. [[ADVP, PRT]]");
  CHECK(error_of("skip_tags: [a, [b]]\n") == "s.yaml:1:16: expected a text value, found a list");
  CHECK(error_of("root_labels: [a\n").rfind("s.yaml:2:1: YAML syntax: ", 0) == 0);
  CHECK(error_of("- a\n") ==
        "s.yaml:1:1: expected the scoring settings as a map of keys, found a list");
}
