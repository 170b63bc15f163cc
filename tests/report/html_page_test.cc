// The HTML report page: self-contained (no external reference), one row per case, trees for
// each case, data escaped everywhere, sortable tables with sign-and-arrow deltas, charts with
// one bar per value, and the view filled from results files.
#include <doctest/doctest.h>

#include <regex>
#include <string>

#include "evaluator/bracket_io.h"
#include "evaluator/tally.h"
#include "harness/report/html_chart.h"
#include "harness/report/html_escape.h"
#include "harness/report/html_from_results.h"
#include "harness/report/html_page.h"
#include "harness/report/html_table.h"
#include "harness/results/case_score.h"

namespace html = treegate::report::html;
namespace results = treegate::results;

namespace {

std::size_t count(const std::string& s, const std::string& what) {
  std::size_t n = 0;
  for (auto p = s.find(what); p != std::string::npos; p = s.find(what, p + 1)) ++n;
  return n;
}

results::CaseRecord record(const std::string& suite, const std::string& id, const std::string& gold,
                           const std::string& predicted, results::Outcome outcome) {
  results::CaseRecord c;
  c.suite = suite;
  c.id = id;
  c.gold = gold;
  c.predicted = predicted;
  c.outcome = outcome;
  treegate::Scorer scorer{treegate::Scheme{}};
  const auto g = treegate::parse_tree(gold);
  const auto t = predicted.empty() ? treegate::Tree() : treegate::parse_tree(predicted);
  for (auto w : g.words()) c.words.emplace_back(w);
  const auto s = scorer.score(g, t);
  treegate::results::set_score(c, s);
  return c;
}

const char* kGold =
    "(S (NP (NNS astronomers)) (VP (V saw) (NP (NP (NNS stars)) (PP (P with) (NP (NNS ears))))))";
const char* kVerb =
    "(S (NP (NNS astronomers)) (VP (VP (V saw) (NP (NNS stars))) (PP (P with) (NP (NNS ears)))))";

results::RunResults sample_run(bool attach_to_verb) {
  results::RunResults run;
  run.header.tool_version = "0.1.0";
  run.header.grammar = "g<1>.pcfg";
  run.cases.push_back(record("pp", "stars", kGold, attach_to_verb ? kVerb : kGold,
                             attach_to_verb ? results::Outcome::kFail : results::Outcome::kPass));
  run.cases.push_back(record("pp", "none", kGold, "", results::Outcome::kError));
  run.cases.back().reason = "no parse";
  // Hostile text in every field that comes from data.
  treegate::Tree t;
  const auto s = t.add_node("S", treegate::kNoNode);
  t.add_leaf("<script>alert(1)</script>", t.add_node("NN", t.add_node("NP", s)));
  t.add_leaf("]]>&\"'", t.add_node("VB", t.add_node("VP", s)));
  auto& h = run.cases.emplace_back();
  h.suite = "<b>suite</b>";
  h.id = "id\"><img src=x onerror=alert(1)>";
  h.constructions = {"</script><script>alert(2)</script>"};
  h.gold = h.predicted = treegate::to_bracketed(t);
  h.words = {"<script>alert(1)</script>", "]]>&\"'"};
  h.score = "scored";
  h.outcome = results::Outcome::kPass;
  h.f1 = 100;
  h.reason = "<i>why</i>";
  return run;
}

}  // namespace

TEST_CASE("html page: one self-contained file, one row per case, escaped data") {
  const auto run = sample_run(true);
  const auto view = html::view_of_run(run, nullptr, {false, {"F1 < 90 & more"}}, "today");
  const std::string page = html::render_html_report(view);
  CHECK(page.rfind("<!DOCTYPE html>", 0) == 0);
  CHECK(count(page, "<details class=\"case") == 3);
  CHECK(count(page, "<script") == 1);  // the page's own script, nothing from data
  CHECK(page.find("<img") == std::string::npos);
  CHECK(page.find("<b>suite") == std::string::npos);
  CHECK(page.find("&lt;b&gt;suite&lt;/b&gt;") != std::string::npos);
  CHECK(page.find("F1 &lt; 90 &amp; more") != std::string::npos);
  CHECK(page.find("&lt;i&gt;why&lt;/i&gt;") != std::string::npos);
  CHECK(page.find("g&lt;1&gt;.pcfg") != std::string::npos);
  CHECK(page.find("Gate failed") != std::string::npos);
  // Nothing is fetched: no URL of any scheme but the empty data: icon.
  CHECK_FALSE(std::regex_search(page, std::regex("(src|href)=\"(?!data:)")));
  CHECK(page.find("http://") == page.find("http://www.w3.org/2000/svg"));
  CHECK(page.find("https://") == std::string::npos);
  CHECK(page.find("@import") == std::string::npos);
  CHECK(page.find("url(") == page.find("url(#"));  // only pattern references inside the page
  // The failing case shows gold and predicted; the error case shows its note.
  CHECK(page.find("m-missing") != std::string::npos);
  CHECK(page.find("m-wrong") != std::string::npos);
  CHECK(page.find("no predicted tree") != std::string::npos);
}

TEST_CASE("html page: against a baseline, cases show baseline, new and gold trees") {
  const auto before = sample_run(false);
  const auto after = sample_run(true);
  const auto view = html::view_of_run(after, &before, {true, {}}, "today");
  CHECK(view.counts.broken == 1u);
  CHECK(view.counts.fixed == 0u);
  CHECK(view.cases[0].transition == "broken");
  CHECK(view.cases[2].transition == "unchanged");
  CHECK(view.summary.f1.before.has_value());
  const std::string page = html::render_html_report(view);
  const auto first = page.find("<details");
  const auto second = page.find("<details", first + 1);
  const std::string row = page.substr(first, second - first);
  CHECK(count(row, "<svg class=\"tree\"") == 3);
  CHECK(row.find("\xE2\x86\x93 broken") != std::string::npos);
  CHECK(page.find("id=\"filter-transition\"") != std::string::npos);
}

TEST_CASE("html tables: deltas carry a sign and an arrow, sort keys are numbers") {
  CHECK(html::delta_cell({91.5, 90.0}, 2).html.find("+1.50 \xE2\x96\xB2") != std::string::npos);
  CHECK(html::delta_cell({88.0, 90.0}, 2)
            .html.find("\xE2\x88\x92"
                       "2.00 \xE2\x96\xBC") != std::string::npos);
  CHECK(html::delta_cell({90.0, 90.0}, 2).html.find("= ") == std::string::npos);
  CHECK(html::delta_cell({90.0, 90.0}, 2).html.find("unchanged") != std::string::npos);
  CHECK(html::delta_cell({1.0, 2.0}, 2, false).html.find("better") != std::string::npos);
  CHECK(html::delta_cell({90.0, std::nullopt}, 2).html.empty());
  CHECK(html::delta_cell({91.5, 90.0}, 2).sort == "1.500000");
  html::Breakdown b{"suites", "By suite", "suite", "cases", {}, ""};
  b.rows.push_back({"a<b", 3, 2, {50, {}}, {50, {}}, {50, 40.0}});
  const std::string t = html::render_table(html::breakdown_table(b, true));
  CHECK(t.find("<td data-v=\"a&lt;b\">a&lt;b</td>") != std::string::npos);
  CHECK(t.find("data-v=\"10.000000\"") != std::string::npos);
  CHECK(count(t, "<th ") == 8);
}

TEST_CASE("html charts: one bar per value, hatched baseline, escaped names") {
  html::BarChart c{"c1", "F1 <by> length", {"1-10", "41+"}, {}, 100, 1};
  c.series.push_back({"old", {80.0, std::nullopt}, true});
  c.series.push_back({"new", {90.0, 70.0}, false});
  const std::string svg = html::render_bar_chart(c);
  CHECK(count(svg, "<rect class=\"bar") == 3);
  CHECK(count(svg, "class=\"bar old hatch\"") == 1);
  CHECK(svg.find("F1 &lt;by&gt; length") != std::string::npos);
  CHECK(svg.find(">90.0</text>") != std::string::npos);
  CHECK(html::render_bar_chart(html::BarChart{"c2", "empty", {}, {}, 0, 0}).empty());
  CHECK(html::round_up(87) == 100);
  CHECK(html::round_up(12) == 20);
  CHECK(html::round_up(2.1) == 2.5);
  CHECK(html::round_up(0) == 1);
}

TEST_CASE("html escape: characters, bad UTF-8, controls, script-safe JSON") {
  CHECK(html::escape("a<b>&\"'") == "a&lt;b&gt;&amp;&quot;&#39;");
  CHECK(html::escape("caf\xC3\xA9") == "caf\xC3\xA9");
  CHECK(html::escape("x\xFFy") == "x\xEF\xBF\xBDy");
  CHECK(html::escape("\xC0\x80") == "\xEF\xBF\xBD\xEF\xBF\xBD");  // overlong NUL
  CHECK(html::escape(std::string("a\0b\x01", 4)) ==
        "a\xEF\xBF\xBD"
        "b\xEF\xBF\xBD");
  CHECK(html::script_safe_json("\"</script>&\"") == "\"\\u003c/script\\u003e\\u0026\"");
  CHECK(html::text_width("abcd", 10) == doctest::Approx(24));
  CHECK(html::text_width("\xE6\xBC\xA2", 10) == doctest::Approx(12));  // a wide character
}

TEST_CASE("html view: length buckets and transitions") {
  CHECK(html::length_bucket(1) ==
        "1\xE2\x80\x93"
        "10");
  CHECK(html::length_bucket(10) ==
        "1\xE2\x80\x93"
        "10");
  CHECK(html::length_bucket(11) ==
        "11\xE2\x80\x93"
        "20");
  CHECK(html::length_bucket(40) ==
        "31\xE2\x80\x93"
        "40");
  CHECK(html::length_bucket(41) == "41+");
  results::CaseRecord a, b;
  a.outcome = results::Outcome::kFail;
  b.outcome = results::Outcome::kPass;
  CHECK(html::transition(a, b) == "fixed");
  CHECK(html::transition(b, a) == "broken");
  a.outcome = results::Outcome::kFail;
  b.outcome = results::Outcome::kFail;
  a.f1 = 50;
  b.f1 = 60;
  CHECK(html::transition(a, b) == "better");
  CHECK(html::transition(b, a) == "worse");
  b.f1 = 50;
  b.predicted = "(S (X y))";
  CHECK(html::transition(a, b) == "changed_same_f1");
  a.predicted = b.predicted;
  CHECK(html::transition(a, b) == "unchanged");
}
