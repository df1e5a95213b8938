// same_rates.hpp - "do all groups share one success rate?": the analysis
// behind RATES.SAME.P and RATES.SAME.REPORT, choosing among the chi-square
// approximations (table.hpp), the exact p-value (exact.hpp) and Monte Carlo
// (monte_carlo.hpp), with a memo of results and refusals. The trend test
// across ordered groups is in trend.hpp.
#pragma once

#include <cstdint>
#include <string>

#include "tallyrates/core/cache.hpp"
#include "tallyrates/core/counts.hpp"
#include "tallyrates/omnibus/exact.hpp"
#include "tallyrates/omnibus/monte_carlo.hpp"
#include "tallyrates/omnibus/table.hpp"

namespace tallyrates::omnibus {

// What the user asked for (functions.md, RATES.SAME.P).
enum class method { automatic, pearson, lr, exact, exact_lr, exact_prob, monte_carlo, tarone };

// What was actually computed.
enum class route { pearson, lr, exact, monte_carlo, all_alike, tarone };

// Fixed default seed: same result at every recalculation and on every machine.
inline constexpr std::uint64_t default_seed = 20260101;
inline constexpr std::int64_t default_draws = 100000;
// Largest seed: every whole number up to 2^53 is exact in a cell.
inline constexpr double max_seed = 9007199254740992.0;

// Hard caps on user-requested work (Err:523 past them) and the share of the
// 250 ms budget that the automatic route may spend on each attempt. Work is
// counted in deterministic units (see src/omnibus/exact/ and monte_carlo.cpp), never in
// seconds, so that the route chosen depends on the inputs only.
struct limits {
    // Calibrated on this project's 2-core machine (README, bench_exact and
    // bench_omnibus): about 1.3-2 ns per exact work unit on two threads
    // (twice that on one) and 8 ns per Monte Carlo unit.
    std::uint64_t exact_work = 3'000'000'000;  // about 5 s, for "exact" asked by name
    std::uint64_t auto_exact_work = 40'000'000;  // about 60 ms
    std::int64_t max_draws = 10'000'000;
    std::uint64_t monte_carlo_work = 600'000'000;  // about 5 s, for draws asked by name (planned up front)
    std::uint64_t auto_monte_carlo_work = 12'000'000;  // about 100 ms (the two autos stay under 250 ms)
    std::size_t max_buckets = 16'000'000;  // partial values of the exact network held at once (24 bytes each)
    std::size_t auto_max_buckets = 1'000'000;  // the same for "auto" (24 MB)
    auto operator<=>(const limits&) const = default;
};

struct options {
    method how = method::automatic;
    // Checked by same_rates (arguments::whole with the caps below).
    std::int64_t draws = default_draws;
    std::uint64_t seed = default_seed;
    unsigned threads = 1;  // Monte Carlo only; the result does not depend on it
    limits caps{};
};

struct result {
    method requested = method::automatic;
    route used = route::pearson;
    ordering order = ordering::pearson;
    double statistic = 0;
    int df = 0;
    double p = 1;
    std::string why;  // one sentence: why this route
    expected_summary expected;
    bool has_monte_carlo = false;
    monte_carlo_outcome mc;
    bool has_exact = false;
    exact_outcome exact;
};

// Memo of analyses keyed by the table and every option that changes the
// answer (threads does not).
struct analysis_key {
    std::vector<std::int64_t> x, n;
    method how;
    std::int64_t draws;
    std::uint64_t seed;
    limits caps;
    auto operator<=>(const analysis_key&) const = default;
};
// Refusals are remembered too: a refused exact run costs up to two work caps,
// and a sheet asks RATES.SAME.P and RATES.SAME.REPORT the same question.
struct refusal {
    std::string message;
    bool has_bounds = false;
    double p_low = 0, p_high = 1;
};
struct result_cache {
    explicit result_cache(std::size_t capacity = 64) : results(capacity), refusals(capacity) {}
    lru_cache<analysis_key, result> results;
    lru_cache<analysis_key, refusal> refusals;
};

// The whole analysis for RATES.SAME.P / RATES.SAME.REPORT. Throws
// invalid_input, budget_exceeded (exact_refused for the exact route) when a
// requested route does not fit. With a cache, a repeated question is a lookup.
result same_rates(const counts& c, const options& opt, result_cache* cache = nullptr);

// Which route "auto" takes and why, without computing the p-value beyond what
// the choice needs (used by RATES.CHECK).
std::string auto_route_advice(const counts& c, result_cache* cache = nullptr);

}  // namespace tallyrates::omnibus
