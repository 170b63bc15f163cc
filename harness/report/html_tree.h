// Trees drawn as SVG for the HTML report. Several trees over the same words share one column
// layout, so their words sit on one baseline and line up under each other; nodes never overlap
// (a left-to-right sweep widens the gap between two words until every row fits). Everything
// is computed without recursion. Pure functions over borrowed trees; thread-safe.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "evaluator/tree.h"

namespace treegate::report::html {

/// Per-node marks (bit flags), indexed by NodeId; see html_diff.h for how they are computed.
enum Mark : std::uint8_t {
  kMatched = 1,   // a bracket found in both trees
  kWrong = 2,     // a bracket of the predicted tree that gold lacks
  kMissing = 4,   // a gold bracket that the predicted tree lacks
  kTagWrong = 8,  // a preterminal whose tag differs from gold's
};

struct TreePanel {
  std::string title;                // shown above the tree ("gold", "predicted", ...)
  const Tree* tree = nullptr;       // borrowed; null or empty: `note` is shown instead
  std::vector<std::uint8_t> marks;  // by NodeId; may be empty
  std::string note;                 // e.g. "no parse"
};

struct LayoutOptions {
  double font_px = 12;
  double row_height = 36;
  double word_gap = 10;  // least space between two neighbouring words
  double node_gap = 8;   // least space between two boxes in a row
  double margin = 8;
  std::size_t max_nodes = 5000;  // larger trees are shown as bracketed text
  std::size_t max_depth = 250;
};

struct NodeBox {
  NodeId node;
  double x, y, w, h;  // centre x, top y, width, height
};

struct PanelLayout {
  bool drawn = false;          // false: empty tree or over the limits
  std::vector<NodeBox> boxes;  // one per internal node, in NodeId order
  std::vector<double> word_x;  // centre of each word
  double word_y = 0;           // baseline of the words (shared by all panels)
  double width = 0, height = 0;
};

/// Lays out the trees together: shared columns when all drawn trees have the same number of
/// words, one shared baseline always.
std::vector<PanelLayout> layout_trees(const std::vector<const Tree*>& trees,
                                      const LayoutOptions& options = {});

/// HTML for the panels side by side (they wrap on narrow screens): a <figure> per panel with
/// an escaped caption and an inline <svg class="tree">, its words as <text class="leaf">.
std::string render_trees(const std::vector<TreePanel>& panels, const LayoutOptions& options = {});

}  // namespace treegate::report::html
