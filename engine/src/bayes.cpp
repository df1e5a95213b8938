// bayes.cpp - posterior answers for one group; methods and sources in bayes.hpp.
#include "tallyrates/bayes.hpp"

#include <algorithm>
#include <boost/math/distributions/beta.hpp>
#include <boost/math/special_functions/beta.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <limits>

#include "tallyrates/arguments.hpp"
#include "tallyrates/errors.hpp"
#include "tallyrates/text.hpp"

namespace tallyrates::bayes {

namespace {

// Further attempts a prediction may sum over (about 30 ms at the worst).
constexpr std::int64_t max_further_attempts = 10000000;

double quantile(const beta_law& law, double q) {
    return boost::math::ibeta_inv(law.a, law.b, q);
}

// log density up to its constant, for comparing two points.
double log_kernel(const beta_law& law, double x) {
    return (law.a - 1) * std::log(x) + (law.b - 1) * std::log1p(-x);
}

// Highest-density interval of a unimodal law (a > 1 and b > 1): the lower
// end l in (0, q(1 - level)) where the density at l equals the density at
// u(l) = q(F(l) + level); the difference changes sign once on that range.
interval hpd_unimodal(const beta_law& law, double level) {
    auto upper_of = [&](double l) { return quantile(law, std::min(1.0, boost::math::ibeta(law.a, law.b, l) + level)); };
    auto f = [&](double l) { return log_kernel(law, l) - log_kernel(law, upper_of(l)); };
    const double hi = quantile(law, 1 - level);
    // At l -> 0 the density vanishes (a > 1): f < 0 there; as l -> q(1 - level),
    // u -> 1 where the density vanishes (b > 1): f > 0. The bracket stops just
    // short of that end, where u is still below 1 and f finite.
    double a = std::max(hi * 1e-300, std::numeric_limits<double>::min());
    double b = quantile(law, (1 - level) * (1 - 1e-9));
    double fa = f(a), fb = f(b);
    if (!(fa < 0)) return {0.0, quantile(law, level)};  // the lower end is 0 in double precision
    if (!(fb > 0)) return {hi, 1.0};  // the upper end is 1 in double precision
    std::uintmax_t iterations = 200;
    const auto r = boost::math::tools::toms748_solve(f, a, b, fa, fb, boost::math::tools::eps_tolerance<double>(50),
                                                     iterations);
    if (iterations >= 200) throw no_convergence("The highest-density interval's root search did not converge.");
    const double l = (r.first + r.second) / 2;
    return {l, upper_of(l)};
}

}  // namespace

prior checked(prior p) {
    for (auto [v, name] : {std::pair{p.a, "prior_a"}, std::pair{p.b, "prior_b"}})
        if (!(std::isfinite(v) && v > 0))
            throw invalid_input(std::string("The argument ") + name + " (" + format_number(v) +
                                ") must be a number above 0; 1 and 1 make the flat prior.");
    return p;
}

beta_law posterior(const counts& c, double i, prior p) {
    p = checked(p);
    const group& g = c.at_position(i, "i");
    return {p.a + static_cast<double>(g.successes), p.b + static_cast<double>(g.attempts - g.successes)};
}

double mean(const beta_law& law) { return law.a / (law.a + law.b); }

interval credible(const beta_law& law, double level, kind how) {
    level = arguments::level(level, "level");
    if (how == kind::central) return {quantile(law, (1 - level) / 2), quantile(law, (1 + level) / 2)};
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
    if (!(rate >= 0 && rate <= 1))
        throw invalid_input("The argument rate (" + format_number(rate) +
                            ") must lie between 0 and 1, a fraction such as 0.99 for 99 %.");
    return g == goal::high ? boost::math::ibetac(law.a, law.b, rate) : boost::math::ibeta(law.a, law.b, rate);
}

double next_at_least(const beta_law& law, std::int64_t m, std::int64_t k) {
    if (m < 0 || k < 0 || k > m)
        throw invalid_input("The arguments m (" + std::to_string(m) + ") and k (" + std::to_string(k) +
                            ") must satisfy 0 <= k <= m: at least k successes in the next m attempts.");
    if (m > max_further_attempts)
        throw budget_exceeded("The prediction over " + std::to_string(m) +
                              " further attempts is beyond the cap of 10^7 attempts.");
    if (k == 0) return 1.0;
    const double a = law.a, b = law.b, md = static_cast<double>(m);
    // log P(X = k) = log C(m, k) + log B(k + a, m - k + b) - log B(a, b).
    const double kd = static_cast<double>(k);
    double log_scale = boost::math::lgamma(md + 1) - boost::math::lgamma(kd + 1) - boost::math::lgamma(md - kd + 1) +
                       boost::math::lgamma(kd + a) + boost::math::lgamma(md - kd + b) - boost::math::lgamma(md + a + b) -
                       (boost::math::lgamma(a) + boost::math::lgamma(b) - boost::math::lgamma(a + b));
    // The upper tail summed upward from k, terms relative to P(X = k) and
    // rescaled when large, by the ratio of successive terms
    //   P(x + 1) / P(x) = (m - x)(x + a) / ((x + 1)(m - x - 1 + b)),
    // so that a tiny answer keeps its relative accuracy. With a, b >= 1 the
    // law is log-concave (the ratio decreases in x): once the terms fall and
    // no longer count, the rest cannot count either. Otherwise (a prior
    // below 1 and no successes or no failures yet) the law can rise again at
    // the far end, and every term is summed.
    const bool log_concave = a >= 1 && b >= 1;
    double term = 1.0, sum = 0.0;
    for (std::int64_t x = k; x <= m; ++x) {
        sum += term;
        const double xd = static_cast<double>(x);
        const double ratio = (md - xd) * (xd + a) / ((xd + 1) * (md - xd - 1 + b));
        term *= ratio;
        if (log_concave && ratio < 1 && term < sum * 1e-17) break;
        if (sum > 1e250) {
            sum *= 1e-250;
            term *= 1e-250;
            log_scale += 250 * std::log(10.0);
        }
    }
    return std::clamp(sum * std::exp(log_scale), 0.0, 1.0);
}

}  // namespace tallyrates::bayes
