// Escaping for the HTML report: every text that comes from data (words, labels, ids, suite
// names, messages) goes through these before it reaches the page. Also a width estimate for
// text drawn in SVG. Pure functions; thread-safe.
#pragma once

#include <string>
#include <string_view>

namespace treegate::report::html {

/// Text content and attribute values: & < > " ' are replaced by character references, bytes
/// that are not valid UTF-8 by U+FFFD, and control characters other than tab and newline by
/// U+FFFD (HTML forbids them in text).
std::string escape(std::string_view text);

/// A JSON text made safe inside <script>: "<", ">", "&" and U+2028/2029 become \u escapes, so
/// no data can close the script element or start a comment.
std::string script_safe_json(std::string_view json);

/// Estimated width in pixels of `text` in the report's monospace font at `font_px`
/// (0.6 em per character, 1.2 em for wide East Asian characters).
double text_width(std::string_view text, double font_px);

/// Number formatting shared by tables and charts: fixed decimals, "–" for NaN.
std::string fixed(double value, int decimals);

}  // namespace treegate::report::html
