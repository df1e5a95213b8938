// The analysis memo: a repeated question is answered from the cache with the
// very same result; any change of a count or an option is a new question.
// (Properties of the design, architecture.md "Recalculation"; no outside
// numbers involved.)
#include <gtest/gtest.h>

#include <thread>

#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"

using namespace tallyrates;
using namespace tallyrates::omnibus;

TEST(Cache, RepeatsAreLookupsAndChangesAreNot) {
    result_cache cache(4);
    const auto c = counts::from_values(std::vector<std::int64_t>{2, 3, 1, 4}, std::vector<std::int64_t>{5, 5, 4, 6});
    options o;
    o.how = method::monte_carlo;
    o.draws = 5000;
    const auto a = same_rates(c, o, &cache);
    EXPECT_EQ(cache.results.size(), 1u);
    const auto b = same_rates(c, o, &cache);
    EXPECT_EQ(cache.results.size(), 1u);
    EXPECT_EQ(a.p, b.p);
    EXPECT_EQ(a.mc.extreme, b.mc.extreme);
    o.seed = 99;  // another option: another entry
    same_rates(c, o, &cache);
    EXPECT_EQ(cache.results.size(), 2u);
    const auto c2 = counts::from_values(std::vector<std::int64_t>{2, 3, 1, 5}, std::vector<std::int64_t>{5, 5, 4, 6});
    EXPECT_NE(same_rates(c2, o, &cache).p, a.p);
    EXPECT_EQ(cache.results.size(), 3u);
    for (std::int64_t d = 1000; d < 1006; ++d) {  // evictions keep the size bounded
        o.draws = d;
        same_rates(c, o, &cache);
    }
    EXPECT_EQ(cache.results.size(), 4u);
}

TEST(Cache, SafeUnderConcurrentUse) {
    result_cache cache(8);
    const auto c = counts::from_values(std::vector<std::int64_t>{1, 4, 6}, std::vector<std::int64_t>{6, 7, 8});
    std::vector<double> seen(4);
    std::vector<std::thread> threads;
    for (int k = 0; k < 4; ++k)
        threads.emplace_back([&, k] {
            options o;
            for (int rep = 0; rep < 50; ++rep) seen[k] = same_rates(c, o, &cache).p;
        });
    for (auto& t : threads) t.join();
    for (double p : seen) EXPECT_EQ(p, seen[0]);
}

TEST(ExactRefused, CarriesCertifiedBounds) {
    // The unequal 2 x 12 table of bench_exact (N = 500, rates 0.35 to 0.65):
    // exact needs 7.8e7 work units, the coarse 1 % grid 8.8e6 (the work
    // counts are deterministic); under a cap of 5e7 exact is refused and the coarse pass,
    // with a quarter of the cap, leaves certified bounds.
    const std::vector<std::int64_t> n{20, 25, 30, 35, 38, 40, 42, 45, 48, 52, 60, 65},
        x{7, 9, 12, 15, 17, 19, 22, 24, 27, 31, 37, 42};
    options o;
    o.how = method::exact;
    o.caps.exact_work = 50'000'000;
    try {
        same_rates(counts::from_values(x, n), o);
        FAIL() << "expected a refusal";
    } catch (const exact_refused& e) {
        ASSERT_TRUE(e.has_bounds) << e.what();
        EXPECT_LE(e.p_low, e.p_high);
        options full;
        full.how = method::exact;
        full.caps.exact_work = 100'000'000;
        const double p = same_rates(counts::from_values(x, n), full).p;
        EXPECT_LE(e.p_low, p * (1 + 1e-12));
        EXPECT_GE(e.p_high, p * (1 - 1e-12));
        EXPECT_LT(e.p_high - e.p_low, 0.15 * p);  // informative: within 15 % (0.106 to 0.117)
    }
    // A refusal is remembered: asked again through a cache, the same answer
    // comes back without the work.
    result_cache cache;
    for (int k = 0; k < 2; ++k) {
        try {
            same_rates(counts::from_values(x, n), o, &cache);
            FAIL();
        } catch (const exact_refused& e) {
            EXPECT_TRUE(e.has_bounds);
        }
    }
    EXPECT_EQ(cache.refusals.size(), 1u);
}
