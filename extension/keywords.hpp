// keywords.hpp - the words users type for methods and options, and their
// enums. One table per option; parsing is case-insensitive, and an unknown
// word is an error that lists the allowed ones. No UNO types.
#pragma once

#include <algorithm>
#include <array>
#include <cctype>
#include <span>
#include <string>
#include <string_view>

#include "tallyrates/errors.hpp"
#include "tallyrates/omnibus.hpp"

namespace tallyrates::keywords {

template <class E>
struct word {
    std::string_view text;
    E value;
};

inline constexpr std::array<word<omnibus::method>, 7> omnibus_method{{
    {"auto", omnibus::method::automatic},
    {"pearson", omnibus::method::pearson},
    {"lr", omnibus::method::lr},
    {"exact", omnibus::method::exact},
    {"exact-lr", omnibus::method::exact_lr},
    {"exact-prob", omnibus::method::exact_prob},
    {"montecarlo", omnibus::method::monte_carlo},
}};

inline constexpr std::array<word<omnibus::ordering>, 2> statistic{{
    {"pearson", omnibus::ordering::pearson},
    {"lr", omnibus::ordering::lr},
}};

inline constexpr std::array<word<omnibus::trend_variance>, 2> trend_variance{{
    {"binomial", omnibus::trend_variance::binomial},
    {"conditional", omnibus::trend_variance::conditional},
}};

template <class E, std::size_t K>
E parse(std::string_view text, const std::array<word<E>, K>& words, const char* argument) {
    auto lower = [](std::string_view s) {
        std::string out(s);
        for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
        // Surrounding spaces are a typing accident, not a different word.
        const auto b = out.find_first_not_of(' '), e = out.find_last_not_of(' ');
        return b == std::string::npos ? std::string() : out.substr(b, e - b + 1);
    };
    const std::string key = lower(text);
    for (const auto& w : words)
        if (w.text == key) return w.value;
    std::string allowed;
    for (std::size_t k = 0; k < K; ++k) allowed += (k ? ", \"" : "\"") + std::string(words[k].text) + "\"";
    throw invalid_input(std::string("The argument ") + argument + " must be one of " + allowed + "; got \"" +
                        std::string(text) + "\".");
}

template <class E, std::size_t K>
std::string_view text_of(E value, const std::array<word<E>, K>& words) {
    for (const auto& w : words)
        if (w.value == value) return w.text;
    return {};
}

}  // namespace tallyrates::keywords
