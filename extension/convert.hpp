// convert.hpp - cell values (as Calc passes them through UNO) to plain engine
// values. The only judgement made here is what kind of value a cell held:
// every rule about what is allowed, and every message about it, lives in the
// engine (counts.hpp for count ranges, arguments.hpp for the rest).
//
// How Calc passes arguments (addin-recipe.md, DEVELOPERS.md "How range
// arguments reach us"): count ranges are XCellRange objects, read here down
// to the last filled row only, with TRUE/FALSE told from numbers by the
// cells' number format (the calling document's formats say which are
// logical). Optional arguments are `any`: VOID when omitted, a reference to an
// empty cell as 0.0, a range as sequence<sequence<any>> with numbers and
// booleans as double, text as string and EMPTY CELLS AS AN EMPTY STRING.
#pragma once

#include <com/sun/star/beans/XPropertySet.hpp>
#include <com/sun/star/table/XCellRange.hpp>
#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Reference.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <optional>
#include <span>
#include <string>
#include <vector>

#include "tallyrates/core/counts.hpp"
#include "tallyrates/omnibus/report.hpp"

namespace tallyrates::convert {

using range = css::uno::Sequence<css::uno::Sequence<css::uno::Any>>;
using cells = css::uno::Reference<css::table::XCellRange>;
using caller = css::uno::Reference<css::beans::XPropertySet>;

// One column or one row of cells, in order (a block of several rows and
// columns is refused by arguments::not_one_line).
std::vector<entry> range_entries(const range& values, const char* argument);

// One cell value. Calc sends booleans as doubles too; a cell styled as
// boolean cannot be told from 1/0 here, which the count rules accept.
entry cell_entry(const css::uno::Any& cell);

// Optional arguments: nothing when omitted (or left empty, or a reference to
// a blank cell given as a one-cell range).
std::optional<double> number(const css::uno::Any& a, const char* argument);
std::optional<std::string> word(const css::uno::Any& a, const char* argument);
// An optional switch that takes TRUE/FALSE or a word naming the choice:
// booleans come as 1 or 0 (Calc passes them as numbers), text as the word;
// both empty when omitted.
struct number_or_word {
    std::optional<double> number;
    std::optional<std::string> word;
};
number_or_word switch_value(const css::uno::Any& a, const char* argument);
// An optional range argument (scores): empty when omitted.
std::vector<entry> optional_range(const css::uno::Any& a, const char* argument);
// An optional range of names (labels): the text of each cell, numbers as
// they would be typed, blank cells empty; nothing when omitted.
std::vector<std::string> optional_texts(const css::uno::Any& a, const char* argument);

// The two count ranges of a call as lines of cells, each read down to the
// last cell filled in either (ranges of up to a few thousand cells are read
// whole: cheaper than asking where they end); the rest counts as blank.
// `document` may be empty (a call from outside Calc): booleans then read as
// numbers.
struct count_lines {
    cell_line successes, attempts;
    bool down = true;  // one group per row (a column of counts), else per column
};
count_lines lines_of(const caller& document, const cells& successes, const cells& attempts);

// The two count ranges of a call, validated (engine rules, counts.hpp).
// `labels`: one per position, or none.
counts counts_of(const caller& document, const cells& successes, const cells& attempts,
                 std::span<const std::string> labels = {});

// One value per position (blank where there is none), laid out like the
// count ranges: a column for counts in a column, a row for counts in a row.
range along_the_counts(const std::vector<std::optional<double>>& values, bool down);

// Rows of cells (all of one length) as an array result.
range rows_to_array(const std::vector<std::vector<css::uno::Any>>& rows);
// A header row of texts (the engine writes the titles).
std::vector<css::uno::Any> texts_to_row(const std::vector<std::string>& texts);

// Label/value rows (RATES.SAME.REPORT) as a two-column array result.
range to_array(const std::vector<report_row>& rows);

}  // namespace tallyrates::convert
