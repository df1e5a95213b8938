// convert.cpp - see convert.hpp.
#include "convert.hpp"

#include <rtl/ustring.hxx>

#include "guard.hpp"
#include "tallyrates/arguments.hpp"
#include "tallyrates/text.hpp"

namespace tallyrates::convert {

using css::uno::Any;
using css::uno::TypeClass_BOOLEAN;
using css::uno::TypeClass_DOUBLE;
using css::uno::TypeClass_STRING;
using css::uno::TypeClass_VOID;

namespace {

// The single cell of a 1 x 1 range (how a one-cell reference arrives), or
// the value itself.
Any single(const Any& a) {
    range r;
    if ((a >>= r) && r.getLength() == 1 && r[0].getLength() == 1) return r[0][0];
    return a;
}

}  // namespace

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
        arguments::not_one_line(argument, static_cast<std::size_t>(rows), static_cast<std::size_t>(cols));
    std::vector<entry> out;
    out.reserve(static_cast<std::size_t>(rows > 1 ? rows : cols));
    for (sal_Int32 r = 0; r < rows; ++r)
        for (const Any& cell : cells[r]) out.push_back(cell_entry(cell));
    return out;
}

std::optional<double> number(const Any& a, const char* argument) {
    const entry e = cell_entry(single(a));
    if (e.what == entry::kind::blank) return std::nullopt;
    if (e.what != entry::kind::number) arguments::not_a_number(argument);
    return e.value;
}

std::optional<std::string> word(const Any& a, const char* argument) {
    const Any v = single(a);
    if (v.getValueTypeClass() == TypeClass_VOID) return std::nullopt;
    rtl::OUString s;
    if (!(v >>= s)) arguments::not_a_word(argument);
    if (s.isEmpty()) return std::nullopt;
    return uno::utf8(s);
}

std::vector<entry> optional_range(const Any& a, const char* argument) {
    if (a.getValueTypeClass() == TypeClass_VOID) return {};
    range r;
    if (a >>= r) return range_entries(r, argument);
    if (a.getValueTypeClass() == TypeClass_DOUBLE) return {cell_entry(a)};
    arguments::not_a_range(argument);
}

std::vector<std::string> optional_texts(const Any& a, const char* argument) {
    if (a.getValueTypeClass() == TypeClass_VOID) return {};
    range r;
    if (!(a >>= r)) arguments::not_a_range(argument);
    const sal_Int32 rows = r.getLength(), cols = rows ? r[0].getLength() : 0;
    if (rows > 1 && cols > 1) arguments::not_one_line(argument, static_cast<std::size_t>(rows), static_cast<std::size_t>(cols));
    std::vector<std::string> out;
    for (const auto& row : r)
        for (const Any& cell : row) {
            rtl::OUString s;
            double v = 0;
            if (cell >>= s) out.push_back(uno::utf8(s));
            else if (cell >>= v) out.push_back(format_number(v));
            else out.emplace_back();
        }
    return out;
}

counts counts_of(const range& successes, const range& attempts) {
    return counts::from_entries(range_entries(successes, "successes"), range_entries(attempts, "attempts"));
}

range to_array(const std::vector<report_row>& rows) {
    range out(static_cast<sal_Int32>(rows.size()));
    auto* o = out.getArray();
    for (std::size_t r = 0; r < rows.size(); ++r) {
        Any cells[2] = {Any(uno::ou(rows[r].label)), Any(rtl::OUString())};
        if (const auto* d = std::get_if<double>(&rows[r].value)) cells[1] <<= uno::finite(*d);
        if (const auto* s = std::get_if<std::string>(&rows[r].value)) cells[1] <<= uno::ou(*s);
        o[r] = css::uno::Sequence<Any>(cells, 2);
    }
    return out;
}

}  // namespace tallyrates::convert
