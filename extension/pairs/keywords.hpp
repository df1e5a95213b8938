// pairs/keywords.hpp - the words users type for the options of the pairs
// family (RATES.DIFF.*, RATES.PAIR.P, RATES.PAIRS, RATES.ONE.*) and their
// engine enums. Parsing is arguments::keyword in the engine. No UNO types.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <utility>

#include "tallyrates/pairs/adjust.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"

namespace tallyrates::keywords {

using arguments::word;

inline constexpr std::array<word<pairwise::interval_method>, 4> difference_method{{
    {"newcombe", pairwise::interval_method::newcombe},
    {"score", pairwise::interval_method::score},
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
    {"bh", adjust::p_values::bh},
    {"bonferroni", adjust::p_values::bonferroni},
    {"sidak", adjust::p_values::sidak},
}};

// RATES.PAIRS: one word for both columns; Bonferroni and Sidak also widen
// the intervals to hold jointly, the step-wise methods adjust p only.
using table_adjust = std::pair<adjust::simultaneous, adjust::p_values>;
inline constexpr std::array<word<table_adjust>, 6> pairs_adjust{{
    {"holm", {adjust::simultaneous::none, adjust::p_values::holm}},
    {"hochberg", {adjust::simultaneous::none, adjust::p_values::hochberg}},
    {"bh", {adjust::simultaneous::none, adjust::p_values::bh}},
    {"bonferroni", {adjust::simultaneous::bonferroni, adjust::p_values::bonferroni}},
    {"sidak", {adjust::simultaneous::sidak, adjust::p_values::sidak}},
    {"none", {adjust::simultaneous::none, adjust::p_values::none}},
}};

inline constexpr std::array<word<one_rate::method>, 4> one_rate_method{{
    {"wilson", one_rate::method::wilson},
    {"exact", one_rate::method::exact},
    {"jeffreys", one_rate::method::jeffreys},
    {"agresti-coull", one_rate::method::agresti_coull},
}};

// The interval method of RATES.ONE.LOW/HIGH and RATES.PLAN.WIDTH; Wilson when omitted.
inline one_rate::method one_rate_method_or_wilson(const std::optional<std::string>& text) {
    return arguments::keyword_or(text, one_rate::default_method, one_rate_method, "method");
}

}  // namespace tallyrates::keywords
