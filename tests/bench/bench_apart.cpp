// Benchmarks of the apart family (targets in the README: the RATES.APART
// table of 30 groups with N up to 10^4 under 50 ms with method "exact",
// family "all", no target; under 1 ms with "normal"; RATES.PRIOR.FIT of 200
// groups under 5 ms). Figures go into the README; nothing here passes or
// fails.
#include <benchmark/benchmark.h>

#include <vector>

#include "tallyrates/apart/limits.hpp"
#include "tallyrates/apart/prior_fit.hpp"

using namespace tallyrates;

namespace {

// G groups of mixed sizes (40 to 620 attempts, about 10^4 in all at G = 30)
// with rates around 95 %, one group low: a supplier tally (invented).
counts tally_of(std::size_t groups) {
    std::vector<std::int64_t> x, n;
    for (std::size_t g = 0; g < groups; ++g) {
        const auto attempts = static_cast<std::int64_t>(40 + (g * 97) % 581);
        const double rate = g == 3 ? 0.88 : 0.93 + 0.04 * static_cast<double>((g * 7) % 5) / 4;
        n.push_back(attempts);
        x.push_back(static_cast<std::int64_t>(rate * static_cast<double>(attempts)));
    }
    return counts::from_values(x, n);
}

void BM_apart_table(benchmark::State& state) {
    const auto c = tally_of(static_cast<std::size_t>(state.range(0)));
    apart::options o;
    o.how = state.range(1) == 0 ? apart::method::exact : apart::method::normal;
    o.together = state.range(2) == 0 ? apart::family::all : apart::family::each;
    for (auto _ : state) benchmark::DoNotOptimize(apart::table(c, o));
}
// (groups, 0 exact / 1 normal, 0 all / 1 each)
BENCHMARK(BM_apart_table)
    ->Args({4, 0, 0})
    ->Args({12, 0, 0})
    ->Args({30, 0, 0})
    ->Args({30, 1, 0})
    ->Args({30, 0, 1})
    ->Args({100, 0, 0})
    ->Unit(benchmark::kMillisecond);

void BM_prior_fit(benchmark::State& state) {
    const auto c = tally_of(static_cast<std::size_t>(state.range(0)));
    for (auto _ : state) benchmark::DoNotOptimize(apart::fit_prior(c));
}
BENCHMARK(BM_prior_fit)->Arg(12)->Arg(200)->Unit(benchmark::kMillisecond);

void BM_funnel(benchmark::State& state) {
    const auto c = tally_of(30);
    for (auto _ : state) benchmark::DoNotOptimize(apart::funnel(c, 0.998, 0.95, state.range(0)));
}
BENCHMARK(BM_funnel)->Arg(50)->Arg(1000)->Unit(benchmark::kMillisecond);

}  // namespace

BENCHMARK_MAIN();
