// Omnibus tests: X^2 / G^2 against scipy, the exact route against an
// independent rational enumeration and scipy's Fisher test, published
// examples, edges and the automatic route's choices (Monte Carlo in
// test_monte_carlo.cpp, the trend test in test_trend.cpp). Reference values:
// tests/reference/omnibus.csv (omnibus.py).
#include <gtest/gtest.h>

#include <bit>

#include <array>
#include <cmath>

#include "detail/hypergeometric.hpp"
#include "golden_cases.hpp"
#include "reference.hpp"
#include "support.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/omnibus/tarone.hpp"
#include "tallyrates/omnibus/trend.hpp"

using namespace tallyrates;
using namespace tallyrates::omnibus;
using tallyrates::testing::reference_rows;
using tallyrates::testing::tally;

namespace {

using tallyrates::testing::expect_relative;

method method_for(const std::string& q) {
    if (q == "pearson_p" || q == "pearson_stat") return method::pearson;
    if (q == "lr_p" || q == "lr_stat") return method::lr;
    if (q == "exact_p" || q == "fisher_p") return method::exact;
    if (q == "exact_lr_p") return method::exact_lr;
    return method::exact_prob;
}

}  // namespace

TEST(OmnibusReference, ChiSquareStatisticsAndPValuesMatchScipy) {
    // Source: scipy 1.10.1 stats.chi2_contingency(correction=False), with and
    // without lambda_="log-likelihood" (each row of omnibus.csv names it).
    const auto rows = reference_rows("omnibus.csv", "");
    int checked = 0;
    for (const auto& r : rows) {
        if (r.quantity != "pearson_stat" && r.quantity != "pearson_p" && r.quantity != "lr_stat" &&
            r.quantity != "lr_p")
            continue;
        options o;
        o.how = method_for(r.quantity);
        const auto res = same_rates(tally(r.successes, r.attempts), o);
        const bool stat = r.quantity.ends_with("_stat");
        // Statistics to 1e-12; p-values to 1e-12 except deep tails, where two
        // incomplete-gamma implementations agree to about 1e-10.
        expect_relative(stat ? res.statistic : res.p, r.value, (stat || r.value > 1e-30) ? 1e-12 : 1e-9,
                        r.name + " " + r.quantity + " (" + r.source + ")");
        ++checked;
    }
    EXPECT_EQ(checked, 40);
}

TEST(OmnibusReference, ExactMatchesIndependentEnumerationAndFisher) {
    // Sources: brute_force_exact in omnibus.py (exact rational arithmetic,
    // every table listed), vector_exact there (numpy, every table of N = 300
    // to 480) and scipy 1.10.1 stats.fisher_exact two-sided. The near-tie
    // tables pin the tie tolerance (1e-7) and the merge width below it: at
    // 1e-6 their p-values move by 0.2 %.
    int checked = 0;
    for (const auto& r : reference_rows("omnibus.csv", "")) {
        if (!r.quantity.starts_with("exact") && r.quantity != "fisher_p") continue;
        options o;
        o.how = method_for(r.quantity);
        const auto res = same_rates(tally(r.successes, r.attempts), o);
        expect_relative(res.p, r.value, 1e-12, r.name + " " + r.quantity + " (" + r.source + ")");
        // Certain, not estimated: the certified bounds meet at the answer
        // (a merge width of 1e-6 leaves the near-tie table undecided and
        // p_high 0.2 % above it).
        expect_relative(res.exact.p_low, r.value, 1e-12, r.name + " " + r.quantity + " p_low");
        expect_relative(res.exact.p_high, r.value, 1e-12, r.name + " " + r.quantity + " p_high");
        ++checked;
    }
    EXPECT_EQ(checked, 41);  // 26 small tables, 6 near ties, 9 of N = 300 to 480
}

TEST(OmnibusPublished, FisherTeaTasting) {
    // Fisher's tea tasting [[3,1],[1,3]], two-sided exact p = 0.486 [S]
    // (checks.md; Agresti 2002, Categorical Data Analysis, section 3.5).
    options o;
    o.how = method::exact;
    EXPECT_NEAR(same_rates(tally({3, 1}, {4, 4}), o).p, 0.486, 0.0005);
}

TEST(OmnibusPublished, AgrestiPartyIdentificationByGender) {
    // Agresti (2002) 2 x 3 table 762/1246, 327/566, 468/945: X^2 = 30.1 [S],
    // G^2 = 30.0 [M] (checks.md).
    options o;
    o.how = method::pearson;
    EXPECT_NEAR(same_rates(tally({762, 327, 468}, {1246, 566, 945}), o).statistic, 30.1, 0.05);
    o.how = method::lr;
    EXPECT_NEAR(same_rates(tally({762, 327, 468}, {1246, 566, 945}), o).statistic, 30.0, 0.05);
}

TEST(OmnibusPublished, AgrestiAspirinTrial) {
    // 189/11034 against 104/11037: X^2 = 25.01 [S] (checks.md).
    options o;
    o.how = method::pearson;
    EXPECT_NEAR(same_rates(tally({189, 104}, {11034, 11037}), o).statistic, 25.01, 0.005);
}

TEST(OmnibusPublished, ArmitageHomogeneityChiSquare) {
    // Armitage 1955 Table 1: homogeneity X^2 recomputes to 7.8848 [R] (checks.md).
    options o;
    o.how = method::pearson;
    EXPECT_NEAR(same_rates(tally({19, 29, 24}, {516, 589, 293}), o).statistic, 7.8848, 0.00005);
}

TEST(OmnibusEdges, AllSuccessesOrNoneGiveOne) {
    // Every group shows the same rate: no evidence of a difference (common
    // practice, no source: the only table with these margins is the observed one).
    for (auto how : {method::automatic, method::pearson, method::lr, method::exact, method::exact_prob,
                     method::monte_carlo}) {
        options o;
        o.how = how;
        o.draws = 1000;
        EXPECT_EQ(same_rates(tally({5, 7}, {5, 7}), o).p, 1.0);
        EXPECT_EQ(same_rates(tally({0, 0, 0}, {5, 7, 1}), o).p, 1.0);
    }
}

TEST(OmnibusEdges, GroupsWithoutAttemptsAreLeftOut) {
    // functions.md: "the frequentist functions leave such a group out of tests".
    options o;
    o.how = method::pearson;
    const auto with_empty = counts::from_entries(
        std::vector{entry::number(18), entry::number(0), entry::number(27)},
        std::vector{entry::number(40), entry::number(0), entry::number(40)});
    const auto r = same_rates(with_empty, o);
    EXPECT_EQ(r.df, 1);
    // scipy chi2_contingency(correction=False) on [[18,22],[27,13]]: g2_even row.
    EXPECT_NEAR(r.statistic, 4.114285714285715, 1e-12);
    EXPECT_THROW(same_rates(tally({3, 0}, {5, 0}), o), invalid_input);
}

TEST(OmnibusExact, CoarseBoundsBracketTheExactValue) {
    // Certified bounds: the exact value (itself checked above) lies between them.
    const table t = table_of(tally({2, 3, 1, 4, 0, 5, 6, 2}, {5, 5, 4, 6, 3, 6, 9, 7}));
    for (auto o : {ordering::pearson, ordering::lr, ordering::probability}) {
        const auto exact = exact_p(t, o, 1u << 30, 1u << 22);
        const auto coarse = exact_p(t, o, 1u << 30, 1u << 22, 1e-2);
        ASSERT_TRUE(exact.complete && coarse.complete);
        EXPECT_LE(coarse.p_low, exact.p * (1 + 1e-12));
        EXPECT_GE(coarse.p_high, exact.p * (1 - 1e-12));
        EXPECT_LE(exact.p_high - exact.p_low, 1e-12);
        EXPECT_LE(coarse.work, exact.work);
    }
}

TEST(OmnibusExact, SameOutcomeBitForBitOnAnyThreadCount) {
    // Issue 10: levels and the join are cut into chunks by what they read,
    // never by the thread count, so p, its bounds, the work counted and
    // every refusal are the same with 1, 2 or 3 threads. Two 2 x 12 tables
    // (bench_exact's unequal sizes at N = 300, rates 0.35 to 0.65, whose later
    // levels and join are cut in two; equal groups of 20, rates 0.10 to
    // 0.90), both grids, and caps that stop the enumeration part way by work
    // and by memory.
    const auto unequal = tallyrates::testing::unequal_twelve("unequal_300", 300, 0.35, 0.65);
    const std::vector<table> tables = {
        table_of(tally(unequal.x, unequal.n)),
        table_of(tally({2, 3, 4, 6, 7, 9, 10, 12, 13, 15, 16, 18}, std::vector<std::int64_t>(12, 20)))};
    std::size_t stopped = 0, split = 0;
    for (const auto& t : tables)
        for (auto o : {ordering::pearson, ordering::lr, ordering::probability})
            for (double width : {1e-9, 1e-2}) {
                const auto full = exact_p(t, o, 1ull << 40, 1ull << 30, width, 1);
                ASSERT_TRUE(full.complete);
                split += full.work > 1'000'000;
                const std::vector<std::pair<std::uint64_t, std::size_t>> caps = {
                    {1ull << 40, 1ull << 30}, {full.work / 3, 1ull << 30}, {full.work * 9 / 10, 1ull << 30},
                    {1ull << 40, 20'000}, {1ull << 40, 100'000}};
                for (const auto& [work, buckets] : caps) {
                    const auto one = exact_p(t, o, work, buckets, width, 1);
                    stopped += !one.complete;
                    for (unsigned threads : {2u, 3u}) {
                        const auto many = exact_p(t, o, work, buckets, width, threads);
                        EXPECT_EQ(one.complete, many.complete);
                        EXPECT_EQ(one.stopped, many.stopped);
                        EXPECT_EQ(one.work, many.work);
                        EXPECT_EQ(std::bit_cast<std::uint64_t>(one.p), std::bit_cast<std::uint64_t>(many.p));
                        EXPECT_EQ(std::bit_cast<std::uint64_t>(one.p_low), std::bit_cast<std::uint64_t>(many.p_low));
                        EXPECT_EQ(std::bit_cast<std::uint64_t>(one.p_high), std::bit_cast<std::uint64_t>(many.p_high));
                    }
                }
            }
    EXPECT_GE(stopped, 12u);  // the caps did stop runs part way
    EXPECT_GE(split, 6u);
    // A table whose later levels are large enough to be cut in two: X² only,
    // stopped part way by work and by memory (a chunking that followed the
    // thread count fails here).
    const auto large = tallyrates::testing::unequal_twelve("unequal_420", 420, 0.35, 0.65);
    const table t = table_of(tally(large.x, large.n));
    const auto full = exact_p(t, ordering::pearson, 1ull << 40, 1ull << 30, 1e-9, 2);
    for (const auto& [work, buckets] : std::vector<std::pair<std::uint64_t, std::size_t>>{
             {1ull << 40, 1ull << 30}, {full.work / 2, 1ull << 30}, {full.work - 1000, 1ull << 30},
             {1ull << 40, 400'000}, {1ull << 40, 1'000'000}}) {
        const auto one = exact_p(t, ordering::pearson, work, buckets, 1e-9, 1);
        const auto two = exact_p(t, ordering::pearson, work, buckets, 1e-9, 2);
        EXPECT_EQ(one.complete, two.complete);
        EXPECT_EQ(one.stopped, two.stopped);
        EXPECT_EQ(one.work, two.work);
        EXPECT_EQ(std::bit_cast<std::uint64_t>(one.p), std::bit_cast<std::uint64_t>(two.p));
    }
}

TEST(OmnibusExact, GivesUpOnHugeTablesWhenAskedByName) {
    // Architecture: heavy work past the hard cap fails quickly with Err:523.
    options o;
    o.how = method::exact;
    EXPECT_THROW(same_rates(tally({3, 40000, 41000, 39000}, {5, 80000, 80000, 80000}), o), budget_exceeded);
    // The refusal path stays quick: 10,000 groups of 2 attempts
    // would hold 1.6 GB of bounds alone, and are refused before anything is
    // built or enumerated, with no coarse pass after (too_large).
    std::vector<std::int64_t> x(10000), n(10000, 2);
    for (std::size_t k = 0; k < x.size(); ++k) x[k] = static_cast<std::int64_t>(k % 3);
    const limits caps;
    const auto r = exact_p(table_of(tally(x, n)), ordering::pearson, caps.exact_work, caps.max_buckets);
    EXPECT_FALSE(r.complete);
    EXPECT_TRUE(r.too_large);
    EXPECT_NE(r.stopped.find("in memory at once"), std::string::npos) << r.stopped;
}

TEST(OmnibusAuto, RouteChoiceOnBothSidesOfEachCap) {
    const auto twelve = [](std::int64_t m) {
        std::vector<std::int64_t> x{1}, n{4};  // a group of 4: expected counts below 5
        for (std::int64_t g = 0; g < 11; ++g) {
            n.push_back(m);
            x.push_back(m * (30 + 4 * g) / 100);
        }
        return tally(x, n);
    };
    // Exact work 3.3e7 (m = 70) and 5.3e7 (m = 80) against the cap of 4e7.
    EXPECT_EQ(same_rates(twelve(70), options{}).used, route::exact);
    EXPECT_EQ(same_rates(twelve(80), options{}).used, route::monte_carlo);
    // The memory cap of "auto" (10^6 partial values): bench_exact's unequal
    // table at N = 240 passes it after 6.7e6 of its 4e7 units and goes to
    // Monte Carlo.
    const auto unequal = tally({1, 2, 3, 5, 7, 8, 10, 12, 15, 17, 22, 26},
                              {10, 12, 14, 17, 18, 19, 20, 22, 23, 25, 29, 31});
    const auto stopped = exact_p(table_of(unequal), ordering::pearson, 40'000'000, 1'000'000);
    EXPECT_FALSE(stopped.complete);
    EXPECT_NE(stopped.stopped.find("partial results in memory"), std::string::npos) << stopped.stopped;
    EXPECT_LT(stopped.work, 10'000'000u);
    EXPECT_EQ(same_rates(unequal, options{}).used, route::monte_carlo);
    // Monte Carlo for "auto" needs 1,000 draws within 1.2e7 units: a group
    // of 5 beside four groups of 80,000 fits (about 1,500 draws), beside five
    // it does not, and the chi-square approximation is used with a caution.
    const auto beside = [](int groups) {
        std::vector<std::int64_t> x{3}, n{5};
        for (int g = 0; g < groups; ++g) {
            n.push_back(80000);
            x.push_back(40000 + 1000 * (g % 3));
        }
        return tally(x, n);
    };
    const auto four = same_rates(beside(4), options{});
    EXPECT_EQ(four.used, route::monte_carlo);
    EXPECT_GT(four.mc.draws, 999);
    const auto five = same_rates(beside(5), options{});
    EXPECT_EQ(five.used, route::pearson);
    EXPECT_NE(five.why.find("caution"), std::string::npos);
    // Asked by name, the cap of 6e8 units (about 5 s): 10^7 draws over 15
    // groups of 1000 are refused at once, naming the draws that fit.
    options named;
    named.how = method::monte_carlo;
    named.draws = 10000000;
    std::vector<std::int64_t> x, n;
    for (int g = 0; g < 15; ++g) {
        n.push_back(1000);
        x.push_back(600 + 3 * g);
    }
    try {
        same_rates(tally(x, n), named);
        ADD_FAILURE() << "not refused";
    } catch (const budget_exceeded& e) {
        const std::string why = e.what();
        const auto at = why.find("about ", why.find("cap"));
        ASSERT_NE(at, std::string::npos) << why;
        const double fit = std::stod(why.substr(why.find("; about ") + 8));
        EXPECT_GT(fit, 4.5e6) << why;
        EXPECT_LT(fit, 6.5e6) << why;
    }
}

TEST(OmnibusAuto, PicksTheRouteTheRulesSay) {
    options o;  // auto
    EXPECT_EQ(same_rates(tally({400, 420}, {1000, 1000}), o).used, route::pearson);
    const auto small = same_rates(tally({45, 171, 12}, {50, 190, 12}), o);
    EXPECT_EQ(small.used, route::exact);
    EXPECT_NE(small.why.find("below 5"), std::string::npos);
    // Expected count below 5 in a tiny group beside huge ones: exact is too
    // dear, Monte Carlo is used.
    const auto big = same_rates(tally({3, 40000, 41000, 39000, 40500}, {5, 80000, 80000, 80000, 80000}), o);
    EXPECT_EQ(big.used, route::monte_carlo);
    EXPECT_GT(big.mc.draws, 999);
}

TEST(Tarone, ReferenceRows) {
    // tarone_z, tarone_p: Tarone (1979) recomputed in omnibus.py (exact
    // fractions, 50-digit mpmath).
    int checked = 0;
    for (const auto& r : tallyrates::testing::reference_rows("omnibus.csv", "tarone_")) {
        const auto v = omnibus::tarone(counts::from_values(r.successes, r.attempts));
        const double got = r.quantity == "tarone_z" ? v.z : v.p;
        EXPECT_NEAR(got, r.value, 1e-12 * std::fabs(r.value) + 1e-300) << r.name << " " << r.quantity << " " << r.source;
        // RATES.SAME.P with "tarone" gives the same p.
        omnibus::options o;
        o.how = omnibus::method::tarone;
        if (r.quantity == "tarone_p") {
            EXPECT_EQ(omnibus::same_rates(counts::from_values(r.successes, r.attempts), o).p, v.p);
        }
        ++checked;
    }
    EXPECT_EQ(checked, 6);
}

TEST(Tarone, NotDefinedIsRefusedWithAReason) {
    omnibus::options o;
    o.how = omnibus::method::tarone;
    TALLYRATES_EXPECT_THROW_SAYING(omnibus::same_rates(tally({1, 0, 1}, {1, 1, 1}), o), invalid_input, "single attempt");
    TALLYRATES_EXPECT_THROW_SAYING(omnibus::same_rates(tally({5, 7}, {5, 7}), o), invalid_input, "passed");
    o.how = omnibus::method::pearson;  // the question of one shared rate: p = 1 there
    EXPECT_EQ(omnibus::same_rates(tally({5, 7}, {5, 7}), o).p, 1.0);
}
