#include "dense_cky.h"

#include <cmath>
#include <limits>

namespace treegate::bench {

double DenseCky::parse(const std::vector<std::vector<pcfg::LexEntry>>& lexical,
                       std::uint64_t& applications) {
  constexpr double kNone = -std::numeric_limits<double>::infinity();
  const std::size_t n = lexical.size(), S = g_.num_symbols();
  auto cell = [n](std::size_t i, std::size_t j) { return i * n - i * (i - 1) / 2 + (j - i - 1); };
  chart_.assign(n * (n + 1) / 2 * S, kNone);
  pre_.resize(S);
  auto close = [&](double* out) {
    for (pcfg::Symbol b = 0; b < S; ++b) {
      if (pre_[b] == kNone) continue;
      for (const pcfg::UnaryLink& link : g_.unary_above(b)) {
        out[link.top] = std::max(out[link.top], pre_[b] + link.logp);
      }
    }
  };
  for (std::size_t i = 0; i < n; ++i) {
    std::fill(pre_.begin(), pre_.end(), kNone);
    for (const pcfg::LexEntry& e : lexical[i]) pre_[e.symbol] = std::max(pre_[e.symbol], e.logp);
    close(&chart_[cell(i, i + 1) * S]);
  }
  for (std::size_t span = 2; span <= n; ++span) {
    for (std::size_t i = 0; i + span <= n; ++i) {
      const std::size_t j = i + span;
      std::fill(pre_.begin(), pre_.end(), kNone);
      for (std::size_t k = i + 1; k < j; ++k) {
        const double* left = &chart_[cell(i, k) * S];
        const double* right = &chart_[cell(k, j) * S];
        for (pcfg::Symbol b = 0; b < S; ++b) {
          if (left[b] == kNone) continue;
          for (const pcfg::RightGroup& grp : g_.groups(b)) {
            const double r = right[grp.right];
            if (r == kNone) continue;
            applications += grp.end - grp.begin;
            for (std::uint32_t t = grp.begin; t < grp.end; ++t) {
              const pcfg::BinaryTarget& target = g_.target(t);
              pre_[target.lhs] = std::max(pre_[target.lhs], left[b] + r + target.logp);
            }
          }
        }
      }
      close(&chart_[cell(i, j) * S]);
    }
  }
  return chart_[cell(0, n) * S + g_.start()];
}

}  // namespace treegate::bench
