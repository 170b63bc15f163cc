// JUnit XML: one <testsuite> per suite, one <testcase> per case, one further suite of
// construction-gate test cases. Checked against the JUnit 10 schema in tests/e2e.
#include <pugixml.hpp>

#include <cstdio>
#include <set>
#include <sstream>

#include "harness/report/bracket_diff.h"
#include "harness/report/run_reports.h"
#include "harness/report/xml_text.h"

namespace treegate::report {
namespace {

using results::CaseRecord;
using results::Outcome;

std::string secs(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.3f", v < 0 ? 0.0 : v);
  return buf;
}

std::string num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2f", v);
  return buf;
}

void attr(pugi::xml_node n, const char* name, const std::string& value) {
  n.append_attribute(name) = xml_safe(value).c_str();
}

std::string classname(const std::string& suite) {
  std::string s = suite;
  for (char& c : s) {
    if (c == '.') c = '-';
  }
  return std::string(kJunitProjectWord) + "." + s;
}

std::string case_name(const CaseRecord& c, std::set<std::string>& used) {
  std::string name = c.id;
  std::string words;
  for (std::size_t i = 0; i < c.words.size() && i < 6; ++i) words += (i ? " " : "") + c.words[i];
  if (c.words.size() > 6) words += " ...";
  if (!words.empty()) name += ": " + words;
  std::string unique = name;
  for (int k = 2; !used.insert(unique).second; ++k) unique = name + " #" + std::to_string(k);
  return unique;
}

std::string details(const CaseRecord& c, const Scheme& scheme) {
  std::ostringstream out;
  out << "gold:      " << (c.gold.empty() ? "(none)" : c.gold) << "\n";
  out << "predicted: " << (c.predicted.empty() ? "(none)" : c.predicted) << "\n";
  const BracketDiff d = bracket_diff(c, scheme);
  if (!c.gold.empty() && !c.predicted.empty()) {
    out << "missing (gold only):    " << join_brackets(d.missing) << "\n";
    out << "extra (predicted only): " << join_brackets(d.extra) << "\n";
  }
  for (const auto& k : c.checks) out << (k.passed ? "ok     " : "FAILED ") << k.check << "\n";
  return out.str();
}

void add_case(pugi::xml_node suite, const CaseRecord& c, const results::RunResults& run,
              const std::optional<double>& baseline_f1, std::set<std::string>& used) {
  pugi::xml_node tc = suite.append_child("testcase");
  attr(tc, "name", case_name(c, used));
  attr(tc, "classname", classname(c.suite));
  attr(tc, "time", secs(c.seconds));
  const Scheme& scheme = run.header.scheme;
  std::string message = c.reason;
  if (baseline_f1) message += " (baseline F1 " + num(*baseline_f1) + ")";
  if (c.outcome == Outcome::kFail) {
    pugi::xml_node f = tc.append_child("failure");
    attr(f, "type", "check");
    attr(f, "message", "F1 " + num(c.f1) + " (threshold " + num(c.min_f1) + "): " + message);
    f.text().set(xml_safe(details(c, scheme)).c_str());
  } else if (c.outcome == Outcome::kError) {
    pugi::xml_node e = tc.append_child("error");
    attr(e, "type",
         c.parse == "not_run"          ? "suite"
         : c.score == "yield_mismatch" ? "yield"
                                       : "parse");
    attr(e, "message", message);
    e.text().set(xml_safe(details(c, scheme)).c_str());
  } else if (c.outcome == Outcome::kExpectedFailure) {
    attr(tc.append_child("skipped"), "message", "known failure: " + c.known_failure.value_or(""));
  } else if (c.outcome == Outcome::kUnexpectedPass) {
    const std::string news = "known failure now passes; remove its known_failure marker (" +
                             c.known_failure.value_or("") + ")";
    if (run.header.gate.fail_on_unexpected_pass) {
      pugi::xml_node f = tc.append_child("failure");
      attr(f, "type", "unexpected-pass");
      attr(f, "message", news);
    } else {
      tc.append_child("system-out").text().set(xml_safe(news).c_str());
    }
  }
}

void property(pugi::xml_node props, const char* name, const std::string& value) {
  pugi::xml_node p = props.append_child("property");
  attr(p, "name", name);
  attr(p, "value", value);
}

void add_construction_suite(pugi::xml_node root, const run::RunSummary& s) {
  pugi::xml_node suite = root.append_child("testsuite");
  std::size_t failures = 0;
  for (const auto& g : s.construction_gates) failures += g.passed ? 0 : 1;
  attr(suite, "name", "construction gates");
  attr(suite, "tests", std::to_string(s.construction_gates.size()));
  attr(suite, "failures", std::to_string(failures));
  attr(suite, "errors", "0");
  attr(suite, "skipped", "0");
  attr(suite, "time", "0.000");
  for (const auto& g : s.construction_gates) {
    pugi::xml_node tc = suite.append_child("testcase");
    attr(tc, "name", "construction " + g.name);
    attr(tc, "classname", std::string(kJunitProjectWord) + ".construction gates");
    attr(tc, "time", "0.000");
    if (!g.passed) {
      pugi::xml_node f = tc.append_child("failure");
      attr(f, "type", "construction-gate");
      attr(f, "message", g.detail);
    } else {
      tc.append_child("system-out").text().set(xml_safe(g.detail).c_str());
    }
  }
}

}  // namespace

std::string junit_xml(const results::RunResults& run, const run::RunSummary& s) {
  pugi::xml_document doc;
  pugi::xml_node root = doc.append_child("testsuites");
  attr(root, "name", kJunitProjectWord);
  std::size_t tests = 0, failures = 0, errors = 0;
  double total_time = 0;
  for (const auto& g : s.suites) {
    pugi::xml_node suite = root.append_child("testsuite");
    std::size_t f = 0, e = 0, sk = 0, n = 0;
    double time = 0;
    for (const auto& c : run.cases) {
      if (c.suite != g.name) continue;
      ++n;
      time += c.seconds;
      f += c.outcome == Outcome::kFail ||
           (c.outcome == Outcome::kUnexpectedPass && run.header.gate.fail_on_unexpected_pass);
      e += c.outcome == Outcome::kError;
      sk += c.outcome == Outcome::kExpectedFailure;
    }
    attr(suite, "name", g.name);
    attr(suite, "tests", std::to_string(n));
    attr(suite, "failures", std::to_string(f));
    attr(suite, "errors", std::to_string(e));
    attr(suite, "skipped", std::to_string(sk));
    attr(suite, "time", secs(time));
    pugi::xml_node props = suite.append_child("properties");
    const Figures fig = figures(g.counts);
    property(props, "f1", num(fig.f1));
    property(props, "precision", num(fig.precision));
    property(props, "recall", num(fig.recall));
    property(props, "exact_match", num(fig.exact_match));
    property(props, "passed", std::to_string(g.passed));
    property(props, "f1_delta", g.f1_delta ? num(*g.f1_delta) : "none");
    std::set<std::string> used;
    for (std::size_t i = 0; i < run.cases.size(); ++i) {
      if (run.cases[i].suite == g.name)
        add_case(suite, run.cases[i], run, s.baseline_case_f1[i], used);
    }
    tests += n;
    failures += f;
    errors += e;
    total_time += time;
  }
  add_construction_suite(root, s);
  for (const auto& g : s.construction_gates) failures += g.passed ? 0 : 1;
  tests += s.construction_gates.size();
  attr(root, "tests", std::to_string(tests));
  attr(root, "failures", std::to_string(failures));
  attr(root, "errors", std::to_string(errors));
  attr(root, "time", secs(total_time));
  std::ostringstream out;
  doc.save(out, "  ", pugi::format_default | pugi::format_no_declaration, pugi::encoding_utf8);
  return "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + out.str();
}

}  // namespace treegate::report
