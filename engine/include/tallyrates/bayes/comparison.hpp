// comparison.hpp - Bayesian comparisons of two groups' rates, each a
// one-dimensional integral over a rate x or a finite sum:
// - AHEAD: P(rate_1 > rate_2), on the side that is the smaller probability so
//   that small answers keep their relative accuracy: the finite sum of Cook
//   (2005, technical report, UT MD Anderson Cancer Center) over the first
//   Beta parameter of the group behind, or over the second of the group ahead
//   (by symmetry), whichever is the smaller whole number up to 2,000,000
//   (whole counts and a whole prior), else the integral of f_1(x) F_2(x) dx;
// - the credible bounds of a difference of two rates;
// - ORDER: every pair's AHEAD.
#pragma once

#include <vector>
#include <span>

#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/interval.hpp"

namespace tallyrates::bayes {

// P(rate of law x > rate of law y).
double ahead(const beta_law& x, const beta_law& y);
// P(rate x is the better one): above y's for goal high, below for goal low.
inline double ahead(const beta_law& x, const beta_law& y, goal g) { return g == goal::high ? ahead(x, y) : ahead(y, x); }
// The same to an absolute accuracy of about 1e-9 only (a tiny probability
// loses its relative digits), where it is compared with a confidence
// (RATES.PLAN.AHEAD): an integral, when one is needed, runs over the law's
// 1e-16 quantiles instead of its 1e-100 ones, to a relative tolerance of
// 1e-9. Finite sums are as in `ahead`.
double ahead_absolute(const beta_law& x, const beta_law& y);
// Central credible bounds at `level` for rate_x - rate_y: the d where
// P(rate_x - rate_y <= d) = (1 -+ level) / 2, that probability being the
// integral of f_y(t) F_x(t + d) dt (split where t + d meets 0 or 1), found by
// a bracketing root search (TOMS 748).
interval difference(const beta_law& x, const beta_law& y, double level);
// Cap on the groups of ORDER (budget_exceeded, Err:523, beyond it): it fills
// G x G cells, one sum or integral per pair (100 groups of 300 with
// Jeffreys' prior: about 0.7 s); all the pairs share one work cap (about
// 2 s), which refuses large groups sooner.
inline constexpr std::size_t max_groups_order = 100;
// RATES.POST.ORDER: cell (r, c) holds P(rate_r > rate_c) (P(rate_r < rate_c)
// for goal low: row r better than column c), the diagonal 0.
std::vector<std::vector<double>> order(std::span<const beta_law> laws, goal g = default_goal);

}  // namespace tallyrates::bayes
