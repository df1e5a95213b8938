// trend.cpp - the Cochran-Armitage test for a trend in the rate across
// ordered groups: Cochran 1954 (Biometrics 10:417), Armitage 1955
// (Biometrics 11:375).
#include "tallyrates/omnibus/trend.hpp"

#include <boost/math/distributions/normal.hpp>
#include <algorithm>
#include <cmath>
#include <vector>

#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/table.hpp"

namespace tallyrates::trend {

// z = sum (s_g - sbar) x_g / sqrt(V), sbar = sum n_g s_g / N,
// V_binomial = pbar (1 - pbar) sum n_g (s_g - sbar)^2 (Armitage 1955, eq. for
// chi^2_1 of the regression), V_conditional = V_binomial * N / (N - 1)
// (hypergeometric variance; Agresti 2002, 5.3.5, gives M^2 = (N - 1) r^2).
namespace {

// One score per group with attempts, in range order.
std::vector<double> scores_of(const counts& c, std::span<const entry> scores) {
    if (!scores.empty() && scores.size() != c.range_size())
        throw invalid_input("The scores range has " + std::to_string(scores.size()) + " cells but the count ranges " +
                            std::to_string(c.range_size()) + "; give one score per row.");
    std::vector<double> s;
    for (const auto& g : c.with_attempts()) {
        if (scores.empty()) {
            s.push_back(static_cast<double>(g.position));
            continue;
        }
        const entry& e = scores[g.position - 1];
        if (e.what != entry::kind::number || !std::isfinite(e.value))
            throw invalid_input("Position " + std::to_string(g.position) + " of the range: the score must be a number.",
                                g.position);
        s.push_back(e.value);
    }
    // z does not change when every score is multiplied by one positive
    // number: scale by the power of two that brings the largest magnitude
    // near 1, so that scores such as 1e300 cannot overflow the sums of
    // squares below (they gave z = 0), nor 1e-300 underflow. A power of two
    // scales every sum and product exactly: z keeps every bit.
    double largest = 0;
    for (double v : s) largest = std::max(largest, std::fabs(v));
    if (largest > 0) {
        const int shift = std::ilogb(largest);
        for (double& v : s) v = std::ldexp(v, -shift);
    }
    return s;
}

}  // namespace

result test(const counts& c, std::span<const entry> scores, variance v) {
    const auto t = omnibus::table_of(c);  // at least two groups with attempts
    const auto s = scores_of(c, scores);
    const double N = static_cast<double>(t.attempts), S = static_cast<double>(t.successes);
    double ns = 0;
    for (std::size_t g = 0; g < t.groups(); ++g) ns += static_cast<double>(t.n[g]) * s[g];
    const double sbar = ns / N, pbar = S / N;
    double T = 0, ss = 0;
    for (std::size_t g = 0; g < t.groups(); ++g) {
        const double d = s[g] - sbar;
        T += d * static_cast<double>(t.x[g]);
        ss += static_cast<double>(t.n[g]) * d * d;
    }
    if (!(ss > 0)) throw invalid_input("The scores of the groups with attempts are all equal; a trend needs them to differ.");
    result r;
    if (t.all_alike()) return r;  // every group shows the same rate: no trend, p = 1
    double var = pbar * (1 - pbar) * ss;
    if (v == variance::conditional) var *= N / (N - 1);  // N >= 2: two groups with attempts
    r.z = T / std::sqrt(var);
    r.chi2 = r.z * r.z;
    r.p = std::min(1.0, 2 * boost::math::cdf(boost::math::complement(boost::math::normal(), std::fabs(r.z))));
    return r;
}

}  // namespace tallyrates::trend
