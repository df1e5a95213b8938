// Benchmarks of the Bayesian family (targets in the README: AHEAD under 50 us for
// n <= 10^4 and under 1 ms at n = 10^6; BEST and LOSS for 12 groups under
// 10 ms; ORDER for 12 groups under 20 ms). Figures go into the README;
// nothing here passes or fails.
#include <benchmark/benchmark.h>

#include <cmath>
#include <random>

#include "tallyrates/bayes/across.hpp"
#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/bayes/law.hpp"

using namespace tallyrates;

namespace {

std::vector<bayes::beta_law> twelve(double n) {
    std::vector<bayes::beta_law> laws;
    for (int g = 0; g < 12; ++g) {
        const double x = std::floor(n * (0.80 + 0.015 * g));
        laws.push_back({1 + x, 1 + n - x});
    }
    return laws;
}

void BM_ahead(benchmark::State& state) {
    const double n = static_cast<double>(state.range(0));
    const bayes::beta_law a{1 + std::floor(0.95 * n), 1 + n - std::floor(0.95 * n)};
    const bayes::beta_law b{1 + std::floor(0.94 * n), 1 + n - std::floor(0.94 * n)};
    for (auto _ : state) benchmark::DoNotOptimize(bayes::ahead(a, b));
}
BENCHMARK(BM_ahead)->Arg(14)->Arg(300)->Arg(10000)->Arg(1000000)->Unit(benchmark::kMicrosecond);

void BM_best_one_of_12(benchmark::State& state) {
    const auto laws = twelve(static_cast<double>(state.range(0)));
    for (auto _ : state) benchmark::DoNotOptimize(bayes::best(laws, 5, bayes::goal::high));
}
void BM_best_all_12(benchmark::State& state) {
    const auto laws = twelve(static_cast<double>(state.range(0)));
    for (auto _ : state)
        for (std::size_t i = 0; i < 12; ++i) benchmark::DoNotOptimize(bayes::best(laws, i, bayes::goal::high));
}
void BM_loss_one_of_12(benchmark::State& state) {
    const auto laws = twelve(static_cast<double>(state.range(0)));
    for (auto _ : state) benchmark::DoNotOptimize(bayes::loss(laws, 5, bayes::goal::high));
}
void BM_order_12(benchmark::State& state) {
    const auto laws = twelve(static_cast<double>(state.range(0)));
    for (auto _ : state)
        for (std::size_t i = 0; i < 12; ++i)
            for (std::size_t j = 0; j < 12; ++j)
                if (i != j) benchmark::DoNotOptimize(bayes::ahead(laws[i], laws[j]));
}
// A column of 12 POST.BEST cells beside a POST.TABLE, as the component runs
// them: the first cell's pass is kept in the cache, the others look it up.
void BM_best_all_12_cached(benchmark::State& state) {
    const auto laws = twelve(static_cast<double>(state.range(0)));
    for (auto _ : state) {
        bayes::across_cache cache(4);
        for (std::size_t i = 0; i < 12; ++i) benchmark::DoNotOptimize(bayes::best(laws, i, bayes::goal::high, &cache));
    }
}
BENCHMARK(BM_best_all_12_cached)->Arg(300)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_best_one_of_12)->Arg(300)->Arg(10000)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_best_all_12)->Arg(300)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_loss_one_of_12)->Arg(300)->Arg(10000)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_order_12)->Arg(300)->Arg(10000)->Unit(benchmark::kMillisecond);

// Issue 18: groups of very different sizes (a pilot of 5 beside lines of 300
// to 10^4), 200 groups of 300 (the cap of BEST and LOSS), 30 with Jeffreys'
// prior (the cap of TABLE), and a prediction over 10^9 further attempts.
void BM_best_pilot_beside_lines(benchmark::State& state) {
    const std::vector<bayes::beta_law> laws{{5, 1}, {20, 3}, {45, 6}, {90, 11}, {150, 20}, {280, 21}, {9501, 501}};
    for (auto _ : state) benchmark::DoNotOptimize(bayes::best(laws, 0, bayes::goal::high));
}
std::vector<bayes::beta_law> many(int groups, double n, double prior) {
    std::vector<bayes::beta_law> laws;
    for (int g = 0; g < groups; ++g) {
        const double x = std::floor(n * (0.85 + 0.10 * g / groups));
        laws.push_back({prior + x, prior + n - x});
    }
    return laws;
}
void BM_best_200(benchmark::State& state) {
    const auto laws = many(200, 300, state.range(0) == 1 ? 1.0 : 0.5);
    for (auto _ : state) benchmark::DoNotOptimize(bayes::best(laws, 100, bayes::goal::high));
}
void BM_loss_200(benchmark::State& state) {
    const auto laws = many(200, 300, state.range(0) == 1 ? 1.0 : 0.5);
    for (auto _ : state) benchmark::DoNotOptimize(bayes::loss(laws, 100, bayes::goal::high));
}
// What POST.TABLE of 30 groups integrates: the pass (its credible bounds aside).
void BM_table_passes_30(benchmark::State& state) {
    const auto laws = many(30, 300, state.range(0) == 1 ? 1.0 : 0.5);
    for (auto _ : state) benchmark::DoNotOptimize(bayes::across(laws, bayes::goal::high));
}
void BM_next_1e9(benchmark::State& state) {
    const bayes::beta_law law{state.range(0) == 1 ? 15.0 : 14.5, state.range(0) == 1 ? 1.0 : 0.5};
    for (auto _ : state) benchmark::DoNotOptimize(bayes::next_at_least(law, 1000000000, 999999990));
}
// Arg 1: the flat prior; 2: Jeffreys' prior.
BENCHMARK(BM_best_pilot_beside_lines)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_best_200)->Arg(1)->Arg(2)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_loss_200)->Arg(1)->Arg(2)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_table_passes_30)->Arg(1)->Arg(2)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_next_1e9)->Arg(1)->Arg(2)->Unit(benchmark::kMicrosecond);

// Issue 22: how the cross-group calls grow with the groups (the caps in
// across.hpp and comparison.hpp come from these). Args: groups, prior (1:
// flat, 2: Jeffreys').
void BM_best_groups(benchmark::State& state) {
    const auto laws = many(static_cast<int>(state.range(0)), 300, state.range(1) == 1 ? 1.0 : 0.5);
    for (auto _ : state) benchmark::DoNotOptimize(bayes::best(laws, 0, bayes::goal::high));
}
void BM_table_passes_groups(benchmark::State& state) {
    const auto laws = many(static_cast<int>(state.range(0)), 300, state.range(1) == 1 ? 1.0 : 0.5);
    for (auto _ : state) benchmark::DoNotOptimize(bayes::across(laws, bayes::goal::high));
}
void BM_order_groups(benchmark::State& state) {
    const auto laws = many(static_cast<int>(state.range(0)), 300, state.range(1) == 1 ? 1.0 : 0.5);
    for (auto _ : state) benchmark::DoNotOptimize(bayes::order(laws, bayes::goal::high));
}
BENCHMARK(BM_best_groups)->ArgsProduct({{500}, {1, 2}})->Unit(benchmark::kMillisecond);
BENCHMARK(BM_table_passes_groups)->ArgsProduct({{100, 500}, {1, 2}})->Unit(benchmark::kMillisecond);
BENCHMARK(BM_order_groups)->ArgsProduct({{40, 100}, {1, 2}})->Unit(benchmark::kMillisecond);

void BM_credible_hpd(benchmark::State& state) {
    const bayes::beta_law law{287, 15};
    for (auto _ : state) benchmark::DoNotOptimize(bayes::credible(law, 0.95, bayes::kind::hpd));
}
void BM_next_1000(benchmark::State& state) {
    const bayes::beta_law law{501, 1};
    for (auto _ : state) benchmark::DoNotOptimize(bayes::next_at_least(law, 1000, 1000));
}
void BM_difference_bounds(benchmark::State& state) {
    const double n = static_cast<double>(state.range(0));
    const bayes::beta_law a{1 + std::floor(0.95 * n), 1 + n - std::floor(0.95 * n)};
    const bayes::beta_law b{1 + std::floor(0.94 * n), 1 + n - std::floor(0.94 * n)};
    for (auto _ : state) benchmark::DoNotOptimize(bayes::difference(a, b, 0.95));
}
BENCHMARK(BM_credible_hpd)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_difference_bounds)->Arg(300)->Arg(10000)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_next_1000)->Unit(benchmark::kMicrosecond);

// Side by side: our P(best) for six groups against the common Monte
// Carlo estimate, 100,000 draws per group, written here only for the
// comparison (std::gamma_distribution: a Beta draw is G_a / (G_a + G_b)).
// Both report their error against 50-digit mpmath: tests/reference/omnibus.csv,
// row c_six, post_best|1|1|4 = 0.7574822118838822.
const std::vector<bayes::beta_law> six{{10, 12}, {13, 9}, {8, 14}, {16, 6}, {12, 10}, {11, 11}};
constexpr double six_best_4 = 0.7574822118838822;

void BM_best_of_6_computed(benchmark::State& state) {
    double p = 0;
    for (auto _ : state) benchmark::DoNotOptimize(p = bayes::best(six, 3, bayes::goal::high));
    state.counters["abs_error"] = std::fabs(p - six_best_4);
}
void BM_best_of_6_monte_carlo_100k(benchmark::State& state) {
    std::mt19937_64 rng(20260101);
    double p = 0;
    for (auto _ : state) {
        std::vector<std::gamma_distribution<double>> ga, gb;
        for (const auto& l : six) {
            ga.emplace_back(l.a, 1.0);
            gb.emplace_back(l.b, 1.0);
        }
        std::int64_t wins = 0;
        constexpr int draws = 100000;
        for (int d = 0; d < draws; ++d) {
            double best_rate = -1;
            std::size_t best_group = 0;
            for (std::size_t g = 0; g < six.size(); ++g) {
                const double x = ga[g](rng), y = gb[g](rng);
                const double rate = x / (x + y);
                if (rate > best_rate) best_rate = rate, best_group = g;
            }
            wins += best_group == 3;
        }
        benchmark::DoNotOptimize(p = static_cast<double>(wins) / draws);
    }
    state.counters["abs_error"] = std::fabs(p - six_best_4);
}
BENCHMARK(BM_best_of_6_computed)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_best_of_6_monte_carlo_100k)->Unit(benchmark::kMillisecond);

}  // namespace

BENCHMARK_MAIN();
