// check.hpp - RATES.CHECK: a sentence about the count ranges.
#pragma once

#include <optional>
#include <span>
#include <string>

#include "tallyrates/core/counts.hpp"
#include "tallyrates/omnibus/same_rates.hpp"

namespace tallyrates {

// Never throws for bad counts: the problem is the answer. `labels` (one per
// position, or none) name the groups in the sentence. With `asked` (a method
// other than auto), also says what that route would do or why it is refused.
// With `i` and/or `j` (the positions a pairs or one-rate function names),
// also checks that they name groups with attempts, and different ones.
struct positions_asked {
    std::optional<double> i, j;
};
std::string check_text(const cell_line& successes, const cell_line& attempts,
                       std::span<const std::string> labels = {}, const omnibus::options* asked = nullptr,
                       omnibus::result_cache* cache = nullptr, const positions_asked& positions = {});

// Where the smallest expected count is: "failures at position 4, Pilot oven".
std::string smallest_expected_place(const counts& c, const omnibus::expected_summary& e);

}  // namespace tallyrates
