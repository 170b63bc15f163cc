#include "harness/suite/scheme_yaml.h"

#include "harness/suite/yaml_util.h"

namespace treegate {

void apply_scheme_yaml(const std::string& file, const YAML::Node& node, Scheme& scheme) {
  if (node.IsNull()) return;
  yaml::check_keys(file, node,
                   {"root_labels", "skip_tags", "empty_tag", "strip_functions", "same_label",
                    "length_cutoff", "count_unparsed"},
                   "the scoring settings");
  if (node["root_labels"]) scheme.root_labels = yaml::read_strings(file, node["root_labels"]);
  if (node["skip_tags"]) scheme.ignored_tags = yaml::read_strings(file, node["skip_tags"]);
  if (node["empty_tag"]) scheme.empty_tag = yaml::read_string(file, node["empty_tag"]);
  if (node["strip_functions"])
    scheme.strip_function_tags = yaml::read_bool(file, node["strip_functions"]);
  if (node["same_label"]) {
    const YAML::Node groups = node["same_label"];
    if (!groups.IsSequence())
      yaml::fail_at(file, groups, "expected a list of label groups, e.g. [[ADVP, PRT]]");
    scheme.equivalent_labels.clear();
    for (const auto& g : groups) scheme.equivalent_labels.push_back(yaml::read_strings(file, g));
  }
  if (node["length_cutoff"]) {
    scheme.length_cutoff =
        static_cast<std::size_t>(yaml::read_int(file, node["length_cutoff"], 1, 1000000));
  }
  if (node["count_unparsed"]) scheme.count_unparsed = yaml::read_bool(file, node["count_unparsed"]);
}

Scheme load_scheme_file(const std::string& path) {
  Scheme scheme;
  apply_scheme_yaml(path, yaml::load_file(path), scheme);
  return scheme;
}

}  // namespace treegate
