#include "harness/report/html_table.h"

#include <cmath>

#include <fmt/format.h>

#include "harness/report/html_escape.h"

namespace treegate::report::html {
namespace {

constexpr const char* kMinus = "\xE2\x88\x92";  // U+2212
constexpr const char* kUp = "\xE2\x96\xB2";     // ▲
constexpr const char* kDown = "\xE2\x96\xBC";   // ▼

struct Delta {
  std::string text, cls, title;
  double value = 0;
  bool present = false;
};

Delta make_delta(const Figure& f, int decimals, bool higher_is_better) {
  Delta d;
  if (!f.before || std::isnan(f.value) || std::isnan(*f.before)) return d;
  d.present = true;
  d.value = f.value - *f.before;
  const double eps = 0.5 * std::pow(10.0, -decimals);
  const std::string mag = fixed(std::fabs(d.value), decimals);
  if (std::fabs(d.value) < eps) {
    d.text = "\xC2\xB1" + mag + " =";
    d.cls = "same";
    d.title = "unchanged";
  } else if (d.value > 0) {
    d.text = "+" + mag + " " + kUp;
    d.cls = higher_is_better ? "up good" : "up bad";
    d.title = higher_is_better ? "better" : "worse";
  } else {
    d.text = std::string(kMinus) + mag + " " + kDown;
    d.cls = higher_is_better ? "down bad" : "down good";
    d.title = higher_is_better ? "worse" : "better";
  }
  return d;
}

}  // namespace

Cell text_cell(const std::string& text) { return {escape(text), escape(text)}; }

Cell number_cell(double value, int decimals) {
  if (std::isnan(value)) return {fixed(value, decimals), ""};
  return {fixed(value, decimals), fmt::format("{:.6f}", value)};
}

Cell delta_cell(const Figure& figure, int decimals, bool higher_is_better) {
  const Delta d = make_delta(figure, decimals, higher_is_better);
  if (!d.present) return {"", ""};
  return {fmt::format("<span class=\"delta {}\" title=\"{}\">{}</span>", d.cls, d.title, d.text),
          fmt::format("{:.6f}", d.value)};
}

std::string delta_html(const Figure& figure, int decimals, bool higher_is_better) {
  return delta_cell(figure, decimals, higher_is_better).html;
}

std::string render_table(const Table& t) {
  std::string out =
      fmt::format("<div class=\"table-wrap\"><table class=\"sortable\" id=\"{}\">", escape(t.id));
  if (!t.caption.empty()) out += "<caption>" + escape(t.caption) + "</caption>";
  out += "<thead><tr>";
  for (std::size_t c = 0; c < t.headings.size(); ++c) {
    const bool num = c < t.numeric.size() && t.numeric[c];
    out += fmt::format(
        "<th scope=\"col\" class=\"{}\" aria-sort=\"none\"><button type=\"button\" "
        "data-kind=\"{}\">{}<span class=\"sort-mark\" aria-hidden=\"true\"></span></button></th>",
        num ? "num" : "text", num ? "num" : "text", escape(t.headings[c]));
  }
  out += "</tr></thead><tbody>";
  for (const auto& row : t.rows) {
    out += "<tr>";
    for (std::size_t c = 0; c < row.size(); ++c) {
      const bool num = c < t.numeric.size() && t.numeric[c];
      out += fmt::format("<td{} data-v=\"{}\">{}</td>", num ? " class=\"num\"" : "", row[c].sort,
                         row[c].html);
    }
    out += "</tr>";
  }
  out += "</tbody></table></div>";
  if (!t.note.empty()) out += "<p class=\"table-note\">" + escape(t.note) + "</p>";
  return out;
}

Table breakdown_table(const Breakdown& b, bool with_before) {
  Table t;
  t.id = "table-" + b.id;
  t.note = b.note;
  t.headings = {b.key, b.count};
  bool any_passed = false;
  for (const auto& r : b.rows) any_passed = any_passed || r.passed.has_value();
  if (any_passed) t.headings.push_back("passed");
  for (const char* h : {"precision", "recall", "F1"}) t.headings.push_back(h);
  if (with_before) {
    t.headings.push_back("F1 before");
    t.headings.push_back("F1 change");
  }
  t.numeric.assign(t.headings.size(), true);
  t.numeric[0] = false;
  for (const auto& r : b.rows) {
    std::vector<Cell> row{text_cell(r.name), number_cell(static_cast<double>(r.cases), 0)};
    if (any_passed) {
      row.push_back(r.passed ? number_cell(static_cast<double>(*r.passed), 0) : Cell{"", ""});
    }
    row.push_back(number_cell(r.precision.value, 2));
    row.push_back(number_cell(r.recall.value, 2));
    row.push_back(number_cell(r.f1.value, 2));
    if (with_before) {
      row.push_back(r.f1.before ? number_cell(*r.f1.before, 2) : Cell{"", ""});
      row.push_back(delta_cell(r.f1, 2));
    }
    t.rows.push_back(std::move(row));
  }
  return t;
}

Table error_class_table(const std::vector<ErrorClassRow>& rows, bool with_before,
                        const std::string& before_name, const std::string& after_name) {
  Table t;
  t.id = "table-error-classes";
  t.headings = {"error class"};
  if (with_before) t.headings.push_back(before_name);
  t.headings.push_back(after_name);
  if (with_before) t.headings.push_back("change");
  t.numeric.assign(t.headings.size(), true);
  t.numeric[0] = false;
  for (const auto& r : rows) {
    std::vector<Cell> row{text_cell(r.name)};
    const auto now = static_cast<double>(r.count);
    if (with_before) {
      row.push_back(r.before ? number_cell(static_cast<double>(*r.before), 0) : Cell{"", ""});
    }
    row.push_back(number_cell(now, 0));
    if (with_before) {
      Figure f{now,
               r.before ? std::optional<double>(static_cast<double>(*r.before)) : std::nullopt};
      row.push_back(delta_cell(f, 0, false));
    }
    t.rows.push_back(std::move(row));
  }
  return t;
}

}  // namespace treegate::report::html
