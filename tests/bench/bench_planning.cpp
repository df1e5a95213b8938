// Benchmarks of the planning family (targets in the README: every call under 1 ms
// in the engine except AHEAD, under 20 ms for established groups of up to
// 10^6 attempts). Figures go into the README; nothing here passes or fails.
#include <benchmark/benchmark.h>

#include "tallyrates/core/errors.hpp"
#include "tallyrates/planning/planning.hpp"

using namespace tallyrates;

namespace {

void BM_demo(benchmark::State& state) {
    const auto failures = state.range(0);
    for (auto _ : state) benchmark::DoNotOptimize(planning::demonstration(0.999, 0.95, failures));
}
BENCHMARK(BM_demo)->Arg(0)->Arg(3)->Arg(100)->Unit(benchmark::kMicrosecond);

// RATES.PLAN.MORE after 120 units with 0, 3 or 100 failures (0.99 at 95 %).
void BM_more(benchmark::State& state) {
    const std::int64_t failed = state.range(0), run = 120 + failed;
    for (auto _ : state) benchmark::DoNotOptimize(planning::more_units(0.99, 0.95, run, failed));
}
BENCHMARK(BM_more)->Arg(0)->Arg(3)->Arg(100)->Unit(benchmark::kMicrosecond);

void BM_width(benchmark::State& state) {
    const auto how = static_cast<one_rate::method>(state.range(0));
    for (auto _ : state) benchmark::DoNotOptimize(planning::width(0.97, 0.005, 0.95, how));
}
// 0 wilson, 1 exact, 2 jeffreys, 3 agresti_coull (one_rate::method order).
BENCHMARK(BM_width)->DenseRange(0, 3)->Unit(benchmark::kMicrosecond);

void BM_width_rare(benchmark::State& state) {  // the whole count changes every 1000 attempts
    for (auto _ : state) benchmark::DoNotOptimize(planning::width(0.001, 0.0005, 0.95, one_rate::method::clopper_pearson));
}
BENCHMARK(BM_width_rare)->Unit(benchmark::kMicrosecond);

void BM_power(benchmark::State& state) {
    for (auto _ : state)
        benchmark::DoNotOptimize(planning::power(0.10, 0.15, 0.8, 0.05, planning::correction::continuity));
}
BENCHMARK(BM_power)->Unit(benchmark::kMicrosecond);

// A perfect pilot of 14 against an established group of n attempts at 99 %,
// with the flat prior (Cook's sum) and Jeffreys' prior (quadrature).
void BM_plan_ahead(benchmark::State& state) {
    const double n = static_cast<double>(state.range(0)), prior = state.range(1) ? 0.5 : 1.0;
    const bayes::beta_law pilot{prior + 14, prior}, other{prior + 0.99 * n, prior + 0.01 * n};
    for (auto _ : state) benchmark::DoNotOptimize(planning::ahead(pilot, other, 0.95));
}
BENCHMARK(BM_plan_ahead)
    ->Args({300, 0})->Args({10000, 0})->Args({1000000, 0})
    ->Args({300, 1})->Args({10000, 1})->Args({1000000, 1})
    ->Unit(benchmark::kMillisecond);

// Refusals: an unreachable target must be quick (no call over 250 ms).
void BM_refusals(benchmark::State& state) {
    for (auto _ : state) {
        try {
            planning::ahead({15, 2}, {1e10, 1}, 0.95);
        } catch (const unreachable_target&) {
        }
        try {
            planning::width(0.5, 1e-6, 0.95, one_rate::method::clopper_pearson);
        } catch (const unreachable_target&) {
        }
    }
}
BENCHMARK(BM_refusals)->Unit(benchmark::kMicrosecond);

}  // namespace

BENCHMARK_MAIN();
