// planning/keywords.hpp - the words users type for the options of the
// planning family (RATES.PLAN.*) and their engine enums. The interval methods
// of RATES.PLAN.WIDTH are those of RATES.ONE.LOW (pairs/keywords.hpp). No UNO
// types.
#pragma once

#include <array>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/planning/planning.hpp"

namespace tallyrates::keywords {

using arguments::word;

inline constexpr std::array<word<planning::correction>, 2> correction{{
    {"none", planning::correction::none},
    {"continuity", planning::correction::continuity},
}};

}  // namespace tallyrates::keywords
