// law.cpp - one group's posterior: its law, mean, credible bounds (central
// and highest-density), P(rate above r), the chance of at least k successes in
// m more attempts, its density and curves; methods and sources in
// tallyrates/bayes/law.hpp.
#include "tallyrates/bayes/law.hpp"

#include <algorithm>
#include <boost/math/special_functions/beta.hpp>
#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <limits>
#include <string>
#include <utility>

#include "bayes/law_math.hpp"
#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::bayes {

using namespace detail;

namespace {

// Highest-density interval of a unimodal law (a > 1 and b > 1): the lower
// end l in (0, q(1 - level)) where the density at l equals the density at
// u(l) = q(F(l) + level); the difference changes sign once on that range.
interval hpd_unimodal(const beta_law& law, double level) {
    auto upper_of = [&](double l) { return quantile(law, std::min(1.0, boost::math::ibeta(law.a, law.b, l) + level)); };
    // Searched on log l: with a first parameter just above 1 the density
    // rises like l^(a - 1) and the lower end can lie at 1e-30 or below, which
    // a search on l itself approaches by halving (Beta(1.05, 9.05) did not
    // converge in 200 steps); on log l every decade costs about one step.
    auto f = [&](double log_l) {
        const double l = std::exp(log_l);
        return log_kernel(law, l) - log_kernel(law, upper_of(l));
    };
    const double hi = quantile(law, 1 - level);
    // At l -> 0 the density vanishes (a > 1): f < 0 there; as l -> q(1 - level),
    // u -> 1 where the density vanishes (b > 1): f > 0. The bracket stops just
    // short of that end, where u is still below 1 and f finite.
    double a = std::log(std::numeric_limits<double>::min());
    double b = std::log(quantile(law, (1 - level) * (1 - 1e-9)));
    double fa = f(a), fb = f(b);
    if (!(fa < 0)) return {0.0, quantile(law, level)};  // the lower end is 0 in double precision
    if (!(fb > 0)) return {hi, 1.0};  // the upper end is 1 in double precision
    std::uintmax_t iterations = max_root_steps;
    const auto r = boost::math::tools::toms748_solve(f, a, b, fa, fb, boost::math::tools::eps_tolerance<double>(50),
                                                     iterations);
    if (iterations >= max_root_steps)
        throw no_convergence("The highest-density interval's root search did not converge in " +
                             std::to_string(max_root_steps) + " steps.");
    const double l = std::exp((r.first + r.second) / 2);
    return {l, upper_of(l)};
}

}  // namespace

prior checked(prior p) {
    for (auto [v, name] : {std::pair{p.a, "prior_a"}, std::pair{p.b, "prior_b"}})
        if (!(v >= min_prior && v <= max_prior))
            throw invalid_input(std::string("The argument ") + name + " (" + format_number(v) + ") must be a number from " +
                                format_number(min_prior) + " to " + format_number(max_prior) +
                                "; 1 and 1 make the flat prior, 0.5 and 0.5 Jeffreys' prior.");
    return p;
}

beta_law posterior(const group& g, prior p) {
    p = checked(p);
    return {p.a + static_cast<double>(g.successes), p.b + static_cast<double>(g.attempts - g.successes)};
}

std::vector<beta_law> posteriors(const counts& c, prior p) {
    p = checked(p);
    std::vector<beta_law> out;
    for (const auto& g : c.groups()) out.push_back(posterior(g, p));
    return out;
}

double mean(const beta_law& law) { return law.a / (law.a + law.b); }

interval credible(const beta_law& law, double level, kind how) {
    level = arguments::level(level, "level");
    if (how == kind::central) return {quantile(law, (1 - level) / 2), quantile(law, (1 + level) / 2)};
    if (how == kind::one_sided) {  // each bound alone: P(rate >= low) = P(rate <= high) = level
        arguments::interval_level(level, sides::one, "level");
        return {quantile(law, 1 - level), quantile(law, level)};
    }
    // The density falls from 0 (a <= 1) or rises to 1 (b <= 1): the shortest
    // interval starts at that end.
    if (law.a <= 1 && law.b > 1) return {0.0, quantile(law, level)};
    if (law.b <= 1 && law.a > 1) return {quantile(law, 1 - level), 1.0};
    if (law.a <= 1 && law.b <= 1) {
        if (law.a == 1 && law.b == 1) return {(1 - level) / 2, (1 + level) / 2};  // flat: every interval is shortest
        throw invalid_input("The posterior has its highest density at both ends (no data yet and a prior below 1), so "
                            "no single interval is the highest-density one; use kind \"central\".");
    }
    return hpd_unimodal(law, level);
}

double above(const beta_law& law, double rate, goal g) {
    arguments::rate(rate, "rate");
    return g == goal::high ? boost::math::ibetac(law.a, law.b, rate) : boost::math::ibeta(law.a, law.b, rate);
}

double next_at_least(const beta_law& law, std::int64_t m, std::int64_t k) {
    if (m < 0 || k < 0 || k > m)
        throw invalid_input("The arguments m (" + std::to_string(m) + ") and k (" + std::to_string(k) +
                            ") must satisfy 0 <= k <= m: at least k successes in the next m attempts.");
    if (k == 0) return 1.0;
    // Given the rate p, P(at least k of m) = I_p(k, m - k + 1), the CDF at p
    // of Y ~ Beta(k, m - k + 1) (the binomial tail as an incomplete beta,
    // DLMF 8.17.5); averaged over the posterior that is P(rate > Y), the
    // comparison of two laws that `ahead` computes (a finite sum of Cook 2005
    // or one integral, never a sum over the m further attempts).
    return ahead(law, {static_cast<double>(k), static_cast<double>(m - k + 1)});
}

std::optional<double> density(const beta_law& law, double x) {
    if ((x <= 0 && law.a < 1) || (x >= 1 && law.b < 1)) return std::nullopt;
    return boost::math::ibeta_derivative(law.a, law.b, x);
}

namespace {

// The rates a span covers: [0, 1], or from the lowest group's curve_tail
// quantile to the highest group's upper one, out to whole percents.
std::pair<double, double> span_of(const std::vector<beta_law>& laws, curve_span span) {
    if (span == curve_span::whole || laws.empty()) return {0.0, 1.0};
    double low = 1, high = 0;
    for (const auto& law : laws) {
        low = std::min(low, quantile(law, curve_tail));
        high = std::max(high, quantile(law, 1 - curve_tail));
    }
    low = std::clamp(std::floor(low * 100) / 100, 0.0, 0.99);
    high = std::clamp(std::ceil(high * 100) / 100, low + 0.01, 1.0);
    return {low, high};
}

}  // namespace

std::vector<std::vector<std::optional<double>>> curves(const counts& c, std::int64_t points, prior p,
                                                       curve_span span) {
    if (points < min_curve_points || points > max_curve_points)
        throw invalid_input("The argument points (" + std::to_string(points) + ") must be a whole number from " +
                            std::to_string(min_curve_points) + " to " + std::to_string(max_curve_points) +
                            ": the rates the curves are drawn at.");
    const auto laws = posteriors(c, p);
    if (static_cast<double>(points) * static_cast<double>(laws.size()) > max_curve_values)
        throw budget_exceeded("The curves of " + std::to_string(laws.size()) + " groups at " + std::to_string(points) +
                              " points are beyond the cap of " + format_number(max_curve_values) +
                              " values; draw fewer points or fewer groups.");
    const auto [from, to] = span_of(laws, span);
    std::vector<std::vector<std::optional<double>>> rows;
    for (std::int64_t k = 0; k < points; ++k) {
        const double t = static_cast<double>(k) / static_cast<double>(points - 1);
        // The ends exactly: the last rate is `to`, not from + (to - from) rounded.
        const double x = k + 1 == points ? to : from + (to - from) * t;
        std::vector<std::optional<double>> row{x};
        for (const auto& law : laws) row.push_back(density(law, x));
        rows.push_back(std::move(row));
    }
    return rows;
}

std::vector<std::string> curves_header(const counts& c) {
    std::vector<std::string> header{"rate"};
    for (const auto& g : c.groups()) {
        const std::string label = c.label_of(g.position);
        header.push_back(label.empty() ? "position " + std::to_string(g.position) : label);
    }
    return header;
}

}  // namespace tallyrates::bayes
