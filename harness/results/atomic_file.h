// Atomic file writes: the text goes to a temp file in the destination's folder, which is then
// renamed over the destination, so a reader (or a killed run) never sees a half-written file.
// Temp files of writes in progress are removed by remove_pending_temp_files() (SIGINT path).
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace treegate::results {

/// Writes `text` to `path` atomically. Throws InputError naming the path on failure.
void write_file_atomically(const std::string& path, const std::string& text);
/// The same for text in pieces, written one after the other (no copy into one string).
void write_file_atomically(const std::string& path, const std::vector<std::string_view>& pieces);

/// Unlinks the temp files of writes in progress. Async-signal-safe enough for a SIGINT
/// handler running in a dedicated thread (uses only unlink on fixed buffers).
void remove_pending_temp_files();

}  // namespace treegate::results
