// The PARSEVAL counts of a results case and the scorer's SentenceScore are the same figures:
// one pair of functions moves them either way (run records a score; the gate, reports and
// the HTML page read it back). Pure functions.
#pragma once

#include "evaluator/parseval.h"
#include "harness/results/results.h"

namespace treegate::results {

/// Sets `c.score`, its bracket, crossing, word and tag counts, and `c.f1` from `s`.
void set_score(CaseRecord& c, const SentenceScore& s);

/// The SentenceScore that `c` records (status from `c.score`; an unknown name is kError).
SentenceScore sentence_score(const CaseRecord& c);

}  // namespace treegate::results
