// omnibus/keywords.hpp - the words users type for the options of the omnibus
// family (RATES.CHECK, RATES.SAME.*, RATES.TREND.*) and their engine enums.
// Parsing (case-insensitive, an error listing the allowed words) is
// arguments::keyword in the engine. No UNO types.
#pragma once

#include <array>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/omnibus/trend.hpp"

namespace tallyrates::keywords {

using arguments::word;

inline constexpr std::array<word<omnibus::method>, 8> omnibus_method{{
    {"auto", omnibus::method::automatic},
    {"pearson", omnibus::method::pearson},
    {"lr", omnibus::method::lr},
    {"exact", omnibus::method::exact},
    {"exact-lr", omnibus::method::exact_lr},
    {"exact-prob", omnibus::method::exact_prob},
    {"montecarlo", omnibus::method::monte_carlo},
    {"tarone", omnibus::method::tarone},
}};

inline constexpr std::array<word<omnibus::ordering>, 2> statistic{{
    {"pearson", omnibus::ordering::pearson},
    {"lr", omnibus::ordering::lr},
}};

inline constexpr std::array<word<trend::variance>, 2> trend_variance{{
    {"binomial", trend::variance::binomial},
    {"conditional", trend::variance::conditional},
}};

}  // namespace tallyrates::keywords
