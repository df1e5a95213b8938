// convert.hpp - cell values (as Calc passes them through UNO) to plain engine
// values. The only judgement made here is what kind of value a cell held:
// every rule about what is allowed, and every message about it, lives in the
// engine (counts.hpp for count ranges, arguments.hpp for the rest).
//
// How Calc passes arguments (addin-recipe.md): ranges declared
// sequence<sequence<any>> arrive with numbers and booleans as double, text as
// string and EMPTY CELLS AS AN EMPTY STRING; an omitted `any` argument is
// VOID; a reference to an empty cell given for an `any` argument arrives as
// 0.0; a range given there arrives as sequence<sequence<any>>.
#pragma once

#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <optional>
#include <string>
#include <vector>

#include "tallyrates/counts.hpp"
#include "tallyrates/report.hpp"

namespace tallyrates::convert {

using range = css::uno::Sequence<css::uno::Sequence<css::uno::Any>>;

// One column or one row of cells, in order (a block of several rows and
// columns is refused by arguments::not_one_line).
std::vector<entry> range_entries(const range& cells, const char* argument);

// One cell value. Calc sends booleans as doubles too; a cell styled as
// boolean cannot be told from 1/0 here, which the count rules accept.
entry cell_entry(const css::uno::Any& cell);

// Optional arguments: nothing when omitted (or left empty, or a reference to
// a blank cell given as a one-cell range).
std::optional<double> number(const css::uno::Any& a, const char* argument);
std::optional<std::string> word(const css::uno::Any& a, const char* argument);
// An optional range argument (scores): empty when omitted.
std::vector<entry> optional_range(const css::uno::Any& a, const char* argument);
// An optional range of names (labels): the text of each cell, numbers as
// they would be typed, blank cells empty; nothing when omitted.
std::vector<std::string> optional_texts(const css::uno::Any& a, const char* argument);

// The two count ranges of a call, validated (engine rules, counts.hpp).
counts counts_of(const range& successes, const range& attempts);

// Label/value rows (RATES.SAME.REPORT) as a two-column array result.
range to_array(const std::vector<report_row>& rows);

}  // namespace tallyrates::convert
