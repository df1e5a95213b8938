// text.cpp - see text.hpp.
#include "tallyrates/core/text.hpp"

#include <cmath>
#include <cstdio>

namespace tallyrates {

std::string format_number(double v) {
    char buf[64];
    if (std::isfinite(v) && v == std::floor(v) && std::fabs(v) < 1e15)
        std::snprintf(buf, sizeof buf, "%.0f", v);
    else
        std::snprintf(buf, sizeof buf, "%.6g", v);
    return buf;
}

std::string format_grouped(std::int64_t v) {
    std::string digits = std::to_string(v < 0 ? -v : v), out;
    for (std::size_t k = 0; k < digits.size(); ++k) {
        if (k > 0 && (digits.size() - k) % 3 == 0) out += ',';
        out += digits[k];
    }
    return v < 0 ? "-" + out : out;
}

std::string problem_text(std::string_view why) { return "problem: " + std::string(why); }

std::string format_short(double v) {
    if (std::isfinite(v) && v == std::floor(v) && std::fabs(v) < 1e15) return format_number(v);
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.3g", v);
    return buf;
}

std::string count_of(std::size_t n, const char* singular, const char* plural) {
    return std::to_string(n) + " " + (n == 1 ? singular : plural);
}

}  // namespace tallyrates
