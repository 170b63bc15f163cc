// HTML report benchmark: builds a run from the open treebank (gold trees against copies with
// some constituents flattened), then times filling the view, laying out trees and rendering
// the page, and prints the file size, for 100, 1,000 and all cases side by side.
//   build/bench/html/html_bench [TREEBANK_DIR]   (default:
//   $TREEGATE_SHARED/data/gum-ccby-train/trees)
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <random>
#include <string>

#include "evaluator/bracket_io.h"
#include "evaluator/tally.h"
#include "harness/report/html_from_results.h"
#include "harness/report/html_page.h"
#include "harness/report/html_tree.h"
#include "harness/results/case_score.h"

using namespace treegate;
using Clock = std::chrono::steady_clock;

namespace {

double seconds_since(Clock::time_point t0) {
  return std::chrono::duration<double>(Clock::now() - t0).count();
}

Tree flatten_some(const Tree& g, std::mt19937& rng) {
  Tree t;
  std::vector<NodeId> map(g.size(), kNoNode);
  for (std::size_t i = 0; i < g.size(); ++i) {
    const auto id = static_cast<NodeId>(i);
    const Node& n = g.node(id);
    const NodeId parent = n.parent == kNoNode ? kNoNode : map[static_cast<std::size_t>(n.parent)];
    if (n.is_leaf()) {
      map[i] = t.add_leaf(g.word(static_cast<std::size_t>(n.word)), parent);
    } else if (i > 1 && !g.is_preterminal(id) && rng() % 6 == 0) {
      map[i] = parent;
    } else {
      map[i] = t.add_node(g.label(id), parent);
    }
  }
  return t;
}

results::RunResults make_run(const std::vector<Tree>& trees, std::size_t n) {
  results::RunResults run;
  run.header.tool_version = "bench";
  Scorer scorer{Scheme{}};
  std::mt19937 rng(5);
  for (std::size_t i = 0; i < n; ++i) {
    const Tree& gold = trees[i % trees.size()];
    const Tree test = flatten_some(gold, rng);
    const SentenceScore s = scorer.score(gold, test);
    results::CaseRecord c;
    c.suite = "bank" + std::to_string(i % 4);
    c.id = std::to_string(i + 1);
    c.gold = to_bracketed(gold);
    c.predicted = to_bracketed(test);
    results::set_score(c, s);
    c.outcome = s.exact_match() ? results::Outcome::kPass : results::Outcome::kFail;
    run.cases.push_back(std::move(c));
  }
  return run;
}

}  // namespace

int main(int argc, char** argv) {
  const char* shared = std::getenv("TREEGATE_SHARED");
  const std::string dir =
      argc > 1 ? argv[1]
               : std::string(shared ? shared : "../shared") + "/data/gum-ccby-train/trees";
  std::vector<Tree> trees;
  for (const auto& e : std::filesystem::directory_iterator(dir)) {
    for (auto& t : read_tree_file(e.path().string())) trees.push_back(std::move(t));
  }
  std::printf("%zu trees from %s\n", trees.size(), dir.c_str());

  auto t0 = Clock::now();
  std::size_t boxes = 0;
  for (const Tree& t : trees) boxes += report::html::layout_trees({&t, &t})[0].boxes.size();
  const double layout = seconds_since(t0);
  std::printf("layout of every tree twice (shared columns): %.3f s, %.3f ms per pair, %zu boxes\n",
              layout, 1000 * layout / trees.size(), boxes);

  std::printf("%8s %10s %10s %12s %12s %14s\n", "cases", "view s", "render s", "ms/case", "size MB",
              "KB/case");
  for (std::size_t n : {std::size_t{100}, std::size_t{1000}, trees.size()}) {
    const auto run = make_run(trees, n);
    t0 = Clock::now();
    const auto view = report::html::view_of_run(run, nullptr, {true, {}}, "");
    const double view_s = seconds_since(t0);
    t0 = Clock::now();
    const std::string page = report::html::render_html_report(view);
    const double render_s = seconds_since(t0);
    std::printf("%8zu %10.3f %10.3f %12.3f %12.2f %14.1f\n", n, view_s, render_s,
                1000 * (view_s + render_s) / n, page.size() / 1e6, page.size() / 1e3 / n);
  }
  return 0;
}
