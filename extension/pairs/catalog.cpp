// pairs/catalog.cpp - wizard texts of the pairs family: comparisons of two
// groups (functions.md, "Pairs of groups and single groups"). Wording is ours.
#include <array>

#include "../catalog.hpp"
#include "../shared_arguments.hpp"

namespace tallyrates::catalog {

namespace {

constexpr std::array diff_args{shared::successes, shared::attempts, shared::i, shared::j};

constexpr std::array table{
    function{"diff", "RATES.DIFF",
             "Observed rate of group i minus rate of group j, as a fraction: format the cell as % to read it in "
             "percentage points (0.047 is 4.7 points), not as a relative change. If the cell shows Err:502, "
             "RATES.CHECK on the same ranges says why.",
             diff_args},
};

}  // namespace

std::span<const function> pairs_functions() { return table; }

}  // namespace tallyrates::catalog
