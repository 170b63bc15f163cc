#include "harness/run/builtin_parser.h"

#include <cmath>

#include "harness/pcfg/compiled_grammar.h"
#include "harness/pcfg/parser.h"

namespace treegate::run {
namespace {

class BuiltinParser : public SentenceParser {
 public:
  BuiltinParser(std::shared_ptr<const pcfg::CompiledGrammar> grammar, bool gold_tags)
      : parser_(std::move(grammar)) {
    options_.gold_tags = gold_tags;
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
  BuiltinFactory(std::shared_ptr<const pcfg::CompiledGrammar> grammar, bool gold_tags)
      : grammar_(std::move(grammar)), gold_tags_(gold_tags) {}
  std::unique_ptr<SentenceParser> make() const override {
    return std::make_unique<BuiltinParser>(grammar_, gold_tags_);
  }
  std::string describe() const override { return gold_tags_ ? "builtin (gold tags)" : "builtin"; }
  bool wants_tags() const override { return gold_tags_; }

 private:
  std::shared_ptr<const pcfg::CompiledGrammar> grammar_;
  bool gold_tags_;
};

}  // namespace

std::unique_ptr<ParserFactory> make_builtin_parser(const std::string& grammar_path,
                                                   bool gold_tags) {
  return std::make_unique<BuiltinFactory>(pcfg::load_compiled_grammar(grammar_path), gold_tags);
}

}  // namespace treegate::run
