// law_math.hpp (bayes, internal) - the pieces of a Beta law that several
// Bayesian answers share: log B(a, b), quantiles, the log density, its
// windows and scale, and the check of a cross-group call's size.
#pragma once

#include <cstdint>
#include <cstddef>
#include <utility>

#include "tallyrates/bayes/law.hpp"

namespace tallyrates::bayes::detail {

// Quantile used to bound the integration windows: what lies beyond is below
// 1e-100 of the mass (Boost's inverse incomplete beta gives up near 1e-300).
// Probabilities below about 1e-90 therefore keep only their absolute accuracy.
inline constexpr double window_tail = 1e-100;
// Steps of a root search before it is called a failure (Err:523).
inline constexpr std::uintmax_t max_root_steps = 200;

// log B(a, b) by log-gamma: its absolute error grows like eps * a log a (about
// 3e-9 at a = 10^6), which is what SAME can promise there.
double log_beta(double a, double b);
double quantile(const beta_law& law, double q);
// log density up to its constant, for comparing two points.
double log_kernel(const beta_law& law, double x);
// log density, accurate for large parameters.
double log_density(const beta_law& law, double x);
// The point below which (or, upper, above which) the law holds `tail` of its
// mass (rate_axis.cpp: Boost's inverse, a bisection where it gives up).
double tail_point(const beta_law& law, double tail, bool upper);
// A density that is infinite at an end (a or b below 1).
bool singular_ends(const beta_law& law);
double sd(const beta_law& law);
// The window where law's mass lies (all but `tail` of it).
std::pair<double, double> window(const beta_law& law, double tail = window_tail);

// Cross-group answers cost about G integrand terms per point and cell
// (BEST, LOSS), G^2 cells (ORDER) or G cells of G terms (TABLE): caps on
// the groups keep every call within seconds (README, Caps); budget_exceeded
// past `cap`.
void check_groups(std::size_t groups, std::size_t cap, const char* what);

}  // namespace tallyrates::bayes::detail
