// exact.hpp - the exact conditional p-value of the 2 x G table: margins
// fixed, the table follows the multivariate hypergeometric law; tables
// ordered by X^2, by G^2 or by their probability (Freeman & Halton 1951),
// summed over a network of partial tables (Mehta & Patel 1983, JASA 78:427;
// src/omnibus/exact/ for the method).
#pragma once

#include <cstdint>
#include <string>

#include "tallyrates/omnibus/table.hpp"

namespace tallyrates::omnibus {

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
// The merge width of the exact answer (far below the tie tolerance, so every
// tie is resolved as in a plain enumeration), and of the coarse pass that
// gives certified bounds beside a refusal, with its share of the work cap.
inline constexpr double exact_merge_width = 1e-9, coarse_merge_width = 1e-2;
inline constexpr std::uint64_t coarse_work_share = 4;  // a quarter of the cap

}  // namespace tallyrates::omnibus
