// rate_axis.cpp - the one pass over the rate axis for answers across
// groups; method and sources in rate_axis.hpp.
#include "bayes/rate_axis.hpp"

#include <algorithm>
#include <boost/math/special_functions/beta.hpp>
#include <cmath>
#include <limits>
#include <tuple>

#include "bayes/law_math.hpp"
#include "detail/vector_quadrature.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::bayes::detail {

double lower_tail_point(double a, double b, double tail) {
    // Both parameters large: the law is normal to within a skewness of
    // 2 / sqrt(min(a, b)) <= 0.007, which moves a quantile at 1e-100 (21.3
    // standard deviations) by under half a standard deviation; 25 is safe.
    // Boost's inverse costs milliseconds there (3.7 ms at 10^15 attempts, and
    // it gives up), this costs nothing.
    if (std::min(a, b) >= 1e5 && tail >= 1e-100) {
        const double n = a + b;
        return std::max(0.0, a / n - 25 * std::sqrt(a * b / (n * n * (n + 1))));
    }
    try {
        return boost::math::ibeta_inv(a, b, tail);
    } catch (const boost::math::evaluation_error&) {
        // Boost's inverse gives up extremely close to 0 (Beta(4, 98) at
        // 1e-100: about 1e-27): bisect on log d, where the incomplete beta
        // itself is accurate, between the smallest normal number and the mean.
        auto excess = [&](double log_d) {
            const double mass = boost::math::ibeta(a, b, std::exp(log_d));
            return (mass > 0 ? std::log(mass) : -HUGE_VAL) - std::log(tail);
        };
        double lo = std::log(std::numeric_limits<double>::min()), hi = std::log(a / (a + b));
        for (int k = 0; k < 200 && hi - lo > 1e-12; ++k) {
            const double mid = (lo + hi) / 2;
            (excess(mid) < 0 ? lo : hi) = mid;
        }
        return std::exp(lo);  // on the side holding less than `tail`
    }
}

namespace {

using tallyrates::detail::integrate_pieces;
using tallyrates::detail::quadrature_piece;
using tallyrates::detail::vector_integrals;
using tallyrates::detail::vector_tolerance;

// A law in the coordinate of the pass, with its window [low, 1 - high_gap]
// kept as two distances from their ends (each exact near its end).
struct placed_law {
    double a, b, low, high_gap;
    double high() const { return 1 - high_gap; }
    double mean() const { return a / (a + b); }
    double sd() const { return detail::sd(beta_law{a, b}); }
};

placed_law place(const beta_law& law, double tail, bool mirrored) {
    const double a = mirrored ? law.b : law.a, b = mirrored ? law.a : law.b;
    // An end where the density is infinite holds about d^a within d of it:
    // the window reaches that end.
    return {a, b, a < 1 ? 0.0 : lower_tail_point(a, b, tail), b < 1 ? 0.0 : lower_tail_point(b, a, tail)};
}

// Maps of a piece's variable v to the rate s (and 1 - s, exactly near 1).
enum piece_map : int { linear = 0, from_zero = 1, from_one = 2 };

struct axis_point {
    double s, s_gap, jacobian;  // s, 1 - s, ds/dv
};

struct end_maps {
    double zero_end = 0, zero_power = 1;  // s = zero_end v^power on [0, 1]
    double one_gap = 0, one_power = 1;    // 1 - s = one_gap v^power on [0, 1]
};

axis_point point_at(int map, double v, const end_maps& m) {
    if (map == from_zero) {
        const double s = m.zero_end * std::pow(v, m.zero_power);
        return {s, 1 - s, m.zero_end * m.zero_power * std::pow(v, m.zero_power - 1)};
    }
    if (map == from_one) {
        const double gap = m.one_gap * std::pow(v, m.one_power);
        return {1 - gap, gap, m.one_gap * m.one_power * std::pow(v, m.one_power - 1)};
    }
    return {v, 1 - v, 1.0};
}

// log density, from whichever of s and 1 - s is exact.
double log_density_at(const placed_law& law, const axis_point& p) {
    try {
        const double d = p.s <= 0.5 ? boost::math::ibeta_derivative(law.a, law.b, p.s)
                                    : boost::math::ibeta_derivative(law.b, law.a, p.s_gap);
        return d > 0 ? std::log(d) : -HUGE_VAL;
    } catch (const std::overflow_error&) {
        // Next to an end where the density is infinite (a parameter below 1):
        // in logs, where the parameters are small and log-gamma is exact enough.
        return (law.a - 1) * std::log(p.s) + (law.b - 1) * std::log(p.s_gap) - detail::log_beta(law.a, law.b);
    }
}

// log F(s) (lower) or log (1 - F(s)), from whichever of s and 1 - s is exact.
double log_cdf_at(const placed_law& law, const axis_point& p, bool lower) {
    const double v = p.s <= 0.5 ? (lower ? boost::math::ibeta(law.a, law.b, p.s) : boost::math::ibetac(law.a, law.b, p.s))
                                : (lower ? boost::math::ibetac(law.b, law.a, p.s_gap)
                                         : boost::math::ibeta(law.b, law.a, p.s_gap));
    return v > 0 ? std::log(v) : -HUGE_VAL;
}

struct breakpoint {
    double at, scale;
};

// The pieces between `from` and `to`, cut at every law's scale; points closer
// than half the finer scale of two neighbours are merged.
std::vector<double> cuts_between(const std::vector<placed_law>& laws, double from, double to, bool densities) {
    // A density is a peak that nodes may step over: cuts at 2, 5 and 10 sd.
    // The expected best's integrand, a product of CDFs, only steps.
    static constexpr double peak_sds[] = {0, 2, -2, 5, -5, 10, -10}, step_sds[] = {0};
    const std::span<const double> sds = densities ? std::span<const double>(peak_sds) : std::span<const double>(step_sds);
    std::vector<breakpoint> points;
    for (const auto& law : laws) {
        const double m = law.mean(), s = law.sd();
        for (double k : sds) points.push_back({m + k * s, s});
        points.push_back({law.low, s});
        points.push_back({law.high(), s});
    }
    // A density infinite at an end varies over decades next to it. Where the
    // pieces reach that end, the substitution of compare_all takes care of
    // it; where they stop short, one piece per decade of the distance.
    const bool infinite_at_zero = std::any_of(laws.begin(), laws.end(), [](const placed_law& l) { return l.a < 1; });
    const bool infinite_at_one = std::any_of(laws.begin(), laws.end(), [](const placed_law& l) { return l.b < 1; });
    if (infinite_at_zero && from > 0)
        for (double d = std::max(from, 1e-300) * 10; d < 0.1; d *= 10) points.push_back({d, d});
    if (infinite_at_one && to < 1)
        for (double d = std::max(1 - to, 1e-300) * 10; d < 0.1; d *= 10) points.push_back({1 - d, d});
    std::sort(points.begin(), points.end(), [](const breakpoint& x, const breakpoint& y) { return x.at < y.at; });
    std::vector<double> cuts{from};
    double last_scale = HUGE_VAL;
    for (const auto& p : points) {
        if (!(p.at > from && p.at < to)) continue;
        if (p.at - cuts.back() > 0.5 * std::min(p.scale, last_scale)) {
            cuts.push_back(p.at);
            last_scale = p.scale;
        } else {
            last_scale = std::min(last_scale, p.scale);
        }
    }
    cuts.push_back(to);
    // Both ends singular and nothing between: two pieces, one map each.
    if (cuts.size() == 2 && from == 0 && to == 1 && infinite_at_zero && infinite_at_one) cuts.insert(cuts.begin() + 1, 0.5);
    return cuts;
}

// The problem in the coordinate of the pass: the laws (mirrored when the
// range lies nearer 1), which end is sought, and the range [from, to] where
// the integrals can be non-zero.
struct axis_problem {
    std::vector<placed_law> laws;
    bool mirrored = false, want_high = true;
    double from = 0, to = 0;
};

// For the highest, from the largest lower window edge to the largest upper
// one (below it some other law is surely lower, above it every law is); for
// the lowest, from the smallest lower edge to the smallest upper one.
std::pair<double, double> range_of(const std::vector<placed_law>& laws, bool want_high) {
    double from = want_high ? 0.0 : 1.0, to = from;
    for (const auto& l : laws) {
        from = want_high ? std::max(from, l.low) : std::min(from, l.low);
        to = want_high ? std::max(to, l.high()) : std::min(to, l.high());
    }
    return {from, std::max(from, to)};
}

axis_problem set_up(std::span<const beta_law> input, goal g, double tail) {
    axis_problem p;
    for (const auto& law : input) p.laws.push_back(place(law, tail, false));
    const bool high = g == goal::high;
    const auto [from, to] = range_of(p.laws, high);
    p.mirrored = from + to > 1;
    if (p.mirrored)
        for (auto& l : p.laws) l = {l.b, l.a, l.high_gap, l.low};
    p.want_high = high != p.mirrored;
    std::tie(p.from, p.to) = range_of(p.laws, p.want_high);
    return p;
}

// The pieces of [from, to]; an end piece next to an infinite density gets
// the power substitution (its map and exponent in `maps`).
std::vector<quadrature_piece> pieces_of(const axis_problem& p, end_maps& maps, bool densities) {
    if (!(p.to > p.from)) return {};
    const auto cuts = cuts_between(p.laws, p.from, p.to, densities);
    double a_min = 1, b_min = 1;
    for (const auto& l : p.laws) {
        a_min = std::min(a_min, l.a);
        b_min = std::min(b_min, l.b);
    }
    std::vector<quadrature_piece> pieces;
    for (std::size_t k = 0; k + 1 < cuts.size(); ++k) {
        if (!(cuts[k + 1] > cuts[k])) continue;
        if (cuts[k] == 0 && a_min < 1) {
            maps.zero_end = cuts[k + 1];
            maps.zero_power = 1 / a_min;
            pieces.push_back({0.0, 1.0, from_zero});
        } else if (cuts[k + 1] == 1 && b_min < 1) {
            maps.one_gap = 1 - cuts[k];
            maps.one_power = 1 / b_min;
            pieces.push_back({0.0, 1.0, from_one});
        } else {
            pieces.push_back({cuts[k], cuts[k + 1], linear});
        }
    }
    return pieces;
}

// The integrands at one node, from one evaluation of each law whose window
// holds it: f_k prod_{j != k} C_j for every group k (answers::every_best) or
// the first only (first_best), or the expected best's integrand (expected).
class node_values {
public:
    node_values(const axis_problem& p, const end_maps& maps, answers what)
        : p_(p), maps_(maps), what_(what), log_f_(p.laws.size()), log_c_(p.laws.size()), prefix_(p.laws.size() + 1) {
        // Cost of one law's evaluation, in units of about 2 us: Boost's
        // incomplete beta slows as the parameters grow (measured: 1.4 us at
        // 10^3 attempts, 5.8 at 10^6, 250 at 10^12, 1.9 ms at 10^15).
        for (const auto& l : p.laws) cost_.push_back(std::max(1.0, std::pow((l.a + l.b) / 1e3, 0.26)));
    }

    void operator()(int map, double v, double* values) {
        const std::size_t G = p_.laws.size();
        const axis_point at = point_at(map, v, maps_);
        if (!(at.jacobian > 0) || !(at.s > 0) || !(at.s_gap > 0) || !std::isfinite(at.jacobian)) {
            std::fill(values, values + (what_ == answers::every_best ? G : 1), 0.0);
            return;
        }
        for (std::size_t j = 0; j < G; ++j) evaluate(j, at);
        if (work_ > max_law_evaluations)
            throw budget_exceeded("Comparing these " + std::to_string(G) + " groups needs more than " +
                                  format_number(max_law_evaluations) +
                                  " units of work, the cap of one call (about 2 s); groups of more than about "
                                  "10^12 attempts or many groups cost the most.");
        // Every group's product of the others without dividing: prefix and suffix sums in logs.
        prefix_[0] = 0;
        for (std::size_t j = 0; j < G; ++j) prefix_[j + 1] = prefix_[j] + log_c_[j];
        if (what_ == answers::expected) {
            values[0] = (p_.want_high ? -std::expm1(prefix_[G]) : std::exp(prefix_[G])) * at.jacobian;
            return;
        }
        double suffix = 0;
        for (std::size_t j = G; j-- > 0;) {
            const double v_j = std::isfinite(log_f_[j]) ? std::exp(log_f_[j] + prefix_[j] + suffix) * at.jacobian : 0.0;
            if (what_ == answers::every_best) values[j] = v_j;
            else if (j == 0) values[0] = v_j;
            suffix += log_c_[j];
        }
    }

private:
    bool needs_density(std::size_t j) const {
        return what_ == answers::every_best || (what_ == answers::first_best && j == 0);
    }

    void evaluate(std::size_t j, const axis_point& at) {
        const placed_law& l = p_.laws[j];
        if (at.s < l.low || at.s_gap < l.high_gap) {
            // Outside the window: no density; the CDF is 0 below, 1 above.
            log_f_[j] = -HUGE_VAL;
            log_c_[j] = ((at.s < l.low) == p_.want_high) ? -HUGE_VAL : 0.0;
            return;
        }
        work_ += cost_[j];
        log_f_[j] = needs_density(j) ? log_density_at(l, at) : -HUGE_VAL;
        log_c_[j] = log_cdf_at(l, at, p_.want_high);
    }

    const axis_problem& p_;
    const end_maps& maps_;
    answers what_;
    std::vector<double> cost_, log_f_, log_c_, prefix_;
    double work_ = 0;
};

// Double precision places a node within eps * s of where it is meant to be:
// a law whose standard deviation is a small fraction of its position (10^15
// attempts: 1e-8) sees its density jitter by eps * s / sd between
// neighbouring nodes, and no error estimate falls below that. The tolerance
// is raised to that floor, which stays below 1e-10 up to about 10^7 attempts
// per group.
double rounding_floor(const axis_problem& p) {
    double floor = 0;
    for (const auto& l : p.laws)
        if (l.low <= p.to && l.high() >= p.from)
            floor = std::max(floor, 32 * std::numeric_limits<double>::epsilon() * p.to / l.sd());
    return floor;
}

}  // namespace

across_groups compare_all(std::span<const beta_law> input, goal g, reach how, answers what) {
    const std::size_t G = input.size(), width = what == answers::every_best ? G : 1;
    const axis_problem p = set_up(input, g, how.tail);
    end_maps maps;
    const auto pieces = pieces_of(p, maps, what != answers::expected);
    const double floor = rounding_floor(p);
    vector_tolerance tolerance{std::max(how.relative, floor), std::vector<double>(width, how.absolute),
                               std::max(how.small_relative, floor), 1e-3};
    // The expected best is a rate, not a probability that may be tiny.
    if (what == answers::expected) tolerance.absolute[0] = std::max(1e-13, floor * p.to);
    const auto integrals = pieces.empty() ? vector_integrals{std::vector<double>(width, 0.0), {}, 0}
                                          : integrate_pieces(node_values(p, maps, what), pieces, width, tolerance);
    across_groups out;
    if (what == answers::expected) {
        // Below `from` the integrand of the expected best is 1 (some law is
        // surely below / every law is surely above), beyond `to` it is 0.
        const double expected = p.from + integrals.value[0];
        out.expected_best = p.mirrored ? 1 - expected : expected;
        for (const auto& l : p.laws)
            out.loss.push_back(std::max(0.0, p.want_high ? expected - l.mean() : l.mean() - expected));
        return out;
    }
    for (std::size_t k = 0; k < G; ++k)
        out.best.push_back(what == answers::every_best || k == 0 ? std::clamp(integrals.value[k], 0.0, 1.0)
                                                                 : std::numeric_limits<double>::quiet_NaN());
    return out;
}

}  // namespace tallyrates::bayes::detail
