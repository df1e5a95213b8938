// restricted.hpp - the rates of two groups estimated under a fixed
// difference p1 - p2 = delta (restricted maximum likelihood), and the
// variance of the observed difference there: the common part of the
// Miettinen-Nurminen interval and score test (pairwise.cpp, with the factor
// N/(N - 1)) and of the Farrington-Manning margin test (margin.cpp, without
// it). Internal to the pairs family.
#pragma once

#include <utility>

#include "tallyrates/core/counts.hpp"

namespace tallyrates::pairwise::restricted {

struct rates_of_two {
    double x1, n1, x2, n2;
    double p1() const { return x1 / n1; }
    double p2() const { return x2 / n2; }
};

rates_of_two two(const group& a, const group& b);

// Restricted maximum likelihood estimate of (p1, p2) under p1 - p2 = delta:
// the root of Miettinen & Nurminen's cubic in the trigonometric closed form
// of Farrington & Manning (1990, Stat Med 9:1447), section 2.
std::pair<double, double> restricted_mle(const rates_of_two& r, double delta);

// q1 (1 - q1) / n1 + q2 (1 - q2) / n2 at the restricted estimate.
double restricted_variance(const rates_of_two& r, double delta);

}  // namespace tallyrates::pairwise::restricted
