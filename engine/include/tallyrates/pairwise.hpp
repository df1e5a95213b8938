// pairwise.hpp - comparisons of two groups and intervals for one group.
//
// So far: the observed difference of rates. Difference intervals (Newcombe
// 1998, Stat Med 17:873), pairwise tests with multiplicity adjustment (Holm
// 1979; Hochberg 1988; Benjamini & Hochberg 1995) and one-rate intervals
// (Brown, Cai & DasGupta 2001) belong here too, as free functions taking the
// validated counts and 1-based positions.
#pragma once

#include "tallyrates/counts.hpp"

namespace tallyrates::pairwise {

// The group at position `pos`, which must have attempts (a frequentist
// statement about a group without data is refused).
const group& group_with_attempts(const counts& c, double pos, const char* argument);

// Observed rate_i - rate_j.
double difference(const counts& c, double i, double j);

}  // namespace tallyrates::pairwise
