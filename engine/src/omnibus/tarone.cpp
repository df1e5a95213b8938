// tarone.cpp - Tarone's test for variation beyond the binomial; method and
// source in omnibus/tarone.hpp.
#include "tallyrates/omnibus/tarone.hpp"

#include <boost/math/distributions/normal.hpp>
#include <cmath>
#include <string>
#include <vector>

#include "tallyrates/core/errors.hpp"

namespace tallyrates::omnibus {

extra_variation tarone(std::span<const std::int64_t> x, std::span<const std::int64_t> n) {
    if (x.size() < 2)
        throw invalid_input("Variation between groups needs at least two groups with attempts.");
    double big_n = 0, s = 0, pairs = 0;
    for (std::size_t g = 0; g < x.size(); ++g) {
        const double ng = static_cast<double>(n[g]);
        big_n += ng;
        s += static_cast<double>(x[g]);
        pairs += ng * (ng - 1);
    }
    const double p = s / big_n, pq = p * (1 - p);
    if (!(pq > 0))
        throw invalid_input(std::string("Every unit of the tally ") + (s == 0 ? "failed" : "passed") +
                            ", so there is no variation between groups to measure (Tarone's test is not defined).");
    if (!(pairs > 0))
        throw invalid_input("Every group has a single attempt, so variation within a group cannot be told from "
                            "variation between groups (Tarone's test is not defined).");
    double sum = 0;
    for (std::size_t g = 0; g < x.size(); ++g) {
        const double d = static_cast<double>(x[g]) - static_cast<double>(n[g]) * p;
        sum += d * d;
    }
    extra_variation out;
    out.z = (sum / pq - big_n) / std::sqrt(2 * pairs);
    out.p = boost::math::cdf(boost::math::complement(boost::math::normal(), out.z));
    return out;
}

extra_variation tarone(const counts& c) {
    std::vector<std::int64_t> x, n;
    for (const auto& g : c.with_attempts()) {
        x.push_back(g.successes);
        n.push_back(g.attempts);
    }
    return tarone(x, n);
}

}  // namespace tallyrates::omnibus
