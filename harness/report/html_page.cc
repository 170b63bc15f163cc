#include "harness/report/html_page.h"

#include <algorithm>
#include <set>

#include <fmt/format.h>

#include "harness/report/html_assets.h"
#include "harness/report/html_case.h"
#include "harness/report/html_chart.h"
#include "harness/report/html_escape.h"
#include "harness/report/html_table.h"
#include "harness/results/atomic_file.h"

namespace treegate::report::html {
namespace {

std::string header(const ReportView& v) {
  std::string out =
      "<header class=\"top\"><div class=\"inner\"><h1>" + escape(v.title) + "</h1><dl>";
  for (const auto& [role, path] : v.grammars) {
    out += "<div><dt>" + escape(role) + "</dt><dd>" + escape(path) + "</dd></div>";
  }
  if (!v.date.empty()) out += "<div><dt>date</dt><dd>" + escape(v.date) + "</dd></div>";
  out += "<div><dt>treegate</dt><dd>" + escape(v.tool_version) + "</dd></div></dl></div></header>";
  return out;
}

std::string gate(const ReportView& v) {
  std::string out = fmt::format(
      "<section class=\"gate {}\" id=\"gate\"><h2>{}</h2>", v.gate_passed ? "pass" : "fail",
      v.gate_passed ? "\xE2\x9C\x93 Gate passed: this grammar may go in"
                    : "\xE2\x9C\x97 Gate failed: this grammar breaks the rules below");
  if (!v.gate_reasons.empty()) {
    out += "<ul>";
    for (const auto& r : v.gate_reasons) out += "<li>" + escape(r) + "</li>";
    out += "</ul>";
  }
  return out + "</section>";
}

std::string card(const char* name, const Figure& f, int decimals, bool higher_is_better,
                 const char* unit) {
  return fmt::format(
      "<div class=\"card\"><div class=\"k\">{}</div><div class=\"v\">{}{}</div>"
      "<div class=\"d\">{}</div></div>",
      name, fixed(f.value, decimals), std::isnan(f.value) ? "" : unit,
      delta_html(f, decimals, higher_is_better));
}

std::string summary(const ReportView& v) {
  const SummaryView& s = v.summary;
  std::string out = "<section id=\"summary\"><h2 class=\"sec\">Summary</h2>";
  if (v.summary.f1.before) {
    out += "<p class=\"note\">Changes are against " + escape(v.before_name) +
           "; \xE2\x96\xB2 up, \xE2\x96\xBC down, = unchanged.</p>";
  }
  out += "<div class=\"cards\">";
  out += card("precision", s.precision, 2, true, "");
  out += card("recall", s.recall, 2, true, "");
  out += card("F1", s.f1, 2, true, "");
  out += card("exact match", s.exact_match, 1, true, "%");
  out += card("crossing / sentence", s.crossing_avg, 2, false, "");
  out += card("tag accuracy", s.tag_accuracy, 1, true, "%");
  out += "</div><ul class=\"counts\" id=\"counts\">";
  const CountsView& c = v.counts;
  auto chip = [&](const char* name, std::size_t n) {
    out += fmt::format("<li>{} <b>{}</b></li>", name, n);
  };
  chip("cases", c.cases);
  chip("\xE2\x9C\x93 passed", c.passed);
  chip("\xE2\x9C\x97 failed", c.failed);
  chip("! errors", c.errors);
  chip("\xE2\x97\x8B expected failures", c.expected_failures);
  chip("\xE2\x98\x85 unexpected passes", c.unexpected_passes);
  if (c.fixed) chip("\xE2\x86\x91 fixed", *c.fixed);
  if (c.broken) chip("\xE2\x86\x93 broken", *c.broken);
  out += "</ul>";
  if (!v.notes.empty()) {
    out += "<div class=\"notes\">";
    for (const auto& n : v.notes) out += "<p>" + escape(n) + "</p>";
    out += "</div>";
  }
  return out + "</section>";
}

std::string charts(const ReportView& v) {
  const bool before = v.summary.f1.before.has_value() || v.comparison;
  BarChart len{"chart-length", "F1 by sentence length (words)", {}, {}, 100, 1};
  Series old_len{v.before_name, {}, true}, new_len{v.after_name, {}, false};
  for (const auto& r : v.lengths) {
    len.categories.push_back(r.name);
    old_len.values.push_back(r.f1.before);
    new_len.values.push_back(r.cases > 0 ? std::optional<double>(r.f1.value) : std::nullopt);
  }
  if (before) len.series.push_back(old_len);
  len.series.push_back(new_len);
  BarChart err{"chart-errors", "Errors by class (count)", {}, {}, 0, 0};
  Series old_err{v.before_name, {}, true}, new_err{v.after_name, {}, false};
  for (const auto& r : v.error_classes) {
    err.categories.push_back(r.name);
    old_err.values.push_back(r.before ? std::optional<double>(static_cast<double>(*r.before))
                                      : std::nullopt);
    new_err.values.push_back(static_cast<double>(r.count));
  }
  if (before) err.series.push_back(old_err);
  err.series.push_back(new_err);
  std::string a = render_bar_chart(len), b = render_bar_chart(err);
  if (a.empty() && b.empty()) return "";
  if (b.empty() && !v.error_classes_note.empty()) {
    b = "<p class=\"note\">" + escape(v.error_classes_note) + "</p>";
  }
  return "<section id=\"charts\"><h2 class=\"sec\">Charts</h2><div class=\"charts\">" + a + b +
         "</div></section>";
}

std::string tables(const ReportView& v) {
  const bool before = v.summary.f1.before.has_value() || v.comparison;
  std::string out =
      "<section id=\"tables\"><h2 class=\"sec\">Breakdowns</h2>"
      "<p class=\"note\">Click a column heading to sort.</p><div class=\"grid\">";
  auto block = [&](const std::string& title, const std::string& body) {
    out += "<div class=\"block\"><h3>" + escape(title) + "</h3>" + body + "</div>";
  };
  for (const auto& b : v.tables) block(b.title, render_table(breakdown_table(b, before)));
  if (!v.lengths.empty()) {
    Breakdown len{"lengths", "By sentence length", "length", "cases", v.lengths, ""};
    block(len.title, render_table(breakdown_table(len, before)));
  }
  std::string errors;
  if (v.error_classes.empty()) {
    errors = "<p class=\"note\">" +
             escape(v.error_classes_note.empty() ? "No error classes in this report."
                                                 : v.error_classes_note) +
             "</p>";
  } else {
    errors = render_table(error_class_table(v.error_classes, before, v.before_name, v.after_name));
    errors +=
        "<p class=\"table-note\">Errors, not brackets: one error may account for several "
        "wrong brackets (see docs/html.md).</p>";
  }
  block("By error class", errors);
  return out + "</div></section>";
}

std::string select(const char* id, const char* label, const std::set<std::string>& values) {
  std::string out = fmt::format(
      "<label for=\"filter-{}\">{}<select id=\"filter-{}\">"
      "<option value=\"\">all</option>",
      id, label, id);
  for (const auto& v : values) {
    out += "<option value=\"" + escape(v) + "\">" + escape(v) + "</option>";
  }
  return out + "</select></label>";
}

std::string cases(const ReportView& v, const PageOptions& o) {
  std::set<std::string> suites, cons, statuses, transitions;
  for (const auto& c : v.cases) {
    suites.insert(c.suite);
    cons.insert(c.constructions.begin(), c.constructions.end());
    statuses.insert(c.status);
    if (!c.transition.empty()) transitions.insert(c.transition);
  }
  std::string out = "<section id=\"cases\"><h2 class=\"sec\">Cases</h2><div class=\"filters\">";
  out += select("suite", "suite", suites) + select("construction", "construction", cons) +
         select("status", "status", statuses);
  if (!transitions.empty()) out += select("transition", "change", transitions);
  out +=
      "<label for=\"filter-text\">words or id<input id=\"filter-text\" type=\"search\" "
      "placeholder=\"e.g. crane\"></label><span id=\"expand-controls\">"
      "<button type=\"button\" id=\"expand-all\">expand shown</button> "
      "<button type=\"button\" id=\"collapse-all\">collapse all</button></span>"
      "<span id=\"shown-count\" aria-live=\"polite\"></span></div>";
  out += tree_key();
  // Trees are drawn for the most interesting cases first, up to the limit.
  std::vector<std::size_t> order(v.cases.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
    return case_priority(v.cases[a]) < case_priority(v.cases[b]);
  });
  std::vector<bool> draw(v.cases.size(), false);
  for (std::size_t k = 0; k < order.size() && k < o.max_drawn_cases; ++k) draw[order[k]] = true;
  CaseRenderer renderer(v);
  out += "<div id=\"case-list\">";
  for (std::size_t i = 0; i < v.cases.size(); ++i) out += renderer.render(v.cases[i], draw[i]);
  out += "</div></section>";
  return out;
}

}  // namespace

std::string render_html_report(const ReportView& v, const PageOptions& o) {
  std::string out =
      "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">"
      "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">"
      "<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; "
      "style-src 'unsafe-inline'; script-src 'unsafe-inline'; img-src data:\">"
      "<link rel=\"icon\" href=\"data:,\"><title>" +
      escape(v.title) + "</title><style>" + kStyle + "</style></head><body>";
  out += header(v) + "<main>" + gate(v) + summary(v) + charts(v) + tables(v) + cases(v, o);
  out += "<footer>Written by treegate " + escape(v.tool_version) +
         ". A self-contained page: it loads nothing from the network.</footer></main><script>";
  out += kScript;
  out += "</script></body></html>\n";
  return out;
}

void write_html_report(const std::string& path, const ReportView& view, const PageOptions& o) {
  results::write_file_atomically(path, render_html_report(view, o));
}

}  // namespace treegate::report::html
