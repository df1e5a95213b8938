// Robustness sweep: thousands of random tables and options (a fixed seed, so
// the sweep is the same every run) through every engine entry point, checking
// invariants that hold whatever the answer: p in [0, 1], exact bounds
// ordered and bracketing, Monte Carlo reproducible, no crash. Run under
// AddressSanitizer and UBSan by the "sanitize" preset. The invariants are
// properties of the definitions (common practice, no source).
#include <gtest/gtest.h>

#include <cmath>
#include <random>

#include "tallyrates/omnibus/check.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/omnibus/report.hpp"

using namespace tallyrates;

namespace {
// std::mt19937_64 is fully specified by the C++ standard: the same inputs on every machine.
std::int64_t below(std::mt19937_64& r, std::int64_t n) {
    return static_cast<std::int64_t>(static_cast<double>(r() >> 11) * 0x1.0p-53 * static_cast<double>(n));
}
}  // namespace

TEST(Fuzz, RandomTablesThroughEveryRoute) {
    std::mt19937_64 rng(12345);
    for (int trial = 0; trial < 400; ++trial) {
        const std::int64_t G = 2 + below(rng, 7);
        std::vector<std::int64_t> x, n;
        for (std::int64_t g = 0; g < G; ++g) {
            const std::int64_t ng = below(rng, trial % 3 == 0 ? 25 : 12);
            n.push_back(ng);
            x.push_back(ng ? below(rng, ng + 1) : 0);
        }
        const auto c = counts::from_values(x, n);
        if (c.with_attempts().size() < 2) {
            EXPECT_THROW(omnibus::same_rates(c, {}), invalid_input);
            continue;
        }
        const auto t = omnibus::table_of(c);
        for (auto o : {omnibus::ordering::pearson, omnibus::ordering::lr, omnibus::ordering::probability}) {
            const auto e = omnibus::exact_p(t, o, 1u << 24, 1u << 20);
            if (!e.complete) {  // allowed: the cap is part of the contract
                EXPECT_FALSE(e.stopped.empty());
                continue;
            }
            EXPECT_GE(e.p, 0.0);
            EXPECT_LE(e.p, 1.0);
            EXPECT_LE(e.p_low, e.p * (1 + 1e-12));
            EXPECT_GE(e.p_high, e.p * (1 - 1e-12));
            const auto coarse = omnibus::exact_p(t, o, 1u << 24, 1u << 20, 0.05);
            ASSERT_TRUE(coarse.complete);
            EXPECT_LE(coarse.p_low, e.p * (1 + 1e-9) + 1e-15);
            EXPECT_GE(coarse.p_high, e.p * (1 - 1e-9) - 1e-15);
            const auto m1 = omnibus::monte_carlo_p(t, o, 3000, trial, 1, 1u << 30);
            const auto m2 = omnibus::monte_carlo_p(t, o, 3000, trial, 2, 1u << 30);
            EXPECT_EQ(m1.extreme, m2.extreme);
            EXPECT_GT(m1.p, 0.0);
            EXPECT_LE(m1.p, 1.0);
        }
        omnibus::options opt;
        const auto r = omnibus::same_rates(c, opt);
        EXPECT_TRUE(std::isfinite(r.p) && r.p >= 0 && r.p <= 1);
        EXPECT_FALSE(check_text(std::vector<entry>{}, std::vector<entry>{}).empty());
    }
}

TEST(Fuzz, RandomCellsNeverCrashTheValidator) {
    std::mt19937_64 rng(777);
    const double specials[] = {NAN, INFINITY, -INFINITY, -1, 0.5, 1e300, 0, 1, 3, 1e15, 1e15 + 2};
    for (int trial = 0; trial < 3000; ++trial) {
        const std::size_t size = static_cast<std::size_t>(below(rng, 8));
        std::vector<entry> s(size), n(size);
        for (auto* v : {&s, &n})
            for (auto& e : *v) {
                switch (below(rng, 5)) {
                    case 0: e = entry::blank(); break;
                    case 1: e = entry::text(); break;
                    case 2: e = entry::boolean(); break;
                    case 3: e = entry::number(specials[below(rng, 11)]); break;
                    default: e = entry::number(static_cast<double>(below(rng, 30))); break;
                }
            }
        const std::string text = check_text(s, n);
        EXPECT_TRUE(text.rfind("ok", 0) == 0 || text.rfind("problem", 0) == 0) << text;
        const auto rows = same_rates_report(s, n, {}, omnibus::options{});
        EXPECT_EQ(rows.size(), same_report_rows);
    }
}
