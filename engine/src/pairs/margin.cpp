// margin.cpp - Farrington-Manning margin tests and Schuirmann's two one-sided
// tests; methods and sources in margin.hpp.
#include "tallyrates/pairs/margin.hpp"

#include <algorithm>
#include <boost/math/distributions/normal.hpp>
#include <cmath>

#include "restricted.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/pairs/pairwise.hpp"

namespace tallyrates::pairwise {

namespace {

// P(Z >= z) for the statistic at delta0: small when the data put p1 - p2
// well above delta0. A variance of 0 (both rates 0 or 1 and no margin) gives
// z = 0 when the difference sits on delta0.
double upper_p(const restricted::rates_of_two& r, double delta0) {
    const double num = r.p1() - r.p2() - delta0;
    const double variance = restricted::restricted_variance(r, delta0);
    const double z = variance > 0 ? num / std::sqrt(variance) : (num > 0 ? HUGE_VAL : (num < 0 ? -HUGE_VAL : 0.0));
    if (std::isinf(z)) return z > 0 ? 0.0 : 1.0;
    return boost::math::cdf(boost::math::complement(boost::math::normal(), z));
}

}  // namespace

double margin_p(const group& a, const group& b, double margin, claim c, goal g) {
    distinct(a, b);
    if (!(margin >= 0 && margin < 1))
        arguments::out_of_range("margin", margin,
                                "lie from 0 up to (not including) 1, a difference of rates such as 0.01 for 1 point");
    if (c == claim::equivalent && !(margin > 0))
        arguments::out_of_range("margin", margin, "be above 0 for claim \"equivalent\" (within +- margin)");
    auto r = restricted::two(a, b);
    if (g == goal::low) {  // defects: test the units without one
        r.x1 = r.n1 - r.x1;
        r.x2 = r.n2 - r.x2;
    }
    switch (c) {
        case claim::not_worse: return upper_p(r, -margin);
        case claim::better: return upper_p(r, margin);
        case claim::equivalent: {
            // Upper side: H0 p1 - p2 >= margin, P(Z <= z) by the mirror of the groups.
            const restricted::rates_of_two swapped{r.x2, r.n2, r.x1, r.n1};
            return std::max(upper_p(r, -margin), upper_p(swapped, -margin));
        }
    }
    return 1.0;
}

}  // namespace tallyrates::pairwise
