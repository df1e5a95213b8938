// shared_keywords.hpp - the words users type for options that several
// families share (goal, sides) and their engine enums (core/rules.hpp).
// Parsing is arguments::keyword in the engine. No UNO types.
#pragma once

#include <array>
#include <optional>
#include <string>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/rules.hpp"

namespace tallyrates::keywords {

inline constexpr std::array<arguments::word<tallyrates::goal>, 2> goal{{
    {"high", tallyrates::goal::high},
    {"low", tallyrates::goal::low},
}};

inline constexpr std::array<arguments::word<tallyrates::sides>, 2> sides{{
    {"two", tallyrates::sides::two},
    {"one", tallyrates::sides::one},
}};

inline tallyrates::goal goal_or_default(const std::optional<std::string>& text) {
    return arguments::keyword_or(text, default_goal, goal, "goal");
}

inline tallyrates::sides sides_or_default(const std::optional<std::string>& text) {
    return arguments::keyword_or(text, default_sides, sides, "sides");
}

}  // namespace tallyrates::keywords
