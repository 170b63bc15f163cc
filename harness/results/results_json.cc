#include "harness/results/results_json.h"

#include <stdexcept>

namespace treegate::results {

using ojson = nlohmann::ordered_json;
using json = nlohmann::json;

ojson scheme_to_json(const Scheme& s) {
  ojson j;
  j["root_labels"] = s.root_labels;
  j["skip_tags"] = s.ignored_tags;
  j["empty_tag"] = s.empty_tag;
  j["strip_functions"] = s.strip_function_tags;
  j["same_label"] = s.equivalent_labels;
  j["length_cutoff"] = s.length_cutoff;
  j["count_unparsed"] = s.count_unparsed;
  return j;
}

Scheme scheme_from_json(const json& j) {
  Scheme s;
  j.at("root_labels").get_to(s.root_labels);
  j.at("skip_tags").get_to(s.ignored_tags);
  j.at("empty_tag").get_to(s.empty_tag);
  j.at("strip_functions").get_to(s.strip_function_tags);
  j.at("same_label").get_to(s.equivalent_labels);
  get_whole(j, "length_cutoff", s.length_cutoff);
  j.at("count_unparsed").get_to(s.count_unparsed);
  return s;
}

ojson gate_to_json(const suite::GateSettings& g) {
  ojson j;
  j["min_f1"] = g.min_f1 ? ojson(*g.min_f1) : ojson(nullptr);
  j["suite_min_f1"] = ojson::object();
  for (const auto& [k, v] : g.suite_min_f1) j["suite_min_f1"][k] = v;
  j["construction_min_f1"] = ojson::object();
  for (const auto& [k, v] : g.construction_min_f1) j["construction_min_f1"][k] = v;
  j["allowed_new_failures"] = g.allowed_new_failures;
  j["max_construction_drop"] =
      g.max_construction_drop ? ojson(*g.max_construction_drop) : ojson(nullptr);
  j["fail_on_unexpected_pass"] = g.fail_on_unexpected_pass;
  return j;
}

suite::GateSettings gate_from_json(const json& j) {
  suite::GateSettings g;
  if (!j.at("min_f1").is_null()) g.min_f1 = j.at("min_f1").get<double>();
  j.at("suite_min_f1").get_to(g.suite_min_f1);
  j.at("construction_min_f1").get_to(g.construction_min_f1);
  get_whole(j, "allowed_new_failures", g.allowed_new_failures);
  if (!j.at("max_construction_drop").is_null()) {
    g.max_construction_drop = j.at("max_construction_drop").get<double>();
  }
  j.at("fail_on_unexpected_pass").get_to(g.fail_on_unexpected_pass);
  return g;
}

}  // namespace treegate::results
