// Bar charts drawn as inline SVG for the HTML report (no chart library, no script): bars of up
// to two series per category, the baseline hatched and the new run solid so they differ
// without colour, each bar labelled with its value. Pure functions; thread-safe.
#pragma once

#include <optional>
#include <string>
#include <vector>

namespace treegate::report::html {

struct Series {
  std::string name;                           // legend text ("baseline", "this run")
  std::vector<std::optional<double>> values;  // one per category; nullopt: no bar
  bool hatched = false;                       // drawn with a hatch pattern (the baseline)
};

struct BarChart {
  std::string id;     // unique on the page (used for pattern ids)
  std::string title;  // caption, also the SVG's accessible name
  std::vector<std::string> categories;
  std::vector<Series> series;
  double max_value = 0;  // 0: from the data, rounded up to a round number
  int decimals = 1;      // of the value labels
};

/// A <figure> with the chart as <svg class="chart"> and a legend; "" when there is no data.
std::string render_bar_chart(const BarChart& chart);

/// The smallest 1, 2, 2.5 or 5 times a power of ten that is >= x (x > 0), else 1.
double round_up(double x);

}  // namespace treegate::report::html
