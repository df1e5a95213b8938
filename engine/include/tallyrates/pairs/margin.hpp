// margin.hpp - is one group not worse than another by more than a margin,
// better by at least a margin, or equivalent within +- margin?
//
// Farrington & Manning (1990, Stat Med 9:1447): the score statistic
// z = (p_i - p_j - delta0) / sqrt(V(delta0)), V from the rates estimated by
// restricted maximum likelihood under p_i - p_j = delta0 (their closed form,
// restricted.hpp), without the N/(N - 1) factor Miettinen & Nurminen add;
// one-sided p = 1 - Phi(z) for the claims below. Equivalence is two
// one-sided tests (Schuirmann 1987, J Pharmacokin Biopharm 15:657): the
// larger of the two p-values, each tested at the full level.
// - not_worse: H0 p_i <= p_j - margin (delta0 = -margin);
// - better: H0 p_i <= p_j + margin (delta0 = margin);
// - equivalent: H0 |p_i - p_j| >= margin.
// Goal low (the counts are defects) mirrors every claim: the tests run on
// the units without the defect, so "not worse" means "at most margin more
// defects".
#pragma once

#include "tallyrates/core/counts.hpp"
#include "tallyrates/core/rules.hpp"

namespace tallyrates::pairwise {

enum class claim { not_worse, better, equivalent };
inline constexpr claim default_claim = claim::not_worse;

// p of the claim for groups a and b (distinct, with attempts); margin is a
// difference of rates in [0, 1) (above 0 for equivalent).
double margin_p(const group& a, const group& b, double margin, claim c, goal g = default_goal);

}  // namespace tallyrates::pairwise
