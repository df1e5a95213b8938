// apart/keywords.hpp - the words users type for the options of the apart
// family (RATES.APART*) and their engine enums. Parsing is
// arguments::keyword in the engine. No UNO types.
#pragma once

#include <array>

#include "tallyrates/apart/limits.hpp"
#include "tallyrates/core/arguments.hpp"

namespace tallyrates::keywords {

inline constexpr std::array<arguments::word<apart::family>, 2> apart_family{{
    {"all", apart::family::all},
    {"each", apart::family::each},
}};

inline constexpr std::array<arguments::word<apart::method>, 2> apart_method{{
    {"exact", apart::method::exact},
    {"normal", apart::method::normal},
}};

inline constexpr std::array<arguments::word<apart::spread>, 2> apart_spread{{
    {"none", apart::spread::none},
    {"time", apart::spread::time},
}};

// RATES.PRIOR.FIT: which parameter of the fitted prior the cell shows.
enum class prior_part { a, b };
inline constexpr std::array<arguments::word<prior_part>, 2> prior_part_word{{
    {"a", prior_part::a},
    {"b", prior_part::b},
}};

}  // namespace tallyrates::keywords
