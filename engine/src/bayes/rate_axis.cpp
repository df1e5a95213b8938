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

namespace {
// Boost.Math evaluates double arguments in long double unless a policy says
// otherwise. In double its incomplete beta is about 10 times quicker (0.4
// against 4.5 us at 300 attempts) and its relative error grows with the
// parameters, about 1.6e-16 (a + b) (measured against the long double
// evaluation: 4e-14 at 300 attempts, 1.6e-13 at 10^3, 1.5e-12 at 10^4,
// 3e-11 at 10^6). An integrand of a pass over G laws is a product of G
// such factors, within about 1.6e-16 G max(a + b) of its value: the laws are
// evaluated in double while G (a + b) stays below 3e5 (an error below 5e-11,
// half the 1e-10 every answer promises; 2 laws of up to 1.5e5 attempts, 200
// of up to 1,500), in long double otherwise.
using in_double = boost::math::policies::policy<boost::math::policies::promote_double<false>>;
inline constexpr double max_size_times_groups_in_double = 3e5;
bool in_double_among(double a, double b, std::size_t groups) {
    return (a + b) * static_cast<double>(groups) <= max_size_times_groups_in_double;
}
}  // namespace

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
        // A window's end need not be exact, only hold at most about `tail`
        // beyond it: double precision suffices.
        return boost::math::ibeta_inv(a, b, tail, in_double());
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

// Where a factor C_j of the products is 1 to within 2^-60, its logarithm is
// 0 to within the rounding of a sum of 200 logarithms: no evaluation needed.
inline constexpr double sure_tail = 0x1p-60;

// A law in the coordinate of the pass, with its window [low, 1 - high_gap]
// kept as two distances from their ends (each exact near its end), and the
// points below sure_low / above 1 - sure_high_gap beyond which it holds at
// most sure_tail of its mass.
struct placed_law {
    double a, b, low, high_gap, sure_low, sure_high_gap;
    bool in_double;
    double high() const { return 1 - high_gap; }
    double mean() const { return a / (a + b); }
    double sd() const { return detail::sd(beta_law{a, b}); }
};

// `groups` decides the precision of the law's evaluations (in_double_among).
placed_law place(const beta_law& law, double tail, bool mirrored, std::size_t groups) {
    const double a = mirrored ? law.b : law.a, b = mirrored ? law.a : law.b;
    // An end where the density is infinite holds about d^a within d of it:
    // the window reaches that end.
    return {a,
            b,
            a < 1 ? 0.0 : lower_tail_point(a, b, tail),
            b < 1 ? 0.0 : lower_tail_point(b, a, tail),
            lower_tail_point(a, b, sure_tail),
            lower_tail_point(b, a, sure_tail),
            in_double_among(a, b, groups)};
}

placed_law mirror(const placed_law& l) { return {l.b, l.a, l.high_gap, l.low, l.sure_high_gap, l.sure_low, l.in_double}; }

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
        const double x = p.s <= 0.5 ? p.s : p.s_gap, a = p.s <= 0.5 ? law.a : law.b, b = p.s <= 0.5 ? law.b : law.a;
        const double d = law.in_double ? boost::math::ibeta_derivative(a, b, x, in_double())
                                       : boost::math::ibeta_derivative(a, b, x);
        return d > 0 ? std::log(d) : -HUGE_VAL;
    } catch (const std::overflow_error&) {
        // Next to an end where the density is infinite (a parameter below 1):
        // in logs, where the parameters are small and log-gamma is exact enough.
        return (law.a - 1) * std::log(p.s) + (law.b - 1) * std::log(p.s_gap) - detail::log_beta(law.a, law.b);
    }
}

// log F(s) (lower) or log (1 - F(s)), from whichever of s and 1 - s is exact.
double log_cdf_at(const placed_law& law, const axis_point& p, bool lower) {
    // I_s(a, b) = 1 - I_(1-s)(b, a): from 1 - s above 1/2.
    const bool near_zero = p.s <= 0.5;
    const double x = near_zero ? p.s : p.s_gap, a = near_zero ? law.a : law.b, b = near_zero ? law.b : law.a;
    const bool lower_of_x = lower == near_zero;
    double v;
    if (law.in_double) v = lower_of_x ? boost::math::ibeta(a, b, x, in_double()) : boost::math::ibetac(a, b, x, in_double());
    else v = lower_of_x ? boost::math::ibeta(a, b, x) : boost::math::ibetac(a, b, x);
    return v > 0 ? std::log(v) : -HUGE_VAL;
}

struct breakpoint {
    double at, scale;
};

// The pieces between `from` and `to`, cut at every law's scale; points closer
// than half the finer scale of two neighbours are merged.
std::vector<double> cuts_between(const std::vector<placed_law>& laws, double from, double to) {
    // A density is a peak that nodes may step over: cuts at 2, 5 and 10 sd.
    static constexpr double sds[] = {0, 2, -2, 5, -5, 10, -10};
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

axis_problem set_up(std::span<const beta_law> input, goal g, double tail, bool allow_double) {
    axis_problem p;
    // Counted as more groups than any call has, a law is in long double.
    const std::size_t groups = allow_double ? input.size() : std::numeric_limits<std::size_t>::max();
    for (const auto& law : input) p.laws.push_back(place(law, tail, false, groups));
    const bool high = g == goal::high;
    const auto [from, to] = range_of(p.laws, high);
    p.mirrored = from + to > 1;
    if (p.mirrored)
        for (auto& l : p.laws) l = mirror(l);
    p.want_high = high != p.mirrored;
    std::tie(p.from, p.to) = range_of(p.laws, p.want_high);
    return p;
}

// The pieces of [from, to]; an end piece next to an infinite density gets
// the power substitution (its map and exponent in `maps`).
std::vector<quadrature_piece> pieces_of(const axis_problem& p, end_maps& maps) {
    if (!(p.to > p.from)) return {};
    const auto cuts = cuts_between(p.laws, p.from, p.to);
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
// holds it: f_k prod_{j != k} C_j for every group k and then the expected
// best's integrand (answers::every: G + 1 values), or f_1 prod_{j != 1} C_j
// alone (first_best).
class node_values {
public:
    node_values(const axis_problem& p, const end_maps& maps, answers what, work_meter& meter)
        : p_(p), maps_(maps), what_(what), log_f_(p.laws.size()), log_c_(p.laws.size()), prefix_(p.laws.size() + 1),
          meter_(meter) {
        // Cost of one law's evaluation with its share of the pass around it,
        // in units of about 1 us. In long double Boost's incomplete beta
        // takes 4.5 to 6 us up to 10^6 attempts and then slows (250 us at
        // 10^12, 1.9 ms at 10^15): 4 units, growing as (size / 10^6)^0.31
        // beyond. In double 0.26 us with the pass around it (measured on the
        // table of every pair of 100 groups of 300 with Jeffreys' prior).
        for (const auto& l : p.laws)
            cost_.push_back(l.in_double ? 0.25 : 4 * std::max(1.0, std::pow((l.a + l.b) / 1e6, 0.31)));
    }

    void operator()(int map, double v, double* values) {
        const std::size_t G = p_.laws.size();
        const axis_point at = point_at(map, v, maps_);
        if (!(at.jacobian > 0) || !(at.s > 0) || !(at.s_gap > 0) || !std::isfinite(at.jacobian)) {
            std::fill(values, values + (what_ == answers::every ? G + 1 : 1), 0.0);
            return;
        }
        double work = 0;
        for (std::size_t j = 0; j < G; ++j) work += evaluate(j, at);
        meter_.add(work);
        // Every group's product of the others without dividing: prefix and suffix sums in logs.
        prefix_[0] = 0;
        for (std::size_t j = 0; j < G; ++j) prefix_[j + 1] = prefix_[j] + log_c_[j];
        double suffix = 0;
        for (std::size_t j = G; j-- > 0;) {
            const double v_j = std::isfinite(log_f_[j]) ? std::exp(log_f_[j] + prefix_[j] + suffix) * at.jacobian : 0.0;
            if (what_ == answers::every) values[j] = v_j;
            else if (j == 0) values[0] = v_j;
            suffix += log_c_[j];
        }
        // The expected best: 1 - prod F_j for the highest, prod (1 - F_j)
        // for the lowest (in the pass's coordinate).
        if (what_ == answers::every)
            values[G] = (p_.want_high ? -std::expm1(prefix_[G]) : std::exp(prefix_[G])) * at.jacobian;
    }

private:
    bool needs_density(std::size_t j) const {
        return what_ == answers::every || j == 0;
    }

    // The law's values at the node; returns their cost.
    double evaluate(std::size_t j, const axis_point& at) {
        const placed_law& l = p_.laws[j];
        if (at.s < l.low || at.s_gap < l.high_gap) {
            // Outside the window: no density; the CDF is 0 below, 1 above.
            log_f_[j] = -HUGE_VAL;
            log_c_[j] = ((at.s < l.low) == p_.want_high) ? -HUGE_VAL : 0.0;
            return 0;
        }
        log_f_[j] = needs_density(j) ? log_density_at(l, at) : -HUGE_VAL;
        const bool sure_one = p_.want_high ? at.s_gap < l.sure_high_gap : at.s < l.sure_low;
        log_c_[j] = sure_one ? 0.0 : log_cdf_at(l, at, p_.want_high);
        return cost_[j];
    }

    const axis_problem& p_;
    const end_maps& maps_;
    answers what_;
    std::vector<double> cost_, log_f_, log_c_, prefix_;
    work_meter& meter_;
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

void work_meter::add(double units) {
    used += units;
    if (used > max_law_evaluations)
        throw budget_exceeded(what + " needs more than " + format_number(max_law_evaluations) +
                              " units of work, the cap of one call (about 2 s); groups of more than about "
                              "10^6 attempts or many groups cost the most.");
}

namespace {

across_groups one_pass(std::span<const beta_law> input, goal g, reach how, answers what, work_meter& meter,
                       bool allow_double) {
    const std::size_t G = input.size(), width = what == answers::every ? G + 1 : 1;
    const axis_problem p = set_up(input, g, how.tail, allow_double);
    end_maps maps;
    const auto pieces = pieces_of(p, maps);
    const double floor = rounding_floor(p);
    vector_tolerance tolerance{std::max(how.relative, floor), std::vector<double>(width, how.absolute),
                               std::max(how.small_relative, floor), 1e-3};
    // The expected best is a rate, not a probability that may be tiny.
    if (what == answers::every) tolerance.absolute[G] = std::max(1e-13, floor * p.to);
    const auto integrals = pieces.empty() ? vector_integrals{std::vector<double>(width, 0.0), {}, 0}
                                          : integrate_pieces(node_values(p, maps, what, meter), pieces, width, tolerance);
    across_groups out;
    for (std::size_t k = 0; k < G; ++k)
        out.best.push_back(what == answers::every || k == 0 ? std::clamp(integrals.value[k], 0.0, 1.0)
                                                            : std::numeric_limits<double>::quiet_NaN());
    if (what == answers::every) {
        // Below `from` the integrand of the expected best is 1 (some law is
        // surely below / every law is surely above), beyond `to` it is 0.
        const double expected = p.from + integrals.value[G];
        out.expected_best = p.mirrored ? 1 - expected : expected;
        for (const auto& l : p.laws)
            out.loss.push_back(std::max(0.0, p.want_high ? expected - l.mean() : l.mean() - expected));
    }
    return out;
}

}  // namespace

across_groups compare_all(std::span<const beta_law> input, goal g, reach how, answers what, work_meter* meter) {
    work_meter own{"Comparing these " + std::to_string(input.size()) + " groups"};
    work_meter& used = meter ? *meter : own;
    const bool some_in_double = std::any_of(input.begin(), input.end(), [&](const beta_law& l) {
        return in_double_among(l.a, l.b, input.size());
    });
    try {
        return one_pass(input, g, how, what, used, some_in_double);
    } catch (const no_convergence&) {
        if (!some_in_double) throw;
        // Where the error estimate fails with evaluations in double (their
        // rounding noise above what the tolerance allows), the pass again
        // with every law in long double; its own failure is the call's.
        return one_pass(input, g, how, what, used, false);
    }
}

}  // namespace tallyrates::bayes::detail
