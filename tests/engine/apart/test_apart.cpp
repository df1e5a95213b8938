// Tests of the apart family: decision limits for every group around the
// whole (analysis of means, funnel and p-chart limits, exact for small
// counts).
//
// Outside values: rows of tests/reference/apart.csv written by apart.py
// (scipy norm, binom and hypergeom; Laney's sigma_z in numpy; for the exact
// limits of every group at once, every table with the tally's margins
// enumerated), each naming its source.
#include <gtest/gtest.h>

#include <cmath>
#include <map>

#include "reference.hpp"
#include "support.hpp"
#include "tallyrates/apart/limits.hpp"
#include "tallyrates/apart/prior_fit.hpp"
#include "tallyrates/core/errors.hpp"

using namespace tallyrates;
using tallyrates::testing::fields;
using tallyrates::testing::reference_rows;
using tallyrates::testing::tally;

TEST(Apart, ReferenceRows) {
    // apart|method|family|target|spread|level|i|end
    std::map<std::string, int> checked;
    for (const auto& r : reference_rows("apart.csv", "apart|")) {
        const auto f = fields(r.quantity);
        ASSERT_EQ(f.size(), 8u) << r.quantity;
        apart::options o;
        o.how = f[1] == "normal" ? apart::method::normal : apart::method::exact;
        o.together = f[2] == "each" ? apart::family::each : apart::family::all;
        if (f[3] != "none") o.target = std::stod(f[3]);
        o.variation = f[4] == "time" ? apart::spread::time : apart::spread::none;
        o.level = std::stod(f[5]);
        const auto res = apart::limits(counts::from_values(r.successes, r.attempts), o);
        const auto& lim = res.rows.at(std::stoul(f[6]) - 1).limits;
        const double got = f[7] == "low" ? lim.low : lim.high;
        // Exact limits are whole counts over n: equal to the last bit; normal
        // ones are formulas of scipy's quantile.
        const double tol = o.how == apart::method::exact ? 0.0 : 1e-12;
        EXPECT_NEAR(got, r.value, tol) << r.name << " " << r.quantity << " " << r.source;
        ++checked[f[1] + f[2] + f[3]];
    }
    EXPECT_EQ(checked.size(), 8u);
    EXPECT_GE(checked["exactallnone"], 2 * 2 * (4 + 4 + 3));
}

TEST(Apart, OvenCStandsBelowTheWhole) {
    // The sample tally: oven C (233 of 260) falls below the exact limits for
    // every oven at once (the enumeration row of apart.csv gives 90.0 %),
    // the others stay within.
    const auto c = tally({286, 271, 233, 14}, {300, 290, 260, 14});
    const auto res = apart::limits(c, {});
    ASSERT_EQ(res.rows.size(), 4u);
    EXPECT_EQ(res.rows[2].verdict, -1);
    EXPECT_EQ(res.rows[0].verdict, 0);
    EXPECT_EQ(res.rows[3].verdict, 0);
    EXPECT_FALSE(res.fell_back);
    // Never wider than the Sidak limits of the same marginals, never
    // narrower than one group's own.
    EXPECT_GE(res.tail, -std::expm1(std::log(0.95) / 4) / 2);
    EXPECT_LE(res.tail, 0.025);
    EXPECT_EQ(apart::verdict_word(res.rows[2].verdict), "below");
}

TEST(Apart, RefusalsSayWhy) {
    const auto c = tally({9, 10}, {10, 10});
    apart::options o;
    o.target = 1.5;
    TALLYRATES_EXPECT_THROW_SAYING(apart::limits(c, o), invalid_input, "target");
    o = {};
    o.variation = apart::spread::time;
    TALLYRATES_EXPECT_THROW_SAYING(apart::limits(c, o), invalid_input, "normal");
    TALLYRATES_EXPECT_THROW_SAYING(apart::limits(tally({10, 10}, {10, 10}), {}), invalid_input, "passed");
    TALLYRATES_EXPECT_THROW_SAYING(apart::limits(tally({4}, {10}), {}), invalid_input, "two groups");
    o = {};
    o.target = 0.9;  // one group against a standard is a funnel point
    EXPECT_NO_THROW(apart::limits(tally({4}, {10}), o));
    o.level = 1;
    EXPECT_THROW(apart::limits(c, o), invalid_input);
}

TEST(Apart, LargeTalliesFallBackOrRefuseAtOnce) {
    // 100 groups of 10^6: the exact recursion for every group at once would
    // pass its cap (judged before it runs); the Sidak limits of the
    // marginals come instead.
    std::vector<std::int64_t> x(100), n(100, 1000000);
    for (std::size_t g = 0; g < x.size(); ++g) x[g] = 900000 + static_cast<std::int64_t>(g * 37 % 500);
    const auto res = apart::limits(counts::from_values(x, n), {});
    EXPECT_TRUE(res.fell_back);
    EXPECT_NEAR(res.tail, -std::expm1(std::log(0.95) / 100) / 2, 1e-15);
    // Counts of 10^13: too many marginal values to store; Err:523 at once.
    EXPECT_THROW(apart::limits(tally({4000000000000, 5000000000000}, {10000000000000, 10000000000000}), {}),
                 budget_exceeded);
}

TEST(PriorFit, ReferenceRows) {
    // prior_fit_a / _b: scipy betabinom.logpmf maximised numerically
    // (apart.py); the optimum is flat, so the parameters agree to 1e-3 and
    // the engine's likelihood is at least scipy's optimum's.
    std::map<std::string, std::map<std::string, double>> want;
    std::map<std::string, counts> tallies;
    for (const auto& r : reference_rows("apart.csv", "prior_fit_")) {
        want[r.name][r.quantity] = r.value;
        tallies.emplace(r.name, counts::from_values(r.successes, r.attempts));
    }
    ASSERT_EQ(want.size(), 4u);
    for (const auto& [name, q] : want) {
        const auto& c = tallies.at(name);
        const auto fit = apart::fit_prior(c);
        if (q.contains("prior_fit_capped")) {
            EXPECT_TRUE(fit.at_cap) << name;
            EXPECT_NEAR(fit.prior.a + fit.prior.b, apart::max_total, 1e-6 * apart::max_total) << name;
            EXPECT_NEAR(fit.prior.a / (fit.prior.a + fit.prior.b), q.at("prior_fit_mean"), 1e-4) << name;
            continue;
        }
        EXPECT_FALSE(fit.at_cap) << name;
        EXPECT_NEAR(fit.prior.a, q.at("prior_fit_a"), 1e-3 * q.at("prior_fit_a")) << name;
        EXPECT_NEAR(fit.prior.b, q.at("prior_fit_b"), 1e-3 * q.at("prior_fit_b")) << name;
        EXPECT_GE(fit.log_likelihood,
                  apart::beta_binomial_log_likelihood(c, q.at("prior_fit_a"), q.at("prior_fit_b")) - 1e-9)
            << name;
    }
}

TEST(PriorFit, EveryValidTallyGetsAPrior) {
    // Never an error for two or more groups with attempts: all passing, all
    // failing, single units, one group huge (common practice, no source).
    for (const auto& c : {tally({10, 12}, {10, 12}), tally({0, 0, 0}, {5, 9, 40}), tally({1, 0}, {1, 1}),
                          tally({999990, 3}, {1000000, 4}), tally({14, 286, 271, 233}, {14, 300, 290, 260})}) {
        const auto fit = apart::fit_prior(c);
        EXPECT_GE(fit.prior.a, bayes::min_prior);
        EXPECT_GE(fit.prior.b, bayes::min_prior);
        EXPECT_LE(fit.prior.a + fit.prior.b, apart::max_total * (1 + 1e-12));
    }
    EXPECT_THROW(apart::fit_prior(tally({3}, {9})), invalid_input);
}

TEST(Funnel, ReferenceRows) {
    // curve|level|target|points|k|end: Spiegelhalter's (2005) interpolated
    // exact limits recomputed with scipy binom (apart.py).
    int checked = 0;
    for (const auto& r : reference_rows("apart.csv", "curve|")) {
        const auto f = fields(r.quantity);
        ASSERT_EQ(f.size(), 6u);
        std::optional<double> target;
        if (f[2] != "none") target = std::stod(f[2]);
        const auto rows = apart::funnel(counts::from_values(r.successes, r.attempts), std::stod(f[1]), target,
                                        std::stoll(f[3]));
        const auto& line = rows.at(std::stoul(f[4]) - 1);
        const double got = f[5] == "n" ? line[0] : (f[5] == "low" ? line[1] : line[2]);
        EXPECT_NEAR(got, r.value, 1e-9) << r.name << " " << r.quantity << " " << r.source;
        ++checked;
    }
    EXPECT_EQ(checked, 2 * 2 * 12 * 3);
}

TEST(Apart, ThirtySuppliersAreExactNotTheFallback) {
    // The README's benchmark tally (bench_apart.cpp): 30 groups of 40 to 620
    // attempts. The recursion runs (no fallback) and its tail lies between
    // the Sidak tail and the one-group tail; a group at 88 % stands below.
    std::vector<std::int64_t> x, n;
    for (std::size_t g = 0; g < 30; ++g) {
        const auto attempts = static_cast<std::int64_t>(40 + (g * 97) % 581);
        const double rate = g == 3 ? 0.88 : 0.93 + 0.04 * static_cast<double>((g * 7) % 5) / 4;
        n.push_back(attempts);
        x.push_back(static_cast<std::int64_t>(rate * static_cast<double>(attempts)));
    }
    const auto res = apart::limits(counts::from_values(x, n), {});
    EXPECT_FALSE(res.fell_back);
    EXPECT_GE(res.tail, -std::expm1(std::log(0.95) / 30) / 2);
    EXPECT_LE(res.tail, 0.025);
    EXPECT_EQ(res.rows[3].verdict, -1);
    std::printf("30 suppliers: tail %.6g (Sidak %.6g)\n", res.tail, -std::expm1(std::log(0.95) / 30) / 2);
}

TEST(Apart, LargeGroupsFarFromHalfStillUseTheMargins) {
    // 30 groups of 10^4 at about 90 % (and the same counted as failures,
    // about 10 %): the recursion's weights once underflowed over regions of
    // several hundred counts and the Sidak limits came back silently. The
    // tail found must lie above the Sidak tail, and the same for the mirrored
    // tally (common practice, no source: swapping successes and failures
    // mirrors every limit).
    std::vector<std::int64_t> x, f, n;
    for (int g = 0; g < 30; ++g) {
        n.push_back(10000);
        x.push_back(9000 + ((g * 37) % 11 - 5) * 10);
        f.push_back(n.back() - x.back());
    }
    const auto high = apart::limits(counts::from_values(x, n), {});
    const auto low = apart::limits(counts::from_values(f, n), {});
    const double sidak = -std::expm1(std::log(0.95) / 30) / 2;
    EXPECT_FALSE(high.fell_back);
    EXPECT_GT(high.tail, 1.01 * sidak);
    EXPECT_NEAR(high.tail, low.tail, 1e-9 * high.tail);  // sums in the other order: the last bits differ
    for (std::size_t g = 0; g < 30; ++g) {
        EXPECT_NEAR(high.rows[g].limits.low, 1 - low.rows[g].limits.high, 1e-12);
        EXPECT_NEAR(high.rows[g].limits.high, 1 - low.rows[g].limits.low, 1e-12);
    }
}

// Found by tests/fuzz/fuzz_apart (corpus/apart/finding-level-2.6e-316): at a
// level of 2.6e-316 the tail rounds to 1/2, the two tail sums of a group's
// law rounded past each other, the region came out empty and the recursion
// read before its array (undefined behaviour caught by UBSan). In exact
// arithmetic a tail of at most 1/2 never flags the median, so every route
// must give limits in order, inside [0, 1], around a count the group can
// have (common practice, no source: the definition of a median).
TEST(Apart, LevelsThatRoundTheTailToOneHalfStillGiveOrderedLimits) {
    const auto c = tally({11, 117, 2}, {58, 199, 3});
    for (double level : {2.6463580382514125e-316, 1e-300, 1e-17})
        for (auto together : {apart::family::all, apart::family::each})
            for (auto how : {apart::method::exact, apart::method::normal})
                for (auto target : {std::optional<double>{}, std::optional<double>{0.4}}) {
                    apart::options o;
                    o.level = level;
                    o.together = together;
                    o.how = how;
                    o.target = target;
                    for (const auto& row : apart::limits(c, o).rows) {
                        EXPECT_LE(0.0, row.limits.low);
                        EXPECT_LE(row.limits.low, row.limits.high) << level << " at position " << row.position;
                        EXPECT_LE(row.limits.high, 1.0);
                    }
                }
}
