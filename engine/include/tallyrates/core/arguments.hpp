// arguments.hpp - the rules for worksheet arguments other than the count
// ranges (those are in counts.hpp): whole numbers, positions, levels and
// keywords, and every "The argument ..." sentence. The extension only says
// what a cell held (a number, a word, nothing); the judgement is made here,
// once for every function.
#pragma once

#include <array>
#include <cstddef>
#include <cstdint>
#include <optional>
#include <span>
#include <string>
#include <string_view>

#include "tallyrates/core/rules.hpp"

namespace tallyrates::arguments {

// A whole number in [low, high]. Not whole, not finite or below `low`:
// invalid_input (Err:502). Above `high`, a request for more work than the
// cap allows: budget_exceeded (Err:523), naming the cap.
std::int64_t whole(double value, double low, double high, const char* name);
std::int64_t whole_or(std::optional<double> value, std::int64_t fallback, double low, double high, const char* name);

// A 1-based position in a range of `size` rows.
std::size_t position(double value, std::size_t size, const char* name);

// A confidence or credible level strictly between 0 and 1.
double level(double value, const char* name);
// The level every function uses when none is given.
inline constexpr double default_level = 0.95;
// The level of the two-sided interval whose ends are the bounds asked:
// `level` itself for sides "two"; for "one" each end alone holds at `level`,
// so the interval has 2 level - 1 (each tail 1 - level; 0 at level 0.5, the
// median claim of reliability demonstrations), and `level` must be at least
// 0.5. Checked as `level` above.
double interval_level(double value, sides s, const char* name);

// A rate: a fraction from 0 to 1 inclusive.
double rate(double value, const char* name);

// Any other range rule: "The argument NAME (VALUE) must RULE."
[[noreturn]] void out_of_range(const char* name, double value, const std::string& rule);

// What a cell held when a number, a word or a range was wanted.
[[noreturn]] void not_a_number(const char* name);
[[noreturn]] void not_a_word(const char* name);
[[noreturn]] void not_a_range(const char* name);
[[noreturn]] void not_one_line(const char* name, std::size_t rows, std::size_t columns);

// ---- keywords: lower-case words of the trade, matched without regard to case ----
template <class E>
struct word {
    std::string_view text;
    E value;
};

// Lower case, surrounding spaces removed (a typing accident, not another word).
std::string normalised(std::string_view text);
[[noreturn]] void unknown_word(const char* name, std::string_view got, std::span<const std::string_view> allowed);

template <class E, std::size_t K>
E keyword(std::string_view text, const std::array<word<E>, K>& words, const char* name) {
    const std::string key = normalised(text);
    for (const auto& w : words)
        if (w.text == key) return w.value;
    std::array<std::string_view, K> allowed;
    for (std::size_t k = 0; k < K; ++k) allowed[k] = words[k].text;
    unknown_word(name, text, allowed);
}

template <class E, std::size_t K>
E keyword_or(const std::optional<std::string>& text, E fallback, const std::array<word<E>, K>& words,
             const char* name) {
    return text ? keyword(*text, words, name) : fallback;
}

template <class E, std::size_t K>
std::string_view text_of(E value, const std::array<word<E>, K>& words) {
    for (const auto& w : words)
        if (w.value == value) return w.text;
    return {};
}

}  // namespace tallyrates::arguments
