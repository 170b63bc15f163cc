// The report's inline style sheet and script, kept apart from the page builder so each reads
// on its own. Constant strings; thread-safe.
#pragma once

namespace treegate::report::html {

extern const char* const kStyle;   // CSS: screen and print
extern const char* const kScript;  // sortable tables, case filters, expand/collapse

}  // namespace treegate::report::html
