// arguments.cpp - see arguments.hpp.
#include "tallyrates/core/arguments.hpp"

#include <cctype>
#include <cmath>

#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::arguments {

namespace {
std::string the(const char* name) { return std::string("The argument ") + name; }
}  // namespace

std::int64_t whole(double value, double low, double high, const char* name) {
    if (!std::isfinite(value) || value != std::floor(value) || value < low)
        throw invalid_input(the(name) + " (" + format_number(value) + ") must be a whole number of at least " +
                            format_number(low) + ".");
    if (value > high)
        throw budget_exceeded(the(name) + " (" + format_number(value) + ") is above the cap of " +
                              format_number(high) + ".");
    return static_cast<std::int64_t>(value);
}

std::int64_t whole_or(std::optional<double> value, std::int64_t fallback, double low, double high, const char* name) {
    return value ? whole(*value, low, high, name) : fallback;
}

std::size_t position(double value, std::size_t size, const char* name) {
    if (!std::isfinite(value) || value != std::floor(value) || value < 1 || value > static_cast<double>(size))
        throw invalid_input(the(name) + " (" + format_number(value) + ") must be a whole position from 1 to " +
                            std::to_string(size) + ", counting rows of the range.");
    return static_cast<std::size_t>(value);
}

double level(double value, const char* name) {
    if (!(value > 0 && value < 1))
        throw invalid_input(the(name) + " (" + format_number(value) +
                            ") must lie strictly between 0 and 1, for example 0.95 for 95 %.");
    return value;
}

double interval_level(double value, sides s, const char* name) {
    level(value, name);
    if (s == sides::two) return value;
    if (!(value >= 0.5))
        out_of_range(name, value, "be at least 0.5 when the bound is one-sided (sides \"one\"), for example 0.95");
    return 2 * value - 1;  // exact for value in [0.5, 1] (Sterbenz)
}

double rate(double value, const char* name) {
    if (!(value >= 0 && value <= 1)) out_of_range(name, value, "lie between 0 and 1, a fraction such as 0.99 for 99 %");
    return value;
}

void out_of_range(const char* name, double value, const std::string& rule) {
    throw invalid_input(the(name) + " (" + format_number(value) + ") must " + rule + ".");
}

void not_a_number(const char* name) { throw invalid_input(the(name) + " must be a single number."); }
void not_a_word(const char* name) { throw invalid_input(the(name) + " must be a word in quotes."); }
void not_a_range(const char* name) { throw invalid_input(the(name) + " must be a range of cells."); }
void not_one_line(const char* name, std::size_t rows, std::size_t columns) {
    throw invalid_input(the(name) + " is a block of " + std::to_string(rows) + " rows and " +
                        std::to_string(columns) + " columns; select one column or one row.");
}

std::string normalised(std::string_view text) {
    std::string out(text);
    for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    const auto b = out.find_first_not_of(' '), e = out.find_last_not_of(' ');
    return b == std::string::npos ? std::string() : out.substr(b, e - b + 1);
}

void unknown_word(const char* name, std::string_view got, std::span<const std::string_view> allowed) {
    std::string list;
    for (std::size_t k = 0; k < allowed.size(); ++k) list += (k ? ", \"" : "\"") + std::string(allowed[k]) + "\"";
    throw invalid_input(the(name) + " must be one of " + list + "; got \"" + std::string(got) + "\".");
}

}  // namespace tallyrates::arguments
