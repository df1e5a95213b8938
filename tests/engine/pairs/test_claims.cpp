// Tests of the claims the pairs family lets an engineer sign: margins
// (non-inferiority, superiority by a margin, equivalence), one-sided bounds
// of a difference, and the agreement of the default intervals, adjusted
// p-values and verdicts of every pair.
//
// Outside values: rows margin_* of tests/reference/pairs.csv, written by
// pairs.py (Farrington & Manning 1990 in 50-digit mpmath, the restricted
// estimate by mpmath.polyroots checked against a direct maximisation of the
// restricted likelihood; Schuirmann 1987 for equivalence). The agreement of
// intervals and tests is a property of the methods (a score interval is the
// set of differences its test does not reject, Miettinen & Nurminen 1985),
// tested over random tallies of the kind users type.
#include <gtest/gtest.h>

#include <cmath>
#include <random>
#include <sstream>

#include "cells.hpp"
#include "reference.hpp"
#include "support.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/pairs/margin.hpp"
#include "tallyrates/pairs/pairwise.hpp"

using namespace tallyrates;
using tallyrates::testing::reference_rows;

namespace {

namespace cell = tallyrates::testing::cell;

group g(std::int64_t x, std::int64_t n, std::size_t position = 1) { return {position, x, n}; }

pairwise::claim claim_of(const std::string& word) {
    if (word == "not-worse") return pairwise::claim::not_worse;
    if (word == "better") return pairwise::claim::better;
    return pairwise::claim::equivalent;
}

// A tally as users type them: 2 to 8 groups, attempts from 1 to 10^6 spread
// evenly in their logarithm, rates anywhere including exactly 0 and 1 and
// close to either, some groups alike.
counts random_tally(std::mt19937_64& rng) {
    std::uniform_int_distribution<int> groups(2, 8);
    std::uniform_real_distribution<double> unit(0.0, 1.0);
    const int k = groups(rng);
    std::vector<std::int64_t> x, n;
    const double shared = unit(rng);
    for (int q = 0; q < k; ++q) {
        const auto attempts = static_cast<std::int64_t>(std::floor(std::pow(10.0, 6.0 * unit(rng)))) + 1;
        const double pick = unit(rng);
        double rate = pick < 0.1 ? 0.0 : pick < 0.2 ? 1.0 : pick < 0.35 ? 1 - std::pow(10.0, -4 * unit(rng))
                                                     : pick < 0.6 ? shared : unit(rng);
        std::binomial_distribution<std::int64_t> draw(attempts, rate);
        x.push_back(draw(rng));
        n.push_back(attempts);
    }
    return counts::from_values(x, n);
}

}  // namespace

TEST(Margin, ReferenceRows) {
    // margin_<claim>_<goal>_<margin>, groups 1 and 2.
    std::size_t checked = 0;
    for (const auto& r : reference_rows("pairs.csv", "margin_")) {
        std::vector<std::string> part;
        std::stringstream in(r.quantity);
        for (std::string w; std::getline(in, w, '_');) part.push_back(w);
        ASSERT_EQ(part.size(), 4u) << r.quantity;
        const auto better = part[2] == "low" ? goal::low : goal::high;
        const double p = pairwise::margin_p(g(r.successes[0], r.attempts[0]), g(r.successes[1], r.attempts[1], 2),
                                            std::stod(part[3]), claim_of(part[1]), better);
        EXPECT_NEAR(p, r.value, 1e-10 * r.value + 1e-13) << r.name << " " << r.quantity << " " << r.source;
        ++checked;
    }
    EXPECT_EQ(checked, 14u);
}

TEST(Margin, EquivalenceIsTheLargerOfTheTwoOneSidedTests) {
    // Schuirmann (1987): both one-sided tests must reject; "not-worse" at
    // margin m is one of them, so equivalence is never easier to show.
    const auto a = g(930, 1000), b = g(941, 1000, 2);
    for (double m : {0.005, 0.01, 0.02, 0.05}) {
        const double eq = pairwise::margin_p(a, b, m, pairwise::claim::equivalent);
        EXPECT_GE(eq, pairwise::margin_p(a, b, m, pairwise::claim::not_worse));
        EXPECT_GE(eq, pairwise::margin_p(b, a, m, pairwise::claim::not_worse));
        EXPECT_EQ(eq, pairwise::margin_p(b, a, m, pairwise::claim::equivalent));
    }
    // A wider margin is easier to meet (common practice, no source).
    EXPECT_LT(pairwise::margin_p(a, b, 0.03, pairwise::claim::not_worse),
              pairwise::margin_p(a, b, 0.01, pairwise::claim::not_worse));
}

TEST(Margin, DefectCountsMirrorTheClaims) {
    // 7 defects in 800 against 12 in 900: as defect counts (goal low) "not
    // worse" is the claim on the units without a defect (goal high).
    EXPECT_EQ(pairwise::margin_p(g(7, 800), g(12, 900, 2), 0.01, pairwise::claim::not_worse, goal::low),
              pairwise::margin_p(g(793, 800), g(888, 900, 2), 0.01, pairwise::claim::not_worse, goal::high));
}

TEST(Margin, BadMarginsAreRefused) {
    const auto a = g(48, 50), b = g(45, 50, 2);
    for (double m : {-0.01, 1.0, 2.0, std::nan("")})
        EXPECT_THROW(pairwise::margin_p(a, b, m, pairwise::claim::not_worse), invalid_input) << m;
    TALLYRATES_EXPECT_THROW_SAYING(pairwise::margin_p(a, b, 0.0, pairwise::claim::equivalent), invalid_input,
                                   "above 0");
    EXPECT_THROW(pairwise::margin_p(a, a, 0.01, pairwise::claim::not_worse), invalid_input);  // i = j
}

TEST(Coherence, DefaultIntervalsPValuesAndVerdictsNeverDisagree) {
    // The defaults of DIFF.LOW/HIGH, PAIR.P and PAIRS: an interval clear of 0
    // exactly when the adjusted p is below 1 - level, over 400 random
    // tallies and four levels (except within 1e-9 of the edge, where the
    // two sides of the same root meet in rounding); the verdict says what
    // both say; every single cell equals its table row.
    std::mt19937_64 rng(20261205);
    std::size_t pairs_seen = 0, called = 0;
    for (int t = 0; t < 400; ++t) {
        const auto c = random_tally(rng);
        for (double level : {0.8, 0.9, 0.95, 0.99}) {
            pairwise::table_options o;
            o.level = level;
            const auto rows = pairwise::pairs_table(c, o);
            for (const auto& r : rows) {
                const bool clear = r.bounds.low > 0 || r.bounds.high < 0;
                const bool small = r.p_adjusted < 1 - level;
                if (std::fabs(r.p_adjusted - (1 - level)) > 1e-9) {
                    EXPECT_EQ(clear, small) << "pair " << r.i << "," << r.j << " level " << level << " ["
                                            << r.bounds.low << ", " << r.bounds.high << "] p " << r.p_adjusted;
                }
                EXPECT_EQ(r.called != 0, clear && small);
                if (r.called != 0) {
                    EXPECT_EQ(r.called > 0, r.difference > 0);
                }
                pairwise::interval_options io;
                io.level = level;
                const auto ci = cell::difference_interval(c, static_cast<double>(r.i), static_cast<double>(r.j), io);
                EXPECT_EQ(ci.low, r.bounds.low);
                EXPECT_EQ(ci.high, r.bounds.high);
                EXPECT_EQ(cell::same_rate_p(c, static_cast<double>(r.i), static_cast<double>(r.j), {}), r.p_adjusted);
                ++pairs_seen;
                called += r.called != 0;
            }
        }
    }
    EXPECT_GT(pairs_seen, 10000u);
    EXPECT_GT(called, pairs_seen / 10);  // the tallies have real differences to call
}

TEST(Coherence, TheOldDefaultsDidDisagree) {
    // The check above can fail: Newcombe's intervals with Holm's p (the
    // defaults before) show an interval clear of 0 beside an adjusted p
    // above 1 - level, or the reverse, on some random tallies.
    std::mt19937_64 rng(20261205);
    std::size_t contradictions = 0, pairs = 0;
    for (int t = 0; t < 400; ++t) {
        const auto c = random_tally(rng);
        pairwise::table_options o;
        o.how = pairwise::interval_method::newcombe;
        o.intervals = adjust::simultaneous::none;
        o.p = adjust::p_values::holm;
        for (const auto& r : pairwise::pairs_table(c, o)) {
            contradictions += (r.bounds.low > 0 || r.bounds.high < 0) != (r.p_adjusted < 0.05);
            ++pairs;
        }
    }
    EXPECT_GT(contradictions, 0u);
    std::printf("old defaults at 95 %%: %zu of %zu pairs contradict\n", contradictions, pairs);
}

TEST(Coherence, OneSidedDifferenceBoundsMatchTheOneSidedTest) {
    // A one-sided lower bound at level is above 0 exactly when the
    // one-sided score test (half the two-sided p, on the side of the
    // difference) is below 1 - level; unadjusted, two groups.
    std::mt19937_64 rng(7);
    for (int t = 0; t < 300; ++t) {
        const auto c = random_tally(rng);
        pairwise::interval_options o;
        o.adjust = adjust::simultaneous::none;
        o.side = sides::one;
        pairwise::test_options raw;
        raw.adjust = adjust::p_values::none;
        const auto ci = cell::difference_interval(c, 1, 2, o);
        const double half = cell::same_rate_p(c, 1, 2, raw) / 2;
        const double d = cell::difference(c, 1, 2);
        if (std::fabs(half - 0.05) > 1e-9 && d != 0) {
            EXPECT_EQ(d > 0 ? ci.low > 0 : ci.high < 0, half < 0.05);
        }
    }
}

TEST(Verdict, WordsFollowTheGoal) {
    // Five invented supplier lots counted as defects (goal low): lot C has
    // many more defects than the rest.
    std::vector<entry> x, n;
    for (double v : {3, 4, 41, 2, 5}) x.push_back(entry::number(v));
    for (double v : {500, 520, 480, 510, 495}) n.push_back(entry::number(v));
    const std::vector<std::string> labels{"Lot A", "Lot B", "Lot C", "Lot D", "Lot E"};
    const auto c = counts::from_entries(x, n, labels);
    pairwise::table_options o;
    o.better = goal::low;
    const auto rows = pairwise::pairs_table(c, o);
    ASSERT_EQ(rows.size(), 10u);
    EXPECT_EQ(pairwise::verdict(c, rows[1], goal::low), "Lot A fewer defects");  // A against C
    EXPECT_EQ(pairwise::verdict(c, rows[1], goal::high), "Lot C higher");
    EXPECT_EQ(pairwise::verdict(c, rows[0], goal::low), "no clear difference");  // A against B
    const auto header = pairwise::pairs_header(o, rows.size(), "bonferroni");
    ASSERT_EQ(header.size(), pairwise::pairs_columns);
    EXPECT_EQ(header[3], "confidence low (95 % jointly, Bonferroni)");
    EXPECT_EQ(header[7], "verdict (all pairs together, 95 %)");
}
