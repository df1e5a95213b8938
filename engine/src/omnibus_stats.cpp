// omnibus_stats.cpp - the 2 x G table, expected counts, X^2 and G^2 and their
// chi-square p-values (Agresti 2002, Categorical Data Analysis, 3.2), and the
// per-group terms that the exact and Monte Carlo routes sum.
#include <boost/math/distributions/chi_squared.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>

#include "tallyrates/errors.hpp"
#include "tallyrates/omnibus.hpp"
#include "terms.hpp"

namespace tallyrates::omnibus {

table table_of(const counts& c) {
    table t;
    for (const auto& g : c.with_attempts()) {
        t.x.push_back(g.successes);
        t.n.push_back(g.attempts);
        t.successes += g.successes;
        t.attempts += g.attempts;
    }
    if (t.groups() < 2)
        throw invalid_input("At least two groups with attempts are needed to compare rates; " +
                            std::to_string(t.groups()) + (t.groups() == 1 ? " has" : " have") + " any.");
    return t;
}

expected_summary expected_counts(const table& t) {
    expected_summary e;
    e.cells = 2 * t.groups();
    e.smallest = INFINITY;
    const double N = static_cast<double>(t.attempts);
    const double S = static_cast<double>(t.successes);
    for (auto n : t.n) {
        for (double E : {static_cast<double>(n) * S / N, static_cast<double>(n) * (N - S) / N}) {
            e.smallest = std::min(e.smallest, E);
            if (E < 5.0) ++e.below_five;
        }
    }
    return e;
}

namespace detail {

double log_choose(std::int64_t n, std::int64_t k) {
    // lgamma differences: ample here, since only the ordering of tables (with a
    // 1e-7 tie tolerance) depends on these values, never the p-value itself.
    return boost::math::lgamma(static_cast<double>(n) + 1) - boost::math::lgamma(static_cast<double>(k) + 1) -
           boost::math::lgamma(static_cast<double>(n - k) + 1);
}

namespace {
// x ln(x / e) with 0 ln 0 = 0.
double xlogx_over(double x, double e) { return x == 0.0 ? 0.0 : x * std::log(x / e); }
}  // namespace

term_function::term_function(const table& t, ordering o) : t_(t), o_(o) {
    N_ = static_cast<double>(t.attempts);
    S_ = static_cast<double>(t.successes);
    F_ = N_ - S_;
}

double term_function::operator()(std::size_t g, std::int64_t x) const {
    const double nd = static_cast<double>(t_.n[g]);
    const double xd = static_cast<double>(x);
    switch (o_) {
        case ordering::pearson: {
            const double d = xd - nd * S_ / N_;
            return d * d * (N_ * N_ / (nd * S_ * F_));
        }
        case ordering::lr:
            return 2.0 * (xlogx_over(xd, nd * S_ / N_) + xlogx_over(nd - xd, nd * F_ / N_));
        case ordering::probability:
            return log_choose(t_.n[g], t_.x[g]) - log_choose(t_.n[g], x);
    }
    return 0.0;
}

std::vector<term_row> term_tables(const table& t, ordering o) {
    const term_function term(t, o);
    const std::int64_t S = t.successes, F = t.attempts - t.successes;
    double cells = 0;
    for (auto n : t.n) cells += static_cast<double>(std::min({n, S, F})) + 1;
    if (cells > 5e7)
        throw budget_exceeded("The tables of this route would hold " + format_number(cells) +
                              " values, more than memory allows; counts this large suit the chi-square route.");
    std::vector<term_row> rows(t.groups());
    for (std::size_t g = 0; g < t.groups(); ++g) {
        const std::int64_t n = t.n[g];
        rows[g].first = std::max<std::int64_t>(0, n - F);
        const std::int64_t last = std::min(n, S);
        rows[g].values.reserve(static_cast<std::size_t>(last - rows[g].first + 1));
        for (std::int64_t x = rows[g].first; x <= last; ++x) rows[g].values.push_back(term(g, x));
    }
    return rows;
}

double observed_total(const table& t, ordering o) {
    const term_function term(t, o);
    double total = 0.0;
    for (std::size_t g = 0; g < t.groups(); ++g) total += term(g, t.x[g]);
    return total;
}

double extreme_threshold(double observed, ordering o) {
    if (o == ordering::probability) return observed - 1e-7;
    // The 1e-12 floor keeps tied tables whose G^2 rounds a hair below 0.
    return observed * (1.0 - 1e-7) - 1e-12;
}

}  // namespace detail

double statistic(const table& t, ordering o) {
    if (t.successes == 0 || t.successes == t.attempts) return o == ordering::probability ? 1.0 : 0.0;
    const double total = detail::observed_total(t, o);
    if (o != ordering::probability) return total;
    // Probability of the observed table: prod C(n_g, x_g) / C(N, S).
    double log_p = -detail::log_choose(t.attempts, t.successes);
    for (std::size_t g = 0; g < t.groups(); ++g) log_p += detail::log_choose(t.n[g], t.x[g]);
    return std::exp(log_p);
}

}  // namespace tallyrates::omnibus
