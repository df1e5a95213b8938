// prior_fit.cpp - the Beta prior of largest marginal likelihood; method and
// sources in apart/prior_fit.hpp.
#include "tallyrates/apart/prior_fit.hpp"

#include <algorithm>
#include <boost/math/special_functions/beta.hpp>
#include <boost/math/tools/minima.hpp>
#include <cmath>
#include <cstdint>
#include <vector>

#include "tallyrates/core/errors.hpp"

namespace tallyrates::apart {

namespace {

// Bits of the two Brent searches: a prior good to about 1e-7 relative, far
// below what changes a posterior answer.
constexpr int search_bits = 24;
constexpr std::uintmax_t search_steps = 200;

struct group_counts {
    double x, f;  // successes and failures
};

double log_beta(double a, double b) { return std::lgamma(a) + std::lgamma(b) - std::lgamma(a + b); }

double log_likelihood(const std::vector<group_counts>& gs, double a, double b) {
    double sum = 0;
    const double base = log_beta(a, b);
    for (const auto& g : gs) sum += log_beta(a + g.x, b + g.f) - base;
    return sum;
}

std::vector<group_counts> groups_of(const counts& c) {
    std::vector<group_counts> gs;
    for (const auto& g : c.with_attempts())
        gs.push_back({static_cast<double>(g.successes), static_cast<double>(g.attempts - g.successes)});
    return gs;
}

}  // namespace

double beta_binomial_log_likelihood(const counts& c, double a, double b) { return log_likelihood(groups_of(c), a, b); }

fitted_prior fit_prior(const counts& c) {
    const auto gs = groups_of(c);
    if (gs.size() < 2)
        throw invalid_input("A prior fitted to the groups needs at least two groups with attempts; " +
                            std::to_string(gs.size()) + (gs.size() == 1 ? " has" : " have") + " any.");
    const double floor = bayes::min_prior;
    // For a weight m, the best mean: a = mu m and b = (1 - mu) m kept at or
    // above the floor.
    auto best_mean = [&](double m, double* value) {
        const double lo = floor / m, hi = 1 - floor / m;
        auto minus = [&](double u) {  // u: logit of mu
            const double mu = std::clamp(1 / (1 + std::exp(-u)), lo, hi);
            return -log_likelihood(gs, mu * m, (1 - mu) * m);
        };
        std::uintmax_t steps = search_steps;
        const double ulo = std::log(lo / (1 - lo)), uhi = std::log(hi / (1 - hi));
        const auto r = boost::math::tools::brent_find_minima(minus, ulo, uhi, search_bits, steps);
        if (value) *value = -r.second;
        return std::clamp(1 / (1 + std::exp(-r.first)), lo, hi);
    };
    auto minus_profile = [&](double log_m) {
        double v = 0;
        best_mean(std::exp(log_m), &v);
        return -v;
    };
    std::uintmax_t steps = search_steps;
    const double log_lo = std::log(2 * floor), log_hi = std::log(max_total);
    const auto best = boost::math::tools::brent_find_minima(minus_profile, log_lo, log_hi, search_bits, steps);
    // Brent stays inside the bracket: a maximum at (or within its resolution
    // of) the top end, or no better than the top end, is the cap.
    double m = std::exp(best.first), top_value = 0;
    best_mean(max_total, &top_value);
    fitted_prior out;
    if (best.first > log_hi - 1e-3 || top_value >= -best.second - 1e-9 * std::fabs(best.second)) {
        m = max_total;
        out.at_cap = true;
    }
    const double mu = best_mean(m, &out.log_likelihood);
    out.prior = {std::clamp(mu * m, floor, max_total), std::clamp((1 - mu) * m, floor, max_total)};
    return out;
}

}  // namespace tallyrates::apart
