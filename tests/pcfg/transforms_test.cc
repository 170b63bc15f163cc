// Tree transforms and their inverses: golden one-line forms for each transform, the
// checks on training trees, and round trips (transform, write, read, undo) over a generated
// treebank and over the open trees of gum-ccby-train for every combination of v, h, unary.
#include <doctest/doctest.h>

#include <cstdlib>
#include <filesystem>
#include <random>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "evaluator/parseval.h"
#include "harness/pcfg/transforms.h"
#include "harness/pcfg/transforms_tree.h"

namespace treegate::pcfg {
namespace {

std::string forward(const std::string& text, const TransformSpec& spec) {
  EditTree edit = to_edit_tree(parse_tree(text));
  apply_transforms(edit, spec);
  return to_bracketed(to_tree(edit));
}

std::string undo(const std::string& text, const TransformSpec& spec) {
  EditTree edit = to_edit_tree(parse_tree(text));
  undo_transforms(edit, spec);
  return to_bracketed(to_tree(edit));
}

TransformSpec spec_with(int v, int h, bool unary) {
  TransformSpec spec;
  spec.parent = v;
  spec.horizontal = h;
  spec.collapse_unary = unary;
  return spec;
}

const char* kSample =
    "(ROOT (S (NP-SBJ-1 (DT the) (NN dog)) (VP (VBZ barks) (NP (-NONE- *T*-1)))))";

TEST_CASE("function tags and empty elements go; the root wrapper becomes the start symbol") {
  TransformSpec spec;
  CHECK(forward(kSample, spec) == "(ROOT (S (NP (DT the) (NN dog)) (VP (VBZ barks))))");
  spec.start = "TOP";
  CHECK(forward(kSample, spec) == "(TOP (S (NP (DT the) (NN dog)) (VP (VBZ barks))))");
  CHECK(forward("( (S (NN x)))", spec) == "(TOP (S (NN x)))");
  CHECK(forward("(S (NN x))", spec) == "(TOP (S (NN x)))");
  spec.strip_functions = false;
  spec.drop_empties = false;
  CHECK(forward(kSample, spec) ==
        "(TOP (S (NP-SBJ-1 (DT the) (NN dog)) (VP (VBZ barks) (NP (-NONE- *T*-1)))))");
}

TEST_CASE("parent annotation of order 2 and 3 (Johnson 1998) leaves tags alone") {
  CHECK(forward(kSample, spec_with(2, TransformSpec::kNoBinarize, false)) ==
        "(ROOT (S^ROOT (NP^S (DT the) (NN dog)) (VP^S (VBZ barks))))");
  CHECK(forward(kSample, spec_with(3, TransformSpec::kNoBinarize, false)) ==
        "(ROOT (S^ROOT (NP^S^ROOT (DT the) (NN dog)) (VP^S^ROOT (VBZ barks))))");
}

TEST_CASE("unary chains of phrasal nodes collapse below the root; preterminals stay") {
  const TransformSpec spec = spec_with(1, TransformSpec::kNoBinarize, true);
  CHECK(forward("(ROOT (S (VP (VP (VB go)))))", spec) == "(ROOT (S~VP~VP (VB go)))");
  CHECK(forward("(ROOT (S (VP (VP (VB go)))))", spec_with(2, TransformSpec::kNoBinarize, true)) ==
        "(ROOT (S^ROOT~VP^S~VP^VP (VB go)))");
  CHECK(undo("(ROOT (S^ROOT~VP^S~VP^VP (VB go)))", spec) == "(ROOT (S (VP (VP (VB go)))))");
}

TEST_CASE("binarization with horizontal Markov order h (Klein & Manning 2003, section 2)") {
  const std::string np = "(ROOT (NP (DT a) (JJ b) (NN c) (NN d)))";
  CHECK(forward(np, spec_with(1, 0, false)) ==
        "(ROOT (NP (DT a) (NP> (JJ b) (NP> (NN c) (NN d)))))");
  CHECK(forward(np, spec_with(1, 1, false)) ==
        "(ROOT (NP (DT a) (NP>DT (JJ b) (NP>JJ (NN c) (NN d)))))");
  CHECK(forward(np, spec_with(1, 2, false)) ==
        "(ROOT (NP (DT a) (NP>DT (JJ b) (NP>DT>JJ (NN c) (NN d)))))");
  CHECK(forward(np, spec_with(1, TransformSpec::kUnlimited, false)) ==
        "(ROOT (NP (DT a) (NP>DT (JJ b) (NP>DT>JJ (NN c) (NN d)))))");
  CHECK(forward(np, spec_with(2, 1, false)) ==
        "(ROOT (NP^ROOT (DT a) (NP^ROOT>DT (JJ b) (NP^ROOT>JJ (NN c) (NN d)))))");
  CHECK(undo("(ROOT (NP^ROOT (DT a) (NP^ROOT>DT (JJ b) (NP^ROOT>JJ (NN c) (NN d)))))",
             TransformSpec{}) == "(ROOT (NP (DT a) (JJ b) (NN c) (NN d)))");
}

TEST_CASE("the inverse restores the treebank's root wrapper style") {
  TransformSpec spec;
  spec.wrapper = TransformSpec::Wrapper::kEmpty;
  CHECK(undo("(ROOT (S (NN x)))", spec) == "( (S (NN x)))");
  spec.wrapper = TransformSpec::Wrapper::kNone;
  CHECK(undo("(ROOT (S (NN x)))", spec) == "(S (NN x))");
  spec.wrapper = TransformSpec::Wrapper::kTop;
  CHECK(undo("(ROOT (S (NN x)))", spec) == "(TOP (S (NN x)))");
  spec.wrapper = TransformSpec::Wrapper::kAsIs;
  CHECK(undo("(ROOT (S (NN x)))", spec) == "(ROOT (S (NN x)))");
}

TEST_CASE("undo_transforms reads the grammar header") {
  GrammarHeader header;
  header.transforms = to_pairs(spec_with(2, 1, true));
  Tree tree = parse_tree("(ROOT (NP^ROOT (DT a) (NP^ROOT>DT (JJ b) (NP^ROOT>JJ (NN c) (NN d)))))");
  undo_transforms(tree, header);
  CHECK(to_bracketed(tree) == "(ROOT (NP (DT a) (JJ b) (NN c) (NN d)))");
  header.transforms = {{"parent", "7"}};
  CHECK_THROWS_WITH(undo_transforms(tree, header),
                    "grammar header: @transform parent='7': expected a whole number from 1 to 3");
  CHECK_THROWS_WITH(check_transforms(header, "g.pcfg"),
                    "g.pcfg: @transform parent='7': expected a whole number from 1 to 3");
  header.transforms = {{"sideways", "1"}};
  CHECK_THROWS_WITH(undo_transforms(tree, header),
                    "grammar header: @transform has an unknown key 'sideways'; expected functions, "
                    "empties, start, wrapper, parent, unary, horizontal or rare-words");
}

TEST_CASE("header pairs round-trip") {
  for (int v = 1; v <= 3; ++v) {
    for (int h : {TransformSpec::kNoBinarize, TransformSpec::kUnlimited, 0, 1, 2, 5}) {
      TransformSpec spec = spec_with(v, h, v == 2);
      spec.rare_words = v;
      spec.wrapper = TransformSpec::Wrapper::kTop;
      CHECK(to_pairs(from_pairs(to_pairs(spec), "x")) == to_pairs(spec));
    }
  }
}

std::string problem_of(const std::string& text) {
  const auto problem = check_training_tree(parse_tree(text));
  return problem ? problem->message : "(none)";
}

TEST_CASE("training trees are checked") {
  CHECK(problem_of("(ROOT (S (NP (DT the) (NN dog))))") == "(none)");
  CHECK(problem_of("( (S (NN dog)))") == "(none)");
  CHECK(problem_of("(NN dog)") == "(none)");
  CHECK(problem_of("(ROOT dog)") == "word 'dog' has no tag of its own: expected (TAG word)");
  CHECK(problem_of("(TOP dog)") == "word 'dog' has no tag of its own: expected (TAG word)");
  CHECK(problem_of("(S ( (NN dog)))") == "constituent without a label: expected (LABEL child ...)");
  CHECK(problem_of("(S (N^P (NN dog)))") ==
        "label 'N^P' contains '^', which grammar transforms reserve for their own labels");
  CHECK(problem_of("(S (# #))") ==
        "label '#' cannot be a grammar symbol (symbols may not contain '#', start with '\"', '<' "
        "or '@', or be '->'); rename it in the treebank");
  CHECK(problem_of("(S (<X y))") ==
        "label '<X' cannot be a grammar symbol (symbols may not contain '#', start with '\"', "
        "'<' or '@', or be '->'); rename it in the treebank");
  CHECK(problem_of("()") == "empty tree (): expected a tree with words");
  // Words beside constituents and empty constituents are refused by the reader already.
  CHECK_THROWS_AS(parse_tree("(S (NP the (NN dog)))"), InputError);
  CHECK_THROWS_AS(parse_tree("(S (NP) (NN dog))"), InputError);
}

// A random treebank tree: labels with function tags and indices, empty elements, unary
// chains, wide constituents, words shared across trees.
std::string random_tree(std::mt19937& rng, const std::string& wrapper) {
  const char* phrasal[] = {"S", "NP", "VP", "PP", "NP-SBJ", "S-TPC-1", "ADJP", "SBAR", "NP=2"};
  const char* tags[] = {"DT", "NN", "VBZ", "IN", "PRP$", "-LRB-", ",", "JJ"};
  std::string out;
  std::uniform_int_distribution<int> pick(0, 99);
  // An explicit stack of open constituents with the children still to write.
  std::vector<int> todo{1 + pick(rng) % 3};
  out += wrapper.empty() ? "( " : wrapper == "none" ? "" : "(" + wrapper + " ";
  out += "(S ";
  while (!todo.empty()) {
    if (todo.back() == 0) {
      out += ")";
      todo.pop_back();
      continue;
    }
    --todo.back();
    const int roll = pick(rng);
    if (roll < 35 && todo.size() < 9) {
      out += "(" + std::string(phrasal[pick(rng) % 9]) + " ";
      todo.push_back(roll < 8 ? 1 : 1 + pick(rng) % 5);  // some unary, some up to 5 wide
    } else if (roll < 40) {
      out += "(-NONE- *T*-1)";
    } else {
      out += "(" + std::string(tags[pick(rng) % 8]) + " w" + std::to_string(pick(rng) % 7) + ")";
    }
  }
  if (wrapper != "none") out += ")";
  return out;
}

// The original after the scoring scheme's normalisation: function tags, empties out.
std::string normalised(const Tree& tree) {
  EditTree edit = to_edit_tree(tree);
  strip_functions(edit);
  drop_empties(edit, "-NONE-");
  return to_bracketed(to_tree(edit));
}

// Transform, write in bracketed form, read back, undo: equal to the normalised original.
void check_round_trip(const Tree& original, const TransformSpec& spec, bool score = true,
                      bool reread = true) {
  EditTree edit = to_edit_tree(original);
  const std::string start_label = std::string(original.label(original.root()));
  TransformSpec used = spec;
  used.wrapper = wrapper_style(edit, spec.start);
  apply_transforms(edit, used);
  if (edit.root < 0) return;  // nothing but empty elements
  // Writing and re-reading shows the labels survive the bracketed form (generated bank only:
  // parse_tree sets up a 1 MB buffer per call, too slow for 50,000 calls).
  Tree written = reread ? parse_tree(to_bracketed(to_tree(edit))) : to_tree(edit);
  GrammarHeader header;
  header.transforms = to_pairs(used);
  undo_transforms(written, header);
  INFO("tree: ", to_bracketed(original));
  INFO("spec: v=", spec.parent, " h=", spec.horizontal, " unary=", spec.collapse_unary);
  REQUIRE(to_bracketed(written) == normalised(original));
  if (!score) return;
  static Scorer scorer(Scheme{});
  CHECK(scorer.score(original, written).exact_match());
}

TEST_CASE("round trip over a generated treebank for every v, h and unary setting") {
  std::mt19937 rng(20261201);
  std::vector<Tree> bank;
  for (const std::string wrapper : {"ROOT", "TOP", "", "none"}) {
    for (int i = 0; i < 150; ++i) bank.push_back(parse_tree(random_tree(rng, wrapper)));
  }
  for (int v = 1; v <= 3; ++v) {
    for (int h : {TransformSpec::kNoBinarize, 0, 1, 2, 3, TransformSpec::kUnlimited}) {
      for (bool unary : {false, true}) {
        for (const Tree& tree : bank) check_round_trip(tree, spec_with(v, h, unary));
      }
    }
  }
}

TEST_CASE("round trip over the open treebank gum-ccby-train") {
  const char* shared = std::getenv("TREEGATE_SHARED");
  const std::filesystem::path dir =
      std::filesystem::path(shared ? shared : TREEGATE_SOURCE_DIR "/../shared") / "data" /
      "gum-ccby-train" / "trees";
  if (!std::filesystem::is_directory(dir)) {
    if (std::getenv("CI")) FAIL("gum-ccby-train missing: ", dir.string());
    MESSAGE("not run: ", dir.string(), " not found (set TREEGATE_SHARED)");
    return;
  }
  std::vector<Tree> bank;
  for (const auto& entry : std::filesystem::directory_iterator(dir)) {
    for (Tree& tree : read_tree_file(entry.path().string())) bank.push_back(std::move(tree));
  }
  CHECK(bank.size() == 2387);
  for (int v = 1; v <= 3; ++v) {
    for (int h : {TransformSpec::kNoBinarize, 1, TransformSpec::kUnlimited}) {
      for (bool unary : {false, true}) {
        for (const Tree& tree : bank) check_round_trip(tree, spec_with(v, h, unary), true, false);
      }
    }
  }
}

TEST_CASE("a tree nested 90,000 levels deep is transformed and undone without recursion") {
  std::string text;
  for (int i = 0; i < 90000; ++i) text += "(X ";
  text += "(NN w) (NN v) (NN u)";
  text += std::string(90000, ')');
  ReadLimits limits;
  limits.max_depth = 300000;
  std::istringstream in(text);
  BracketReader reader(in, "deep", LabelTable::shared(), limits);
  Tree tree;
  REQUIRE(reader.next(tree));
  check_round_trip(tree, spec_with(3, 1, true), /*score=*/false);  // scoring is quadratic in depth
}

}  // namespace
}  // namespace treegate::pcfg
