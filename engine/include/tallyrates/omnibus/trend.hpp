// trend.hpp - is there a trend in the success rate across ordered groups
// (belt speed, temperature step, supplier age)? The Cochran-Armitage test:
// Cochran (1954), Biometrics 10:417; Armitage (1955), Biometrics 11:375.
#pragma once

#include <span>

#include "tallyrates/core/counts.hpp"

namespace tallyrates::trend {

enum class variance {
    binomial,    // Armitage 1955: p(1-p) * sum n (s - mean s)^2
    conditional  // hypergeometric, the N/(N-1) form (Agresti 2002, section 5.3.5)
};
inline constexpr variance default_variance = variance::binomial;

struct result {
    double z = 0;   // signed: positive when the rate rises with the score
    double chi2 = 0;
    double p = 1;   // two-sided
};

// `scores` has one entry per position of the range (blank rows' entries are
// ignored); empty means the positions 1, 2, 3, ... themselves. Groups with
// no attempts are left out.
result test(const counts& c, std::span<const entry> scores, variance v);

}  // namespace tallyrates::trend
