// omnibus.hpp - "do all groups share one success rate?" on the 2 x G table.
//
// Statistics: Pearson X^2 and likelihood-ratio G^2 with G - 1 degrees of
// freedom (Agresti 2002, Categorical Data Analysis, sections 1.5 and 3.2).
// Exact conditional test: margins fixed, the table follows the multivariate
// hypergeometric law; tables ordered by X^2, by G^2 or by their probability
// (Freeman & Halton 1951). Monte Carlo with fixed margins by sequential
// hypergeometric draws (the 2 x G case of Patefield 1981, AS 159), p-value
// (1 + extreme) / (B + 1) (Davison & Hinkley 1997; Phipson & Smyth 2010).
// The trend test across ordered groups is in trend.hpp.
//
// Groups with no attempts carry no information about a shared rate and are
// left out; at least two groups with attempts are needed.
#pragma once

#include <cstdint>
#include <span>
#include <string>
#include <optional>
#include <vector>

#include "tallyrates/cache.hpp"
#include "tallyrates/counts.hpp"
#include "tallyrates/errors.hpp"

namespace tallyrates::omnibus {

// The statistic that orders tables from least to most extreme.
enum class ordering { pearson, lr, probability };

// What the user asked for (functions.md, RATES.SAME.P).
enum class method { automatic, pearson, lr, exact, exact_lr, exact_prob, monte_carlo };

// What was actually computed.
enum class route { pearson, lr, exact, monte_carlo, all_alike };

// Fixed default seed: same result at every recalculation and on every machine.
inline constexpr std::uint64_t default_seed = 20260101;
inline constexpr std::int64_t default_draws = 100000;
// Largest seed: every whole number up to 2^53 is exact in a cell.
inline constexpr double max_seed = 9007199254740992.0;

// Hard caps on user-requested work (Err:523 past them) and the share of the
// 250 ms budget that the automatic route may spend on each attempt. Work is
// counted in deterministic units (see exact.cpp and monte_carlo.cpp), never in
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

// The groups with attempts, as the table the tests work on.
struct table {
    std::vector<std::int64_t> x;  // successes per group
    std::vector<std::int64_t> n;  // attempts per group
    std::vector<std::size_t> position;  // each group's 1-based position in the range
    std::int64_t successes = 0;
    std::int64_t attempts = 0;
    std::size_t groups() const { return n.size(); }
    // No attempt or every attempt succeeded: every group shows the same rate,
    // only one table has these margins, and p = 1 by every route.
    bool all_alike() const { return successes == 0 || successes == attempts; }
};
// invalid_input unless at least two groups have attempts.
table table_of(const counts& c);

struct expected_summary {
    double smallest = 0;           // smallest expected count over the 2 x G cells
    std::size_t smallest_position = 0;  // the group it belongs to (position in the range)
    bool smallest_is_failures = false;  // expected failures rather than successes
    std::size_t below_five = 0;    // cells with expected count < 5
    std::size_t cells = 0;         // 2 x G
};
expected_summary expected_counts(const table& t);

// Adjusted standardized residual of each group's successes under one shared
// rate (Haberman 1973, Biometrics 29:205): (x - E) / sqrt(E (1 - n/N)(1 - S/N)),
// about standard normal when the rates are alike, so a group beyond about +-2
// stands out. One value per position of the range (a range longer than
// 65,536 rows, such as a whole column, only down to its last group); blank
// rows and groups without attempts have none. All 0 when every attempt (or
// none) succeeded.
std::vector<std::optional<double>> adjusted_residuals(const counts& c);

// The observed statistic: X^2, G^2, or for ordering::probability the
// probability of the observed table under the hypothesis of one shared rate.
double statistic(const table& t, ordering o);

struct exact_outcome {
    double p = 0;        // exact p-value (ties within relative 1e-7 count as extreme)
    double p_low = 0;    // certified bounds on it: they differ only when partial
    double p_high = 0;   //   statistic values were merged on a coarse grid
    std::uint64_t work = 0;
    bool complete = false;  // false: the work cap was reached; nothing else is valid
    bool too_large = false;  // stopped before enumerating: no coarser pass can fit either
    std::string stopped;    // why it stopped, when not complete
};
// Exact conditional p-value. `merge_width` is the relative width within which
// partial statistic values are merged: 1e-9 gives the exact answer, a coarse
// width gives certified bounds at lower cost.
// The work is shared by up to `threads` threads; the outcome (p, bounds,
// refusal) is the same bit for bit whatever their number.
exact_outcome exact_p(const table& t, ordering o, std::uint64_t work_cap, std::size_t max_buckets,
                      double merge_width = 1e-9, unsigned threads = 2);

struct monte_carlo_outcome {
    std::int64_t draws = 0;
    std::int64_t extreme = 0;  // simulated tables at least as extreme as observed
    double p = 0;              // (1 + extreme) / (draws + 1)
    double standard_error = 0;
    double low = 0, high = 0;  // 95% Clopper-Pearson interval for the exact p-value
    std::uint64_t work = 0;
};
// Throws budget_exceeded, before building anything, when the planned work
// of the draws (monte_carlo.cpp) is above work_cap or the term tables would
// not fit memory. With fit_to_work, draws is an upper limit instead: drawing
// stops (at a point fixed by the inputs) once the work reaches the cap, and
// `draws` in the outcome says how many were made (budget_exceeded, at once
// when foreseen, below 1,000).
monte_carlo_outcome monte_carlo_p(const table& t, ordering o, std::int64_t draws, std::uint64_t seed,
                                  unsigned threads, std::uint64_t work_cap, bool fit_to_work = false);

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
