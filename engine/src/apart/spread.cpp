// spread.cpp - Tarone's test for variation beyond the binomial; method and
// source in apart/spread.hpp.
#include "tallyrates/apart/spread.hpp"

#include <boost/math/distributions/normal.hpp>
#include <cmath>

#include "tallyrates/core/errors.hpp"

namespace tallyrates::apart {

extra_variation tarone(const counts& c) {
    const auto gs = c.with_attempts();
    if (gs.size() < 2)
        throw invalid_input("Variation between groups needs at least two groups with attempts.");
    double big_n = 0, s = 0, pairs = 0;
    for (const auto& g : gs) {
        const double n = static_cast<double>(g.attempts);
        big_n += n;
        s += static_cast<double>(g.successes);
        pairs += n * (n - 1);
    }
    const double p = s / big_n, pq = p * (1 - p);
    if (!(pq > 0))
        throw invalid_input(std::string("Every unit of the tally ") + (s == 0 ? "failed" : "passed") +
                            ", so there is no variation between groups to measure.");
    if (!(pairs > 0))
        throw invalid_input("Every group has a single attempt, so variation within a group cannot be told from "
                            "variation between groups (Tarone's test is not defined).");
    double sum = 0;
    for (const auto& g : gs) {
        const double d = static_cast<double>(g.successes) - static_cast<double>(g.attempts) * p;
        sum += d * d;
    }
    extra_variation out;
    out.z = (sum / pq - big_n) / std::sqrt(2 * pairs);
    out.p = boost::math::cdf(boost::math::complement(boost::math::normal(), out.z));
    return out;
}

}  // namespace tallyrates::apart
