// limits.cpp - decision limits around the whole; methods and sources in
// apart/limits.hpp.
#include "tallyrates/apart/limits.hpp"

#include <algorithm>
#include <boost/math/distributions/binomial.hpp>
#include <boost/math/distributions/normal.hpp>
#include <cmath>
#include <numeric>
#include <utility>

#include "detail/hypergeometric.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"
#include "tallyrates/omnibus/tarone.hpp"

namespace tallyrates::apart {

namespace {

// d2 for moving ranges of two consecutive points (common practice of control
// charts, no single source; Laney 2002 uses it).
constexpr double d2 = 1.128;
// Hypergeometric values kept per group: below 1e-40 of the mode (beyond
// about 13.6 standard deviations) no tail the limits use can reach.
constexpr double marginal_trim = 1e-40;
// Stored marginal values in all (8 bytes each, three arrays): about 100 MB.
constexpr double max_stored = 4e6;

double sidak_tail(double level, std::size_t k) {
    // (1 - level^(1/k)) / 2 without cancellation for levels near 1.
    return -std::expm1(std::log(level) / static_cast<double>(k)) / 2;
}

double upper_z(double tail) { return boost::math::quantile(boost::math::complement(boost::math::normal(), tail)); }

// ---- one group's binomial limits ----

// The counts a group's region runs over, from the smallest count with
// P(X <= x) >= tail (a) and the largest with P(X >= x) >= tail (b). For a
// tail of at most 1/2 the median is never flagged, so a <= b exactly; when
// the tail rounds to 1/2 (levels below about 1e-16) the two sums can round
// past each other by one count, and the region is then the two counts at the
// median (found by tests/fuzz/fuzz_apart: a level of 2.6e-316 gave a > b).
std::pair<std::int64_t, std::int64_t> region_between(std::int64_t a, std::int64_t b) {
    return a <= b ? std::pair{a, b} : std::pair{b, a};
}

// Smallest x with P(X <= x) >= tail, largest with P(X >= x) >= tail (for a
// tail above 1/2 the second may lie below the first: the funnel uses the
// first as a quantile).
interval binomial_counts(std::int64_t n, double c, double tail) {
    if (c <= 0) return {0.0, 0.0};
    if (c >= 1) return {static_cast<double>(n), static_cast<double>(n)};
    const boost::math::binomial_distribution<double> law(static_cast<double>(n), c);
    const double nd = static_cast<double>(n);
    auto cdf = [&](double x) { return x < 0 ? 0.0 : boost::math::cdf(law, std::min(x, nd)); };
    auto at_least = [&](double x) { return x <= 0 ? 1.0 : boost::math::cdf(boost::math::complement(law, x - 1)); };
    // Start at the normal approximation and walk: the steps are few.
    const double sd = std::sqrt(nd * c * (1 - c)), z = upper_z(tail);
    double a = std::clamp(std::floor(nd * c - z * sd), 0.0, nd);
    while (a > 0 && cdf(a - 1) >= tail) {
        const double step = std::max(1.0, std::floor((a - (nd * c - z * sd - 4 * sd - 1)) / 2));
        a = cdf(a - step) >= tail ? std::max(0.0, a - step) : a - 1;
    }
    while (cdf(a) < tail) ++a;
    double b = std::clamp(std::ceil(nd * c + z * sd), 0.0, nd);
    while (b < nd && at_least(b + 1) >= tail) {
        const double step = std::max(1.0, std::floor(((nd * c + z * sd + 4 * sd + 1) - b) / 2));
        b = at_least(b + step) >= tail ? std::min(nd, b + step) : b + 1;
    }
    while (at_least(b) < tail) --b;
    return {a, b};
}

// ---- the groups' hypergeometric marginals given the margins ----

struct marginal {
    std::int64_t first = 0;
    std::vector<double> below;   // P(X <= first + k)
    std::vector<double> at_least;  // P(X >= first + k)
    std::int64_t last() const { return first + static_cast<std::int64_t>(below.size()) - 1; }
    // Smallest x with P(X <= x) >= t; largest with P(X >= x) >= t.
    std::int64_t low(double t) const {
        const auto it = std::lower_bound(below.begin(), below.end(), t);
        return first + (it - below.begin());
    }
    std::int64_t high(double t) const {
        // at_least falls with x: the last index with value >= t.
        const auto it = std::lower_bound(at_least.begin(), at_least.end(), t, std::greater_equal<double>());
        return first + (it - at_least.begin()) - 1;
    }
};

marginal marginal_of(std::int64_t big_n, std::int64_t s, std::int64_t n) {
    std::vector<double> pmf;
    const auto kept = detail::hypergeometric_pmf(big_n, s, n, pmf, marginal_trim);
    marginal m;
    m.first = kept.first;
    m.below.resize(pmf.size());
    m.at_least.resize(pmf.size());
    double run = 0;
    for (std::size_t k = 0; k < pmf.size(); ++k) m.below[k] = (run += pmf[k]);
    run = 0;
    for (std::size_t k = pmf.size(); k-- > 0;) m.at_least[k] = (run += pmf[k]);
    return m;
}

// An upper bound on the work of all_inside at these regions (running totals
// times counts per group), found without running it.
double work_of(const std::vector<std::pair<std::int64_t, std::int64_t>>& region, std::int64_t s) {
    const std::size_t k = region.size();
    std::vector<double> rest_low(k + 1, 0), rest_high(k + 1, 0);
    for (std::size_t j = k; j-- > 0;) {
        rest_low[j] = rest_low[j + 1] + static_cast<double>(region[j].first);
        rest_high[j] = rest_high[j + 1] + static_cast<double>(region[j].second);
    }
    double work = 0, done_low = 0, done_high = 0;
    const double sd = static_cast<double>(s);
    for (std::size_t j = 0; j < k; ++j) {
        done_low += static_cast<double>(region[j].first);
        done_high += static_cast<double>(region[j].second);
        const double lo = std::max(done_low, sd - rest_high[j + 1]), hi = std::min(done_high, sd - rest_low[j + 1]);
        if (hi >= lo) work += (hi - lo + 1) * static_cast<double>(region[j].second - region[j].first + 1);
    }
    return work;
}

double log_choose(double n, double k) { return std::lgamma(n + 1) - std::lgamma(k + 1) - std::lgamma(n - k + 1); }

// log of the binomial probability of x in n at rate p.
double log_binomial_pmf(double n, double x, double p) {
    return log_choose(n, x) + x * std::log(p) + (n - x) * std::log1p(-p);
}

// P(every group's count inside its region) under the multivariate
// hypergeometric law of the margins, prod C(n_i, x_i) / C(N, S), summed over
// the running total group by group. With p = S / N the product equals
// prod Bin(x_i; n_i, p) / Bin(S; N, p) (the powers of p and 1 - p multiply
// to p^S (1 - p)^(N - S) whatever the x_i), so each group's weights are its
// binomial probabilities at p: near 1 at their largest across its region,
// where the binomial coefficients alone ran to 1e-700 over a region of 700
// counts at 90 % (a silent underflow that kept the Sidak limits). Each stage
// is also scaled by its largest value (the log of the scale kept apart).
double all_inside(const std::vector<group>& gs, const std::vector<std::pair<std::int64_t, std::int64_t>>& region,
                  std::int64_t big_n, std::int64_t s) {
    const std::size_t k = gs.size();
    std::vector<std::int64_t> rest_low(k + 1, 0), rest_high(k + 1, 0);  // sums over groups j..k-1
    for (std::size_t j = k; j-- > 0;) {
        rest_low[j] = rest_low[j + 1] + region[j].first;
        rest_high[j] = rest_high[j + 1] + region[j].second;
    }
    if (rest_low[0] > s || rest_high[0] < s) return 0.0;
    const double p = static_cast<double>(s) / static_cast<double>(big_n), odds = p / (1 - p);
    double log_scale = 0;
    std::vector<double> now{1.0}, next;
    std::int64_t now_low = 0;  // running total of now[0]
    std::int64_t done_low = 0, done_high = 0;
    std::vector<double> w;
    for (std::size_t j = 0; j < k; ++j) {
        const auto [a, b] = region[j];
        const double n = static_cast<double>(gs[j].attempts);
        // Bin(x; n, p) / Bin(x0; n, p) from the count x0 nearest n p, by the
        // ratios (n - x) p / ((x + 1) q) upwards and their inverses downwards.
        const std::int64_t x0 = std::clamp(static_cast<std::int64_t>(std::llround(n * p)), a, b);
        w.assign(static_cast<std::size_t>(b - a + 1), 0.0);
        w[static_cast<std::size_t>(x0 - a)] = 1.0;
        for (std::int64_t x = x0; x < b; ++x)
            w[static_cast<std::size_t>(x + 1 - a)] =
                w[static_cast<std::size_t>(x - a)] * (n - static_cast<double>(x)) / static_cast<double>(x + 1) * odds;
        for (std::int64_t x = x0; x > a; --x)
            w[static_cast<std::size_t>(x - 1 - a)] =
                w[static_cast<std::size_t>(x - a)] * static_cast<double>(x) / (n - static_cast<double>(x) + 1) / odds;
        log_scale += log_binomial_pmf(n, static_cast<double>(x0), p);
        done_low += a;
        done_high += b;
        const std::int64_t lo = std::max(done_low, s - rest_high[j + 1]);
        const std::int64_t hi = std::min(done_high, s - rest_low[j + 1]);
        if (lo > hi) return 0.0;
        next.assign(static_cast<std::size_t>(hi - lo + 1), 0.0);
        const std::int64_t now_high = now_low + static_cast<std::int64_t>(now.size()) - 1;
        for (std::int64_t t = lo; t <= hi; ++t) {
            // t = previous total r + x, x in [a, b], r in [now_low, now_high].
            const std::int64_t x_from = std::max(a, t - now_high), x_to = std::min(b, t - now_low);
            double sum = 0;
            for (std::int64_t x = x_from; x <= x_to; ++x)
                sum += now[static_cast<std::size_t>(t - x - now_low)] * w[static_cast<std::size_t>(x - a)];
            next[static_cast<std::size_t>(t - lo)] = sum;
        }
        const double top = *std::max_element(next.begin(), next.end());
        if (!(top > 0)) return 0.0;
        for (double& v : next) v /= top;
        log_scale += std::log(top);
        now.swap(next);
        now_low = lo;
    }
    const double at_s = now[static_cast<std::size_t>(s - now_low)];
    return std::exp(std::log(at_s) + log_scale -
                    log_binomial_pmf(static_cast<double>(big_n), static_cast<double>(s), p));
}

}  // namespace

std::string verdict_word(int verdict) { return verdict < 0 ? "below" : verdict > 0 ? "above" : "within"; }

namespace {

// What every method needs: the groups with attempts and their totals.
struct whole {
    std::vector<group> groups;
    std::int64_t attempts = 0, successes = 0;
    double level = 0;
};

// Centre +- h sigma_i, sigma_i about a standard or about a whole that
// includes the group, times Laney's sigma_z for rows in time order.
void normal_limits(const whole& w, const options& o, bool by_standard, result& out) {
    const auto& gs = w.groups;
    const std::size_t k = gs.size();
    const double tail = o.together == family::each ? (1 - w.level) / 2 : sidak_tail(w.level, k);
    const double cq = out.centre * (1 - out.centre), bn = static_cast<double>(w.attempts);
    std::vector<double> sigma;
    for (const auto& g : gs) {
        const double n = static_cast<double>(g.attempts);
        sigma.push_back(by_standard ? std::sqrt(cq / n) : std::sqrt(cq * (bn - n) / (bn * n)));
    }
    if (o.variation == spread::time && k >= 2) {
        double moving = 0;
        bool defined = true;
        for (std::size_t r = 1; r < k; ++r) {
            if (!(sigma[r] > 0 && sigma[r - 1] > 0)) defined = false;
            else
                moving += std::fabs((gs[r].rate() - out.centre) / sigma[r] -
                                    (gs[r - 1].rate() - out.centre) / sigma[r - 1]);
        }
        if (defined) out.spread_factor = moving / static_cast<double>(k - 1) / d2;
    }
    out.multiplier = upper_z(tail) * out.spread_factor;
    for (std::size_t r = 0; r < k; ++r)
        out.rows[r].limits = {std::max(0.0, out.centre - out.multiplier * sigma[r]),
                              std::min(1.0, out.centre + out.multiplier * sigma[r])};
}

// Each group's binomial(n_i, centre) counts at the tail.
void standard_limits(const whole& w, const options& o, result& out) {
    out.tail = o.together == family::each ? (1 - w.level) / 2 : sidak_tail(w.level, w.groups.size());
    for (std::size_t r = 0; r < w.groups.size(); ++r) {
        const auto ends = binomial_counts(w.groups[r].attempts, out.centre, out.tail);
        const auto [low, high] =
            region_between(static_cast<std::int64_t>(ends.low), static_cast<std::int64_t>(ends.high));
        const double n = static_cast<double>(w.groups[r].attempts);
        out.rows[r].limits = {static_cast<double>(low) / n, static_cast<double>(high) / n};
    }
}

// Every group at once against the whole it belongs to: the largest common
// tail whose regions hold every group at the level under the margins' law.
void joint_limits(const whole& w, result& out) {
    const auto& gs = w.groups;
    const std::int64_t big_n = w.attempts, s = w.successes;
    const double widest = sidak_tail(w.level, gs.size()), narrowest = (1 - w.level) / 2;
    double stored = 0;
    const double q = static_cast<double>(s) / static_cast<double>(big_n), bn = static_cast<double>(big_n);
    for (const auto& g : gs) {
        const double n = static_cast<double>(g.attempts);
        const double sd = bn > 1 ? std::sqrt(n * q * (1 - q) * (bn - n) / (bn - 1)) : 0.0;
        stored += std::min(n + 1, 28 * sd + 3);
    }
    if (stored > max_stored)
        throw budget_exceeded("Exact limits for every group at once would store about " + format_short(stored) +
                              " probabilities, beyond the cap of " + format_number(max_stored) +
                              "; at these counts method \"normal\" is as accurate.");
    std::vector<marginal> laws;
    for (const auto& g : gs) laws.push_back(marginal_of(big_n, s, g.attempts));
    auto regions_at = [&](double t) {
        std::vector<std::pair<std::int64_t, std::int64_t>> region;
        for (const auto& m : laws) region.push_back(region_between(m.low(t), m.high(t)));
        return region;
    };
    // The tails at which some group's region changes, between the Sidak
    // tail and the one-group tail: the only values worth trying.
    std::vector<double> candidates{widest, narrowest};
    for (const auto& m : laws)
        for (const auto* side : {&m.below, &m.at_least})
            for (double v : *side)
                if (v > widest && v < narrowest) candidates.push_back(v);
    std::sort(candidates.begin(), candidates.end());
    candidates.erase(std::unique(candidates.begin(), candidates.end()), candidates.end());
    // The cost of one pass at the widest regions, times the passes of a bisection.
    const auto widest_regions = regions_at(widest);
    const double passes = std::ceil(std::log2(static_cast<double>(candidates.size()) + 1)) + 1;
    double chosen = widest;
    if (work_of(widest_regions, s) * passes > max_exact_work) {
        out.fell_back = true;
    } else if (all_inside(gs, widest_regions, big_n, s) >= w.level) {
        // The largest candidate whose regions still hold every group at the level.
        std::size_t good = 0, bad = candidates.size();
        while (bad - good > 1) {
            const std::size_t mid = (good + bad) / 2;
            if (all_inside(gs, regions_at(candidates[mid]), big_n, s) >= w.level) good = mid;
            else bad = mid;
        }
        chosen = candidates[good];
    }
    out.tail = chosen;
    const auto region = regions_at(chosen);
    for (std::size_t r = 0; r < gs.size(); ++r) {
        const double n = static_cast<double>(gs[r].attempts);
        out.rows[r].limits = {static_cast<double>(region[r].first) / n, static_cast<double>(region[r].second) / n};
    }
}

}  // namespace

result limits(const counts& c, const options& o) {
    whole w{c.with_attempts(), 0, 0, arguments::level(o.level, "level")};
    const std::size_t k = w.groups.size();
    if (o.target && !(*o.target >= 0 && *o.target <= 1))
        arguments::out_of_range("target", *o.target, "lie between 0 and 1, a rate such as 0.95 for 95 %");
    if (o.how == method::exact && o.variation == spread::time)
        throw invalid_input("The spread \"time\" (Laney's limits) widens normal limits; use method \"normal\" with it.");
    if (k == 0 || (!o.target && k < 2))
        throw invalid_input("Limits around the whole need at least two groups with attempts (or a target); " +
                            std::to_string(k) + (k == 1 ? " has" : " have") + " any.");
    for (const auto& g : w.groups) {
        w.attempts += g.attempts;
        w.successes += g.successes;
    }
    if (!o.target && (w.successes == 0 || w.successes == w.attempts))
        throw invalid_input(std::string("Every unit of the tally ") + (w.successes == 0 ? "failed" : "passed") +
                            ", so no group can stand apart from the others; give a target to judge against.");
    result out;
    out.centre = o.target ? *o.target : static_cast<double>(w.successes) / static_cast<double>(w.attempts);
    for (const auto& g : w.groups) out.rows.push_back({g.position, g.successes, g.attempts, g.rate(), {}, 0});
    const bool by_standard = o.target || o.together == family::each;
    if (o.how == method::normal) normal_limits(w, o, by_standard, out);
    else if (by_standard) standard_limits(w, o, out);
    else joint_limits(w, out);
    // Whole counts compare exactly; normal limits compare as rates.
    for (auto& row : out.rows) row.verdict = row.rate < row.limits.low ? -1 : (row.rate > row.limits.high ? 1 : 0);
    return out;
}

}  // namespace tallyrates::apart

namespace tallyrates::apart {

namespace {

std::string family_words(const options& o, std::size_t k) {
    const std::string pct = format_short(o.level * 100) + " %";
    std::string who = o.together == family::each ? "each group alone"
                                                  : "all " + std::to_string(k) + " groups at once";
    const std::string around = o.target ? "around the target " + format_short(*o.target * 100) + " %"
                                        : "around the whole";
    std::string how = o.how == method::exact ? "exact" : "normal";
    if (o.variation == spread::time) how += ", Laney";
    return pct + ", " + who + ", " + around + ", " + how;
}

}  // namespace

std::vector<std::vector<table_cell>> table(const counts& c, const options& o) {
    const auto res = limits(c, o);
    const std::string words = family_words(o, res.rows.size());
    std::vector<std::vector<table_cell>> out;
    out.push_back({std::string("group (") + std::to_string(c.range_size() + 1) + "+ rows)", std::string("attempts"),
                   std::string("rate"), "lower limit (" + words + ")", "upper limit (" + words + ")",
                   std::string("verdict")});
    const auto blank = [] { return std::vector<table_cell>(table_columns, std::string()); };
    std::size_t next = 0;  // rows of res in range order
    std::size_t at = 0;    // groups() in range order
    const auto& groups = c.groups();
    for (std::size_t pos = 1; pos <= c.range_size(); ++pos) {
        if (at >= groups.size() || groups[at].position != pos) {
            out.push_back(blank());
            continue;
        }
        const group& g = groups[at++];
        const std::string label = c.label_of(pos);
        const table_cell name = label.empty() ? table_cell(static_cast<double>(pos)) : table_cell(label);
        if (g.attempts == 0) {
            out.push_back({name, 0.0, std::string(), std::string(), std::string(), std::string("no attempts")});
            continue;
        }
        const auto& row = res.rows[next++];
        out.push_back({name, static_cast<double>(row.attempts), row.rate, row.limits.low, row.limits.high,
                       verdict_word(row.verdict)});
    }
    if (res.fell_back)
        out.push_back({std::string("note: exact limits for every group at once pass their cap on work here; these are "
                                   "the Sidak limits of the groups' exact laws, a little wider."),
                       std::string(), std::string(), std::string(), std::string(), std::string()});
    if (res.rows.size() >= min_groups_caution) {
        try {
            const auto v = omnibus::tarone(c);
            if (v.p < 0.05)
                out.push_back({"caution: the groups vary more than counting alone explains (Tarone's test, p = " +
                                   format_short(v.p) +
                                   "); these limits assume independent units and will flag too many groups. For "
                                   "rows in time order, spread \"time\" widens them (Laney).",
                               std::string(), std::string(), std::string(), std::string(), std::string()});
        } catch (const invalid_input&) {
        }
    }
    return out;
}

}  // namespace tallyrates::apart

namespace tallyrates::apart {

namespace {

// Spiegelhalter's interpolated limit at probability p for n units at rate c.
double interpolated(std::int64_t n, double c, double p) {
    const double nd = static_cast<double>(n);
    if (c <= 0) return 0.0;
    if (c >= 1) return 1.0;
    const boost::math::binomial_distribution<double> law(nd, c);
    // r: the smallest count with P(X <= r) >= p (the one-group search's lower count).
    const double r = binomial_counts(n, c, p).low;
    const double at = boost::math::cdf(law, r), mass = boost::math::pdf(law, r);
    const double alpha = mass > 0 ? (at - p) / mass : 0.0;
    return std::clamp((r - alpha) / nd, 0.0, 1.0);
}

}  // namespace

std::vector<std::array<double, 3>> funnel(const counts& c, double level, std::optional<double> target,
                                          std::int64_t points) {
    level = arguments::level(level, "level");
    points = arguments::whole(static_cast<double>(points), static_cast<double>(min_curve_points),
                              static_cast<double>(max_curve_points), "sizes");
    options o;
    o.level = level;
    o.together = family::each;
    o.target = target;
    o.how = method::exact;
    const auto res = limits(c, o);  // the checks and the centre, as the table's
    std::int64_t smallest = res.rows.front().attempts, largest = smallest;
    for (const auto& row : res.rows) {
        smallest = std::min(smallest, row.attempts);
        largest = std::max(largest, row.attempts);
    }
    const double tail = (1 - level) / 2, from = std::log(static_cast<double>(smallest)),
                 to = std::log(static_cast<double>(largest));
    std::vector<std::array<double, 3>> out;
    for (std::int64_t k = 0; k < points; ++k) {
        const double t = points == 1 ? 0.0 : static_cast<double>(k) / static_cast<double>(points - 1);
        const auto n = std::clamp(static_cast<std::int64_t>(std::llround(std::exp(from + t * (to - from)))), smallest,
                                  largest);
        out.push_back({static_cast<double>(n), interpolated(n, res.centre, tail), interpolated(n, res.centre, 1 - tail)});
    }
    return out;
}

std::vector<std::string> funnel_header(double level, std::optional<double> target) {
    const std::string pct = format_short(level * 100) + " %";
    const std::string around = target ? "around the target " + format_short(*target * 100) + " %" : "around the whole";
    return {"attempts", "lower limit (" + pct + ", each group, " + around + ")",
            "upper limit (" + pct + ", each group, " + around + ")"};
}

}  // namespace tallyrates::apart
