// hypergeometric.cpp - see hypergeometric.hpp for the recurrence and why it
// uses only + - * /.
#include "hypergeometric.hpp"

#include <algorithm>
#include <cmath>

namespace tallyrates::detail {

hypergeometric_support hypergeometric_pmf(std::int64_t M, std::int64_t K, std::int64_t n, std::vector<double>& pmf,
                                          double trim) {
    const auto full = feasible_successes(M, K, n);
    // Mode of the hypergeometric law: floor((n + 1)(K + 1) / (M + 2)), computed
    // in floating point because the product can pass 2^63 for huge counts.
    const double mode_real = std::floor(static_cast<double>(n + 1) * static_cast<double>(K + 1) /
                                        static_cast<double>(M + 2));
    const std::int64_t mode = std::clamp(static_cast<std::int64_t>(mode_real), full.first, full.last);
    const double fail = static_cast<double>(M - K - n);

    // Downward first, straight into the output (no temporary buffers: the
    // Monte Carlo route calls this for many small tables), then reversed:
    // w(x - 1) = w(x) * x (M - K - n + x) / ((K - x + 1)(n - x + 1)).
    pmf.clear();
    double w = 1.0;
    for (std::int64_t x = mode; x > full.first; --x) {
        w = w * (static_cast<double>(x) * (fail + static_cast<double>(x))) /
            (static_cast<double>(K - x + 1) * static_cast<double>(n - x + 1));
        if (w == 0.0 || w < trim) break;
        pmf.push_back(w);
    }
    const auto below_mode = static_cast<std::int64_t>(pmf.size());
    std::reverse(pmf.begin(), pmf.end());
    // Then the mode and upward.
    w = 1.0;
    pmf.push_back(w);
    for (std::int64_t x = mode; x < full.last; ++x) {
        const double r = (static_cast<double>(K - x) * static_cast<double>(n - x)) /
                         (static_cast<double>(x + 1) * (fail + static_cast<double>(x + 1)));
        w *= r;
        if (w == 0.0 || w < trim) break;
        pmf.push_back(w);
    }
    const hypergeometric_support kept{mode - below_mode, mode - below_mode + static_cast<std::int64_t>(pmf.size()) - 1};
    // Fixed summation order (ascending x) keeps the result reproducible.
    double total = 0.0;
    for (double v : pmf) total += v;
    for (double& v : pmf) v /= total;
    return kept;
}

}  // namespace tallyrates::detail
