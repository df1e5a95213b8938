// omnibus.cpp - routes for "all groups share one rate".
//
// "auto" (functions.md): the chi-square approximation when every expected
// count is at least 5 (the usual rule, Cochran 1954, Biometrics 10:417);
// otherwise the exact conditional test when it completes within a work cap
// sized to about 100 ms; otherwise Monte Carlo with as many draws (up to the
// default) as fit a second such cap. Work is counted in deterministic units,
// so the route taken depends on the counts alone, never on machine speed.
#include <boost/math/distributions/chi_squared.hpp>
#include <algorithm>
#include <cmath>
#include <thread>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/omnibus/tarone.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::omnibus {

namespace {

double chi_square_upper(double x, int df) {
    if (x <= 0) return 1.0;
    return boost::math::cdf(boost::math::complement(boost::math::chi_squared(df), x));
}

ordering ordering_of(method m) {
    switch (m) {
        case method::lr:
        case method::exact_lr: return ordering::lr;
        case method::exact_prob: return ordering::probability;
        default: return ordering::pearson;
    }
}

// "3 of 8 expected counts are below 5".
std::string below_phrase(const expected_summary& e) {
    return std::to_string(e.below_five) + " of " + std::to_string(e.cells) + " expected counts " +
           (e.below_five == 1 ? "is" : "are") + " below " + format_number(min_expected_count);
}

std::string expected_phrase(const expected_summary& e) {
    return below_phrase(e) + ", the smallest " + format_short(e.smallest);
}

void check_draws(std::int64_t draws, const limits& caps) {
    arguments::whole(static_cast<double>(draws), 1, static_cast<double>(caps.max_draws), "draws");
}

// What every route shares: the statistic, its degrees of freedom, the
// expected counts.
result start(const table& t, const options& opt) {
    check_draws(opt.draws, opt.caps);
    result r;
    r.requested = opt.how;
    r.order = ordering_of(opt.how);
    r.df = static_cast<int>(t.groups()) - 1;
    r.expected = expected_counts(t);
    r.statistic = statistic(t, r.order);
    return r;
}

// The exact route shares its work among two threads where the machine has
// them; its outcome does not depend on the number (exact/).
unsigned exact_threads() { return std::max(1u, std::min(2u, std::thread::hardware_concurrency())); }

result chi_square(result& r, route used, std::string why) {
    r.used = used;
    r.p = chi_square_upper(r.statistic, r.df);
    r.why = std::move(why);
    return r;
}

// "exact", "exact-lr", "exact-prob" asked by name: the answer, or a refusal
// with certified bounds from a coarse pass where one fits. The coarse pass
// merges partial values within 1 % of the observed statistic and gets a
// quarter of the cap, so a refusal costs at most 1.25 caps. On the unequal
// 2 x 12 table of N = 500 (bench_exact) a 1 % grid needs 9-25 times less
// work than the exact one, on tables a tenth as costly 1-2.7 times; a 0.1 %
// grid needs at most 1.4 times less.
result exact_as_asked(result r, const table& t, const options& opt) {
    r.used = route::exact;
    r.has_exact = true;
    r.exact = exact_p(t, r.order, opt.caps.exact_work, opt.caps.max_buckets, exact_merge_width, exact_threads());
    if (!r.exact.complete) {
        exact_outcome coarse;  // pointless when the table is too large to start at all
        if (!r.exact.too_large)
            coarse = exact_p(t, r.order, opt.caps.exact_work / coarse_work_share, opt.caps.max_buckets,
                             coarse_merge_width, exact_threads());
        std::string bounds;
        if (coarse.complete)
            bounds = "; the exact p-value lies between " + format_short(coarse.p_low) + " and " +
                     format_short(coarse.p_high);
        throw exact_refused("Exact route refused: " + r.exact.stopped + bounds +
                                ". Use method \"montecarlo\" or \"auto\".",
                            coarse.complete, coarse.p_low, coarse.p_high);
    }
    r.p = r.exact.p;
    r.why = "Exact conditional test, as asked.";
    return r;
}

result monte_carlo_as_asked(result r, const table& t, const options& opt) {
    r.used = route::monte_carlo;
    r.has_monte_carlo = true;
    r.mc = monte_carlo_p(t, r.order, opt.draws, opt.seed, opt.threads, opt.caps.monte_carlo_work);
    r.p = r.mc.p;
    r.why = "Monte Carlo with " + format_number(static_cast<double>(opt.draws)) + " random tables and seed " +
            format_number(static_cast<double>(opt.seed)) + ", as asked.";
    return r;
}

// "auto": chi-square when every expected count is at least min_expected_count; else exact
// within its work cap; else Monte Carlo with the draws that fit its cap;
// else (counts too large for both) chi-square with a caution.
result automatic(result r, const table& t, const options& opt) {
    if (r.expected.smallest >= min_expected_count)
        return chi_square(r, route::pearson,
                          "Every expected count is at least " + format_number(min_expected_count) + ", the smallest " +
                              format_short(r.expected.smallest) + ", so the chi-square approximation is used.");
    r.has_exact = true;
    r.exact = exact_p(t, ordering::pearson, opt.caps.auto_exact_work, opt.caps.auto_max_buckets, exact_merge_width,
                      exact_threads());
    if (r.exact.complete) {
        r.used = route::exact;
        r.p = r.exact.p;
        r.why = expected_phrase(r.expected) + ", so the exact conditional test is used.";
        return r;
    }
    r.has_exact = false;
    try {
        // At most the draws asked for; fewer when the work cap is reached first.
        r.mc = monte_carlo_p(t, ordering::pearson, opt.draws, opt.seed, 1, opt.caps.auto_monte_carlo_work, true);
    } catch (const budget_exceeded&) {
        return chi_square(r, route::pearson,
                          expected_phrase(r.expected) +
                              ", but neither the exact test nor Monte Carlo fits the time budget for counts this "
                              "large, so the chi-square approximation is used: treat it with caution.");
    }
    r.used = route::monte_carlo;
    r.has_monte_carlo = true;
    r.p = r.mc.p;
    r.why = expected_phrase(r.expected) + ", and the exact test does not fit the time budget: " + r.exact.stopped +
            ". Monte Carlo with " + format_number(static_cast<double>(r.mc.draws)) + " random tables is used.";
    return r;
}

// Every route, without the memo.
result same_rates_uncached(const table& t, const options& opt) {
    result r = start(t, opt);
    if (opt.how == method::tarone) {  // a different question: refused, not p = 1, where it is not defined
        const auto v = tarone(t.x, t.n);
        r.used = route::tarone;
        r.statistic = v.z;
        r.p = v.p;
        r.why = "Tarone's test, as asked: do the groups vary more than counting alone explains? One-sided; a small p "
                "says they do, so intervals and limits that assume independent units are too narrow.";
        return r;
    }
    if (t.all_alike()) {
        r.used = route::all_alike;
        r.p = 1.0;
        r.why = t.successes == 0 ? "No attempt succeeded, so every group shows the same rate, 0; p = 1 by every route."
                                 : "Every attempt succeeded, so every group shows the same rate, 1; p = 1 by every route.";
        return r;
    }
    switch (opt.how) {
        case method::pearson:
        case method::lr:
            return chi_square(r, opt.how == method::pearson ? route::pearson : route::lr,
                              "Chi-square approximation with " + std::to_string(r.df) + " degrees of freedom, as "
                              "asked; " + expected_phrase(r.expected) + ".");
        case method::exact:
        case method::exact_lr:
        case method::exact_prob: return exact_as_asked(std::move(r), t, opt);
        case method::monte_carlo: return monte_carlo_as_asked(std::move(r), t, opt);
        case method::tarone:
        case method::automatic: break;
    }
    return automatic(std::move(r), t, opt);
}

}  // namespace

result same_rates(const counts& c, const options& opt, result_cache* cache) {
    const table t = table_of(c);
    // The chi-square routes cost less than a cache lookup: never memoised.
    if (!cache || opt.how == method::pearson || opt.how == method::lr) return same_rates_uncached(t, opt);
    const analysis_key key{t.x, t.n, opt.how, opt.draws, opt.seed, opt.caps};
    if (auto hit = cache->results.find(key)) return *hit;
    if (auto no = cache->refusals.find(key)) throw exact_refused(no->message, no->has_bounds, no->p_low, no->p_high);
    try {
        result r = same_rates_uncached(t, opt);
        cache->results.put(key, r);
        return r;
    } catch (const exact_refused& e) {
        cache->refusals.put(key, {e.what(), e.has_bounds, e.p_low, e.p_high});
        throw;
    }
}

std::string auto_route_advice(const counts& c, result_cache* cache) {
    // Runs the automatic route itself, so the advice can never disagree with it.
    const result r = same_rates(c, options{}, cache);
    if (r.used == route::all_alike) return "every group shows the same rate, so p = 1";
    if (r.expected.smallest >= min_expected_count)
        return "every expected count is at least " + format_number(min_expected_count) +
               ", so method \"auto\" uses the chi-square approximation";
    const char* taken = r.used == route::exact ? "the exact conditional test"
                        : r.used == route::monte_carlo
                            ? "Monte Carlo, since the exact test does not fit the time budget"
                            : "the chi-square approximation, since nothing else fits the time budget: treat it with "
                              "caution";
    return "caution: " + below_phrase(r.expected) + ", so the chi-square p-value is doubtful; method \"auto\" uses " +
           taken;
}

}  // namespace tallyrates::omnibus
