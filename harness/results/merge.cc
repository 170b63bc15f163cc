#include "harness/results/merge.h"

#include <map>
#include <set>

#include "evaluator/errors.h"
#include "harness/results/results_json.h"

namespace treegate::results {
namespace {

// The header with the shard left out, as text: parts of one run have equal texts.
std::string run_identity(const Header& h) {
  Header copy = h;
  copy.shard = {};
  RunResults r;
  r.header = copy;
  return results_text(r);
}

std::string first_difference(const Header& a, const Header& b) {
  if (a.grammar_hash != b.grammar_hash || a.grammar != b.grammar) return "the grammar";
  if (a.parser != b.parser) return "the parser";
  if (a.tool_version != b.tool_version) return "the treegate version";
  if (a.suites.size() != b.suites.size()) return "the suites";
  for (std::size_t i = 0; i < a.suites.size(); ++i) {
    if (a.suites[i].name != b.suites[i].name || a.suites[i].hash != b.suites[i].hash ||
        a.suites[i].cases != b.suites[i].cases) {
      return "suite " + a.suites[i].name;
    }
  }
  if (scheme_to_json(a.scheme) != scheme_to_json(b.scheme)) return "the scoring scheme";
  if (gate_to_json(a.gate) != gate_to_json(b.gate) || a.case_min_f1 != b.case_min_f1)
    return "the gate settings";
  if (a.timings != b.timings) return "whether timings are kept";
  if (a.shard.count != b.shard.count) return "the number of shards";
  return "the header";
}

}  // namespace

RunResults merge_results(const std::vector<RunResults>& parts,
                         const std::vector<std::string>& names) {
  if (parts.empty()) throw InputError("merge: expected at least one results file");
  const Header& first = parts.front().header;
  const std::string identity = run_identity(first);
  std::set<std::size_t> shards;
  for (std::size_t i = 0; i < parts.size(); ++i) {
    const Header& h = parts[i].header;
    if (run_identity(h) != identity || h.shard.count != first.shard.count) {
      throw InputError(names[i] + ": not a shard of the same run as " + names[0] + ": " +
                       first_difference(first, h) + " differs");
    }
    if (!shards.insert(h.shard.index).second) {
      throw InputError(names[i] + ": shard " + std::to_string(h.shard.index) + "/" +
                       std::to_string(h.shard.count) + " is given twice");
    }
  }
  if (shards.size() != first.shard.count) {
    std::string missing;
    for (std::size_t k = 1; k <= first.shard.count; ++k) {
      if (!shards.count(k)) missing += (missing.empty() ? "" : ", ") + std::to_string(k);
    }
    throw InputError("merge: shards missing: " + missing + " of " +
                     std::to_string(first.shard.count));
  }
  RunResults out;
  out.header = first;
  out.header.shard = {};
  std::map<std::pair<std::string, std::size_t>, std::string> seen;
  for (std::size_t i = 0; i < parts.size(); ++i) {
    for (const auto& c : parts[i].cases) {
      auto [it, fresh] = seen.emplace(std::make_pair(c.suite, c.n), names[i]);
      if (!fresh) {
        throw InputError(names[i] + ": case " + c.suite + "/" + c.id + " is also in " + it->second);
      }
      out.cases.push_back(c);
    }
  }
  for (const auto& s : first.suites) {
    for (std::size_t n = 1; n <= s.cases; ++n) {
      if (!seen.count({s.name, n})) {
        throw InputError("merge: case " + std::to_string(n) + " of suite " + s.name +
                         " is in none of the files (was a shard interrupted?)");
      }
    }
  }
  if (seen.size() != out.cases.size())
    throw InputError("merge: the files hold cases of unknown suites");
  sort_canonical(out);
  return out;
}

}  // namespace treegate::results
