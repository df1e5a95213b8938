// bayes/keywords.hpp - the words users type for the options of the Bayesian
// family (RATES.POST.*) and their engine enums. Parsing is arguments::keyword
// in the engine. No UNO types.
#pragma once

#include <array>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/bayes/law.hpp"
#include "../shared_keywords.hpp"

namespace tallyrates::keywords {

using arguments::word;

inline constexpr std::array<word<bayes::kind>, 3> credible_kind{{
    {"central", bayes::kind::central},
    {"hpd", bayes::kind::hpd},
    {"one-sided", bayes::kind::one_sided},
}};

inline constexpr std::array<word<bayes::curve_span>, 2> curve_span{{
    {"whole", bayes::curve_span::whole},
    {"likely", bayes::curve_span::likely},
}};

}  // namespace tallyrates::keywords
