// Benchmarks of the omnibus routes (targets in the README: exact 2 x 12 under 10 ms at
// N <= 150 and under 1 s at N <= 500 for each ordering; Monte Carlo at most
// 1 us per table at N = 5,000; the automatic route never above 250 ms).
// Figures go into the README; nothing here passes or fails.
#include <benchmark/benchmark.h>

#include <cmath>

#include "tallyrates/omnibus/same_rates.hpp"

using namespace tallyrates;
using namespace tallyrates::omnibus;

namespace {

// 2 x 12 with equal attempts N / 12 and rates rising gently from 0.40 to 0.62:
// a table near the middle of its reference distribution, where pruning helps
// least.
table twelve_groups(std::int64_t N, double low = 0.40, double step = 0.02) {
    std::vector<std::int64_t> x, n;
    for (int g = 0; g < 12; ++g) {
        const std::int64_t ng = N / 12;
        n.push_back(ng);
        x.push_back(static_cast<std::int64_t>(static_cast<double>(ng) * (low + step * g)));
    }
    return table_of(counts::from_values(x, n));
}

void run_exact(benchmark::State& state, const table& t, ordering o) {
    std::uint64_t work = 0;
    double p = 0;
    for (auto _ : state) {
        const auto r = exact_p(t, o, 1ull << 40, 1u << 24);
        work = r.work;
        p = r.p;
        benchmark::DoNotOptimize(r.p);
    }
    state.counters["work"] = static_cast<double>(work);
    state.counters["log10p"] = std::log10(p);
}
void exact(benchmark::State& state, ordering o) { run_exact(state, twelve_groups(state.range(0)), o); }
void BM_exact_pearson(benchmark::State& s) { exact(s, ordering::pearson); }
void BM_exact_lr(benchmark::State& s) { exact(s, ordering::lr); }
void BM_exact_prob(benchmark::State& s) { exact(s, ordering::probability); }
BENCHMARK(BM_exact_pearson)->Arg(60)->Arg(150)->Arg(240)->Arg(500)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_exact_lr)->Arg(60)->Arg(150)->Arg(240)->Arg(500)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_exact_prob)->Arg(60)->Arg(150)->Arg(240)->Arg(500)->Unit(benchmark::kMillisecond);

// The same near table between and beyond those sizes, each ordering (0 X^2,
// 1 G^2, 2 probability): the README asks for no slowdown at any N up to 1,000,
// and the network changes its plan with N (when its back pass starts).
void BM_exact_near_sweep(benchmark::State& s) {
    run_exact(s, twelve_groups(s.range(0)), static_cast<ordering>(s.range(1)));
}
BENCHMARK(BM_exact_near_sweep)
    ->ArgsProduct({{90, 120, 180, 210, 270, 300, 360, 420, 600, 720, 840, 960}, {0, 1, 2}})
    ->Unit(benchmark::kMillisecond);

// The same shape far from "one shared rate": rates 0.10, 0.17, ..., 0.83, so
// the p-value is tiny and pruning has little to cut.
void exact_far(benchmark::State& state, ordering o) {
    run_exact(state, twelve_groups(state.range(0), 0.10, 0.8 / 11), o);
}
void BM_exact_far_pearson(benchmark::State& s) { exact_far(s, ordering::pearson); }
void BM_exact_far_lr(benchmark::State& s) { exact_far(s, ordering::lr); }
void BM_exact_far_prob(benchmark::State& s) { exact_far(s, ordering::probability); }
BENCHMARK(BM_exact_far_pearson)->Arg(60)->Arg(150)->Arg(240)->Arg(500)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_exact_far_lr)->Arg(60)->Arg(150)->Arg(240)->Arg(500)->Unit(benchmark::kMillisecond);
BENCHMARK(BM_exact_far_prob)->Arg(60)->Arg(150)->Arg(240)->Arg(500)->Unit(benchmark::kMillisecond);

void BM_monte_carlo_per_table(benchmark::State& state) {
    const table t = twelve_groups(state.range(0));
    const std::int64_t draws = 200000;
    for (auto _ : state) {
        const auto r = monte_carlo_p(t, ordering::pearson, draws, default_seed, 1, 1ull << 40);
        benchmark::DoNotOptimize(r.extreme);
    }
    state.SetItemsProcessed(state.iterations() * draws);  // items/s = tables per second
}
BENCHMARK(BM_monte_carlo_per_table)->Arg(240)->Arg(5000)->Unit(benchmark::kMillisecond);

// twelve_groups(N) with its first group replaced by a small one.
table with_small_group(std::int64_t N, std::int64_t x0, std::int64_t n0) {
    table t = twelve_groups(N);
    t.x[0] = x0;
    t.n[0] = n0;
    return t;
}

// The automatic route on the inputs that make it work hardest: small expected
// counts where exact is affordable only just, or not at all.
void BM_auto(benchmark::State& state) {
    table t;
    switch (state.range(0)) {
        case 0: t = with_small_group(500, 1, 3); break;    // exact fits
        case 1:                                            // tiny group beside huge ones
            t.x = {3, 40000, 41000, 39000, 40500, 40200, 39900, 40100, 40300, 39800, 40050, 39950};
            t.n = {5, 80000, 80000, 80000, 80000, 80000, 80000, 80000, 80000, 80000, 80000, 80000};
            break;
        case 2: t = with_small_group(1200, 2, 4); break;   // exact at its cap
        case 3: t = with_small_group(3000, 1, 4); break;   // exact attempt fails, then Monte Carlo
        default:                                           // rare defects: N = 120,000, S = 40
            t.x = {2, 5, 3, 4, 1, 6, 2, 3, 4, 5, 3, 2};
            t.n.assign(12, 10000);
            break;
    }
    const std::vector<std::int64_t> x = t.x, n = t.n;
    const auto c = counts::from_values(x, n);
    route used = route::pearson;
    for (auto _ : state) {
        const auto r = same_rates(c, options{});
        used = r.used;
        benchmark::DoNotOptimize(r.p);
    }
    state.counters["route"] = static_cast<double>(used);  // 0 pearson, 2 exact, 3 monte carlo
}
BENCHMARK(BM_auto)->DenseRange(0, 4)->Unit(benchmark::kMillisecond);

}  // namespace

BENCHMARK_MAIN();
