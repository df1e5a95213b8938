// Benchmarks of the Bayesian family (issue 8 targets: AHEAD under 50 us for
// n <= 10^4 and under 1 ms at n = 10^6; BEST and LOSS for 12 groups under
// 10 ms; ORDER for 12 groups under 20 ms). Figures go into the README;
// nothing here passes or fails.
#include <benchmark/benchmark.h>

#include <cmath>

#include "tallyrates/bayes.hpp"

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
BENCHMARK(BM_best_one_of_12)->Arg(300)->Arg(10000)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_best_all_12)->Arg(300)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_loss_one_of_12)->Arg(300)->Arg(10000)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_order_12)->Arg(300)->Arg(10000)->Unit(benchmark::kMillisecond);

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

}  // namespace

BENCHMARK_MAIN();
