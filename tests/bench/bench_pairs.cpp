// Benchmarks of the pairs family (targets in the README: all 66 pairs of 12 groups,
// every method, under 2 ms in the engine; any single-cell call under 50 us).
// Figures go into the README; nothing here passes or fails.
#include <benchmark/benchmark.h>

#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "cells.hpp"

using namespace tallyrates;

namespace {

namespace cell = tallyrates::testing::cell;

// Twelve lines of 40 to 1,200 attempts with pass rates from 80 % to 100 %:
// a pilot of a dozen perfect units beside long runs.
counts twelve_lines() {
    std::vector<std::int64_t> x, n;
    for (int g = 0; g < 12; ++g) {
        const std::int64_t ng = g == 0 ? 12 : 40 + 100 * g;
        n.push_back(ng);
        x.push_back(g == 0 ? 12 : static_cast<std::int64_t>(static_cast<double>(ng) * (0.80 + 0.015 * g)));
    }
    return counts::from_values(x, n);
}

// Every pair's interval by one method, Bonferroni over the 66.
void all_pairs_intervals(benchmark::State& state, pairwise::interval_method how) {
    const auto c = twelve_lines();
    pairwise::interval_options o;
    o.how = how;
    o.adjust = adjust::simultaneous::bonferroni;
    for (auto _ : state)
        for (double i = 1; i <= 12; ++i)
            for (double j = i + 1; j <= 12; ++j) benchmark::DoNotOptimize(cell::difference_interval(c, i, j, o));
}
void BM_66_pairs_newcombe(benchmark::State& s) { all_pairs_intervals(s, pairwise::interval_method::newcombe); }
void BM_66_pairs_score(benchmark::State& s) { all_pairs_intervals(s, pairwise::interval_method::miettinen_nurminen); }
void BM_66_pairs_agresti_caffo(benchmark::State& s) { all_pairs_intervals(s, pairwise::interval_method::agresti_caffo); }
void BM_66_pairs_wald(benchmark::State& s) { all_pairs_intervals(s, pairwise::interval_method::wald); }
BENCHMARK(BM_66_pairs_newcombe)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_66_pairs_score)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_66_pairs_agresti_caffo)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_66_pairs_wald)->Unit(benchmark::kMicrosecond);

// Every pair's p-value, Holm-adjusted over the 66, without a cache.
void all_pairs_p(benchmark::State& state, pairwise::test_method how) {
    const auto c = twelve_lines();
    for (auto _ : state) {
        const auto raw = pairwise::all_pairs_p(c, how);
        benchmark::DoNotOptimize(adjust::adjusted(raw, adjust::p_values::holm));
    }
}
void BM_66_pairs_p_score(benchmark::State& s) { all_pairs_p(s, pairwise::test_method::score); }
void BM_66_pairs_p_exact(benchmark::State& s) { all_pairs_p(s, pairwise::test_method::exact); }
BENCHMARK(BM_66_pairs_p_score)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_66_pairs_p_exact)->Unit(benchmark::kMicrosecond);

// The whole RATES.PAIRS table (66 rows, score intervals, Holm), cold.
void BM_pairs_table_score_cold(benchmark::State& state) {
    const auto c = twelve_lines();
    pairwise::table_options o;
    o.how = pairwise::interval_method::miettinen_nurminen;
    for (auto _ : state) benchmark::DoNotOptimize(pairwise::pairs_table(c, o));
}
BENCHMARK(BM_pairs_table_score_cold)->Unit(benchmark::kMicrosecond);

// Single-cell calls, cold (no cache): the slowest of each kind.
void BM_cell_diff_low_score(benchmark::State& state) {
    const auto c = twelve_lines();
    pairwise::interval_options o;
    o.how = pairwise::interval_method::miettinen_nurminen;
    for (auto _ : state) benchmark::DoNotOptimize(cell::difference_interval(c, 1, 12, o));
}
// A Holm-adjusted exact p for one pair: every pair's p of the family, or,
// with a cache, a look-up after the first call.
void cell_pair_p_holm_exact(benchmark::State& state, pairwise::p_cache* cache) {
    const auto c = twelve_lines();
    pairwise::test_options o;
    o.how = pairwise::test_method::exact;
    o.adjust = adjust::p_values::holm;
    for (auto _ : state) benchmark::DoNotOptimize(cell::same_rate_p(c, 1, 12, o, cache));
}
void BM_cell_pair_p_holm_exact(benchmark::State& state) { cell_pair_p_holm_exact(state, nullptr); }
void BM_cell_pair_p_holm_exact_cached(benchmark::State& state) {
    pairwise::p_cache cache(8);
    cell_pair_p_holm_exact(state, &cache);
}
void BM_cell_one_exact(benchmark::State& state) {
    for (auto _ : state) benchmark::DoNotOptimize(one_rate::bounds(987, 1200, 0.95, one_rate::method::clopper_pearson));
}
void BM_cell_pair_p_exact_million(benchmark::State& state) {
    const group a{1, 999123, 1000000}, b{2, 998800, 1000000};
    for (auto _ : state) benchmark::DoNotOptimize(pairwise::same_rate_p(a, b, pairwise::test_method::exact));
}
BENCHMARK(BM_cell_diff_low_score)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_cell_pair_p_holm_exact)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_cell_pair_p_holm_exact_cached)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_cell_one_exact)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_cell_pair_p_exact_million)->Unit(benchmark::kMicrosecond);

}  // namespace

BENCHMARK_MAIN();
