#include "harness/report/html_tree.h"

#include <algorithm>
#include <climits>

#include <fmt/format.h>

#include "evaluator/bracket_io.h"
#include "harness/report/html_escape.h"

namespace treegate::report::html {
namespace {

constexpr double kStemHalfWidth = 1.5;  // a word's vertical line, as an obstacle in a row
constexpr std::size_t kMaxRowItems = 2'000'000;
constexpr std::size_t kMaxBracketedChars = 20'000;

// Depth and word range of every node of one tree.
struct TreeShape {
  const Tree* tree = nullptr;
  std::vector<std::int32_t> depth, lo, hi;
  std::int32_t rows = 0;  // rows of internal nodes (the words sit below them)
  bool ok = false;
};

TreeShape analyse(const Tree& tree, const LayoutOptions& options) {
  TreeShape s;
  s.tree = &tree;
  const std::size_t n = tree.size();
  if (n == 0 || n > options.max_nodes) return s;
  s.depth.assign(n, 0);
  s.lo.assign(n, INT_MAX);
  s.hi.assign(n, -1);
  for (std::size_t i = 1; i < n; ++i) {
    s.depth[i] = s.depth[static_cast<std::size_t>(tree.node(static_cast<NodeId>(i)).parent)] + 1;
  }
  for (std::size_t i = n; i-- > 0;) {  // children have larger ids: a backward pass is post-order
    const Node& node = tree.node(static_cast<NodeId>(i));
    if (node.is_leaf()) {
      s.lo[i] = s.hi[i] = node.word;
    } else {
      if (s.lo[i] > s.hi[i]) return s;  // a constituent without words: not drawn
      s.rows = std::max(s.rows, s.depth[i] + 1);
    }
    if (node.parent != kNoNode) {
      const auto p = static_cast<std::size_t>(node.parent);
      s.lo[p] = std::min(s.lo[p], s.lo[i]);
      s.hi[p] = std::max(s.hi[p], s.hi[i]);
    }
  }
  s.ok = static_cast<std::size_t>(s.rows) <= options.max_depth &&
         tree.num_words() * static_cast<std::size_t>(s.rows) <= kMaxRowItems;
  return s;
}

std::string label_text(const Tree& tree, NodeId id, std::uint8_t marks) {
  std::string text(tree.label(id));
  if (text.empty()) text = "\xC2\xB7";  // an unlabeled root shows as a middle dot
  if (marks & kWrong) text += " +";
  if (marks & kMissing) text += " \xE2\x88\x92";
  if (marks & kTagWrong) text += " *";
  return text;
}

double box_width(const Tree& tree, NodeId id, std::uint8_t marks, const LayoutOptions& o) {
  return text_width(label_text(tree, id, marks), o.font_px) + o.font_px;
}

// A thing that takes room in a row: an internal node, or a word's line passing down.
struct Item {
  std::int32_t lo, hi;
  std::int32_t node;  // >= 0: node id; < 0: the stem of word (-node - 1)
  double half;
};

struct Constraint {
  std::size_t tree;
  Item a, b;  // a is left of b in one row
  double separation;
};

struct Group {
  const LayoutOptions& o;
  std::vector<TreeShape> shapes;
  std::vector<const std::vector<std::uint8_t>*> marks;
  std::vector<double> col_x;
  std::vector<std::vector<double>> node_x;

  double mark_of(std::size_t t, std::size_t id) const {
    const auto* m = marks[t];
    return m && id < m->size() ? (*m)[id] : 0;
  }

  void compute_x() {
    for (std::size_t t = 0; t < shapes.size(); ++t) {
      const Tree& tree = *shapes[t].tree;
      auto& x = node_x[t];
      x.assign(tree.size(), 0);
      for (std::size_t i = tree.size(); i-- > 0;) {
        const Node& node = tree.node(static_cast<NodeId>(i));
        x[i] = node.is_leaf() ? col_x[static_cast<std::size_t>(node.word)]
                              : (x[static_cast<std::size_t>(node.first_child)] +
                                 x[static_cast<std::size_t>(node.last_child)]) /
                                    2;
      }
    }
  }

  double item_x(std::size_t t, const Item& item) const {
    return item.node >= 0 ? node_x[t][static_cast<std::size_t>(item.node)]
                          : col_x[static_cast<std::size_t>(-item.node - 1)];
  }

  std::vector<std::vector<Constraint>> constraints_by_boundary() const;
  void sweep();
};

std::vector<std::vector<Constraint>> Group::constraints_by_boundary() const {
  std::vector<std::vector<Constraint>> by(col_x.size());
  for (std::size_t t = 0; t < shapes.size(); ++t) {
    const TreeShape& s = shapes[t];
    const Tree& tree = *s.tree;
    std::vector<std::vector<Item>> rows(static_cast<std::size_t>(s.rows));
    for (std::size_t i = 0; i < tree.size(); ++i) {
      const Node& node = tree.node(static_cast<NodeId>(i));
      const auto id = static_cast<std::int32_t>(i);
      if (!node.is_leaf()) {
        const double half = box_width(tree, id, static_cast<std::uint8_t>(mark_of(t, i)), o) / 2;
        rows[static_cast<std::size_t>(s.depth[i])].push_back({s.lo[i], s.hi[i], id, half});
        continue;
      }
      for (std::int32_t d = s.depth[i]; d < s.rows; ++d) {  // the stem passes these rows
        rows[static_cast<std::size_t>(d)].push_back(
            {node.word, node.word, -node.word - 1, kStemHalfWidth});
      }
    }
    for (auto& row : rows) {
      std::sort(row.begin(), row.end(), [](const Item& a, const Item& b) { return a.lo < b.lo; });
      for (std::size_t k = 1; k < row.size(); ++k) {
        const Item& a = row[k - 1];
        const Item& b = row[k];
        by[static_cast<std::size_t>(a.hi)].push_back({t, a, b, a.half + b.half + o.node_gap});
      }
    }
  }
  return by;
}

// Moves every word right of a boundary by the largest shortfall of the rows there. Nodes left
// of the boundary keep their place and nodes right of it move by the full amount, so a row
// fixed at an earlier boundary never gets tighter: one pass from left to right suffices.
void Group::sweep() {
  const auto by = constraints_by_boundary();
  bool stale = true;
  for (std::size_t b = 0; b + 1 < col_x.size(); ++b) {
    if (by[b].empty()) continue;
    if (stale) compute_x();
    double delta = 0;
    for (const Constraint& c : by[b]) {
      delta = std::max(delta, c.separation - (item_x(c.tree, c.b) - item_x(c.tree, c.a)));
    }
    stale = delta > 0;
    if (stale) {
      for (std::size_t k = b + 1; k < col_x.size(); ++k) col_x[k] += delta;
    }
  }
  compute_x();
}

// Lays out trees over the same words; `rows` is the shared number of node rows.
std::vector<PanelLayout> layout_group(Group& g, std::int32_t rows) {
  const LayoutOptions& o = g.o;
  const std::size_t words = g.shapes.front().tree->num_words();
  std::vector<double> width(words, 0);
  for (const auto& s : g.shapes) {
    for (std::size_t w = 0; w < words; ++w) {
      width[w] = std::max(width[w], text_width(s.tree->word(w), o.font_px));
    }
  }
  g.col_x.assign(words, 0);
  for (std::size_t w = 1; w < words; ++w) {
    g.col_x[w] = g.col_x[w - 1] + (width[w - 1] + width[w]) / 2 + o.word_gap;
  }
  g.node_x.resize(g.shapes.size());
  g.sweep();

  const double box_h = o.font_px + 8;
  std::vector<PanelLayout> out(g.shapes.size());
  double left = 0, right = 0;
  for (std::size_t w = 0; w < words; ++w) {
    left = std::min(left, g.col_x[w] - width[w] / 2);
    right = std::max(right, g.col_x[w] + width[w] / 2);
  }
  for (std::size_t t = 0; t < g.shapes.size(); ++t) {
    const TreeShape& s = g.shapes[t];
    PanelLayout& p = out[t];
    p.drawn = true;
    for (std::size_t i = 0; i < s.tree->size(); ++i) {
      const auto id = static_cast<NodeId>(i);
      if (s.tree->node(id).is_leaf()) continue;
      const double w = box_width(*s.tree, id, static_cast<std::uint8_t>(g.mark_of(t, i)), o);
      const double y = o.margin + s.depth[i] * o.row_height;
      p.boxes.push_back({id, g.node_x[t][i], y, w, box_h});
      left = std::min(left, g.node_x[t][i] - w / 2);
      right = std::max(right, g.node_x[t][i] + w / 2);
    }
  }
  const double shift = o.margin - left;
  for (std::size_t t = 0; t < out.size(); ++t) {
    PanelLayout& p = out[t];
    for (auto& box : p.boxes) box.x += shift;
    p.word_x = g.col_x;
    for (double& x : p.word_x) x += shift;
    p.word_y = o.margin + rows * o.row_height + o.font_px;
    p.width = right + shift + o.margin;
    p.height = p.word_y + o.font_px / 2 + o.margin;
  }
  return out;
}

}  // namespace

namespace {

std::vector<PanelLayout> layout_marked(const std::vector<const Tree*>& trees,
                                       const std::vector<const std::vector<std::uint8_t>*>& marks,
                                       const LayoutOptions& o) {
  std::vector<TreeShape> shapes(trees.size());
  std::int32_t rows = 1;
  std::size_t words = 0;
  bool same_words = true, first = true;
  for (std::size_t t = 0; t < trees.size(); ++t) {
    if (!trees[t] || trees[t]->num_words() == 0) continue;
    shapes[t] = analyse(*trees[t], o);
    if (!shapes[t].ok) continue;
    rows = std::max(rows, shapes[t].rows);
    if (!first && trees[t]->num_words() != words) same_words = false;
    words = trees[t]->num_words();
    first = false;
  }
  std::vector<PanelLayout> out(trees.size());
  std::vector<std::size_t> members;
  auto flush = [&] {
    if (members.empty()) return;
    Group g{o, {}, {}, {}, {}};
    for (std::size_t t : members) {
      g.shapes.push_back(shapes[t]);
      g.marks.push_back(marks[t]);
    }
    auto laid = layout_group(g, rows);
    for (std::size_t k = 0; k < members.size(); ++k) out[members[k]] = std::move(laid[k]);
    members.clear();
  };
  for (std::size_t t = 0; t < trees.size(); ++t) {
    if (!shapes[t].ok) continue;
    members.push_back(t);
    if (!same_words) flush();  // different words: each tree gets columns of its own
  }
  flush();
  return out;
}

void render_svg(std::string& out, const TreePanel& panel, const PanelLayout& p,
                const LayoutOptions& o) {
  const Tree& tree = *panel.tree;
  auto mark = [&](NodeId id) -> std::uint8_t {
    const auto i = static_cast<std::size_t>(id);
    return i < panel.marks.size() ? panel.marks[i] : 0;
  };
  std::vector<std::size_t> box_of(tree.size(), 0);
  for (std::size_t k = 0; k < p.boxes.size(); ++k) {
    box_of[static_cast<std::size_t>(p.boxes[k].node)] = k;
  }
  out += fmt::format(
      "<svg class=\"tree\" xmlns=\"http://www.w3.org/2000/svg\" width=\"{:.0f}\" height=\"{:.0f}\" "
      "viewBox=\"0 0 {:.0f} {:.0f}\" role=\"img\" aria-label=\"{}: {} words\" data-words=\"{}\">",
      p.width, p.height, p.width, p.height, escape(panel.title), tree.num_words(),
      tree.num_words());
  std::string edges, stems;
  const double word_top = p.word_y - o.font_px;
  for (const NodeBox& b : p.boxes) {
    for (NodeId c = tree.node(b.node).first_child; c != kNoNode; c = tree.node(c).next_sibling) {
      const Node& child = tree.node(c);
      if (child.is_leaf()) {
        const double wx = p.word_x[static_cast<std::size_t>(child.word)];
        const double bend = std::min(b.y + o.row_height, word_top - 2);
        stems += fmt::format("M{:.0f} {:.0f}L{:.0f} {:.0f}V{:.0f}", b.x, b.y + b.h, wx, bend,
                             word_top - 2);
      } else {
        const NodeBox& cb = p.boxes[box_of[static_cast<std::size_t>(c)]];
        edges += fmt::format("M{:.0f} {:.0f}L{:.0f} {:.0f}", b.x, b.y + b.h, cb.x, cb.y);
      }
    }
  }
  out += "<path class=\"edges\" d=\"" + edges + "\"/><path class=\"stems\" d=\"" + stems + "\"/>";
  for (const NodeBox& b : p.boxes) {
    const std::uint8_t m = mark(b.node);
    std::string cls = "node";
    std::string tip;  // a tooltip only where there is something to say (keeps files small)
    if (m & kMatched) cls += " m-match";
    if (m & kWrong) cls += " m-wrong", tip += ": in this tree, not in gold (wrong)";
    if (m & kMissing) cls += " m-missing", tip += ": in gold, not in the predicted tree (missing)";
    if (m & kTagWrong) cls += " m-tag", tip += ": tag differs from gold";
    if (!tip.empty()) tip = "<title>" + escape(std::string(tree.label(b.node)) + tip) + "</title>";
    out += fmt::format(
        "<g class=\"{}\">{}<rect x=\"{:.0f}\" y=\"{:.0f}\" width=\"{:.0f}\" height=\"{:.0f}\" "
        "rx=\"4\"/><text x=\"{:.0f}\" y=\"{:.0f}\">{}</text></g>",
        cls, tip, b.x - b.w / 2, b.y, b.w, b.h, b.x, b.y + b.h / 2 + o.font_px * 0.35,
        escape(label_text(tree, b.node, m)));
  }
  for (std::size_t w = 0; w < tree.num_words(); ++w) {
    out += fmt::format("<text class=\"leaf\" x=\"{:.0f}\" y=\"{:.0f}\">{}</text>", p.word_x[w],
                       p.word_y, escape(tree.word(w)));
  }
  out += "</svg>";
}

void render_fallback(std::string& out, const TreePanel& panel) {
  if (!panel.tree || panel.tree->empty()) {
    out += "<p class=\"note\">" + escape(panel.note.empty() ? "no tree" : panel.note) + "</p>";
    return;
  }
  std::string text = to_bracketed(*panel.tree);
  const bool cut = text.size() > kMaxBracketedChars;
  if (cut) text.resize(kMaxBracketedChars);
  out += "<p class=\"note\">too large to draw (" + std::to_string(panel.tree->size()) +
         " nodes); bracketed form" + (cut ? ", cut short" : std::string()) + ":</p>";
  out += "<pre class=\"bracketed\">" + escape(text) + "</pre>";
}

}  // namespace

std::vector<PanelLayout> layout_trees(const std::vector<const Tree*>& trees,
                                      const LayoutOptions& options) {
  return layout_marked(trees, std::vector<const std::vector<std::uint8_t>*>(trees.size()), options);
}

std::string render_trees(const std::vector<TreePanel>& panels, const LayoutOptions& options) {
  std::vector<const Tree*> trees;
  std::vector<const std::vector<std::uint8_t>*> marks;
  for (const auto& p : panels) {
    trees.push_back(p.tree);
    marks.push_back(&p.marks);
  }
  const auto layouts = layout_marked(trees, marks, options);
  std::string out = "<div class=\"trees\">";
  for (std::size_t k = 0; k < panels.size(); ++k) {
    out += "<figure class=\"panel\"><figcaption>" + escape(panels[k].title);
    if (!panels[k].note.empty() && layouts[k].drawn) {
      out += " <span class=\"note\">" + escape(panels[k].note) + "</span>";
    }
    out += "</figcaption>";
    if (layouts[k].drawn) {
      render_svg(out, panels[k], layouts[k], options);
    } else {
      render_fallback(out, panels[k]);
    }
    out += "</figure>";
  }
  out += "</div>";
  return out;
}

}  // namespace treegate::report::html
