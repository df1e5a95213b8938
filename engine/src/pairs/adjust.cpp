// adjust.cpp - multiplicity adjustments; methods and sources in adjust.hpp.
#include "tallyrates/pairs/adjust.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

namespace tallyrates::adjust {

double per_comparison_level(double level, std::size_t m, simultaneous how) {
    if (m <= 1) return level;
    const auto md = static_cast<double>(m);
    switch (how) {
        case simultaneous::none: return level;
        case simultaneous::bonferroni: return 1 - (1 - level) / md;
        // level^(1/m) computed as exp(log1p(level - 1) / m): exact for levels near 1.
        case simultaneous::sidak: return std::exp(std::log1p(level - 1) / md);
    }
    return level;
}

std::vector<double> adjusted(std::span<const double> p, p_values how) {
    const std::size_t m = p.size();
    std::vector<double> out(p.begin(), p.end());
    if (how == p_values::none || m == 0) return out;
    const auto md = static_cast<double>(m);
    if (how == p_values::bonferroni) {
        for (double& v : out) v = std::min(1.0, v * md);
        return out;
    }
    if (how == p_values::sidak) {  // 1 - (1 - p)^m without cancellation for small p
        for (double& v : out) v = std::min(1.0, -std::expm1(md * std::log1p(-v)));
        return out;
    }
    // Ranks by raw p (ties keep their order; tied raw values end equal).
    std::vector<std::size_t> order(m);
    std::iota(order.begin(), order.end(), std::size_t{0});
    std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return p[a] < p[b]; });
    auto factor = [&](std::size_t rank) {  // rank 0 = smallest p
        const auto k = static_cast<double>(rank + 1);
        return how == p_values::benjamini_hochberg ? md / k : md - k + 1;
    };
    if (how == p_values::holm) {
        // Step-down: running maximum from the smallest p.
        double running = 0.0;
        for (std::size_t r = 0; r < m; ++r) {
            running = std::max(running, std::min(1.0, factor(r) * p[order[r]]));
            out[order[r]] = running;
        }
    } else {
        // Step-up (Hochberg, BH): running minimum from the largest p.
        double running = 1.0;
        for (std::size_t r = m; r-- > 0;) {
            running = std::min(running, std::min(1.0, factor(r) * p[order[r]]));
            out[order[r]] = running;
        }
    }
    return out;
}

}  // namespace tallyrates::adjust
