// pairs/keywords.hpp - the words users type for the options of the pairs
// family (RATES.DIFF.*, RATES.PAIR.P, RATES.PAIRS, RATES.MARGIN.P, RATES.ONE.*) and their
// engine enums. Parsing is arguments::keyword in the engine. No UNO types.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <utility>

#include "tallyrates/pairs/adjust.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/pairs/margin.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "../shared_keywords.hpp"

namespace tallyrates::keywords {

using arguments::word;

inline constexpr std::array<word<pairwise::interval_method>, 4> difference_method{{
    {"miettinen-nurminen", pairwise::interval_method::miettinen_nurminen},
    {"newcombe", pairwise::interval_method::newcombe},
    {"agresti-caffo", pairwise::interval_method::agresti_caffo},
    {"wald", pairwise::interval_method::wald},
}};

inline constexpr std::array<word<adjust::simultaneous>, 3> simultaneous{{
    {"none", adjust::simultaneous::none},
    {"bonferroni", adjust::simultaneous::bonferroni},
    {"sidak", adjust::simultaneous::sidak},
}};

inline constexpr std::array<word<pairwise::family>, 2> family{{
    {"all", pairwise::family::all},
    {"against", pairwise::family::against},
}};

inline constexpr std::array<word<pairwise::test_method>, 2> pair_test{{
    {"score", pairwise::test_method::score},
    {"exact", pairwise::test_method::exact},
}};

inline constexpr std::array<word<adjust::p_values>, 6> p_adjust{{
    {"none", adjust::p_values::none},
    {"holm", adjust::p_values::holm},
    {"hochberg", adjust::p_values::hochberg},
    {"benjamini-hochberg", adjust::p_values::benjamini_hochberg},
    {"bonferroni", adjust::p_values::bonferroni},
    {"sidak", adjust::p_values::sidak},
}};

// RATES.PAIRS: one word for both columns; Bonferroni and Sidak also widen
// the intervals to hold jointly, the step-wise methods adjust p only.
using table_adjust = std::pair<adjust::simultaneous, adjust::p_values>;
inline constexpr std::array<word<table_adjust>, 6> pairs_adjust{{
    {"none", {adjust::simultaneous::none, adjust::p_values::none}},
    {"holm", {adjust::simultaneous::none, adjust::p_values::holm}},
    {"hochberg", {adjust::simultaneous::none, adjust::p_values::hochberg}},
    {"benjamini-hochberg", {adjust::simultaneous::none, adjust::p_values::benjamini_hochberg}},
    {"bonferroni", {adjust::simultaneous::bonferroni, adjust::p_values::bonferroni}},
    {"sidak", {adjust::simultaneous::sidak, adjust::p_values::sidak}},
}};

inline constexpr std::array<word<pairwise::claim>, 3> claim{{
    {"not-worse", pairwise::claim::not_worse},
    {"better", pairwise::claim::better},
    {"equivalent", pairwise::claim::equivalent},
}};

inline constexpr std::array<word<one_rate::method>, 4> one_rate_method{{
    {"wilson", one_rate::method::wilson},
    {"clopper-pearson", one_rate::method::clopper_pearson},
    {"jeffreys", one_rate::method::jeffreys},
    {"agresti-coull", one_rate::method::agresti_coull},
}};

// The interval method of RATES.ONE.LOW/HIGH and RATES.PLAN.WIDTH; Wilson when omitted.
inline one_rate::method one_rate_method_or_wilson(const std::optional<std::string>& text) {
    return arguments::keyword_or(text, one_rate::default_method, one_rate_method, "method");
}

}  // namespace tallyrates::keywords
