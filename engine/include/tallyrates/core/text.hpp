// text.hpp - numbers as they appear inside sentences (messages, RATES.CHECK,
// the report's "why" row).
#pragma once

#include <cstdint>
#include <string>
#include <string_view>

namespace tallyrates {

// Whole numbers without a decimal point (1e15 and above in exponent form);
// others with up to 6 significant digits. For arguments and counts the user
// typed, which must be recognisable.
std::string format_number(double v);

// A computed quantity in a sentence: 3 significant digits (0.0426, 1.23e-21),
// whole numbers in full.
std::string format_short(double v);

// A whole number with thousands separators, as rules are quoted in
// sentences: 1000 -> "1,000".
std::string format_grouped(std::int64_t v);

// How a cell that answers in words reports bad input: "problem: " and the
// sentence (RATES.CHECK, the first cell of a table).
std::string problem_text(std::string_view why);

// "1 group" / "3 groups".
std::string count_of(std::size_t n, const char* singular, const char* plural);

}  // namespace tallyrates
