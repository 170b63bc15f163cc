#include "harness/report/html_case.h"

#include <cmath>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "harness/report/html_diff.h"
#include "harness/report/html_escape.h"
#include "harness/report/html_table.h"
#include "harness/report/html_tree.h"

namespace treegate::report::html {
namespace {

const char* status_badge(const std::string& status) {
  if (status == "pass") return "\xE2\x9C\x93 pass";
  if (status == "fail") return "\xE2\x9C\x97 fail";
  if (status == "error") return "! error";
  if (status == "expected_failure") return "\xE2\x97\x8B expected failure";
  if (status == "unexpected_pass") return "\xE2\x98\x85 unexpected pass";
  return nullptr;
}

const char* transition_badge(const std::string& t) {
  if (t == "fixed") return "\xE2\x86\x91 fixed";
  if (t == "broken") return "\xE2\x86\x93 broken";
  if (t == "better") return "\xE2\x86\x97 better";
  if (t == "worse") return "\xE2\x86\x98 worse";
  if (t == "changed_same_f1") return "\xE2\x86\x94 changed, same F1";
  return nullptr;
}

// A tree from its bracketed text; an empty tree with `note` set when there is none or it is bad.
Tree read(const std::string& text, const char* what, LabelTable& labels, std::string& note) {
  if (text.empty() || text == "()") {
    note = std::string("no ") + what + " tree";
    return Tree(labels);
  }
  try {
    return parse_tree(text, what, labels);
  } catch (const InputError& e) {
    note = e.what();
    return Tree(labels);
  }
}

std::string words_of(const Tree& gold, const CaseView& c) {
  std::string s;
  for (std::size_t w = 0; w < gold.num_words(); ++w) {
    if (w) s += ' ';
    s += gold.word(w);
  }
  return s.empty() ? c.gold : s;  // an unreadable gold tree: filter on its text
}

std::string diff_list(const char* title, const std::vector<std::string>& items) {
  if (items.empty()) return "";
  std::string out = fmt::format("<p>{} ({}):</p><ul>", title, items.size());
  for (const auto& i : items) out += "<li>" + escape(i) + "</li>";
  return out + "</ul>";
}

std::string f1_text(const CaseView& c) {
  std::string out = "F1 " + fixed(c.f1, 2);
  if (c.f1_before) out += " " + delta_html(Figure{c.f1, c.f1_before}, 2);
  return out;
}

}  // namespace

CaseRenderer::CaseRenderer(const ReportView& view)
    : view_(view), labels_(std::make_unique<LabelTable>()), scorer_(view.scheme, *labels_) {}

int case_priority(const CaseView& c) {
  if (c.transition == "broken") return 0;
  if (c.status == "fail" || c.status == "error") return 1;
  if (c.transition == "fixed" || c.transition == "worse" || c.transition == "better") return 2;
  if (c.transition == "changed_same_f1" || c.status == "unexpected_pass") return 3;
  if (c.status == "expected_failure") return 4;
  return 5;
}

std::string tree_key() {
  auto swatch = [](const char* cls) {
    return fmt::format(
        "<svg width=\"34\" height=\"18\" aria-hidden=\"true\" class=\"tree\"><g class=\"node {}\">"
        "<rect x=\"1\" y=\"1\" width=\"32\" height=\"16\" rx=\"4\"/></g></svg>",
        cls);
  };
  return "<p class=\"key\"><span>" + swatch("m-match") + " XP: bracket in both trees</span><span>" +
         swatch("m-wrong") + " XP +: in the predicted tree, not in gold (wrong)</span><span>" +
         swatch("m-missing") +
         " XP \xE2\x88\x92: in gold, not in the predicted tree (missing)</span><span>" +
         swatch("m-tag") + " TAG *: tag differs from gold</span></p>";
}

std::string CaseRenderer::render(const CaseView& c, bool draw) {
  std::string gold_note, new_note, old_note;
  const Tree gold = read(c.gold, "gold", *labels_, gold_note);
  const Tree test = read(c.predicted, "predicted", *labels_, new_note);
  Tree old(*labels_);
  if (c.predicted_before) old = read(*c.predicted_before, "baseline", *labels_, old_note);
  const std::string words = words_of(gold, c);

  const nlohmann::json cons = c.constructions;
  std::string out = fmt::format(
      "<details class=\"case st-{}\" data-suite=\"{}\" data-id=\"{}\" data-status=\"{}\" "
      "data-transition=\"{}\" data-constructions=\"{}\" data-words=\"{}\" data-length=\"{}\">"
      "<summary>",
      escape(c.status), escape(c.suite), escape(c.id), escape(c.status), escape(c.transition),
      escape(cons.dump(-1, ' ', false, nlohmann::json::error_handler_t::replace)), escape(words),
      gold.num_words());
  const char* badge = status_badge(c.status);
  out += fmt::format("<span class=\"badge st-{}\">{}</span>", escape(c.status),
                     badge ? badge : escape(c.status));
  if (!c.transition.empty()) {
    const char* t = transition_badge(c.transition);
    out += fmt::format("<span class=\"badge tr\">{}</span>", t ? t : escape(c.transition));
  }
  out += "<span class=\"cid\">" + escape(c.suite) + " / " + escape(c.id) + "</span>";
  out += "<span class=\"f1\">" + f1_text(c) + "</span>";
  out += "<span class=\"sentence\">" + escape(words) + "</span></summary><div class=\"case-body\">";
  if (!c.reason.empty()) out += "<p class=\"reason\">" + escape(c.reason) + "</p>";
  for (const auto& check : c.failed_checks) out += "<p>check: " + escape(check) + "</p>";
  if (!c.constructions.empty()) {
    std::string list;
    for (const auto& k : c.constructions) list += (list.empty() ? "" : ", ") + k;
    out += "<p class=\"note\">constructions: " + escape(list) + "</p>";
  }

  const TreeDiff d = diff_trees(gold, test, scorer_);
  std::vector<TreePanel> panels;
  if (c.predicted_before) {
    const TreeDiff od = diff_trees(gold, old, scorer_);
    out += "<div class=\"diffs\">" + diff_list("missing in the new tree", d.missing) +
           diff_list("wrong in the new tree", d.wrong) +
           diff_list("wrong in the baseline tree", od.wrong) + "</div>";
    panels.push_back({view_.before_name, &old, od.test_marks, old_note});
    panels.push_back({view_.after_name, &test, d.test_marks, new_note});
    panels.push_back({"gold", &gold, d.gold_marks, gold_note});
  } else {
    out += "<div class=\"diffs\">" + diff_list("missing (in gold, not predicted)", d.missing) +
           diff_list("wrong (predicted, not in gold)", d.wrong) + "</div>";
    panels.push_back({"gold", &gold, d.gold_marks, gold_note});
    panels.push_back({"predicted", &test, d.test_marks, new_note});
  }
  if (draw) {
    out += render_trees(panels);
  } else {
    out +=
        "<p class=\"note\">Trees not drawn (the report draws at most a set number of cases; "
        "the most interesting ones first). Bracketed:</p>";
    for (const auto& p : panels) {
      out += "<p>" + escape(p.title) + "</p><pre class=\"bracketed\">" +
             escape(p.tree && !p.tree->empty() ? to_bracketed(*p.tree) : p.note) + "</pre>";
    }
  }
  return out + "</div></details>";
}

}  // namespace treegate::report::html
