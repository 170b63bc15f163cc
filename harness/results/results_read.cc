// Reading the results file: one JSON object per line; errors name file:line:col.
#include <algorithm>
#include <map>
#include <nlohmann/json.hpp>

#include "evaluator/errors.h"
#include "evaluator/file_text.h"
#include "harness/results/case_sax.h"
#include "harness/results/results.h"
#include "harness/results/results_json.h"

namespace treegate::results {
namespace {

using json = nlohmann::json;

Header read_header(const json& j) {
  Header h;
  get_whole(j, "treegate_results", h.format);
  if (h.format != kFormatVersion) {
    throw std::runtime_error("expected results format " + std::to_string(kFormatVersion) +
                             ", found " + std::to_string(h.format));
  }
  j.at("tool_version").get_to(h.tool_version);
  j.at("grammar").get_to(h.grammar);
  j.at("grammar_hash").get_to(h.grammar_hash);
  j.at("parser").get_to(h.parser);
  for (const auto& s : j.at("suites")) {
    std::size_t cases = 0;
    get_whole(s, "cases", cases);
    h.suites.push_back({s.at("name").get<std::string>(), s.at("file").get<std::string>(),
                        s.at("hash").get<std::string>(), cases});
  }
  h.scheme = scheme_from_json(j.at("scheme"));
  h.gate = gate_from_json(j.at("gate"));
  j.at("case_min_f1").get_to(h.case_min_f1);
  get_whole(j.at("shard"), "index", h.shard.index);
  get_whole(j.at("shard"), "count", h.shard.count);
  j.at("timings").get_to(h.timings);
  return h;
}

// nlohmann reports a byte offset in the line; turn it into a 1-based column.
std::size_t column_of(const json::parse_error& e) { return e.byte == 0 ? 1 : e.byte; }

}  // namespace

CaseRecord parse_case_line(std::string_view line, const std::string& source, std::size_t line_no) {
  CaseRecord c;
  std::size_t col = 1;
  std::string problem;
  try {
    problem = detail::read_case_line(line, c, col);
  } catch (const json::exception& e) {
    problem = std::string("expected a results case: ") + e.what();
    col = 1;
  }
  if (!problem.empty()) throw InputError(source, line_no, col, problem);
  return c;
}

Header parse_header_line(std::string_view line, const std::string& source, std::size_t line_no) {
  json j;
  try {
    j = json::parse(line);
  } catch (const json::parse_error& e) {
    throw InputError(source, line_no, column_of(e), "expected one JSON object per line");
  } catch (const json::exception& e) {  // e.g. a number too large for a double
    throw InputError(source, line_no, 1,
                     std::string("expected one JSON object per line: ") + e.what());
  }
  if (!j.is_object()) throw InputError(source, line_no, 1, "expected a JSON object");
  if (!j.contains("treegate_results")) {
    throw InputError(source, line_no, 1,
                     "expected a results header (key \"treegate_results\"); is this a "
                     "results file written by `treegate run`?");
  }
  try {
    return read_header(j);
  } catch (const json::exception& e) {
    throw InputError(source, line_no, 1, std::string("expected a results header: ") + e.what());
  } catch (const std::runtime_error& e) {
    if (dynamic_cast<const InputError*>(&e)) throw;
    throw InputError(source, line_no, 1, e.what());
  }
}

RunResults parse_results(const std::string& text, const std::string& source) {
  RunResults out;
  std::size_t line_no = 0, start = 0;
  bool have_header = false;
  while (start < text.size()) {
    std::size_t end = text.find('\n', start);
    if (end == std::string::npos) end = text.size();
    std::string_view line(text.data() + start, end - start);
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    ++line_no;
    start = end + 1;
    if (line.find_first_not_of(" \t") == std::string_view::npos) continue;
    if (have_header) {
      out.cases.push_back(parse_case_line(line, source, line_no));
    } else {
      out.header = parse_header_line(line, source, line_no);
      have_header = true;
    }
  }
  if (!have_header)
    throw InputError(source, 1, 1, "expected a results header, found an empty file");
  return out;
}

RunResults load_results(const std::string& path) {
  return parse_results(read_file_text(path), path);
}

void sort_canonical(RunResults& results) {
  std::map<std::string, std::size_t> position;
  for (std::size_t i = 0; i < results.header.suites.size(); ++i) {
    position.emplace(results.header.suites[i].name, i);
  }
  auto pos = [&](const std::string& s) {
    auto it = position.find(s);
    return it == position.end() ? position.size() : it->second;
  };
  std::stable_sort(results.cases.begin(), results.cases.end(),
                   [&](const CaseRecord& a, const CaseRecord& b) {
                     const auto pa = pos(a.suite), pb = pos(b.suite);
                     if (pa != pb) return pa < pb;
                     return a.n < b.n;
                   });
}

}  // namespace treegate::results
