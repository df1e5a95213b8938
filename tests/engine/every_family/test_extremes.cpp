// Every planning and Bayesian function driven with extreme targets:
// half-widths of 1e-12, rates 1e-12 from 0 or 1, confidence 1 - 1e-12,
// priors of 1e-300 and 1e300, m = 10^12, groups of 10^12 attempts. Each call
// must end with an answer inside its range or one of the engine's errors
// (Err:502 / Err:523 in a cell), never run on: every search and series in
// the engine has an iteration or work cap. The slowest call is printed (a
// figure for the README, not a pass/fail timing).
#include <gtest/gtest.h>

#include <chrono>
#include <iostream>
#include <cmath>
#include <functional>
#include <string>

#include "tallyrates/bayes/across.hpp"
#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/apart/limits.hpp"
#include "tallyrates/apart/prior_fit.hpp"
#include "tallyrates/pairs/margin.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "tallyrates/planning/planning.hpp"
#include "cells.hpp"

using namespace tallyrates;
namespace cell = tallyrates::testing::cell;

namespace {

struct slowest {
    double ms = 0;
    std::string what;
};
slowest worst;
int calls = 0, answered = 0;

// Runs f; an answer must lie in [low, high]; an error must be one of ours.
void answer_or_error(const std::string& what, const std::function<double()>& f, double low, double high) {
    const auto start = std::chrono::steady_clock::now();
    try {
        const double v = f();
        EXPECT_TRUE(std::isfinite(v) && v >= low && v <= high) << what << " gave " << v;
        ++answered;
    } catch (const invalid_input&) {
    } catch (const budget_exceeded&) {
    } catch (const unreachable_target&) {
    } catch (const no_convergence&) {
    } catch (const std::exception& e) {
        ADD_FAILURE() << what << " threw an exception that is none of the engine's: " << e.what();
    }
    const double ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count();
    ++calls;
    if (ms > worst.ms) worst = {ms, what};
    if (ms > 250) std::cout << "slow: " << what << " " << ms << " ms\n";
}

const double tiny = 1e-12;
const double rates[] = {tiny, 1 - tiny, 0.5, 0.0, 1.0};
const double levels[] = {0.5, 0.95, 1 - tiny, tiny};
const double priors[] = {1e-300, 0.01, 0.5, 1e6, 1e300};

}  // namespace

TEST(Extremes, PlanningAnswersOrRefuses) {
    const double big = 1e9;
    for (double r : rates)
        for (double c : levels) {
            for (std::int64_t f : {0, 1, 1000000})
                answer_or_error("demonstration(" + std::to_string(r) + ", " + std::to_string(c) + ", " + std::to_string(f) + ")",
                                [&] { return static_cast<double>(planning::demonstration(r, c, f)); }, 1, big);
            for (std::int64_t run : {std::int64_t{0}, std::int64_t{1000}, std::int64_t{1000000000000000}})
                for (std::int64_t failed : {std::int64_t{0}, std::int64_t{1}, std::int64_t{1000}})
                    answer_or_error("more_units(" + std::to_string(r) + ", " + std::to_string(c) + ", " +
                                        std::to_string(run) + ", " + std::to_string(failed) + ")",
                                    [&] { return static_cast<double>(planning::more_units(r, c, run, failed)); }, 0,
                                    big);
            for (double half : {tiny, 1e-9, 1e-4, 0.49})
                for (auto m : {one_rate::method::wilson, one_rate::method::clopper_pearson, one_rate::method::jeffreys,
                               one_rate::method::agresti_coull})
                    answer_or_error("width(" + std::to_string(r) + ", " + std::to_string(half) + ", " + std::to_string(c) + ", method " + std::to_string(static_cast<int>(m)) + ")",
                                    [&] { return static_cast<double>(planning::width(r, half, c, m)); }, 1, big);
            for (double r2 : rates)
                answer_or_error("power(" + std::to_string(r) + ", " + std::to_string(r2) + ")",
                                [&] {
                                    return static_cast<double>(
                                        planning::power(r, r2, c, 0.05, planning::correction::continuity));
                                },
                                1, big);
        }
    for (double p : priors)
        for (double c : levels)
            for (double n : {0.0, 14.0, 1e6, 1e12})
                answer_or_error("ahead(prior " + std::to_string(p) + ", n " + std::to_string(n) + ")",
                                [&] {
                                    return static_cast<double>(planning::ahead(
                                        bayes::beta_law{bayes::checked({p, p}).a + 13, p + 1},
                                        bayes::beta_law{p + n, p + 1}, c));
                                },
                                0, big);
    std::cout << "planning extremes: " << calls << " calls, " << answered << " answered, slowest " << worst.ms
              << " ms (" << worst.what << ")\n";
}

TEST(Extremes, BayesianAnswersOrRefuses) {
    for (double p : priors)
        for (double n : {0.0, 1.0, 1e6, 1e12, 1e15})
            for (double x : {0.0, n / 2, n}) {
                const std::string at = "prior " + std::to_string(p) + ", " + std::to_string(x) + " of " + std::to_string(n);
                auto law = [&] {
                    const auto q = bayes::checked({p, p});
                    return bayes::beta_law{q.a + std::floor(x), q.b + (n - std::floor(x))};
                };
                for (double c : levels)
                    for (auto k : {bayes::kind::central, bayes::kind::hpd}) {
                        answer_or_error("credible low " + at, [&] { return bayes::credible(law(), c, k).low; }, 0, 1);
                        answer_or_error("credible high " + at, [&] { return bayes::credible(law(), c, k).high; }, 0, 1);
                    }
                for (double r : rates)
                    answer_or_error("above " + at, [&] { return bayes::above(law(), r, bayes::goal::high); }, 0, 1);
                for (std::int64_t m : {std::int64_t{1}, std::int64_t{1000000000000}})
                    for (std::int64_t k : {std::int64_t{1}, m / 2, m})
                        answer_or_error("next " + at, [&] { return bayes::next_at_least(law(), m, k); }, 0, 1);
                const bayes::beta_law other{1e6 + 0.5, 0.5}, pilot{5, 2};
                answer_or_error("ahead " + at, [&] { return bayes::ahead(law(), other); }, 0, 1);
                answer_or_error("ahead absolute " + at, [&] { return bayes::ahead_absolute(law(), pilot); }, 0, 1);
                answer_or_error("difference " + at, [&] { return bayes::difference(law(), pilot, 0.95).low; }, -1, 1);
                for (auto g : {bayes::goal::high, bayes::goal::low}) {
                    answer_or_error("best " + at,
                                    [&] {
                                        const std::vector<bayes::beta_law> laws{law(), other, pilot};
                                        return bayes::best(laws, 0, g);
                                    },
                                    0, 1);
                    answer_or_error("loss " + at,
                                    [&] {
                                        const std::vector<bayes::beta_law> laws{law(), other, pilot};
                                        return bayes::loss(laws, 0, g);
                                    },
                                    0, 1);
                }
            }
    std::cout << "bayesian extremes: " << calls << " calls in all, " << answered << " answered, slowest " << worst.ms
              << " ms (" << worst.what << ")\n";
}

TEST(Extremes, ClaimsAnswerOrRefuse) {
    // Margins, one-sided bounds and the pairs table's verdict at the ends of
    // what a sheet can hold: counts of 0, 1 and 10^15, 0 % and 100 %, margins
    // from 0 to just below 1, levels at both ends. An answer in [0, 1] or an
    // engine error, never a hang.
    const std::int64_t sizes[] = {1, 14, 1000000, 1000000000000000};
    const double margins[] = {0.0, tiny, 0.01, 0.5, 1 - tiny};
    std::vector<std::pair<std::int64_t, std::int64_t>> shapes;
    for (std::int64_t n : sizes)
        for (std::int64_t x : {std::int64_t{0}, n / 2, n - 1, n})
            if (x >= 0) shapes.emplace_back(x, n);
    for (const auto& [x1, n1] : shapes)
        for (const auto& [x2, n2] : shapes) {
            const group a{1, x1, n1}, b{2, x2, n2};
            for (double m : margins)
                for (auto claim : {pairwise::claim::not_worse, pairwise::claim::better, pairwise::claim::equivalent})
                    for (auto g : {goal::high, goal::low})
                        answer_or_error("margin_p(" + std::to_string(x1) + "/" + std::to_string(n1) + ", " +
                                            std::to_string(x2) + "/" + std::to_string(n2) + ", " + std::to_string(m) +
                                            ")",
                                        [&] { return pairwise::margin_p(a, b, m, claim, g); }, 0, 1);
            for (double c : levels) {
                pairwise::interval_options o;
                o.level = c;
                o.side = sides::one;
                answer_or_error("one-sided difference at " + std::to_string(c), [&] {
                    const auto tally = counts::from_values(std::vector{x1, x2}, std::vector{n1, n2});
                    return cell::difference_interval(tally, 1, 2, o).low;
                }, -1, 1);
                answer_or_error("one-sided bound at " + std::to_string(c),
                                [&] { return one_rate::bounds(a, c, one_rate::method::clopper_pearson, sides::one).low; },
                                0, 1);
            }
        }
    std::cout << "claims extremes: " << calls << " calls, " << answered << " answered, slowest " << worst.ms << " ms ("
              << worst.what << ")\n";
}

TEST(Extremes, ApartAnswersOrRefuses) {
    // Decision limits, the funnel and the fitted prior at the ends of what a
    // sheet holds: groups of 1 to 10^15 units, 0 % and 100 %, targets at the
    // ends, levels at both ends; an answer in [0, 1] (the prior within its
    // range) or an engine error, never a hang.
    const std::vector<std::pair<std::vector<std::int64_t>, std::vector<std::int64_t>>> tallies{
        {{0, 1}, {1, 1}},
        {{14, 286}, {14, 300}},
        {{0, 0, 5}, {10, 1000, 1000000}},
        {{999999999, 1000000000000}, {1000000000, 1000000000000}},
        {{1, 1000000000000000 - 1}, {1000000000000000, 1000000000000000}},
        {{3, 7, 2, 9, 4, 6, 8, 1, 5, 10, 0, 2}, {10, 10, 10, 10, 10, 10, 10, 10, 10, 10, 10, 10}}};
    const std::optional<double> targets[] = {std::nullopt, 0.0, tiny, 0.5, 1 - tiny, 1.0};
    for (const auto& [x, n] : tallies) {
        for (double c : levels)
            for (const auto& t : targets)
                for (auto how : {apart::method::exact, apart::method::normal})
                    for (auto fam : {apart::family::all, apart::family::each}) {
                        apart::options o;
                        o.level = c;
                        o.target = t;
                        o.how = how;
                        o.together = fam;
                        answer_or_error("apart limits, level " + std::to_string(c), [&] {
                            const auto res = apart::limits(counts::from_values(x, n), o);
                            double low = 1;
                            for (const auto& row : res.rows) {
                                EXPECT_LE(row.limits.low, row.limits.high);
                                low = std::min(low, row.limits.low);
                            }
                            return low;
                        }, 0, 1);
                        if (how == apart::method::exact && fam == apart::family::each)
                            answer_or_error("funnel, level " + std::to_string(c), [&] {
                                return apart::funnel(counts::from_values(x, n), c, t, 20).front()[1];
                            }, 0, 1);
                    }
        answer_or_error("prior fit", [&] {
            const auto fit = apart::fit_prior(counts::from_values(x, n));
            return (fit.prior.a + fit.prior.b) / apart::max_total;
        }, 0, 1 + 1e-12);
    }
    std::cout << "apart extremes: " << calls << " calls, " << answered << " answered, slowest " << worst.ms << " ms ("
              << worst.what << ")\n";
}
