// Error classes: every wrong bracket of a gold/test pair (a gold bracket the test tree lacks,
// or a test bracket gold lacks) is given to one error of one class (attachment, coordination,
// NP-internal, label, unary, other). The definitions are ours; see docs/compare.md.
// An ErrorClassifier borrows a Scorer (labels, scheme) and is not thread-safe: one per thread.
#pragma once

#include <cstdint>
#include <map>
#include <string>
#include <vector>

#include "evaluator/parseval.h"

namespace treegate {

enum class ErrorKind { kAttachment, kCoordination, kNpInternal, kLabel, kUnary, kOther };

/// Which labels play which part in the definitions (canonical labels, after the scheme).
struct ErrorClassOptions {
  std::vector<std::string> coordination_labels{"CC", "CONJP"};  // a child with one of these
  std::vector<std::string> noun_phrase_labels{"NP"};            // base NPs are of these
  std::vector<std::string> clause_labels{"S", "SBAR", "SBARQ", "SINV", "SQ"};
};

/// One wrong bracket: which tree it is in, its label and span (scored word positions).
struct WrongBracket {
  bool in_gold;  // true: gold has it and the test tree does not; false: the reverse
  LabelId label;
  std::uint32_t start, end;
};

/// One error: a class, the constituent it is about, and the wrong brackets it accounts for.
struct ClassifiedError {
  ErrorKind kind;
  LabelId label;  // attachment: the moved constituent's label; label error: gold's label;
                  // otherwise the first wrong bracket's label
  std::uint32_t start, end;  // attachment: the moved constituent; NP-internal: the base NP;
                             // otherwise the first wrong bracket
  std::vector<WrongBracket> brackets;
};

struct SentenceErrors {
  bool classified = false;  // false when the pair was not scored (no parse, yield mismatch)
  std::vector<ClassifiedError> errors;
};

/// The class name shown to users: "PP attachment", "clause attachment", "coordination",
/// "NP-internal", "label", "unary", "other".
std::string error_class_name(const ClassifiedError& error, const LabelTable& labels,
                             const ErrorClassOptions& options = {});

class ErrorClassifier {
 public:
  explicit ErrorClassifier(Scorer& scorer, ErrorClassOptions options = {});
  /// Classifies every wrong bracket of `test` against `gold` (trees in the scorer's labels).
  /// `score`, when given, is the scorer's result for this pair (saves scoring it again).
  SentenceErrors classify(const Tree& gold, const Tree& test, const SentenceScore* score = nullptr);

 private:
  struct Work;
  Scorer* scorer_;
  ErrorClassOptions options_;
};

/// Counts per class over many sentences: errors, and the wrong brackets they account for.
struct ClassCount {
  std::uint64_t errors = 0;
  std::uint64_t brackets = 0;
};

class ErrorTally {
 public:
  void add(const SentenceErrors& sentence, const LabelTable& labels,
           const ErrorClassOptions& options = {});
  void merge(const ErrorTally& other);
  /// Keyed by error_class_name().
  const std::map<std::string, ClassCount>& by_class() const { return by_class_; }
  std::uint64_t sentences() const { return sentences_; }

 private:
  std::map<std::string, ClassCount> by_class_;
  std::uint64_t sentences_ = 0;
};

}  // namespace treegate
