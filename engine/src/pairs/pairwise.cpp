// pairwise.cpp - differences of two rates, their intervals and tests, and
// the family of comparisons; methods and sources in pairwise.hpp.
#include "tallyrates/pairs/pairwise.hpp"

#include <algorithm>
#include <boost/math/distributions/chi_squared.hpp>
#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <numbers>

#include "detail/hypergeometric.hpp"
#include "restricted.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/rules.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::pairwise {

namespace {

using restricted::rates_of_two;
using restricted::restricted_variance;
using restricted::two;

// Halvings of the score interval's bisection before it is a failure (Err:523);
// 52 reach double precision.
constexpr std::uintmax_t max_bisection_steps = 200;

interval clipped(double low, double high) { return {std::max(-1.0, low), std::min(1.0, high)}; }

interval newcombe(const rates_of_two& r, double level) {
    const auto w1 = one_rate::bounds(static_cast<std::int64_t>(r.x1), static_cast<std::int64_t>(r.n1), level,
                                     one_rate::method::wilson);
    const auto w2 = one_rate::bounds(static_cast<std::int64_t>(r.x2), static_cast<std::int64_t>(r.n2), level,
                                     one_rate::method::wilson);
    const double p1 = r.p1(), p2 = r.p2(), d = p1 - p2;
    return {d - std::hypot(p1 - w1.low, w2.high - p2), d + std::hypot(w1.high - p1, p2 - w2.low)};
}

interval wald_like(double p1, double n1, double p2, double n2, double z) {
    const double half = z * std::sqrt(p1 * (1 - p1) / n1 + p2 * (1 - p2) / n2);
    return clipped(p1 - p2 - half, p1 - p2 + half);
}

// Miettinen-Nurminen score statistic at delta, decreasing in delta.
double score_z(const rates_of_two& r, double delta) {
    const double big_n = r.n1 + r.n2;
    const double variance = restricted_variance(r, delta) * big_n / (big_n - 1);
    const double num = r.p1() - r.p2() - delta;
    if (!(variance > 0)) return num > 0 ? HUGE_VAL : (num < 0 ? -HUGE_VAL : 0.0);
    return num / std::sqrt(variance);
}

// The delta in [from, to] where score_z crosses `target` (score_z - target
// changes sign there), or the end where it does not.
double score_root(const rates_of_two& r, double from, double to, double target) {
    auto f = [&](double delta) { return score_z(r, delta) - target; };
    const double f_from = f(from), f_to = f(to);
    if (f_from == 0) return from;
    if (f_to == 0) return to;
    if ((f_from > 0) == (f_to > 0)) return std::fabs(f_from) < std::fabs(f_to) ? from : to;
    // Bisection: the statistic is infinite at delta = -1 and 1, which
    // interpolating methods cannot use; 52 halvings reach double precision.
    std::uintmax_t iterations = max_bisection_steps;
    const auto bracket = boost::math::tools::bisect(f, from, to, boost::math::tools::eps_tolerance<double>(52),
                                                    iterations);
    if (iterations >= max_bisection_steps)
        throw no_convergence("The score interval's root search did not converge in " +
                             std::to_string(max_bisection_steps) + " steps.");
    return (bracket.first + bracket.second) / 2;
}

interval miettinen_nurminen(const rates_of_two& r, double z) {
    const double d = r.p1() - r.p2();
    return {d <= -1 ? -1.0 : score_root(r, -1.0, d, z), d >= 1 ? 1.0 : score_root(r, d, 1.0, -z)};
}

// The score test the default interval inverts: the statistic at difference 0
// (0 when every unit is a success, or none: no difference to see).
double score_p(const rates_of_two& r) {
    const double z = score_z(r, 0.0);
    return boost::math::cdf(boost::math::complement(boost::math::chi_squared(1.0), z * z));
}

// Largest hypergeometric standard deviation the exact pair test enumerates
// (about 80 standard deviations are stored: 5 million values, 40 MB).
constexpr double exact_max_sd = 60000;

double fisher_p(const group& a, const group& b) {
    const std::int64_t big_n = a.attempts + b.attempts, k = a.successes + b.successes;
    const double nd = static_cast<double>(big_n), kd = static_cast<double>(k), n1 = static_cast<double>(a.attempts);
    const double variance = nd > 1 ? n1 * (kd / nd) * (1 - kd / nd) * (nd - n1) / (nd - 1) : 0.0;
    if (std::sqrt(variance) > exact_max_sd)
        throw budget_exceeded("The exact test for these two groups would enumerate about " +
                              format_short(80 * std::sqrt(variance)) +
                              " tables; at these counts the score test (the default) is as accurate.");
    // Terms below 1e-300 of the mode are left out: without a floor the
    // recurrence can stall on the smallest subnormal and walk the whole
    // support. A term too small to store lies beyond every stored one, so p
    // is then below about 1e-290 and shows as 0.
    std::vector<double> pmf;
    const auto kept = detail::hypergeometric_pmf(big_n, k, a.attempts, pmf, 1e-300);
    if (a.successes < kept.first || a.successes > kept.last) return 0.0;
    const double observed = pmf[static_cast<std::size_t>(a.successes - kept.first)] * (1 + tie_tolerance);
    double p = 0.0;
    for (double v : pmf)  // ascending x: a fixed order, reproducible
        if (v <= observed) p += v;
    return std::min(1.0, p);
}

// The pairs of groups with attempts, in table order: (1,2), (1,3), ...
std::vector<std::pair<const group*, const group*>> pairs_of(const std::vector<group>& g) {
    std::vector<std::pair<const group*, const group*>> out;
    for (std::size_t a = 0; a < g.size(); ++a)
        for (std::size_t b = a + 1; b < g.size(); ++b) out.emplace_back(&g[a], &g[b]);
    return out;
}

}  // namespace

void distinct(const group& a, const group& b) {
    if (a.position == b.position)
        throw invalid_input("The arguments i and j both name position " + std::to_string(a.position) +
                                "; compare two different groups.",
                            a.position);
}

two_groups pair_at(const counts& c, double i, double j) {
    const group& a = c.with_attempts_at(i, "i");
    const group& b = c.with_attempts_at(j, "j");
    distinct(a, b);
    return {a, b};
}

double difference(const group& a, const group& b) {
    distinct(a, b);  // as every other function of a pair: i = j is a mistake, not a difference of 0
    return a.rate() - b.rate();
}

interval difference_interval(const group& a, const group& b, double level, interval_method how) {
    const auto r = two(a, b);
    switch (how) {
        case interval_method::newcombe: return newcombe(r, level);
        case interval_method::miettinen_nurminen: return miettinen_nurminen(r, one_rate::two_sided_z(level));
        case interval_method::agresti_caffo:
            return wald_like((r.x1 + 1) / (r.n1 + 2), r.n1 + 2, (r.x2 + 1) / (r.n2 + 2), r.n2 + 2,
                             one_rate::two_sided_z(level));
        case interval_method::wald: return wald_like(r.p1(), r.n1, r.p2(), r.n2, one_rate::two_sided_z(level));
    }
    return {-1.0, 1.0};
}

double same_rate_p(const group& a, const group& b, test_method how) {
    return how == test_method::exact ? fisher_p(a, b) : score_p(two(a, b));
}

std::size_t family_size(const counts& c, family f) {
    const std::size_t k = c.with_attempts().size();
    const std::size_t m = f == family::all ? k * (k - 1) / 2 : k - 1;
    return std::max<std::size_t>(1, m);
}

namespace {

// The level of the two-sided interval each comparison of the family needs
// (checked once for a table): the per-comparison level of the adjustment,
// then the sides asked (a one-sided bound at L is the end of the two-sided
// interval at 2 L - 1).
double level_each(const counts& c, const interval_options& o) {
    arguments::interval_level(o.level, o.side, "level");
    const double each = adjust::per_comparison_level(o.level, family_size(c, o.comparisons), o.adjust);
    return o.side == sides::two ? each : 2 * each - 1;
}

}  // namespace

interval difference_interval(const counts& c, const group& a, const group& b, const interval_options& o) {
    distinct(a, b);
    return difference_interval(a, b, level_each(c, o), o.how);
}

namespace {

// Every pair of G groups is G (G - 1) / 2 tests: at most max_pairs of them,
// and for the exact test at most max_exact_values hypergeometric values in
// all (about 80 standard deviations per pair, as fisher_p stores them),
// judged before any test runs (about 2 s at most; README, Caps).
constexpr double max_pairs = 200000, max_exact_values = 3e8;

void check_family_cost(const std::vector<group>& groups, test_method how) {
    const double g = static_cast<double>(groups.size()), pairs = g * (g - 1) / 2;
    if (pairs > max_pairs)
        throw budget_exceeded("Adjusting over every pair of " + std::to_string(groups.size()) + " groups means " +
                              format_number(pairs) + " tests, beyond the cap of " + format_number(max_pairs) +
                              " (about 630 groups); compare fewer groups, or leave adjust empty.");
    if (how != test_method::exact) return;
    double values = 0;
    for (std::size_t a = 0; a < groups.size(); ++a)
        for (std::size_t b = a + 1; b < groups.size(); ++b) {
            const double nd = static_cast<double>(groups[a].attempts + groups[b].attempts);
            const double kd = static_cast<double>(groups[a].successes + groups[b].successes);
            const double n1 = static_cast<double>(groups[a].attempts);
            const double variance = nd > 1 ? n1 * (kd / nd) * (1 - kd / nd) * (nd - n1) / (nd - 1) : 0.0;
            values += std::min(n1 + 1, 80 * std::sqrt(variance) + 1);
        }
    if (values > max_exact_values)
        throw budget_exceeded("The exact tests of every pair would enumerate about " + format_short(values) +
                              " tables, beyond the cap of " + format_number(max_exact_values) +
                              "; at these counts the score test (the default) is as accurate.");
}

}  // namespace

std::vector<double> all_pairs_p(const counts& c, test_method how, p_cache* cache) {
    const auto groups = c.with_attempts();
    check_family_cost(groups, how);
    std::pair<std::vector<std::pair<std::int64_t, std::int64_t>>, test_method> key{{}, how};
    for (const auto& g : groups) key.first.emplace_back(g.successes, g.attempts);
    if (cache)
        if (auto hit = cache->find(key)) return *hit;
    std::vector<double> p;
    for (const auto& [a, b] : pairs_of(groups)) p.push_back(same_rate_p(*a, *b, how));
    if (cache) cache->put(key, p);
    return p;
}

double same_rate_p(const counts& c, const group& a, const group& b, const test_options& o, p_cache* cache) {
    distinct(a, b);
    if (o.adjust == adjust::p_values::none) return same_rate_p(a, b, o.how);
    const auto groups = c.with_attempts();
    const auto raw = all_pairs_p(c, o.how, cache);
    const auto pairs = pairs_of(groups);
    // The family's raw p-values, and where (i, j) sits among them.
    std::vector<double> family_p;
    std::size_t at = 0;
    for (std::size_t k = 0; k < pairs.size(); ++k) {
        const auto [g, h] = pairs[k];
        const bool is_ij = (g->position == a.position && h->position == b.position) ||
                           (g->position == b.position && h->position == a.position);
        const bool in_family = o.comparisons == family::all || g->position == b.position || h->position == b.position;
        if (!in_family) continue;
        if (is_ij) at = family_p.size();
        family_p.push_back(raw[k]);
    }
    return adjust::adjusted(family_p, o.adjust)[at];
}

std::vector<pair_row> pairs_table(const counts& c, const table_options& o, p_cache* cache) {
    const auto groups = c.with_attempts();
    if (groups.size() < 2)
        throw invalid_input("At least two groups with attempts are needed to compare pairs; " +
                            std::to_string(groups.size()) + (groups.size() == 1 ? " has" : " have") + " any.");
    const interval_options io{o.level, o.how, o.intervals, family::all, sides::two};
    // The p-values of the family "all", adjusted once: the same vectors the
    // single-cell RATES.PAIR.P takes its value from (same_rate_p above).
    const auto raw = all_pairs_p(c, test_method::score, cache);
    const auto adjusted = adjust::adjusted(raw, o.p);
    const auto pairs = pairs_of(groups);
    // The family and its level once, not per pair: the same values the
    // single-cell functions compute.
    const double each = level_each(c, io);
    std::vector<pair_row> rows;
    for (std::size_t k = 0; k < pairs.size(); ++k) {
        const auto [a, b] = pairs[k];
        pair_row row{a->position, b->position, difference(*a, *b), difference_interval(*a, *b, each, io.how), raw[k],
                     adjusted[k]};
        const bool clear = row.p_adjusted < 1 - o.level;
        row.called = clear && row.bounds.low > 0 ? 1 : (clear && row.bounds.high < 0 ? -1 : 0);
        rows.push_back(row);
    }
    return rows;
}

std::string verdict(const counts& c, const pair_row& row, goal better) {
    if (row.called == 0) return "no clear difference";
    // The group with the higher rate, or for defect counts the lower one.
    const bool first = (row.called > 0) == (better == goal::high);
    const std::size_t pos = first ? row.i : row.j;
    const std::string label = c.label_of(pos);
    const std::string name = label.empty() ? "group " + std::to_string(pos) : label;
    return name + (better == goal::high ? " higher" : " fewer defects");
}

namespace {

// "95 % each" or "95 % jointly, Bonferroni": what the interval columns hold.
std::string level_words(double level, adjust::simultaneous joint) {
    const std::string pct = format_short(level * 100) + " %";
    if (joint == adjust::simultaneous::none) return pct + " each";
    return pct + " jointly, " + (joint == adjust::simultaneous::bonferroni ? "Bonferroni" : "Sidak");
}

}  // namespace

std::vector<std::string> pairs_header(const table_options& o, std::size_t pairs, std::string_view adjust_word) {
    const std::string level = level_words(o.level, o.intervals);
    const std::string pct = format_short(o.level * 100) + " %";
    std::string rule;
    if (o.intervals != adjust::simultaneous::none)
        rule = "all pairs together, " + pct;
    else if (o.p != adjust::p_values::none)
        rule = std::string(adjust_word) + " p below " + format_short(1 - o.level) + ", interval clear of 0";
    else
        rule = "each pair alone, " + pct;
    return {"group i (" + count_of(pairs, "pair", "pairs") + ", " + std::to_string(pairs + 1) + " rows)",
            "group j",
            "rate i - rate j",
            "confidence low (" + level + ")",
            "confidence high (" + level + ")",
            "p (score test)",
            "p adjusted (" + std::string(adjust_word) + ")",
            "verdict (" + rule + ")"};
}

}  // namespace tallyrates::pairwise
