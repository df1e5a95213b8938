// convert.cpp - see convert.hpp.
#include "convert.hpp"

#include <algorithm>
#include <com/sun/star/beans/XPropertyState.hpp>
#include <com/sun/star/container/XIndexAccess.hpp>
#include <com/sun/star/sheet/CellFlags.hpp>
#include <com/sun/star/sheet/XCellFormatRangesSupplier.hpp>
#include <com/sun/star/sheet/XCellRangeAddressable.hpp>
#include <com/sun/star/sheet/XCellRangeData.hpp>
#include <com/sun/star/sheet/XCellRangesQuery.hpp>
#include <com/sun/star/sheet/XSheetCellRanges.hpp>
#include <com/sun/star/util/NumberFormat.hpp>
#include <com/sun/star/util/XNumberFormats.hpp>
#include <com/sun/star/util/XNumberFormatsSupplier.hpp>
#include <map>
#include <rtl/ustring.hxx>

#include "guard.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::convert {

using css::uno::Any;
using css::uno::Reference;
using css::uno::TypeClass_BOOLEAN;
using css::uno::TypeClass_DOUBLE;
using css::uno::TypeClass_STRING;
using css::uno::TypeClass_VOID;
using css::uno::UNO_QUERY_THROW;

namespace {

// The single cell of a 1 x 1 range (how a one-cell reference arrives), or
// the value itself.
Any single(const Any& a) {
    range r;
    if ((a >>= r) && r.getLength() == 1 && r[0].getLength() == 1) return r[0][0];
    return a;
}

// Where a range sits on its sheet, and whether it runs down (a column) or
// across (a row).
struct placement {
    css::table::CellRangeAddress address;
    std::size_t length = 0;
    bool down = true;
};

placement placement_of(const cells& r, const char* argument) {
    if (!r.is()) arguments::not_a_range(argument);
    placement p;
    p.address = Reference<css::sheet::XCellRangeAddressable>(r, UNO_QUERY_THROW)->getRangeAddress();
    const auto rows = static_cast<std::size_t>(p.address.EndRow - p.address.StartRow + 1);
    const auto columns = static_cast<std::size_t>(p.address.EndColumn - p.address.StartColumn + 1);
    if (rows > 1 && columns > 1) arguments::not_one_line(argument, rows, columns);
    p.down = rows > 1;
    p.length = p.down ? rows : columns;
    return p;
}

// Index along the line of a cell address inside it.
std::size_t index_in(const placement& p, sal_Int32 row, sal_Int32 column) {
    return static_cast<std::size_t>(p.down ? row - p.address.StartRow : column - p.address.StartColumn);
}

// A cell of a sheet range as XCellRangeData hands it over: numbers (booleans
// too) as double, text as string, an empty cell as an empty string, a cell
// showing an error as VOID.
entry sheet_entry(const Any& cell) {
    switch (cell.getValueTypeClass()) {
        case TypeClass_VOID: return entry::error();
        case TypeClass_DOUBLE: return entry::number(*static_cast<const double*>(cell.getValue()));
        case TypeClass_STRING:
            return static_cast<const rtl::OUString*>(cell.getValue())->isEmpty() ? entry::blank() : entry::text();
        default: return entry::text();
    }
}

// Which number formats show TRUE/FALSE, asked of the document once per key.
class logical_formats {
public:
    explicit logical_formats(const caller& document) {
        const Reference<css::util::XNumberFormatsSupplier> supplier(document, css::uno::UNO_QUERY);
        if (supplier.is()) formats_ = supplier->getNumberFormats();
    }
    bool known() const { return formats_.is(); }
    bool operator()(sal_Int32 key) {
        if (key == 0) return false;  // the "General" format of every document
        const auto [at, fresh] = answers_.try_emplace(key, false);
        if (fresh) {
            sal_Int16 type = 0;
            formats_->getByKey(key)->getPropertyValue("Type") >>= type;
            at->second = (type & css::util::NumberFormat::LOGICAL) != 0;
        }
        return at->second;
    }

private:
    Reference<css::util::XNumberFormats> formats_;
    std::map<sal_Int32, bool> answers_;
};

sal_Int32 format_key(const Reference<css::beans::XPropertySet>& cells_with_one_format) {
    sal_Int32 key = 0;
    cells_with_one_format->getPropertyValue("NumberFormat") >>= key;
    return key;
}

void numbers_to_booleans(std::vector<entry>& out, std::size_t from, std::size_t to) {
    for (std::size_t k = from; k < to; ++k)
        if (out[k].what == entry::kind::number && (out[k].value == 0 || out[k].value == 1)) out[k] = entry::boolean();
}

// Calc keeps TRUE/FALSE as 1/0 with a logical number format (also on cells
// whose formula gives a logical result): a 0 or 1 in such a cell becomes a
// boolean, which the count rules refuse. (Another number in a cell formatted
// as logical also shows TRUE; it is read as the number it is.) A range in one format (the usual
// tally) is answered by one question; otherwise per run of equal formatting,
// so a long range costs a few runs, never a call per cell.
void mark_booleans(const caller& document, const cells& part, const placement& p, std::vector<entry>& out) {
    // TRUE and FALSE are 1 and 0: without such a number there is nothing to
    // ask (the usual tally), which saves the format questions, about 5 us.
    if (std::none_of(out.begin(), out.end(), [](const entry& e) {
            return e.what == entry::kind::number && (e.value == 0 || e.value == 1);
        }))
        return;
    logical_formats logical(document);
    if (!logical.known()) return;
    const Reference<css::beans::XPropertyState> state(part, UNO_QUERY_THROW);
    if (state->getPropertyState("NumberFormat") != css::beans::PropertyState_AMBIGUOUS_VALUE) {
        if (logical(format_key(Reference<css::beans::XPropertySet>(part, UNO_QUERY_THROW))))
            numbers_to_booleans(out, 0, out.size());
        return;
    }
    const auto runs = Reference<css::sheet::XCellFormatRangesSupplier>(part, UNO_QUERY_THROW)->getCellFormatRanges();
    for (sal_Int32 k = 0; k < runs->getCount(); ++k) {
        const Reference<css::beans::XPropertySet> run(runs->getByIndex(k), UNO_QUERY_THROW);
        if (!logical(format_key(run))) continue;
        // A run inside a line is one stretch of it.
        const auto a = Reference<css::sheet::XCellRangeAddressable>(run, UNO_QUERY_THROW)->getRangeAddress();
        numbers_to_booleans(out, index_in(p, a.StartRow, a.StartColumn), index_in(p, a.EndRow, a.EndColumn) + 1);
    }
}

// Ranges up to this many cells are read whole; longer ones (a whole column)
// only down to their last filled cell, which one query finds.
constexpr std::size_t read_whole_up_to = 4096;

// How far a count range is filled: the cells up to and including its last
// filled one.
std::size_t filled_length(const cells& range, const placement& p) {
    if (p.length <= read_whole_up_to) return p.length;
    using namespace css::sheet::CellFlags;
    const auto used = Reference<css::sheet::XCellRangesQuery>(range, UNO_QUERY_THROW)
                          ->queryContentCells(VALUE | DATETIME | STRING | FORMULA);
    std::size_t end = 0;
    for (const auto& a : used->getRangeAddresses()) end = std::max(end, index_in(p, a.EndRow, a.EndColumn) + 1);
    return end;
}

// The first `count` cells of a range (fewer if it is shorter).
cell_line line_of(const caller& document, const cells& range, const placement& p, std::size_t count) {
    count = std::min(count, p.length);
    if (count == 0) return cell_line({}, p.length);
    const auto last = static_cast<sal_Int32>(count - 1);
    // The range itself when it is read whole (the usual short range): a new
    // range object costs Calc a listener registration.
    const cells part = count == p.length ? range
                       : p.down          ? range->getCellRangeByPosition(0, 0, 0, last)
                                         : range->getCellRangeByPosition(0, 0, last, 0);
    std::vector<entry> out;
    out.reserve(count);
    for (const auto& row : Reference<css::sheet::XCellRangeData>(part, UNO_QUERY_THROW)->getDataArray())
        for (const Any& cell : row) out.push_back(sheet_entry(cell));
    mark_booleans(document, part, p, out);
    return cell_line(std::move(out), p.length);
}

}  // namespace

count_lines lines_of(const caller& document, const cells& successes, const cells& attempts) {
    const placement ps = placement_of(successes, "successes"), pn = placement_of(attempts, "attempts");
    // Both read as far as either is filled, so that a row filled in one range
    // only is seen (and refused) like any other.
    const std::size_t count = std::max(filled_length(successes, ps), filled_length(attempts, pn));
    return {line_of(document, successes, ps, count), line_of(document, attempts, pn, count), ps.down};
}

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

std::vector<entry> range_entries(const range& values, const char* argument) {
    const sal_Int32 rows = values.getLength();
    const sal_Int32 cols = rows ? values[0].getLength() : 0;
    if (rows > 1 && cols > 1)
        arguments::not_one_line(argument, static_cast<std::size_t>(rows), static_cast<std::size_t>(cols));
    std::vector<entry> out;
    out.reserve(static_cast<std::size_t>(rows > 1 ? rows : cols));
    for (sal_Int32 r = 0; r < rows; ++r)
        for (const Any& cell : values[r]) out.push_back(cell_entry(cell));
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

number_or_word switch_value(const Any& a, const char* argument) {
    const Any v = single(a);
    bool on = false;
    if (v >>= on) return {on ? 1.0 : 0.0, std::nullopt};
    if (v.getValueTypeClass() == TypeClass_DOUBLE) return {number(v, argument), std::nullopt};
    return {std::nullopt, word(v, argument)};
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
    if (rows > 1 && cols > 1)
        arguments::not_one_line(argument, static_cast<std::size_t>(rows), static_cast<std::size_t>(cols));
    std::vector<std::string> out;
    for (const auto& row : r)
        for (const Any& cell : row) {
            rtl::OUString s;
            double v = 0;
            if (cell >>= s)
                out.push_back(uno::utf8(s));
            else if (cell >>= v)
                out.push_back(format_number(v));
            else
                out.emplace_back();
        }
    return out;
}

counts counts_of(const caller& document, const cells& successes, const cells& attempts,
                 std::span<const std::string> labels) {
    const auto lines = lines_of(document, successes, attempts);
    return counts::from_entries(lines.successes, lines.attempts, labels);
}

range along_the_counts(const std::vector<std::optional<double>>& values, bool down) {
    auto cell = [&](std::size_t k) { return values[k] ? Any(uno::finite(*values[k])) : Any(rtl::OUString()); };
    if (!down) {
        css::uno::Sequence<Any> row(static_cast<sal_Int32>(values.size()));
        for (std::size_t k = 0; k < values.size(); ++k) row.getArray()[k] = cell(k);
        return range(&row, 1);
    }
    range out(static_cast<sal_Int32>(values.size()));
    for (std::size_t k = 0; k < values.size(); ++k) {
        const Any one = cell(k);
        out.getArray()[k] = css::uno::Sequence<Any>(&one, 1);
    }
    return out;
}

std::vector<Any> texts_to_row(const std::vector<std::string>& texts) {
    std::vector<Any> row;
    for (const auto& t : texts) row.push_back(Any(uno::ou(t)));
    return row;
}

range rows_to_array(const std::vector<std::vector<Any>>& rows) {
    range out(static_cast<sal_Int32>(rows.size()));
    for (std::size_t r = 0; r < rows.size(); ++r)
        out.getArray()[r] = css::uno::Sequence<Any>(rows[r].data(), static_cast<sal_Int32>(rows[r].size()));
    return out;
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
