// restricted.cpp - restricted maximum likelihood of two rates under a fixed
// difference; method and source in restricted.hpp.
#include "restricted.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

namespace tallyrates::pairwise::restricted {

rates_of_two two(const group& a, const group& b) {
    return {static_cast<double>(a.successes), static_cast<double>(a.attempts), static_cast<double>(b.successes),
            static_cast<double>(b.attempts)};
}

std::pair<double, double> restricted_mle(const rates_of_two& r, double delta) {
    // At delta = 0 the cubic's roots are 0, 1 and the pooled rate, the
    // estimate: taken directly, without the rounding of the closed form
    // (about 1e-12 relative at 10^6 attempts, 1e-10 in a small p).
    if (delta == 0) {
        const double pooled = (r.x1 + r.x2) / (r.n1 + r.n2);
        return {pooled, pooled};
    }
    const double theta = r.n2 / r.n1;
    const double p1 = r.p1(), p2 = r.p2();
    const double a = 1 + theta;
    const double b = -(1 + theta + p1 + theta * p2 + delta * (theta + 2));
    const double c = delta * delta + delta * (2 * p1 + theta + 1) + p1 + theta * p2;
    const double d = -p1 * delta * (1 + delta);
    const double v = b * b * b / (27 * a * a * a) - b * c / (6 * a * a) + d / (2 * a);
    const double u2 = b * b / (9 * a * a) - c / (3 * a);
    double q1 = -b / (3 * a);
    if (u2 > 0) {
        const double u = std::copysign(std::sqrt(u2), v);
        const double w = (std::numbers::pi + std::acos(std::clamp(v / (u * u * u), -1.0, 1.0))) / 3;
        q1 += 2 * u * std::cos(w);
    }
    q1 = std::clamp(q1, std::max(0.0, delta), std::min(1.0, 1 + delta));
    return {q1, q1 - delta};
}

double restricted_variance(const rates_of_two& r, double delta) {
    const auto [q1, q2] = restricted_mle(r, delta);
    return q1 * (1 - q1) / r.n1 + q2 * (1 - q2) / r.n2;
}

}  // namespace tallyrates::pairwise::restricted
