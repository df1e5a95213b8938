// Tests of the pairs family: one-rate intervals, difference intervals,
// pairwise tests, multiplicity adjustment and adjusted residuals.
//
// Outside values:
// - published worked examples, marked as checks.md marks them: [S] seen quoted
//   with its citation, [M] from memory (Newcombe 1998a, Stat Med 17:857;
//   Newcombe 1998b, Stat Med 17:873, Table II; Benjamini & Hochberg 1995,
//   JRSS B 57:289, section 4);
// - rows of tests/reference/pairs.csv written by pairs.py (statsmodels
//   proportion_confint, confint_proportions_2indep, multipletests,
//   Table.standardized_resids; scipy chi2_contingency, fisher_exact; an
//   independent Miettinen-Nurminen root search), each naming its source.
#include <gtest/gtest.h>

#include <cmath>
#include <map>
#include <sstream>

#include "reference.hpp"
#include "tallyrates/pairs/adjust.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/omnibus/residuals.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "support.hpp"

using namespace tallyrates;
using tallyrates::testing::reference_rows;

namespace {

namespace cell = tallyrates::testing::cell;

group g(std::int64_t x, std::int64_t n, std::size_t position = 1) { return {position, x, n}; }

using tallyrates::testing::tally;

// Published to 4 decimals: within half a unit of the last place (plus rounding slack).
void expect_4dp(double got, double published, const char* what) {
    EXPECT_NEAR(got, published, 0.5e-4 + 1e-12) << what;
}

const std::map<std::string, one_rate::method> one_methods{{"wilson", one_rate::method::wilson},
                                                          {"clopper_pearson", one_rate::method::clopper_pearson},
                                                          {"jeffreys", one_rate::method::jeffreys},
                                                          {"agresti_coull", one_rate::method::agresti_coull}};
const std::map<std::string, pairwise::interval_method> diff_methods{
    {"newcombe", pairwise::interval_method::newcombe},
    {"miettinen_nurminen", pairwise::interval_method::miettinen_nurminen},
    {"agresti_caffo", pairwise::interval_method::agresti_caffo},
    {"wald", pairwise::interval_method::wald}};

// "one_wilson_low" -> ("wilson", true)
std::pair<std::string, bool> method_and_end(const std::string& quantity, std::size_t prefix) {
    const bool low = quantity.ends_with("_low");
    return {quantity.substr(prefix, quantity.size() - prefix - (low ? 4 : 5)), low};
}

}  // namespace

TEST(OneRate, NewcombePublishedExamples) {
    // Newcombe 1998a, illustrative intervals at 95 % (checks.md marks in the last column).
    using m = one_rate::method;
    struct example {
        std::int64_t x, n;
        m how;
        double low, high;
        const char* mark;
    };
    const example examples[] = {{81, 263, m::wilson, 0.2553, 0.3662, "[S]"}, {81, 263, m::clopper_pearson, 0.2527, 0.3676, "[M]"},
                                {0, 20, m::wilson, 0.0, 0.1611, "[M]"},      {0, 20, m::clopper_pearson, 0.0, 0.1684, "[M]"},
                                {1, 29, m::wilson, 0.0061, 0.1718, "[M]"},   {15, 148, m::wilson, 0.0624, 0.1605, "[M]"}};
    for (const auto& e : examples) {
        const auto b = one_rate::bounds(e.x, e.n, 0.95, e.how);
        expect_4dp(b.low, e.low, e.mark);
        expect_4dp(b.high, e.high, e.mark);
    }
    EXPECT_EQ(one_rate::bounds(0, 20, 0.95, m::wilson).low, 0.0);
}

TEST(OneRate, ReferenceRows) {
    std::size_t checked = 0;
    for (const auto& r : reference_rows("pairs.csv", "one_")) {
        const auto [name, low] = method_and_end(r.quantity, 4);
        const auto b = one_rate::bounds(r.successes[0], r.attempts[0], 0.95, one_methods.at(name));
        const double got = low ? b.low : b.high;
        EXPECT_NEAR(got, r.value, 1e-12 + 1e-10 * std::fabs(r.value)) << r.name << " " << r.quantity << " " << r.source;
        ++checked;
    }
    EXPECT_EQ(checked, 7u * 4 * 2);
}

TEST(OneRate, EndsAreExact) {
    // Common practice, no source: no interval reaches below 0 % or above 100 %,
    // and every method touches 0 at 0 of n and 1 at n of n except the
    // Agresti-Coull form, which may stop short (Brown, Cai & DasGupta 2001).
    for (const auto& [name, m] : one_methods) {
        for (std::int64_t n : {1, 2, 12, 1000000}) {
            const auto zero = one_rate::bounds(0, n, 0.95, m);
            const auto all = one_rate::bounds(n, n, 0.95, m);
            EXPECT_EQ(zero.low, 0.0) << name;
            EXPECT_EQ(all.high, 1.0) << name;
            EXPECT_LE(zero.high, 1.0);
            EXPECT_GE(all.low, 0.0);
        }
    }
}

TEST(OneRate, OneSidedReferenceRows) {
    // sided_<method>_<end>: each bound alone at 95 % (scipy beta.ppf for
    // Clopper-Pearson and Jeffreys, statsmodels proportion_confint at alpha
    // 0.10 for Wilson and Agresti-Coull; pairs.py).
    std::size_t checked = 0;
    for (const auto& r : reference_rows("pairs.csv", "sided_")) {
        const auto [name, low] = method_and_end(r.quantity, 6);
        const auto b = one_rate::bounds(g(r.successes[0], r.attempts[0]), 0.95, one_methods.at(name), sides::one);
        EXPECT_NEAR(low ? b.low : b.high, r.value, 1e-12 + 1e-10 * std::fabs(r.value))
            << r.name << " " << r.quantity << " " << r.source;
        ++checked;
    }
    EXPECT_EQ(checked, 7u * 4 * 2);
}

TEST(OneRate, OneSidedLevelIsAtLeastOneHalf) {
    // A one-sided bound below 50 % would lie on the far side of the
    // estimate; at 50 % (the median claim of reliability demonstrations) a
    // Clopper-Pearson bound is the Beta median (scipy beta.ppf(0.5, 14, 1) =
    // 0.5^(1/14) for 14 of 14).
    EXPECT_THROW(one_rate::bounds(g(5, 10), 0.49, one_rate::method::wilson, sides::one), invalid_input);
    EXPECT_NEAR(one_rate::bounds(g(14, 14), 0.5, one_rate::method::clopper_pearson, sides::one).low,
                std::pow(0.5, 1.0 / 14), 1e-14);
    const auto median = one_rate::bounds(g(5, 10), 0.5, one_rate::method::wilson, sides::one);
    EXPECT_NEAR(median.low, 0.5, 1e-15);  // z = 0: both ends at the estimate
    EXPECT_NEAR(median.high, 0.5, 1e-15);
    TALLYRATES_EXPECT_THROW_SAYING(one_rate::bounds(g(5, 10), 0.3, one_rate::method::wilson, sides::one),
                                   invalid_input, "at least 0.5");
}

TEST(Difference, NewcombeTableTwoHybridScore) {
    // Newcombe 1998b Table II, method 10, 95 % [S] (checks.md).
    struct example {
        std::int64_t x1, n1, x2, n2;
        double low, high;
    };
    const example table_two[] = {{56, 70, 48, 80, 0.0524, 0.3339}, {9, 10, 3, 10, 0.1705, 0.8090},
                                 {6, 7, 2, 7, 0.0582, 0.8062},     {5, 56, 0, 29, -0.0381, 0.1926},
                                 {0, 10, 0, 20, -0.1611, 0.2775},  {0, 10, 0, 10, -0.2775, 0.2775}};
    for (const auto& e : table_two) {
        const auto ci = pairwise::difference_interval(g(e.x1, e.n1), g(e.x2, e.n2, 2), 0.95,
                                                      pairwise::interval_method::newcombe);
        expect_4dp(ci.low, e.low, "hybrid low");
        expect_4dp(ci.high, e.high, "hybrid high");
    }
}

TEST(Difference, NewcombeTableTwoOtherMethods) {
    // Newcombe 1998b Table II, examples (a) 56/70 - 48/80 and (b) 9/10 - 3/10 [S].
    using m = pairwise::interval_method;
    auto check = [](group a, group b, m how, double low, double high, const char* what) {
        const auto ci = pairwise::difference_interval(a, b, 0.95, how);
        expect_4dp(ci.low, low, what);
        expect_4dp(ci.high, high, what);
    };
    check(g(56, 70), g(48, 80, 2), m::wald, 0.0575, 0.3425, "(a) Wald");
    check(g(56, 70), g(48, 80, 2), m::miettinen_nurminen, 0.0528, 0.3382, "(a) Miettinen-Nurminen");
    check(g(56, 70), g(48, 80, 2), m::agresti_caffo, 0.0525, 0.3358, "(a) Agresti-Caffo");
    check(g(9, 10), g(3, 10, 2), m::wald, 0.2605, 0.9395, "(b) Wald");
    check(g(9, 10), g(3, 10, 2), m::miettinen_nurminen, 0.1700, 0.8406, "(b) Miettinen-Nurminen");
    check(g(9, 10), g(3, 10, 2), m::agresti_caffo, 0.1600, 0.8400, "(b) Agresti-Caffo");
}

TEST(Difference, ReferenceRows) {
    std::size_t checked = 0;
    for (const auto& r : reference_rows("pairs.csv", "diff_")) {
        const auto [name, low] = method_and_end(r.quantity, 5);
        const auto ci = pairwise::difference_interval(g(r.successes[0], r.attempts[0]),
                                                      g(r.successes[1], r.attempts[1], 2), 0.95, diff_methods.at(name));
        // The score bounds are roots found by search on both sides: 1e-9.
        const double tol = name == "miettinen_nurminen" ? 1e-9 : 1e-12 + 1e-10 * std::fabs(r.value);
        EXPECT_NEAR(low ? ci.low : ci.high, r.value, tol) << r.name << " " << r.quantity << " " << r.source;
        ++checked;
    }
    EXPECT_EQ(checked, 8u * 4 * 2);
}

TEST(Difference, OneSidedReferenceRows) {
    // diffsided_<method>_<end>: the ends of the two-sided 90 % interval,
    // each a one-sided 95 % bound (mn_interval in pairs.py; statsmodels
    // confint_proportions_2indep at alpha 0.10 for Newcombe).
    std::size_t checked = 0;
    for (const auto& r : reference_rows("pairs.csv", "diffsided_")) {
        const auto [name, low] = method_and_end(r.quantity, 10);
        const auto c = counts::from_values(r.successes, r.attempts);
        pairwise::interval_options o;
        o.how = diff_methods.at(name);
        o.adjust = adjust::simultaneous::none;
        o.side = sides::one;
        const auto ci = cell::difference_interval(c, 1, 2, o);
        const double tol = name == "miettinen_nurminen" ? 1e-9 : 1e-12 + 1e-10 * std::fabs(r.value);
        EXPECT_NEAR(low ? ci.low : ci.high, r.value, tol) << r.name << " " << r.quantity << " " << r.source;
        ++checked;
    }
    EXPECT_EQ(checked, 8u * 2 * 2);
}

TEST(Difference, IntervalsStayInsideMinusOneToOneAndHoldTheEstimate) {
    // Common practice, no source: a difference of two rates lies in [-1, 1],
    // and every interval here contains the observed difference.
    const std::pair<std::int64_t, std::int64_t> shapes[] = {{0, 1}, {1, 1}, {0, 12}, {12, 12}, {3, 40000}, {7, 9}};
    for (const auto& [name, m] : diff_methods)
        for (const auto& [x1, n1] : shapes)
            for (const auto& [x2, n2] : shapes) {
                const auto ci = pairwise::difference_interval(g(x1, n1), g(x2, n2, 2), 0.95, m);
                const double d = static_cast<double>(x1) / static_cast<double>(n1) -
                                 static_cast<double>(x2) / static_cast<double>(n2);
                EXPECT_GE(ci.low, -1.0) << name;
                EXPECT_LE(ci.high, 1.0) << name;
                EXPECT_LE(ci.low, d + 1e-12) << name << " " << x1 << "/" << n1 << " - " << x2 << "/" << n2;
                EXPECT_GE(ci.high, d - 1e-12) << name << " " << x1 << "/" << n1 << " - " << x2 << "/" << n2;
            }
}

TEST(PairTest, ReferenceRows) {
    std::size_t checked = 0;
    for (const auto& r : reference_rows("pairs.csv", "pair_")) {
        const auto how = r.quantity == "pair_exact_p" ? pairwise::test_method::exact : pairwise::test_method::score;
        const double p = pairwise::same_rate_p(g(r.successes[0], r.attempts[0]), g(r.successes[1], r.attempts[1], 2), how);
        // The exact p at n = 10^6 sums long recurrences (ours and scipy's):
        // agreement to 1e-9 relative is what both can promise there.
        const double tol = how == pairwise::test_method::exact ? 1e-9 : 1e-10;
        EXPECT_NEAR(p, r.value, tol * r.value + 1e-300) << r.name << " " << r.quantity << " " << r.source;
        ++checked;
    }
    EXPECT_GE(checked, 14u);
}

TEST(PairTest, FisherTeaTasting) {
    // Fisher's tea tasting [[3,1],[1,3]]: two-sided exact p 0.486 [S] (checks.md).
    EXPECT_NEAR(pairwise::same_rate_p(g(3, 4), g(1, 4, 2), pairwise::test_method::exact), 0.486, 0.0005);
}

TEST(PairTest, ExactRefusesCountsBeyondItsBudget) {
    // Bounded work whatever the counts (the exact 2 x 2 enumeration stores
    // about 80 standard deviations of the conditional law).
    EXPECT_THROW(pairwise::same_rate_p(g(40000000000, 100000000000), g(50000000000, 100000000000, 2),
                                       pairwise::test_method::exact),
                 budget_exceeded);
    EXPECT_NO_THROW(pairwise::same_rate_p(g(40000000000, 100000000000), g(50000000000, 100000000000, 2),
                                          pairwise::test_method::score));
    // Just inside the budget (a standard deviation of about 11,000), far
    // apart: the p-value underflows to 0, quickly.
    EXPECT_EQ(pairwise::same_rate_p(g(400000000, 1000000000), g(500000000, 1000000000, 2),
                                    pairwise::test_method::exact),
              0.0);
}

TEST(Adjust, BenjaminiHochbergSectionFour) {
    // Benjamini & Hochberg 1995 section 4: 15 p-values; at 0.05 BH rejects 4 [S],
    // Bonferroni 3 [M].
    const std::vector<double> p{0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344,
                                0.0459, 0.3240, 0.4262, 0.5719, 0.6528, 0.7590, 1.000};
    auto rejected = [&](adjust::p_values how) {
        int k = 0;
        for (double v : adjust::adjusted(p, how)) k += v <= 0.05;
        return k;
    };
    EXPECT_EQ(rejected(adjust::p_values::benjamini_hochberg), 4);
    EXPECT_EQ(rejected(adjust::p_values::bonferroni), 3);
}

TEST(Adjust, FamilyReferenceRows) {
    // family_<test>_<adjust>_<all|against1>_<i>_<j>: statsmodels multipletests
    // over scipy's pairwise p-values of a five-line tally.
    const std::map<std::string, adjust::p_values> words{{"holm", adjust::p_values::holm},
                                                        {"hochberg", adjust::p_values::hochberg},
                                                        {"benjamini-hochberg", adjust::p_values::benjamini_hochberg},
                                                        {"bonferroni", adjust::p_values::bonferroni},
                                                        {"sidak", adjust::p_values::sidak}};
    std::size_t checked = 0;
    pairwise::p_cache cache(8);
    for (const auto& r : reference_rows("pairs.csv", "family_")) {
        // Split "family_score_holm_all_1_3".
        std::vector<std::string> part;
        std::stringstream in(r.quantity);
        for (std::string s; std::getline(in, s, '_');) part.push_back(s);
        ASSERT_EQ(part.size(), 6u) << r.quantity;
        pairwise::test_options o;
        o.how = part[1] == "exact" ? pairwise::test_method::exact : pairwise::test_method::score;
        o.adjust = words.at(part[2]);
        o.comparisons = part[3] == "all" ? pairwise::family::all : pairwise::family::against;
        const double i = std::stod(part[4]), j = std::stod(part[5]);
        const auto c = counts::from_values(r.successes, r.attempts);
        // "against1" is every group against group 1: j = 1 is the reference.
        const bool against = o.comparisons == pairwise::family::against;
        const double first = against ? (j == 1 ? i : j) : i, second = against ? 1 : j;
        const double p = cell::same_rate_p(c, first, second, o, &cache);
        EXPECT_NEAR(p, r.value, 1e-10 * r.value + 1e-300) << r.quantity << " " << r.source;
        // The same value without the cache, and (in the family of all pairs) for (j, i).
        EXPECT_EQ(p, cell::same_rate_p(c, first, second, o)) << r.quantity;
        if (!against) {
            EXPECT_EQ(p, cell::same_rate_p(c, j, i, o)) << r.quantity;
        }
        ++checked;
    }
    EXPECT_EQ(checked, 2u * 5 * (10 + 4) + 190);  // five lines, every way; twenty lots, Holm
}

TEST(Adjust, MonotoneAndCapped) {
    // Common practice, no source: an adjusted p is at least the raw one, at
    // most 1, and keeps the order of the raw values.
    const std::vector<double> p{0.3, 0.001, 0.04, 0.04, 0.9, 0.0002, 0.5};
    for (auto how : {adjust::p_values::holm, adjust::p_values::hochberg, adjust::p_values::benjamini_hochberg,
                     adjust::p_values::bonferroni, adjust::p_values::sidak}) {
        const auto a = adjust::adjusted(p, how);
        for (std::size_t k = 0; k < p.size(); ++k) {
            EXPECT_GE(a[k], p[k]);
            EXPECT_LE(a[k], 1.0);
            for (std::size_t l = 0; l < p.size(); ++l)
                if (p[k] < p[l]) {
                    EXPECT_LE(a[k], a[l]);
                }
        }
    }
}

TEST(Adjust, SimultaneousLevels) {
    // Bonferroni 1 - 0.05/m and Sidak 0.95^(1/m), the definitions (methods.md).
    EXPECT_DOUBLE_EQ(adjust::per_comparison_level(0.95, 10, adjust::simultaneous::bonferroni), 0.995);
    EXPECT_NEAR(adjust::per_comparison_level(0.95, 10, adjust::simultaneous::sidak), std::pow(0.95, 0.1), 1e-15);
    EXPECT_EQ(adjust::per_comparison_level(0.95, 10, adjust::simultaneous::none), 0.95);
    // Simultaneous intervals over the family are wider than single ones.
    const auto c = tally({45, 171, 12, 30}, {50, 190, 12, 40});
    pairwise::interval_options single, joint;
    single.adjust = adjust::simultaneous::none;
    joint.adjust = adjust::simultaneous::bonferroni;
    const auto a = cell::difference_interval(c, 1, 2, single);
    const auto b = cell::difference_interval(c, 1, 2, joint);
    EXPECT_LT(b.low, a.low);
    EXPECT_GT(b.high, a.high);
    // "against" holds G - 1 = 3 comparisons, "all" 6.
    EXPECT_EQ(pairwise::family_size(c, pairwise::family::against), 3u);
    EXPECT_EQ(pairwise::family_size(c, pairwise::family::all), 6u);
}

TEST(Pairs, BadPositionsAndLevelsAreRefused) {
    const auto c = counts::from_entries(
        std::vector{entry::number(4), entry::number(0), entry::blank(), entry::number(3)},
        std::vector{entry::number(10), entry::number(0), entry::blank(), entry::number(8)});
    const pairwise::interval_options o;
    EXPECT_THROW(cell::difference_interval(c, 1, 1, o), invalid_input);  // i = j
    EXPECT_THROW(cell::difference_interval(c, 1, 2, o), invalid_input);  // no attempts
    EXPECT_THROW(cell::difference_interval(c, 1, 3, o), invalid_input);  // blank row
    EXPECT_THROW(cell::difference_interval(c, 1, 5, o), invalid_input);  // outside
    pairwise::interval_options bad_level;
    bad_level.level = 1.0;
    EXPECT_THROW(cell::difference_interval(c, 1, 4, bad_level), invalid_input);
    EXPECT_THROW(cell::one_bounds(c, 2, 0.95, one_rate::method::wilson), invalid_input);
    EXPECT_THROW(cell::one_bounds(c, 1, 0.0, one_rate::method::wilson), invalid_input);
    EXPECT_THROW(cell::same_rate_p(c, 4, 4, pairwise::test_options{}), invalid_input);
}

TEST(Residuals, ReferenceRows) {
    std::size_t checked = 0;
    for (const auto& r : reference_rows("omnibus.csv", "resid_")) {
        const auto res = omnibus::adjusted_residuals(counts::from_values(r.successes, r.attempts));
        const auto pos = std::stoul(r.quantity.substr(6));
        ASSERT_TRUE(res[pos - 1].has_value());
        EXPECT_NEAR(*res[pos - 1], r.value, 1e-12 + 1e-10 * std::fabs(r.value)) << r.name << " " << r.quantity;
        ++checked;
    }
    EXPECT_EQ(checked, 7u);
}

TEST(Residuals, BlankRowsAndEmptyGroupsHaveNone) {
    const auto c = counts::from_entries(
        std::vector{entry::number(4), entry::blank(), entry::number(0), entry::number(3)},
        std::vector{entry::number(10), entry::blank(), entry::number(0), entry::number(8)});
    const auto res = omnibus::adjusted_residuals(c);
    ASSERT_EQ(res.size(), 4u);
    EXPECT_TRUE(res[0] && res[3]);
    EXPECT_FALSE(res[1] || res[2]);
    // Two groups: the residuals are opposite (arithmetic of the definition).
    EXPECT_NEAR(*res[0], -*res[3], 1e-12);
}

TEST(Pairs, TableAgreesWithTheSingleCellsToTheLastBit) {
    // The rule: a RATES.PAIRS row and the single-cell functions give
    // the same numbers. Blank rows and a group without attempts are left out.
    const auto c = counts::from_entries(
        std::vector{entry::number(45), entry::blank(), entry::number(171), entry::number(0), entry::number(12),
                    entry::number(30)},
        std::vector{entry::number(50), entry::blank(), entry::number(190), entry::number(0), entry::number(12),
                    entry::number(40)});
    pairwise::table_options o;
    o.how = pairwise::interval_method::miettinen_nurminen;
    o.intervals = adjust::simultaneous::sidak;
    o.p = adjust::p_values::hochberg;
    pairwise::p_cache cache(4);
    const auto rows = pairwise::pairs_table(c, o, &cache);
    ASSERT_EQ(rows.size(), 6u);  // 4 groups with attempts
    EXPECT_EQ(rows[0].i, 1u);
    EXPECT_EQ(rows[0].j, 3u);
    EXPECT_EQ(rows[5].i, 5u);
    EXPECT_EQ(rows[5].j, 6u);
    for (const auto& r : rows) {
        const auto i = static_cast<double>(r.i), j = static_cast<double>(r.j);
        const auto ci = cell::difference_interval(
            c, i, j, pairwise::interval_options{o.level, o.how, o.intervals, pairwise::family::all});
        EXPECT_EQ(r.bounds.low, ci.low);
        EXPECT_EQ(r.bounds.high, ci.high);
        EXPECT_EQ(r.difference, cell::difference(c, i, j));
        pairwise::test_options raw;
        raw.adjust = adjust::p_values::none;
        EXPECT_EQ(r.p, cell::same_rate_p(c, i, j, raw));
        pairwise::test_options t;
        t.adjust = o.p;
        EXPECT_EQ(r.p_adjusted, cell::same_rate_p(c, i, j, t));
        EXPECT_GE(r.p_adjusted, r.p);
    }
    EXPECT_THROW(pairwise::pairs_table(tally({3}, {9}), o), invalid_input);
}

// Families of every pair are bounded before any test runs (README, Caps):
// 700 groups are 244,650 pairs, beyond the cap of 200,000; the exact tests
// of every pair of 300 groups of 200,000 attempts at about 50 % would store
// about 5.7e8 values (80 standard deviations of 158 for each of 44,850
// pairs), beyond the cap of 3e8. Both refusals come at once.
TEST(PairFamilies, CostIsCheckedBeforeAnyTestRuns) {
    std::vector<std::int64_t> x(700), n(700, 20);
    for (std::size_t g = 0; g < x.size(); ++g) x[g] = static_cast<std::int64_t>(g % 21);
    const auto many = counts::from_values(x, n);
    pairwise::test_options holm;
    holm.adjust = adjust::p_values::holm;
    EXPECT_THROW(cell::same_rate_p(many, 1, 2, holm), budget_exceeded);
    holm.adjust = adjust::p_values::none;  // one pair alone: no family to pay for
    EXPECT_NO_THROW(cell::same_rate_p(many, 1, 2, holm));
    std::vector<std::int64_t> bx(300), bn(300, 200000);
    for (std::size_t g = 0; g < bx.size(); ++g) bx[g] = 100000 + static_cast<std::int64_t>(g);
    pairwise::test_options exact;
    exact.how = pairwise::test_method::exact;
    exact.adjust = adjust::p_values::holm;
    EXPECT_THROW(cell::same_rate_p(counts::from_values(bx, bn), 1, 2, exact), budget_exceeded);
}
