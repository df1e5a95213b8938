// convert.cpp - see convert.hpp.
#include "convert.hpp"

#include <cmath>
#include <rtl/ustring.hxx>

#include "tallyrates/errors.hpp"

namespace tallyrates::convert {

using css::uno::Any;
using css::uno::TypeClass_DOUBLE;
using css::uno::TypeClass_STRING;
using css::uno::TypeClass_VOID;
using css::uno::TypeClass_BOOLEAN;

entry cell_entry(const Any& cell) {
    switch (cell.getValueTypeClass()) {
        case TypeClass_VOID: return entry::blank();
        case TypeClass_DOUBLE: return entry::number(*static_cast<const double*>(cell.getValue()));
        case TypeClass_BOOLEAN: return entry::boolean();
        case TypeClass_STRING:
            // Empty cells arrive as an empty string; any other text is text.
            return static_cast<const rtl::OUString*>(cell.getValue())->isEmpty() ? entry::blank() : entry::text();
        default: return entry::text();
    }
}

std::vector<entry> range_entries(const range& cells, const char* argument) {
    const sal_Int32 rows = cells.getLength();
    const sal_Int32 cols = rows ? cells[0].getLength() : 0;
    if (rows > 1 && cols > 1)
        throw invalid_input(std::string("The argument ") + argument + " is a block of " + std::to_string(rows) +
                            " rows and " + std::to_string(cols) + " columns; select one column or one row.");
    std::vector<entry> out;
    out.reserve(static_cast<std::size_t>(rows > 1 ? rows : cols));
    for (sal_Int32 r = 0; r < rows; ++r)
        for (const Any& cell : cells[r]) out.push_back(cell_entry(cell));
    return out;
}

bool omitted(const Any& a) { return a.getValueTypeClass() == TypeClass_VOID; }

namespace {
[[noreturn]] void not_a_number(const char* argument) {
    throw invalid_input(std::string("The argument ") + argument + " must be a single number.");
}
}  // namespace

double optional_number(const Any& a, double fallback, const char* argument) {
    if (omitted(a)) return fallback;
    if (a.getValueTypeClass() == TypeClass_DOUBLE) return *static_cast<const double*>(a.getValue());
    if (a.getValueTypeClass() == TypeClass_STRING && static_cast<const rtl::OUString*>(a.getValue())->isEmpty())
        return fallback;
    // A one-cell range arrives as a 1 x 1 sequence.
    range r;
    if ((a >>= r) && r.getLength() == 1 && r[0].getLength() == 1) {
        const entry e = cell_entry(r[0][0]);
        if (e.what == entry::kind::blank) return fallback;
        if (e.what == entry::kind::number) return e.value;
    }
    not_a_number(argument);
}

std::int64_t optional_whole(const Any& a, std::int64_t fallback, double low, double high, const char* argument) {
    const double v = optional_number(a, static_cast<double>(fallback), argument);
    if (!std::isfinite(v) || v != std::floor(v) || v < low)
        throw invalid_input(std::string("The argument ") + argument + " (" + format_number(v) +
                            ") must be a whole number of at least " + format_number(low) + ".");
    // Above `high` is a request for too much work, not a malformed value:
    // report it as such (Err:523), with the cap.
    if (v > high)
        throw budget_exceeded(std::string("The argument ") + argument + " (" + format_number(v) +
                              ") is above the cap of " + format_number(high) + ".");
    return static_cast<std::int64_t>(v);
}

std::string optional_text(const Any& a, const std::string& fallback, const char* argument) {
    if (omitted(a)) return fallback;
    rtl::OUString s;
    if (a >>= s) {
        if (s.isEmpty()) return fallback;
        return rtl::OUStringToOString(s, RTL_TEXTENCODING_UTF8).getStr();
    }
    range r;
    if ((a >>= r) && r.getLength() == 1 && r[0].getLength() == 1 && (r[0][0] >>= s)) {
        if (s.isEmpty()) return fallback;
        return rtl::OUStringToOString(s, RTL_TEXTENCODING_UTF8).getStr();
    }
    throw invalid_input(std::string("The argument ") + argument + " must be a word in quotes.");
}

std::vector<entry> optional_range(const Any& a, const char* argument) {
    if (omitted(a)) return {};
    range r;
    if (a >>= r) return range_entries(r, argument);
    if (a.getValueTypeClass() == TypeClass_DOUBLE) return {cell_entry(a)};
    throw invalid_input(std::string("The argument ") + argument + " must be a range of numbers.");
}

}  // namespace tallyrates::convert
