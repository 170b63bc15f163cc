// The HTML report page: one self-contained file (inline CSS, SVG and a little script; no
// network, no external fonts) built from a ReportView. `write_html_report` writes atomically.
// Pure functions of their input; thread-safe.
#pragma once

#include <string>

#include "harness/report/html_view.h"

namespace treegate::report::html {

struct PageOptions {
  std::size_t max_drawn_cases = 2000;  // beyond this, cases show bracketed text (file size)
};

std::string render_html_report(const ReportView& view, const PageOptions& options = {});

/// Renders and writes `path` atomically (temp file in the same folder, then rename). Throws
/// InputError when the file cannot be written.
void write_html_report(const std::string& path, const ReportView& view,
                       const PageOptions& options = {});

}  // namespace treegate::report::html
