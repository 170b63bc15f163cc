// Sortable tables for the HTML report. Each cell carries a sort key (data-v) that the page's
// script sorts on when a column heading is clicked. Deltas carry a sign and an arrow marker,
// so they read the same without colour. Pure functions; thread-safe.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "harness/report/html_view.h"

namespace treegate::report::html {

struct Cell {
  std::string html;  // escaped content
  std::string sort;  // sort key: a number for numeric columns, else the text
};

struct Table {
  std::string id, caption;
  std::vector<std::string> headings;  // plain text (escaped when rendered)
  std::vector<bool> numeric;          // per column: sort as numbers
  std::vector<std::vector<Cell>> rows;
  std::string note;
};

std::string render_table(const Table& table);

Cell text_cell(const std::string& text);
Cell number_cell(double value, int decimals);
/// "+1.25 ▲" / "−0.50 ▼" / "±0.00 ="; class up/down/same and a title that says better or
/// worse; `higher_is_better` picks which. Empty (sorting last) when there is no baseline.
Cell delta_cell(const Figure& figure, int decimals, bool higher_is_better = true);
/// The same marker as inline HTML, for summary cards.
std::string delta_html(const Figure& figure, int decimals, bool higher_is_better = true);

/// A breakdown (suites, constructions, labels, length buckets) as a table; delta columns only
/// when `with_before`.
Table breakdown_table(const Breakdown& breakdown, bool with_before);
Table error_class_table(const std::vector<ErrorClassRow>& rows, bool with_before,
                        const std::string& before_name, const std::string& after_name);

}  // namespace treegate::report::html
