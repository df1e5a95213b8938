// rate_axis.hpp (bayes, internal) - answers across groups of independent Beta posteriors
// from one pass over the rate axis: every group's chance of being the best,
// the expected best rate and every group's expected loss.
//
// P(group i best) = integral of f_i(t) prod_{j != i} C_j(t) dt, with C_j the
// CDF F_j (goal high) or 1 - F_j (goal low); E[max] = integral of
// (1 - prod F_j), E[min] = integral of prod (1 - F_j) (Gelman et al. 2013,
// Bayesian Data Analysis, 3rd ed., for the laws; the integrals are the
// order-statistic identities of any probability text). The G integrals of
// P(best) share the node values, so that pass costs about what one integral
// costs, and E[best] comes from the same node values (the product of all
// the CDFs, which the P(best) products share).
//
// What makes it trustworthy for laws of very different widths (a pilot of 5
// beside a line of 10^4, where a single adaptive rule over one group's window
// misses the other's narrow step and answered 1 instead of 0.033):
// - the pieces are cut at every law's scale: its mean +- 2, 5, 10 standard
//   deviations and its window, where the window holds all but
//   `tail` of the mass (quantiles from Boost's inverse incomplete beta);
//   every feature of every integrand then spans several nodes of some piece;
// - the integrals run only where they can be non-zero: for goal high from
//   the largest lower window edge to the largest upper one (below it some
//   other law is surely lower, above it every law is);
// - the problem is mirrored (t -> 1 - t, Beta(a, b) -> Beta(b, a), highest
//   <-> lowest) when that range lies nearer 1, so that distances to the
//   nearer end keep every digit (a line of 10^6 with no failure lives within
//   1e-5 of 1);
// - an end where some density is infinite (a parameter below 1) gets the
//   substitution t = q v^(1/a_min), under which every integrand is bounded;
// - each piece is bisected while any component's Kronrod-Gauss error
//   estimate is above its share of that component's tolerance (relative, so
//   a small P(best) keeps its digits), with caps on pieces and work.
#pragma once

#include <span>
#include <string>
#include <vector>

#include "tallyrates/bayes/across.hpp"
#include "tallyrates/bayes/law.hpp"

namespace tallyrates::bayes::detail {

// How far an integral reaches: the window's tail and the tolerances.
struct reach {
    double tail;            // mass left outside each law's window
    double relative;        // relative tolerance of every integral
    double absolute;        // below this an integral needs no relative digits
    double small_relative;  // relative tolerance of a probability below 1e-3
};
// Probabilities that may be tiny: windows at 1e-100, relative 1e-10, and
// 1e-9 below 1e-3 (the promise there is 1e-8 relative: the reference rows).
inline constexpr reach for_probability{1e-100, 1e-10, 1e-300, 1e-9};
// A probability compared with a confidence (RATES.PLAN.AHEAD): 1e-16 cuts
// less than 2e-16, and 1e-9 absolute is plenty.
inline constexpr reach for_comparison{1e-16, 1e-9, 1e-12, 1e-9};

// A point below which Beta(a, b) holds at most `tail` of its mass, as a
// distance from 0 (exact however close to 0): Boost's inverse, with a
// bisection on the logarithm of the distance where that inverse gives up,
// and the normal law's 25 standard deviations when both parameters exceed
// 10^5 (wider than the quantile, never narrower).
double lower_tail_point(double a, double b, double tail);

// Which answers one pass computes: every group's P(best) and the expected
// best rate with every group's loss, from the same node values
// (RATES.POST.BEST, .LOSS and the table's columns), or the first group's
// P(best) alone (P(ahead) of two laws; the others are NaN, no loss). Each
// answer always comes from the same kind of pass, so a cell never depends on
// which cell ran first.
enum class answers { every, first_best };

// Work cap of one call, in law evaluations at quadrature nodes weighted by
// their cost (a unit is about 1 us, so the cap is about 2 s): past it,
// budget_exceeded (Err:523). A call that makes many passes or sums (the
// table of every pair) shares one meter among them, so the cap bounds the
// call, not each pass.
inline constexpr double max_law_evaluations = 2e6;
struct work_meter {
    std::string what;  // the call, as its refusal names it
    double used = 0;
    // Adds `units`; past the cap, budget_exceeded.
    void add(double units);
};

across_groups compare_all(std::span<const beta_law> laws, goal g, reach how, answers what,
                          work_meter* meter = nullptr);

}  // namespace tallyrates::bayes::detail
