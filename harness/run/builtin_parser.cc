#include "harness/run/builtin_parser.h"

#include <cmath>

#include "harness/pcfg/compiled_grammar.h"
#include "harness/pcfg/parser.h"

namespace treegate::run {
namespace {

class BuiltinParser : public SentenceParser {
 public:
  BuiltinParser(std::shared_ptr<const pcfg::CompiledGrammar> grammar, const BuiltinSettings& s)
      : parser_(std::move(grammar)) {
    options_.gold_tags = s.gold_tags;
    options_.max_seconds = s.max_seconds;
    options_.max_chart_bytes = s.max_chart_bytes;
    options_.stop = s.stop;
  }

  ParseOutcome parse(const ParseRequest& request) override {
    pcfg::ParseResult r =
        parser_.parse(*request.words, options_.gold_tags ? request.tags : nullptr, options_);
    ParseOutcome o;
    o.seconds = r.seconds;
    o.reason = r.reason;
    switch (r.status) {
      case pcfg::ParseStatus::parsed:
        o.status = ParseStatus::kParsed;
        o.tree = std::move(r.tree);
        if (std::isfinite(r.logprob)) o.logprob = r.logprob;
        if (std::isfinite(r.inside_logprob)) o.inside_logprob = r.inside_logprob;
        if (!r.parses_infinite) o.parses = static_cast<double>(r.parses);
        break;
      case pcfg::ParseStatus::no_parse:
        o.status = ParseStatus::kNoParse;
        if (o.reason.empty()) o.reason = "the grammar has no parse for this sentence";
        break;
      case pcfg::ParseStatus::error:
        o.status = ParseStatus::kError;
        break;
    }
    return o;
  }

 private:
  pcfg::Parser parser_;
  pcfg::ParseOptions options_;
};

class BuiltinFactory : public ParserFactory {
 public:
  BuiltinFactory(std::shared_ptr<const pcfg::CompiledGrammar> grammar, const BuiltinSettings& s)
      : grammar_(std::move(grammar)), settings_(s) {}
  std::unique_ptr<SentenceParser> make() const override {
    return std::make_unique<BuiltinParser>(grammar_, settings_);
  }
  std::string describe() const override {
    return settings_.gold_tags ? "builtin (gold tags)" : "builtin";
  }
  bool wants_tags() const override { return settings_.gold_tags; }
  std::vector<std::string> warnings() const override {
    std::string w = grammar_->skipped_rules_warning();
    if (w.empty()) return {};
    return {std::move(w)};
  }

 private:
  std::shared_ptr<const pcfg::CompiledGrammar> grammar_;
  BuiltinSettings settings_;
};

}  // namespace

std::unique_ptr<ParserFactory> make_builtin_parser(const std::string& grammar_path,
                                                   const BuiltinSettings& settings) {
  return std::make_unique<BuiltinFactory>(pcfg::load_compiled_grammar(grammar_path), settings);
}

}  // namespace treegate::run
