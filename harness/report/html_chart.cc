#include "harness/report/html_chart.h"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "harness/report/html_escape.h"

namespace treegate::report::html {
namespace {

constexpr double kHeight = 220, kTop = 18, kBottom = 40, kLeft = 48, kRight = 12;
constexpr double kBar = 34, kBarGap = 3, kGroupGap = 20;

std::string legend(const BarChart& c) {
  std::string out = "<p class=\"legend\">";
  for (std::size_t s = 0; s < c.series.size(); ++s) {
    out += fmt::format(
        "<span><svg width=\"14\" height=\"14\" aria-hidden=\"true\"><rect class=\"{}\" "
        "x=\"1\" y=\"1\" width=\"12\" height=\"12\" {}/></svg> {}</span>",
        c.series[s].hatched ? "old hatch" : "new",
        c.series[s].hatched ? fmt::format("fill=\"url(#{}-hatch)\"", c.id) : std::string(),
        escape(c.series[s].name));
  }
  return out + "</p>";
}

}  // namespace

double round_up(double x) {
  if (!(x > 0) || !std::isfinite(x)) return 1;
  const double p = std::pow(10.0, std::floor(std::log10(x)));
  for (double m : {1.0, 2.0, 2.5, 5.0, 10.0}) {
    if (m * p >= x * (1 - 1e-12)) return m * p;
  }
  return 10 * p;
}

std::string render_bar_chart(const BarChart& c) {
  double top = c.max_value;
  bool any = false;
  for (const auto& s : c.series) {
    for (const auto& v : s.values) {
      if (v && std::isfinite(*v)) {
        any = true;
        if (c.max_value <= 0) top = std::max(top, *v);
      }
    }
  }
  if (!any || c.categories.empty()) return "";
  if (c.max_value <= 0) top = round_up(top);
  const std::size_t n = std::max<std::size_t>(1, c.series.size());
  const double group = n * kBar + (n - 1) * kBarGap;
  const double width = kLeft + c.categories.size() * (group + kGroupGap) + kRight;
  const double plot = kHeight - kTop - kBottom;
  auto y_of = [&](double v) { return kTop + plot * (1 - std::clamp(v / top, 0.0, 1.0)); };

  std::string out = fmt::format("<figure class=\"chart\" id=\"{}\"><figcaption>{}</figcaption>",
                                escape(c.id), escape(c.title));
  out += fmt::format(
      "<svg class=\"chart\" xmlns=\"http://www.w3.org/2000/svg\" width=\"{:.0f}\" "
      "height=\"{:.0f}\" viewBox=\"0 0 {:.0f} {:.0f}\" role=\"img\" aria-label=\"{}\">",
      width, kHeight, width, kHeight, escape(c.title));
  out += fmt::format(
      "<defs><pattern id=\"{}-hatch\" patternUnits=\"userSpaceOnUse\" width=\"6\" height=\"6\" "
      "patternTransform=\"rotate(45)\"><rect class=\"hatch-bg\" width=\"6\" height=\"6\"/>"
      "<line class=\"hatch-line\" x1=\"0\" y1=\"0\" x2=\"0\" y2=\"6\"/></pattern></defs>",
      escape(c.id));
  for (int k = 0; k <= 4; ++k) {  // grid lines and axis labels
    const double v = top * k / 4, y = y_of(v);
    out += fmt::format(
        "<line class=\"grid\" x1=\"{:.0f}\" y1=\"{:.1f}\" x2=\"{:.0f}\" y2=\"{:.1f}\"/>"
        "<text class=\"axis\" x=\"{:.0f}\" y=\"{:.1f}\">{}</text>",
        kLeft, y, width - kRight, y, kLeft - 6, y + 4, fixed(v, top < 4 ? 1 : 0));
  }
  for (std::size_t i = 0; i < c.categories.size(); ++i) {
    const double x0 = kLeft + kGroupGap / 2 + i * (group + kGroupGap);
    for (std::size_t s = 0; s < c.series.size(); ++s) {
      const auto& v = i < c.series[s].values.size() ? c.series[s].values[i] : std::nullopt;
      if (!v || !std::isfinite(*v)) continue;
      const double x = x0 + s * (kBar + kBarGap), y = y_of(*v);
      const bool hatch = c.series[s].hatched;
      out += fmt::format(
          "<rect class=\"bar {}\" x=\"{:.1f}\" y=\"{:.1f}\" width=\"{:.0f}\" height=\"{:.1f}\" "
          "{}><title>{}, {}: {}</title></rect><text class=\"value\" x=\"{:.1f}\" "
          "y=\"{:.1f}\">{}</text>",
          hatch ? "old hatch" : "new", x, y, kBar, kTop + plot - y,
          hatch ? fmt::format("fill=\"url(#{}-hatch)\"", escape(c.id)) : std::string(),
          escape(c.series[s].name), escape(c.categories[i]), fixed(*v, c.decimals), x + kBar / 2,
          y - 4, fixed(*v, c.decimals));
    }
    out += fmt::format("<text class=\"category\" x=\"{:.1f}\" y=\"{:.0f}\">{}</text>",
                       x0 + group / 2, kHeight - kBottom + 16, escape(c.categories[i]));
  }
  out += fmt::format(
      "<line class=\"axis-line\" x1=\"{:.0f}\" y1=\"{:.1f}\" x2=\"{:.0f}\" "
      "y2=\"{:.1f}\"/>",
      kLeft, kTop + plot, width - kRight, kTop + plot);
  out += "</svg>" + legend(c) + "</figure>";
  return out;
}

}  // namespace treegate::report::html
