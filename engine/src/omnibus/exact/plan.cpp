// plan.cpp (exact route) - the bounds of a pass (the exact minimum and
// maximum of what the groups not yet taken can add per success count, the
// pruning of methods.md) and the cost model of the set-up; method in
// network.cpp.
#include <algorithm>

#include "omnibus/exact/levels.hpp"

namespace tallyrates::omnibus::exact_network {

namespace {

// Units of set-up work per value of a probability-ordering term: its three
// lgamma calls take about 120 ns, some 64 units (2 x 12, N = 60: 17 us
// against 8 us for X^2), where a X^2 or G^2 term costs 2.
constexpr double probability_term_units = 64, statistic_term_units = 2;

// One level of `reach`: least[s] = min over x of term(x) + next_least[s + x]
// (likewise max). The loop runs over s inside x: every s is its own running
// minimum, so there is no chain of dependent min/max from one x to the next
// and the compiler vectorises it (the other way round made a near-table call
// at N = 150 a fifth slower, 61 against 49 us).
void reach_level(const detail::term_row& term, std::int64_t n_g, std::int64_t lo, std::int64_t hi,
                 std::int64_t next_lo, std::int64_t next_hi, const std::vector<double>& next_least,
                 const std::vector<double>& next_most, std::vector<double>& least, std::vector<double>& most) {
    least.assign(static_cast<std::size_t>(hi - lo + 1), inf);
    most.assign(least.size(), -inf);
    const std::int64_t xa = std::max<std::int64_t>(0, next_lo - hi), xb = std::min(n_g, next_hi - lo);
    for (std::int64_t x = xa; x <= xb; ++x) {
        // s + x must be a node of the next level.
        const std::int64_t sa = std::max(lo, next_lo - x), sb = std::min(hi, next_hi - x);
        if (sa > sb) continue;
        const double v = term[x];
        const std::size_t count = static_cast<std::size_t>(sb - sa + 1);
        double* a = least.data() + (sa - lo);
        double* b = most.data() + (sa - lo);
        const double* na = next_least.data() + (sa + x - next_lo);
        const double* nb = next_most.data() + (sa + x - next_lo);
        for (std::size_t i = 0; i < count; ++i) {
            a[i] = std::min(a[i], v + na[i]);
            b[i] = std::max(b[i], v + nb[i]);
        }
    }
}

}  // namespace

reach reach_of(const pass_plan& plan, const table& t, const std::vector<detail::term_row>& terms,
               std::vector<double> end_least, std::vector<double> end_most) {
    const std::size_t K = plan.levels();
    reach r{std::vector<std::vector<double>>(K + 1), std::vector<std::vector<double>>(K + 1)};
    r.least[K] = std::move(end_least);
    r.most[K] = std::move(end_most);
    for (std::size_t k = K; k-- > 0;) {
        const std::size_t g = plan.groups[k];
        reach_level(terms[g], t.n[g], plan.lo[k], plan.hi[k], plan.lo[k + 1], plan.hi[k + 1], r.least[k + 1],
                    r.most[k + 1], r.least[k], r.most[k]);
    }
    return r;
}

double values_of(const table& t, std::size_t g) {
    return static_cast<double>(std::min({t.n[g], t.successes, t.attempts - t.successes}) + 1);
}

// The term tables, and the reach of both passes (every (node, x) pair once
// each).
double setup_work(const table& t, ordering o) {
    const double S = static_cast<double>(t.successes), N = static_cast<double>(t.attempts);
    const double term_units = o == ordering::probability ? probability_term_units : statistic_term_units;
    double work = 0, placed = 0;
    for (std::size_t k = 0; k < t.groups(); ++k) {
        const double lo = std::max<double>(0, S - (N - placed));
        const double hi = std::min<double>(S, placed);
        work += 2 * (hi - lo + 1) * values_of(t, k) + values_of(t, k) * term_units;
        placed += static_cast<double>(t.n[k]);
    }
    return work;
}

}  // namespace tallyrates::omnibus::exact_network
