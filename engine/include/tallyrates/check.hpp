// check.hpp - RATES.CHECK: a sentence about the count ranges.
#pragma once

#include <span>
#include <string>

#include "tallyrates/counts.hpp"

namespace tallyrates {

// Never throws for bad counts: the problem is the answer.
std::string check_text(std::span<const entry> successes, std::span<const entry> attempts);

}  // namespace tallyrates
