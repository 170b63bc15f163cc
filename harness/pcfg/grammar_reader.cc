// The `.pcfg` reader: one line at a time, tokens with their 1-based byte columns, the first
// error thrown as InputError with file:line:col and what was expected.
#include <charconv>
#include <cmath>
#include <fstream>
#include <map>
#include <sstream>

#include "evaluator/errors.h"
#include "harness/pcfg/grammar.h"

namespace treegate::pcfg {
namespace {

enum class TokenKind { bare, quoted };

struct Token {
  TokenKind kind;
  std::string text;  // bare: as written; quoted: unescaped contents
  std::size_t col;   // 1-based byte column of the first character
};

class LineReader {
 public:
  LineReader(const std::string& file, std::size_t line) : file_(file), line_(line) {}

  [[noreturn]] void fail(std::size_t col, const std::string& message) const {
    throw InputError(file_, line_, col, message);
  }

  /// Splits `text` into tokens; a `#` outside quotes ends the line.
  std::vector<Token> tokenize(std::string_view text) const {
    std::vector<Token> tokens;
    std::size_t i = 0;
    while (i < text.size()) {
      char c = text[i];
      if (c == ' ' || c == '\t' || c == '\r') {  // a stray CR is blank, as at a line's end
        ++i;
      } else if (c == '#') {
        break;
      } else if (c == '"') {
        i = read_quoted(text, i, tokens);
      } else {
        std::size_t start = i;
        while (i < text.size() && text[i] != ' ' && text[i] != '\t' && text[i] != '\r' &&
               text[i] != '#') {
          if (text[i] == '"')
            fail(i + 1, "expected whitespace before '\"' (a terminal is a separate item)");
          ++i;
        }
        tokens.push_back({TokenKind::bare, std::string(text.substr(start, i - start)), start + 1});
      }
    }
    return tokens;
  }

 private:
  std::size_t read_quoted(std::string_view text, std::size_t open, std::vector<Token>& out) const {
    std::string value;
    std::size_t i = open + 1;
    for (;;) {
      if (i >= text.size())
        fail(open + 1, "unterminated terminal: expected a closing '\"' on the same line");
      char c = text[i];
      if (c == '"') break;
      if (c == '\\') {
        if (i + 1 >= text.size() || (text[i + 1] != '"' && text[i + 1] != '\\')) {
          fail(i + 1, "expected \\\" or \\\\ after a backslash in a terminal");
        }
        value += text[i + 1];
        i += 2;
        continue;
      }
      value += c;
      ++i;
    }
    if (value.empty())
      fail(open + 1, "empty terminal \"\": expected at least one character between the quotes");
    std::size_t end = i + 1;
    if (end < text.size() && text[end] != ' ' && text[end] != '\t' && text[end] != '\r' &&
        text[end] != '#') {
      fail(end + 1, "expected whitespace after the closing '\"' of a terminal");
    }
    out.push_back({TokenKind::quoted, std::move(value), open + 1});
    return end;
  }

  const std::string& file_;
  std::size_t line_;
};

bool parse_number(const std::string& text, double& out) {
  const char* first = text.data();
  const char* last = first + text.size();
  if (first != last && *first == '+') ++first;
  auto [ptr, ec] = std::from_chars(first, last, out);
  return ec == std::errc() && ptr == last;
}

class Reader {
 public:
  explicit Reader(const std::string& name) { grammar_.source = name; }

  void line(std::string_view text, std::size_t number) {
    LineReader lr(grammar_.source, number);
    std::vector<Token> tokens = lr.tokenize(text);
    if (tokens.empty()) return;
    if (tokens[0].kind == TokenKind::bare && tokens[0].text[0] == '@') {
      header(lr, tokens, number);
    } else {
      rule(lr, tokens, number);
    }
  }

  Grammar finish() {
    if (grammar_.header.weights == WeightKind::counts) normalise_counts();
    return std::move(grammar_);
  }

 private:
  void header(const LineReader& lr, const std::vector<Token>& t, std::size_t number) {
    const std::string& key = t[0].text;
    GrammarHeader& h = grammar_.header;
    if (!grammar_.rules.empty()) {
      lr.fail(t[0].col, "header line " + key +
                            " after the first rule: expected every @ line before the rules");
    }
    auto want_one = [&](const std::string& what) {
      if (t.size() < 2) lr.fail(t[0].col + key.size(), "expected " + what + " after " + key);
      if (t.size() > 2)
        lr.fail(t[2].col, "expected the end of the line after " + key + " " + t[1].text);
      if (t[1].kind != TokenKind::bare)
        lr.fail(t[1].col, "expected " + what + ", not a quoted terminal");
    };
    if (key == "@start") {
      want_one("a start symbol");
      if (h.start_line != 0)
        lr.fail(t[0].col, "second @start line: the start symbol was set on line " +
                              std::to_string(h.start_line));
      check_nonterminal_name(lr, t[1]);
      h.start = t[1].text;
      h.start_line = number;
    } else if (key == "@weights") {
      want_one("'probabilities' or 'counts'");
      if (t[1].text == "probabilities") {
        h.weights = WeightKind::probabilities;
      } else if (t[1].text == "counts") {
        h.weights = WeightKind::counts;
      } else {
        lr.fail(t[1].col, "expected 'probabilities' or 'counts' after @weights, not " +
                              quote_for_message(t[1].text));
      }
    } else if (key == "@transform") {
      if (t.size() < 2) lr.fail(t[0].col + key.size(), "expected KEY=VALUE after @transform");
      for (std::size_t i = 1; i < t.size(); ++i) {
        std::size_t eq = t[i].kind == TokenKind::bare ? t[i].text.find('=') : std::string::npos;
        if (eq == std::string::npos || eq == 0)
          lr.fail(t[i].col,
                  "expected KEY=VALUE after @transform, not " + quote_for_message(t[i].text));
        h.transforms.emplace_back(t[i].text.substr(0, eq), t[i].text.substr(eq + 1));
      }
    } else if (key == "@unknown") {
      want_one("'signatures'");
      if (t[1].text != "signatures")
        lr.fail(t[1].col,
                "expected 'signatures' after @unknown, not " + quote_for_message(t[1].text));
      h.unknown_signatures = true;
    } else {
      lr.fail(t[0].col, "unknown header line " + quote_for_message(key) +
                            ": expected @start, @weights, @transform or @unknown");
    }
  }

  static void check_nonterminal_name(const LineReader& lr, const Token& t) {
    const char c = t.text[0];
    if (t.text == "->" || c == '<' || c == '@') {
      lr.fail(t.col, "expected a nonterminal name, not " + quote_for_message(t.text) +
                         " (names may not be '->' or start with '<' or '@')");
    }
  }

  RhsItem rhs_item(const LineReader& lr, const Token& t) {
    if (t.kind == TokenKind::quoted) return {ItemKind::terminal, t.text};
    if (t.text[0] == '<') {
      const std::string_view prefix = "<unk:";
      if (t.text.size() <= prefix.size() + 1 || t.text.compare(0, prefix.size(), prefix) != 0 ||
          t.text.back() != '>') {
        lr.fail(t.col,
                "expected an unknown-word class <unk:SIGNATURE>, not " + quote_for_message(t.text));
      }
      return {ItemKind::unknown_class,
              t.text.substr(prefix.size(), t.text.size() - prefix.size() - 1)};
    }
    check_nonterminal_name(lr, t);
    return {ItemKind::nonterminal, t.text};
  }

  void rule(const LineReader& lr, std::vector<Token>& t, std::size_t number) {
    if (t[0].kind == TokenKind::quoted)
      lr.fail(t[0].col, "expected a nonterminal before '->', not a quoted terminal");
    check_nonterminal_name(lr, t[0]);
    if (t.size() < 2 || t[1].kind != TokenKind::bare || t[1].text != "->") {
      std::size_t col = t.size() < 2 ? t[0].col + t[0].text.size() : t[1].col;
      lr.fail(col, "expected '->' after the left-hand side " + quote_for_message(t[0].text));
    }
    Rule r;
    r.lhs = t[0].text;
    r.line = number;
    std::size_t end = t.size();
    if (end > 2 && t[end - 1].kind == TokenKind::bare && t[end - 1].text.rfind("count=", 0) == 0) {
      const std::string digits = t[end - 1].text.substr(6);
      std::uint64_t n = 0;
      auto [ptr, ec] = std::from_chars(digits.data(), digits.data() + digits.size(), n);
      if (digits.empty() || ec != std::errc() || ptr != digits.data() + digits.size()) {
        lr.fail(t[end - 1].col + 6,
                "expected a whole number after count=, not " + quote_for_message(digits));
      }
      r.count = n;
      --end;
    }
    const Token& last = t[end - 1];
    if (end < 3 || last.kind != TokenKind::bare || !parse_number(last.text, r.written_weight)) {
      if (end == 2)
        lr.fail(t[1].col,
                "empty right-hand side: expected at least one symbol and a weight after '->' "
                "(epsilon rules are not allowed)");
      lr.fail(last.col, "expected a weight (a decimal number) at the end of the rule, found " +
                            (last.kind == TokenKind::quoted ? "a quoted terminal"
                                                            : quote_for_message(last.text)));
    }
    if (end == 3)
      lr.fail(last.col,
              "empty right-hand side: expected at least one symbol before the weight (epsilon "
              "rules are not allowed)");
    for (std::size_t i = 2; i + 1 < end; ++i) r.rhs.push_back(rhs_item(lr, t[i]));
    r.weight = r.written_weight;
    grammar_.rules.push_back(std::move(r));
  }

  void normalise_counts() {
    std::map<std::string, double> totals;
    for (const Rule& r : grammar_.rules) totals[r.lhs] += r.written_weight;
    for (Rule& r : grammar_.rules) {
      double total = totals[r.lhs];
      r.weight = total > 0 ? r.written_weight / total : 0.0;
    }
  }

  Grammar grammar_;
};

}  // namespace

Grammar read_grammar_string(std::string_view text, const std::string& name) {
  Reader reader(name);
  if (text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);
  std::size_t number = 0;
  while (!text.empty()) {
    ++number;
    std::size_t nl = text.find('\n');
    std::string_view line = text.substr(0, nl);
    text.remove_prefix(nl == std::string_view::npos ? text.size() : nl + 1);
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    if (line.find('\0') != std::string_view::npos) {
      throw InputError(name, number, line.find('\0') + 1,
                       "unexpected NUL byte: expected a text file");
    }
    reader.line(line, number);
  }
  return reader.finish();
}

Grammar read_grammar_file(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(path, 0, 0, "cannot open grammar file for reading");
  std::ostringstream buffer;
  buffer << in.rdbuf();
  return read_grammar_string(buffer.str(), path);
}

}  // namespace treegate::pcfg
