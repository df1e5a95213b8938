// planning.cpp - sizes for further runs; methods and sources in planning.hpp.
#include "tallyrates/planning/planning.hpp"

#include <algorithm>
#include <boost/math/distributions/binomial.hpp>
#include <boost/math/distributions/normal.hpp>
#include <boost/math/tools/toms748_solve.hpp>
#include <cmath>

#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::planning {

namespace {

// Steps of a root search before it is called a failure (Err:523).
constexpr std::uintmax_t max_search_steps = 100;

[[noreturn]] void beyond_cap(const char* what) {
    throw unreachable_target(std::string("This needs more than ") + format_number(max_attempts) + " " + what +
                             ", the planning cap: relax the target.");
}

// The smallest whole number at least x. The values come out of logarithms
// and square roots: one within 1e-12 (relative) of a whole number is taken as
// that number, so 2.0000000000000004 gives 2, not 3.
std::int64_t whole_at_least(double x) {
    const double n = std::ceil(x - 1e-12 * std::abs(x));
    if (!(n <= max_attempts)) beyond_cap("attempts");
    return std::max<std::int64_t>(1, static_cast<std::int64_t>(n));
}

// The smallest n in [low, high] with meets(n), for a test that holds from
// some n on; meets(high) must hold.
template <class F>
std::int64_t first_meeting(std::int64_t low, std::int64_t high, F meets) {
    while (low < high) {
        const std::int64_t mid = low + (high - low) / 2;
        if (meets(mid))
            high = mid;
        else
            low = mid + 1;
    }
    return low;
}

// The smallest n >= low with meets(n), for a test that holds from some n on:
// doubling until it holds (past the cap: unreachable_target), then bisection.
template <class F>
std::int64_t first_meeting_from(std::int64_t low, F meets, const char* what) {
    const auto cap = static_cast<std::int64_t>(max_attempts);
    std::int64_t high = low;
    while (!meets(high)) {
        if (high >= cap) beyond_cap(what);
        low = high + 1;
        high = std::min(cap, 2 * high);
    }
    return first_meeting(low, high, meets);
}

}  // namespace

// ---- demonstration ----

namespace {

// The target of a demonstration: a rate in (0, 1) and a confidence level.
void check_target(double rate, double confidence) {
    if (!(rate > 0 && rate <= 1))
        arguments::out_of_range("rate", rate, "lie above 0 and at most 1, for example 0.99 for 99 %");
    arguments::level(confidence, "confidence");
    if (rate == 1)
        throw unreachable_target(
            "No number of attempts demonstrates a rate of 100 %: every finite test leaves some doubt. Use a "
            "rate below 1, such as 0.999.");
}

// n units with at most f failures show the rate at the confidence:
// P(at most f failures in n | rate) <= 1 - confidence.
bool demonstrates(double rate, double confidence, std::int64_t n, std::int64_t failures) {
    if (n <= failures) return false;
    return boost::math::cdf(boost::math::binomial_distribution<double>(static_cast<double>(n), 1 - rate),
                            static_cast<double>(failures)) <= 1 - confidence;
}

}  // namespace

std::int64_t demonstration(double rate, double confidence, std::int64_t failures) {
    check_target(rate, confidence);
    // Success-run: n ln(R) <= ln(1 - C). Both logarithms by log1p: R - 1 is exact for R in [0.5, 1].
    const std::int64_t zero_failures = whole_at_least(std::log1p(-confidence) / std::log1p(rate - 1));
    if (failures == 0) return zero_failures;
    // With f failures allowed: the binomial tail P(at most f failures in n) falls as n grows and is at
    // most R^n, so the answer is above both f and the zero-failure size.
    const auto meets = [&](std::int64_t n) { return demonstrates(rate, confidence, n, failures); };
    return first_meeting_from(std::max<std::int64_t>(zero_failures, failures + 1), meets, "attempts");
}

std::int64_t more_units(double rate, double confidence, std::int64_t run, std::int64_t failed) {
    if (run < 0) arguments::out_of_range("run", static_cast<double>(run), "be a whole number of units, 0 or more");
    if (failed < 0 || failed > run)
        arguments::out_of_range("failed", static_cast<double>(failed),
                                "be a whole number from 0 to run (" + std::to_string(run) + "): failures among the units run");
    check_target(rate, confidence);
    // A record that already shows the rate needs nothing more, however long
    // it is (a run beyond the planning cap included).
    if (failed == 0 ? static_cast<double>(run) * std::log1p(rate - 1) <= std::log1p(-confidence)
                    : demonstrates(rate, confidence, run, failed))
        return 0;
    // (The success-run size takes a ratio within 1e-12 of a whole number as
    // that number, so it can equal a run the test above just missed.)
    return std::max<std::int64_t>(0, demonstration(rate, confidence, failed) - run);
}

// ---- interval width ----

double half_width(double rate, std::int64_t n, double level, one_rate::method how) {
    const double nd = static_cast<double>(n);
    const interval b = one_rate::bounds_at(std::floor(rate * nd + 0.5), nd, level, how);
    return (b.high - b.low) / 2;
}

namespace {

// The first n at which an interval at a real count within 1/2 of rate n
// can be as narrow as `half`: TOMS 748 on the lower envelope, smooth in n
// (real n is fine for every method), the narrower interval at the real
// counts rate n -+ 1/2.
std::int64_t first_possible(double rate, double half, double level, one_rate::method how) {
    const auto envelope = [&](double n) {
        const auto at = [&](double x) {
            const interval b = one_rate::bounds_at(std::clamp(x, 0.0, n), n, level, how);
            return (b.high - b.low) / 2;
        };
        return std::min(at(rate * n - 0.5), at(rate * n + 0.5));
    };
    const auto meets = [&](double n) { return envelope(n) <= half; };
    // A bracket around the normal-approximation size z^2 p (1 - p) / E^2,
    // widened by factors of 4, then the root down to a bracket narrower than
    // one attempt: about 10 evaluations where a bisection over [1, 10^9] took 30.
    // Every step below stays within [1, max_attempts]: a target beyond the
    // cap (a half-width of 1e-9 needs about 10^18 attempts) is refused when
    // the cap itself does not meet it, before any search. Past the cap a
    // double no longer counts single attempts (10^18 + 1 == 10^18), which is
    // how a search without that check ran for ever.
    if (!meets(max_attempts)) beyond_cap("attempts");
    const double z = one_rate::two_sided_z(level);
    double lo = std::clamp(std::floor(z * z * rate * (1 - rate) / (half * half)), 1.0, max_attempts), hi = lo;
    while (lo > 1 && meets(lo)) lo = std::max(1.0, std::floor(lo / 4));
    while (!meets(hi)) hi = std::min(max_attempts, 4 * hi);  // ends: the cap meets the target
    if (meets(lo)) return static_cast<std::int64_t>(lo);
    std::uintmax_t iterations = max_search_steps;
    const auto root = boost::math::tools::toms748_solve([&](double n) { return envelope(n) - half; }, lo, hi,
                                                        [](double a, double b) { return b - a < 0.5; }, iterations);
    if (iterations >= max_search_steps)
        throw no_convergence("The search for the number of attempts did not settle in " +
                             std::to_string(max_search_steps) + " steps; try another interval method.");
    lo = std::ceil(root.first);
    // At most a step or two: the bracket is narrower than one attempt.
    for (int step = 0; !meets(lo); ++step) {
        if (step >= 64 || lo >= max_attempts) beyond_cap("attempts");
        ++lo;
    }
    return static_cast<std::int64_t>(lo);
}

}  // namespace

std::int64_t width(double rate, double half, double level, one_rate::method how) {
    arguments::rate(rate, "rate");
    arguments::level(level, "level");
    if (half == 0)
        throw unreachable_target("No number of attempts gives an interval of width 0: choose a half-width above 0.");
    if (!(half > 0 && half < 1))
        arguments::out_of_range("half_width", half,
                                "lie above 0 and below 1: 0.02 asks for plus or minus 2 percentage points");
    auto n = first_possible(rate, half, level, how);
    const auto cap = static_cast<std::int64_t>(max_attempts);
    // Whole counts: step up until the interval itself is narrow enough. The
    // whole count x stays the same for about 1 / rate attempts; while x is at
    // most half of n, more attempts with the same x give a narrower interval,
    // so such a run is judged by its last n and, if that meets the target,
    // searched by bisection. The bound keeps a pathological case from running on.
    const auto narrow_enough = [&](std::int64_t m) { return half_width(rate, m, level, how) <= half; };
    const auto count_at = [&](std::int64_t m) { return std::floor(rate * static_cast<double>(m) + 0.5); };
    // The smaller of the two counts (successes or failures): every interval
    // method here is symmetric in them, and while it stays the same more
    // attempts only narrow the interval. For a rate of 0 or 1 it stays the
    // same for ever (one run to the cap: stepping one attempt at a time took
    // 3 s for Jeffreys at a rate of 0).
    const auto smaller_at = [&](std::int64_t m) {
        const double x = count_at(m);
        return std::min(x, static_cast<double>(m) - x);
    };
    for (int steps = 0; steps < 1000000 && n <= cap; ++steps) {
        const double x = count_at(n), k = smaller_at(n);
        const double side = x <= static_cast<double>(n) / 2 ? rate : 1 - rate;  // the rate of the smaller count
        // Where the smaller count next changes; past the cap (a rate of 1e-300
        // reaches it at 1e300 attempts) the cap itself, compared in double
        // before converting, since such a value has no int64_t.
        const double next_change = side > 0 ? std::ceil((k + 0.5) / side) : max_attempts;
        auto end = next_change < max_attempts ? static_cast<std::int64_t>(next_change) : cap;
        for (int back = 0; back < 64 && end > n && smaller_at(end) != k; ++back) --end;
        if (end > n && smaller_at(end) == k) {
            if (narrow_enough(end)) return first_meeting(n, end, narrow_enough);
            n = end + 1;
            continue;
        }
        if (narrow_enough(n)) return n;
        ++n;
    }
    throw no_convergence("The search for the number of attempts did not settle; try another interval method.");
}

// ---- power ----

correction correction_from_number(double value) {
    if (value == 1) return correction::continuity;
    if (value == 0) return correction::none;
    arguments::out_of_range("correction", value, "be TRUE or FALSE (1 or 0), or the word \"none\" or \"continuity\"");
}

namespace {

struct power_terms {
    double difference;  // |p1 - p2|
    double null_sd;     // sqrt((r + 1) pbar qbar)
    double sd;          // sqrt(r p1 q1 + p2 q2)
    double z_alpha;     // two-sided
    double ratio;       // r = n2 / n1
};

power_terms terms_of(double p1, double p2, double alpha, double r) {
    arguments::rate(p1, "rate_1");
    arguments::rate(p2, "rate_2");
    arguments::level(alpha, "alpha");
    if (!(r >= min_ratio && r <= max_ratio))
        arguments::out_of_range("ratio", r,
                                "lie from " + format_number(min_ratio) + " to " + format_number(max_ratio) +
                                    ": the attempts of group 2 for each attempt of group 1");
    if (p1 == p2)
        throw unreachable_target("The two rates are equal: there is no difference to detect. Enter the rate you "
                                 "expect and the rate you want to be able to tell apart from it.");
    // Written so that r = 1 repeats the equal-groups arithmetic bit for bit.
    const double pbar = (p1 + r * p2) / (r + 1);
    const boost::math::normal normal;
    return {std::abs(p1 - p2), std::sqrt((r + 1) * pbar * (1 - pbar)),
            std::sqrt(r * p1 * (1 - p1) + p2 * (1 - p2)),
            boost::math::quantile(boost::math::complement(normal, alpha / 2)), r};
}

}  // namespace

double power_at(double rate_1, double rate_2, double n, double alpha, correction how, double ratio) {
    const power_terms t = terms_of(rate_1, rate_2, alpha, ratio);
    // sqrt(r n) (|d| - c) with the continuity correction c = (1/n + 1/(r n)) / 2.
    const double root = std::sqrt(t.ratio * n);
    const double corrected =
        how == correction::continuity ? (t.ratio + 1) / (2 * std::sqrt(t.ratio) * std::sqrt(n)) : 0;
    const double margin = root * t.difference - corrected - t.z_alpha * t.null_sd;
    if (t.sd == 0) return margin > 0 ? 1.0 : 0.0;
    return boost::math::cdf(boost::math::normal(), margin / t.sd);
}

std::int64_t power(double rate_1, double rate_2, double power, double alpha, correction how, double ratio) {
    if (power == 1)
        throw unreachable_target("No number of attempts gives a power of 1 (certainty): use 0.8, 0.9 or 0.95.");
    arguments::level(power, "power");
    const power_terms t = terms_of(rate_1, rate_2, alpha, ratio);
    const double z_power = boost::math::quantile(boost::math::normal(), power);
    const double k = t.z_alpha * t.null_sd + z_power * t.sd;
    const double r = t.ratio;
    if (how == correction::none) return k <= 0 ? 1 : whole_at_least(k * k / (r * (t.difference * t.difference)));
    // Fleiss, Tytun & Ury (1980): the root u = sqrt(n) of
    // sqrt(r) |d| u^2 - k u - (r + 1) / (2 sqrt(r)) = 0.
    const double s = std::sqrt(r);
    const double u = (k + std::sqrt(k * k + 2 * (r + 1) * t.difference)) / (2 * s * t.difference);
    return whole_at_least(u * u);
}

// ---- how long a pilot must keep succeeding ----

std::int64_t ahead(const bayes::beta_law& pilot_law, const bayes::beta_law& other_law, double confidence, goal g) {
    const auto pilot = g == goal::high ? pilot_law : bayes::mirrored(pilot_law);
    const auto other = g == goal::high ? other_law : bayes::mirrored(other_law);
    if (confidence == 1)
        throw unreachable_target("No run of successes makes the pilot ahead with certainty: use a confidence "
                                 "below 1, such as 0.95.");
    arguments::level(confidence, "confidence");
    const auto meets = [&](std::int64_t m) {
        return bayes::ahead_absolute({pilot.a + static_cast<double>(m), pilot.b}, other) >= confidence;
    };
    return meets(0) ? 0 : first_meeting_from(1, meets, "further successes");
}

}  // namespace tallyrates::planning
