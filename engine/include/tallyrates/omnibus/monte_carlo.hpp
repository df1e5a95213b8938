// monte_carlo.hpp - the Monte Carlo p-value with fixed margins, by
// sequential hypergeometric draws (the 2 x G case of Patefield 1981, AS 159),
// p = (1 + extreme) / (B + 1) (Davison & Hinkley 1997; Phipson & Smyth 2010).
#pragma once

#include <cstdint>

#include "tallyrates/omnibus/table.hpp"

namespace tallyrates::omnibus {

// Fewest draws a Monte Carlo p-value is given from: with fewer, its own
// error (about 0.007 at p = 0.05) would be of the order of the decisions it
// serves (Davison & Hinkley 1997, 4.2.5, on choosing the number of draws).
inline constexpr std::int64_t min_draws = 1000;

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
// when foreseen, below min_draws).
monte_carlo_outcome monte_carlo_p(const table& t, ordering o, std::int64_t draws, std::uint64_t seed,
                                  unsigned threads, std::uint64_t work_cap, bool fit_to_work = false);

}  // namespace tallyrates::omnibus
