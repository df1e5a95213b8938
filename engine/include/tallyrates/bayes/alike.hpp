// alike.hpp - SAME: the posterior probability that all groups share one rate
// against all rates different, from the two marginal likelihoods in closed
// form (beta functions, in logs; Kass & Raftery 1995, JASA 90:773, for Bayes
// factors).
#pragma once

#include <span>

#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/counts.hpp"

namespace tallyrates::bayes {

// Posterior probability that every group shares one rate (prior probability
// prior_same of that against all rates independent), for the groups' counts.
double same(std::span<const group> groups, prior p, double prior_same);
// Even odds before the counts, when none are given.
inline constexpr double default_prior_same = 0.5;

}  // namespace tallyrates::bayes
