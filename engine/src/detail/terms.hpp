// terms.hpp (detail) - each ordering statistic is a sum over groups of a term
// that depends on that group's successes only, once the margins are fixed:
//   X^2: (x - n S/N)^2 N^2 / (n S F)           (both cells of the column)
//   G^2: 2 [x ln(x / E) + (n - x) ln((n - x) / E')],  E = n S / N, E' = n F / N
//   probability: ln C(n, x_obs) - ln C(n, x)     (so the observed total is 0)
// This additivity is what the exact dynamic programme and the Monte Carlo
// route rely on: a table's statistic is a sum of table lookups.
#pragma once

#include <vector>

#include "tallyrates/omnibus/table.hpp"

namespace tallyrates::detail {

using omnibus::ordering;
using omnibus::table;

// ln C(n, k) by lgamma differences (Boost, long double inside): the observed
// table's probability. The term tables use a double-precision variant.
double log_choose(std::int64_t n, std::int64_t k);

// One term: the statistic's share from group g having x successes.
class term_function {
public:
    term_function(const table& t, ordering o);
    double operator()(std::size_t g, std::int64_t x) const;

private:
    const table& t_;
    ordering o_;
    double N_, S_, F_;
};

// Terms of one group over the successes it can have with these margins,
// max(0, n - F) .. min(n, S): at most min(n, S, F) + 1 values, so memory
// stays small even for huge attempt counts.
struct term_row {
    std::int64_t first = 0;
    std::vector<double> values;
    double operator[](std::int64_t x) const { return values[static_cast<std::size_t>(x - first)]; }
};
// Values the rows hold: the sum of min(n, S, F) + 1 over the groups.
double term_values(const table& t);
// At most this many (48 MB): part of every call's memory budget.
inline constexpr double max_term_values = 6e6;
// budget_exceeded when the rows would pass max_term_values.
std::vector<term_row> term_tables(const table& t, ordering o);

// Sum of the observed terms, in group order.
double observed_total(const table& t, ordering o);

// Tables whose statistic is at least this value count as "as extreme as the
// observed one": a relative tie tolerance of 1e-7 (methods.md), absolute for
// the probability ordering, whose observed total is 0 by construction.
double extreme_threshold(double observed, ordering o);

}  // namespace tallyrates::detail
