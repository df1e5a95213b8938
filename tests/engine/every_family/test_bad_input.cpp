// Bad-input sweep over every engine entry point: NaN, infinities, negative,
// fractional and huge values must give invalid_input (or budget_exceeded for
// work past the caps), never a crash, a hang or a non-finite result.
#include <gtest/gtest.h>

#include <cmath>
#include <limits>

#include "tallyrates/omnibus/check.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/omnibus/residuals.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "tallyrates/omnibus/trend.hpp"
#include "support.hpp"

using namespace tallyrates;

namespace {

namespace cell = tallyrates::testing::cell;
const double bad_values[] = {NAN, INFINITY, -INFINITY, -1.0, 0.5, 1e300, -0.0 - 1e-9, 1e16};

std::vector<entry> col(std::initializer_list<double> v) {
    std::vector<entry> out;
    for (double d : v) out.push_back(entry::number(d));
    return out;
}
}  // namespace

TEST(BadInput, EveryCountCellValue) {
    for (double bad : bad_values) {
        for (int which = 0; which < 2; ++which) {
            auto s = col({3, 4, 5}), n = col({10, 10, 10});
            (which == 0 ? s : n)[1] = entry::number(bad);
            EXPECT_THROW(counts::from_entries(s, n), invalid_input) << bad;
            EXPECT_EQ(check_text(s, n).rfind("problem: Position 2", 0), 0u) << check_text(s, n);
        }
    }
}

TEST(BadInput, EveryEntryPointWithValidCountsAndBadArguments) {
    const auto c = counts::from_values(std::vector<std::int64_t>{3, 4, 5}, std::vector<std::int64_t>{10, 10, 10});
    for (double bad : bad_values) {
        EXPECT_THROW(cell::difference(c, bad, 1), invalid_input) << bad;
        EXPECT_THROW(cell::difference(c, 1, bad), invalid_input) << bad;
        EXPECT_THROW(cell::difference_interval(c, bad, 1, {}), invalid_input) << bad;
        EXPECT_THROW(cell::same_rate_p(c, 1, bad, pairwise::test_options{}), invalid_input) << bad;
        EXPECT_THROW(cell::one_bounds(c, bad, 0.95, one_rate::method::wilson), invalid_input) << bad;
        if (!(bad > 0 && bad < 1)) {  // a bad position may still be a good level (0.5)
            pairwise::interval_options level;
            level.level = bad;
            EXPECT_THROW(cell::difference_interval(c, 1, 2, level), invalid_input) << bad;
            EXPECT_THROW(cell::one_bounds(c, 1, bad, one_rate::method::clopper_pearson), invalid_input) << bad;
        }
        std::vector<entry> scores = col({1, 2, 3});
        scores[0] = entry::number(bad);
        if (std::isfinite(bad)) {
            const auto r = trend::test(c, scores, trend::variance::binomial);
            EXPECT_TRUE(std::isfinite(r.p));
        } else {
            EXPECT_THROW(trend::test(c, scores, trend::variance::binomial), invalid_input);
        }
    }
    omnibus::options o;
    for (std::int64_t draws : {std::int64_t{0}, std::int64_t{-5}, std::numeric_limits<std::int64_t>::min()}) {
        o.how = omnibus::method::monte_carlo;
        o.draws = draws;
        EXPECT_THROW(omnibus::same_rates(c, o), invalid_input);
    }
    o.draws = std::numeric_limits<std::int64_t>::max();
    EXPECT_THROW(omnibus::same_rates(c, o), budget_exceeded);
}

TEST(BadInput, ResultsAreFiniteForEveryMethodOnAwkwardTables) {
    // Extremes that stay valid: zeros, all successes, huge counts, one attempt.
    const std::vector<std::pair<std::vector<std::int64_t>, std::vector<std::int64_t>>> cases = {
        {{0, 1}, {1, 1}}, {{1, 0, 1}, {1, 1, 1}}, {{0, 12}, {12, 12}},
        {{999999999999, 3}, {1000000000000, 12}}, {{0, 0}, {1000000000000000 / 2, 1000000000000000 / 2}},
    };
    for (const auto& [x, n] : cases) {
        const auto c = counts::from_values(x, n);
        for (auto how : {omnibus::method::automatic, omnibus::method::pearson, omnibus::method::lr,
                         omnibus::method::exact, omnibus::method::exact_lr, omnibus::method::exact_prob,
                         omnibus::method::monte_carlo}) {
            omnibus::options o;
            o.how = how;
            o.draws = 2000;
            try {
                const auto r = omnibus::same_rates(c, o);
                EXPECT_TRUE(std::isfinite(r.p) && r.p >= 0 && r.p <= 1) << r.p;
                EXPECT_TRUE(std::isfinite(r.statistic));
            } catch (const budget_exceeded&) {
                // allowed for heavy routes on huge counts
                EXPECT_TRUE(how != omnibus::method::automatic && how != omnibus::method::pearson &&
                            how != omnibus::method::lr);
            }
        }
        EXPECT_NO_THROW(check_text(col({}), col({})));
        // The pairs family on the same extremes: finite, inside [-1, 1] / [0, 1],
        // or a refusal of the exact test's enumeration.
        for (auto how : {pairwise::interval_method::newcombe, pairwise::interval_method::miettinen_nurminen,
                         pairwise::interval_method::agresti_caffo, pairwise::interval_method::wald}) {
            pairwise::interval_options o;
            o.how = how;
            const auto ci = cell::difference_interval(c, 1, 2, o);
            EXPECT_TRUE(ci.low >= -1 && ci.low <= ci.high && ci.high <= 1) << ci.low << " " << ci.high;
        }
        for (auto how : {one_rate::method::wilson, one_rate::method::clopper_pearson, one_rate::method::jeffreys,
                         one_rate::method::agresti_coull}) {
            const auto b = cell::one_bounds(c, 2, 0.95, how);
            EXPECT_TRUE(b.low >= 0 && b.low <= b.high && b.high <= 1);
        }
        for (auto how : {pairwise::test_method::score, pairwise::test_method::exact}) {
            try {
                const double p = cell::same_rate_p(c, 1, 2, pairwise::test_options{how});
                EXPECT_TRUE(p >= 0 && p <= 1) << p;
            } catch (const budget_exceeded&) {
                EXPECT_EQ(how, pairwise::test_method::exact);
            }
        }
        for (const auto& r : omnibus::adjusted_residuals(c))
            if (r) {
                EXPECT_TRUE(std::isfinite(*r));
            }
    }
}

TEST(BadInput, TenThousandGroupsAreAnsweredOrRefused) {
    // Architecture: hostile arguments are refused quickly, default routes answer.
    std::vector<std::int64_t> x(10000), n(10000, 2);
    for (std::size_t k = 0; k < x.size(); ++k) x[k] = static_cast<std::int64_t>(k % 3);
    const auto c = counts::from_values(x, n);
    const auto r = omnibus::same_rates(c, {});
    EXPECT_TRUE(std::isfinite(r.p));
    omnibus::options o;
    o.how = omnibus::method::exact;
    EXPECT_THROW(omnibus::same_rates(c, o), budget_exceeded);
    o.how = omnibus::method::monte_carlo;
    EXPECT_THROW(omnibus::same_rates(c, o), budget_exceeded);  // 1e5 draws x 1e4 groups is past the cap
}

TEST(BadInput, TooManyPositions) {
    std::vector<entry> big(max_positions + 1, entry::blank());
    EXPECT_THROW(counts::from_entries(big, big), invalid_input);
}
