#include <algorithm>
#include <fstream>
#include <sstream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "evaluator/file_text.h"

namespace treegate {
namespace {

constexpr int kEof = -1;
constexpr std::size_t kFirstChunk = 4096;  // small first reads: parse_tree on short strings
constexpr std::size_t kChunk = 1 << 20;    // doubled up to this for large files
constexpr std::size_t kCacheSlots = 4096;  // a power of two

bool is_space(int c) {
  return c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' || c == '\v';
}

// Bytes that end an atom: whitespace, parentheses and NUL (a table: this is the hot loop).
struct DelimTable {
  bool is[256] = {};
  DelimTable() {
    for (int c : {' ', '\t', '\n', '\r', '\f', '\v', '(', ')', '\0'})
      is[static_cast<unsigned char>(c)] = true;
  }
};
const DelimTable kDelims;
bool is_delim(int c) { return c == kEof || kDelims.is[c & 0xff]; }

struct Open {
  NodeId node;
  std::size_t line, col;
};

// The stream of a reader over text in memory: never read (refill() checks `in_memory`).
std::istream& no_stream() {
  static std::istringstream empty;
  return empty;
}

}  // namespace

struct BracketReader::Impl {
  std::istream& in;
  bool in_memory = false;
  std::string source;
  LabelTable& labels;
  ReadLimits limits;
  std::string buf;
  std::size_t pos = 0;
  std::size_t chunk = kFirstChunk;
  std::size_t line = 1, col = 1;
  std::size_t trees = 0;
  std::size_t tree_line = 0;
  bool recovering = false;
  std::string atom;
  std::vector<Open> stack;
  // Labels seen by this reader, so most labels are found without the shared table's lock:
  // a small open-addressing table (FNV-1a hash) that stops growing when half full.
  struct CacheSlot {
    std::string name;
    LabelId id = LabelTable::kNone;
  };
  std::vector<CacheSlot> cache;  // allocated from the second tree on (parse_tree reads one)
  std::size_t cached = 0;

  Impl(std::istream& i, std::string s, LabelTable& l, ReadLimits lim)
      : in(i), source(std::move(s)), labels(l), limits(lim) {}
  // Over text in memory: the whole text is the first chunk, and refill() finds the end.
  Impl(std::string_view text, std::string s, LabelTable& l, ReadLimits lim)
      : in(no_stream()), in_memory(true), source(std::move(s)), labels(l), limits(lim), buf(text) {}

  bool refill() {
    if (in_memory) {  // all of the text was the first chunk
      buf.clear();
      pos = 0;
      return false;
    }
    buf.resize(chunk);
    in.read(buf.data(), static_cast<std::streamsize>(chunk));
    chunk = std::min(chunk * 2, kChunk);
    buf.resize(static_cast<std::size_t>(in.gcount()));
    pos = 0;
    return !buf.empty();
  }
  int peek() {
    if (pos == buf.size() && !refill()) return kEof;
    return static_cast<unsigned char>(buf[pos]);
  }
  void advance() {
    if (buf[pos++] == '\n') {
      ++line;
      col = 1;
    } else {
      ++col;
    }
  }
  void skip_space() {
    for (int c = peek(); is_space(c); c = peek()) advance();
  }
  // Reads an atom (label or word); the caller has checked it is not a delimiter. The view
  // points into the buffer, or into `atom` when the atom crosses a chunk boundary; it is valid
  // until the next read.
  std::string_view read_atom() {
    const std::size_t start = pos;
    while (pos < buf.size() && !is_delim(static_cast<unsigned char>(buf[pos]))) ++pos;
    col += pos - start;
    if (pos < buf.size()) return std::string_view(buf).substr(start, pos - start);
    atom.assign(buf, start, pos - start);
    while (refill()) {
      while (pos < buf.size() && !is_delim(static_cast<unsigned char>(buf[pos]))) ++pos;
      atom.append(buf, 0, pos);
      col += pos;
      if (pos < buf.size()) break;
    }
    return atom;
  }

  [[noreturn]] void fail(std::size_t l, std::size_t c, const std::string& what) {
    recovering = true;
    throw InputError(source, l, c, "tree " + std::to_string(trees) + ": " + what);
  }
  // Describes what stands at the current position, without consuming it.
  std::string found_here() {
    int c = peek();
    if (c == kEof) return "end of file";
    if (c == 0) return "a NUL byte";
    if (c == '(') return "'('";
    if (c == ')') return "')'";
    std::size_t end = pos;
    while (end < buf.size() && !is_delim(static_cast<unsigned char>(buf[end]))) ++end;
    return quote_for_message(buf.substr(pos, end - pos));
  }

  void skip_to_next_tree() {
    // Resume at the next '(' in column 1, the usual start of a tree in treebank files.
    for (int c = peek(); c != kEof; c = peek()) {
      if (c == '(' && col == 1) break;
      advance();
    }
    recovering = false;
  }

  LabelId intern_atom(std::string_view name) {
    if (trees < 2) return labels.intern(name);
    if (cache.empty()) cache.resize(kCacheSlots);
    std::uint64_t h = 1469598103934665603ull;
    for (unsigned char c : name) h = (h ^ c) * 1099511628211ull;
    for (std::size_t i = h & (kCacheSlots - 1);; i = (i + 1) & (kCacheSlots - 1)) {
      CacheSlot& slot = cache[i];
      if (slot.id == LabelTable::kNone) {
        const LabelId id = labels.intern(name);
        if (cached < kCacheSlots / 2) {
          slot.name = name;
          slot.id = id;
          ++cached;
        }
        return id;
      }
      if (slot.name == name) return slot.id;
    }
  }

  void open_node(Tree& out, std::size_t l, std::size_t c) {
    const NodeId parent = stack.empty() ? kNoNode : stack.back().node;
    skip_space();
    const int next = peek();
    NodeId id;
    if (next == '(') {
      id = out.add_node(LabelTable::kEmpty, parent);
    } else if (next == ')' || next == kEof || next == 0) {
      fail(line, col, "expected a label or '(' after '(' but found " + found_here());
    } else {
      id = out.add_node(intern_atom(read_atom()), parent);
    }
    if (stack.size() >= limits.max_depth) {
      fail(l, c, "nested deeper than " + std::to_string(limits.max_depth) + " levels");
    }
    if (out.size() > limits.max_nodes) {
      fail(l, c, "more than " + std::to_string(limits.max_nodes) + " nodes in one tree");
    }
    stack.push_back({id, l, c});
  }

  std::string open_desc(const Tree& out, const Open& o) {
    std::string lab(out.label(o.node));
    return "'(" + lab + "' opened at " + std::to_string(o.line) + ":" + std::to_string(o.col);
  }

  bool read(Tree& out) {
    out.clear();
    stack.clear();
    if (recovering) skip_to_next_tree();
    skip_space();
    int c = peek();
    if (c == kEof) return false;
    ++trees;
    tree_line = line;
    if (c != '(') fail(line, col, "expected '(' to start a tree but found " + found_here());
    std::size_t l = line, cl = col;
    advance();
    skip_space();
    if (peek() == ')') {  // "()" : the empty tree
      advance();
      return true;
    }
    open_node(out, l, cl);
    while (!stack.empty()) {
      skip_space();
      c = peek();
      const Open& top = stack.back();
      const Node& node = out.node(top.node);
      if (c == '(') {
        if (node.first_child != kNoNode && out.node(node.first_child).is_leaf()) {
          fail(line, col,
               "expected ')' after the word of " + open_desc(out, top) +
                   " (a tag holds exactly one word) but found '('");
        }
        l = line;
        cl = col;
        advance();
        open_node(out, l, cl);
      } else if (c == ')') {
        if (node.first_child == kNoNode) {
          fail(line, col,
               "expected a word or '(' inside " + open_desc(out, top) + " but found ')'");
        }
        advance();
        stack.pop_back();
      } else if (c == kEof) {
        fail(line, col, "expected ')' to close " + open_desc(out, top) + " but found end of file");
      } else if (c == 0) {
        fail(line, col, "found a NUL byte; expected a word, '(' or ')'");
      } else {
        l = line;
        cl = col;
        const std::string_view word = read_atom();
        if (node.first_child != kNoNode) {
          fail(l, cl,
               "expected '(' or ')' inside " + open_desc(out, top) + " but found word " +
                   quote_for_message(std::string(word)) +
                   " (a word must be the only child of its tag)");
        }
        out.add_leaf(word, top.node);
      }
    }
    return true;
  }
};

BracketReader::BracketReader(std::istream& in, std::string source, LabelTable& labels,
                             ReadLimits limits)
    : impl_(std::make_unique<Impl>(in, std::move(source), labels, limits)) {}

BracketReader::BracketReader(std::string_view text, std::string source, LabelTable& labels,
                             ReadLimits limits)
    : impl_(std::make_unique<Impl>(text, std::move(source), labels, limits)) {}

BracketReader::~BracketReader() = default;

bool BracketReader::next(Tree& out) { return impl_->read(out); }
std::size_t BracketReader::trees_started() const { return impl_->trees; }
std::size_t BracketReader::tree_line() const { return impl_->tree_line; }
const std::string& BracketReader::source() const { return impl_->source; }

Tree parse_tree(std::string_view text, const std::string& source, LabelTable& labels) {
  BracketReader reader(text, source, labels);
  Tree tree(labels);
  // Each '(' opens at most one constituent and one word below it: one allocation each.
  const auto opens = static_cast<std::size_t>(std::count(text.begin(), text.end(), '('));
  tree.reserve(2 * opens, opens, text.size());
  if (!reader.next(tree))
    throw InputError(source, 1, 1, "expected a bracketed tree but found nothing");
  Tree extra(labels);
  bool more = false;
  try {
    more = reader.next(extra);
  } catch (const InputError&) {
    more = true;
  }
  if (more) {
    throw InputError(source, reader.tree_line(), 0,
                     "expected one bracketed tree but found more text after it");
  }
  return tree;
}

std::vector<Tree> read_tree_file(const std::string& path, LabelTable& labels) {
  std::ifstream in = open_input_file(path);
  BracketReader reader(in, path, labels);
  std::vector<Tree> trees;
  Tree tree(labels);
  while (reader.next(tree)) trees.push_back(tree);
  return trees;
}

}  // namespace treegate
