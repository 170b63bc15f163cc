#include "harness/results/case_sax.h"

#include <cmath>
#include <iterator>
#include <nlohmann/json.hpp>
#include <type_traits>

namespace treegate::results::detail {
namespace {

using json = nlohmann::json;

// Keys a case line must have (checked after the line is read; at most 32, one bit each).
const char* const kKeys[] = {"suite",
                             "id",
                             "n",
                             "words",
                             "constructions",
                             "gold",
                             "predicted",
                             "parse",
                             "score",
                             "outcome",
                             "reason",
                             "logprob",
                             "inside_logprob",
                             "parses",
                             "gold_brackets",
                             "test_brackets",
                             "matched",
                             "crossing",
                             "scored_words",
                             "tags_correct",
                             "f1",
                             "min_f1",
                             "known_failure",
                             "checks",
                             "seconds"};
static_assert(std::size(kKeys) <= 32, "CaseSax::seen has one bit per key");

class CaseSax : public nlohmann::json_sax<json> {
 public:
  explicit CaseSax(CaseRecord& c) : c_(c) {}
  std::string problem;
  std::size_t error_col = 0;
  std::uint32_t seen = 0;  // bit i: kKeys[i] was there (no allocation per key)

  bool null() override { return scalar_null(); }
  bool boolean(bool v) override {
    if (depth_ == 3 && key_ == "passed") {
      c_.checks.back().passed = v;
      return true;
    }
    return wrong("true or false");
  }
  bool number_integer(number_integer_t v) override { return number(static_cast<double>(v)); }
  bool number_unsigned(number_unsigned_t v) override { return number(static_cast<double>(v)); }
  bool number_float(number_float_t v, const string_t&) override { return number(v); }
  bool string(string_t& v) override;
  bool binary(binary_t&) override { return wrong("binary data"); }
  bool start_object(std::size_t) override {
    ++depth_;
    if (depth_ == 1) return true;
    if (depth_ == 3 && array_ == "checks") {
      c_.checks.emplace_back();
      return true;
    }
    return wrong("an object");
  }
  bool end_object() override {
    --depth_;
    return true;
  }
  bool start_array(std::size_t) override {
    ++depth_;
    if (depth_ != 2) return wrong("a list");
    array_ = key_;
    return true;
  }
  bool end_array() override {
    --depth_;
    array_.clear();
    return true;
  }
  bool key(string_t& k) override {
    key_ = k;
    if (depth_ == 1) {
      for (std::size_t i = 0; i < std::size(kKeys); ++i) {
        if (k == kKeys[i]) {
          seen |= std::uint32_t{1} << i;
          break;
        }
      }
    }
    return true;
  }
  bool parse_error(std::size_t position, const std::string& last_token,
                   const nlohmann::detail::exception&) override {
    // `position` is just past the offending token; point at its first byte.
    error_col = position > last_token.size() ? position - last_token.size() + 1 : 1;
    problem = "expected one JSON object per line";
    return false;
  }

 private:
  bool wrong(const char* what) {
    problem = "unexpected " + std::string(what) + " at key '" + key_ + "'";
    return false;
  }
  bool scalar_null() {
    if (depth_ != 1) return wrong("null");
    if (key_ == "logprob")
      c_.logprob.reset();
    else if (key_ == "inside_logprob")
      c_.inside_logprob.reset();
    else if (key_ == "parses")
      c_.parses.reset();
    else if (key_ == "known_failure")
      c_.known_failure.reset();
    else
      return wrong("null");
    return true;
  }
  bool number(double v);

  CaseRecord& c_;
  int depth_ = 0;
  std::string key_, array_;
};

bool CaseSax::number(double v) {
  if (depth_ != 1) return wrong("number");
  // Counts are whole numbers in range; anything else (negative, fractional, 1e300) is an
  // input error, never a cast out of range.
  const auto whole = [&](auto& out, double max) {
    if (!(v >= 0 && v <= max && v == std::floor(v))) return wrong("number (expected a count)");
    out = static_cast<std::remove_reference_t<decltype(out)>>(v);
    return true;
  };
  const auto u32 = [&](std::uint32_t& out) { return whole(out, 4294967295.0); };
  if (key_ == "n")
    return whole(c_.n, 9007199254740992.0);  // 2^53: every count a double holds exactly
  else if (key_ == "logprob")
    c_.logprob = v;
  else if (key_ == "inside_logprob")
    c_.inside_logprob = v;
  else if (key_ == "parses")
    c_.parses = v;
  else if (key_ == "gold_brackets")
    return u32(c_.gold_brackets);
  else if (key_ == "test_brackets")
    return u32(c_.test_brackets);
  else if (key_ == "matched")
    return u32(c_.matched);
  else if (key_ == "crossing")
    return u32(c_.crossing);
  else if (key_ == "scored_words")
    return u32(c_.scored_words);
  else if (key_ == "tags_correct")
    return u32(c_.tags_correct);
  else if (key_ == "f1")
    c_.f1 = v;
  else if (key_ == "min_f1")
    c_.min_f1 = v;
  else if (key_ == "seconds")
    c_.seconds = v;
  else
    return wrong("number");
  return true;
}

bool CaseSax::string(string_t& v) {
  if (depth_ == 2 && array_ == "words") {
    c_.words.push_back(std::move(v));
    return true;
  }
  if (depth_ == 2 && array_ == "constructions") {
    c_.constructions.push_back(std::move(v));
    return true;
  }
  if (depth_ == 3 && array_ == "checks") {
    if (key_ == "check")
      c_.checks.back().check = std::move(v);
    else if (key_ == "detail")
      c_.checks.back().detail = std::move(v);
    else
      return wrong("text");
    return true;
  }
  if (depth_ != 1) return wrong("text");
  if (key_ == "suite")
    c_.suite = std::move(v);
  else if (key_ == "id")
    c_.id = std::move(v);
  else if (key_ == "gold")
    c_.gold = std::move(v);
  else if (key_ == "predicted")
    c_.predicted = std::move(v);
  else if (key_ == "parse")
    c_.parse = std::move(v);
  else if (key_ == "score")
    c_.score = std::move(v);
  else if (key_ == "reason")
    c_.reason = std::move(v);
  else if (key_ == "known_failure")
    c_.known_failure = std::move(v);
  else if (key_ == "outcome") {
    const auto o = outcome_from_name(v);
    if (!o) {
      problem = "unknown outcome '" + v + "'";
      return false;
    }
    c_.outcome = *o;
  } else {
    return wrong("text");
  }
  return true;
}

}  // namespace

std::string read_case_line(std::string_view line, CaseRecord& out, std::size_t& col) {
  CaseSax sax(out);
  col = 1;
  const bool ok = json::sax_parse(line.begin(), line.end(), &sax);
  if (!ok || !sax.problem.empty()) {
    col = sax.error_col ? sax.error_col : 1;
    return sax.problem.empty() ? "expected one JSON object per line" : sax.problem;
  }
  for (std::size_t i = 0; i < std::size(kKeys); ++i) {
    if ((sax.seen & (std::uint32_t{1} << i)) == 0)
      return std::string("expected a results case: key '") + kKeys[i] + "' is missing";
  }
  return "";
}

}  // namespace treegate::results::detail
