// Reading and writing bracketed trees: "(S (NP (DT the) (NN dog)) (VP (VBZ barks)))".
// BracketReader streams any number of trees from an istream in bounded memory (one tree at a
// time), without recursion, and throws InputError with file:line:col, the 1-based tree number
// and what it expected. `()` is read as an empty tree (the usual "no parse" marker).
// Words and labels may hold any bytes but whitespace, parentheses and NUL.
#pragma once

#include <istream>
#include <memory>
#include <ostream>
#include <string>
#include <string_view>
#include <vector>

#include "evaluator/tree.h"

namespace treegate {

struct ReadLimits {
  std::size_t max_depth = 100000;    // deeper nesting is an error, never a stack overflow
  std::size_t max_nodes = 20000000;  // nodes in one tree
};

class BracketReader {
 public:
  BracketReader(std::istream& in, std::string source, LabelTable& labels = LabelTable::shared(),
                ReadLimits limits = {});
  /// Reads from `text` in memory (copied once; no stream buffering).
  BracketReader(std::string_view text, std::string source,
                LabelTable& labels = LabelTable::shared(), ReadLimits limits = {});
  ~BracketReader();
  BracketReader(const BracketReader&) = delete;
  BracketReader& operator=(const BracketReader&) = delete;

  /// Reads the next tree into `out` (cleared first). Returns false at the end of the input.
  /// Throws InputError on bad syntax; after that, next() resumes at the next line that starts
  /// with '(' so the remaining trees can still be read.
  bool next(Tree& out);
  /// Trees started so far (the number of the last tree returned or failed).
  std::size_t trees_started() const;
  /// Line (1-based) where the last tree returned by next() started.
  std::size_t tree_line() const;
  const std::string& source() const;

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

/// Reads exactly one tree from `text` (more or fewer is an InputError naming `source`).
Tree parse_tree(std::string_view text, const std::string& source = "<string>",
                LabelTable& labels = LabelTable::shared());

/// Reads every tree of a file. Throws InputError (also when the file cannot be opened).
std::vector<Tree> read_tree_file(const std::string& path,
                                 LabelTable& labels = LabelTable::shared());

/// The one-line form: "(S (NP (DT the) (NN dog)) (VP (VBZ barks)))"; an empty tree is "()".
std::string to_bracketed(const Tree& tree);
void write_bracketed(std::ostream& out, const Tree& tree);
/// An indented form: one constituent per line, preterminals kept on their parent's line
/// when they fit, children indented by two spaces.
std::string to_indented(const Tree& tree);

}  // namespace treegate
