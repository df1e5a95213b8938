// convert.hpp - cell values (as Calc passes them through UNO) to plain engine
// values. The only judgement made here is what kind of cell a value came
// from; every rule about counts lives in engine/counts.
//
// How Calc passes arguments (addin-recipe.md): ranges declared
// sequence<sequence<any>> arrive with numbers and booleans as double, text as
// string and EMPTY CELLS AS AN EMPTY STRING; an omitted `any` argument is
// VOID; a reference to an empty cell given for an `any` argument arrives as
// 0.0; a range given there arrives as sequence<sequence<any>>.
#pragma once

#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <cstdint>
#include <string>
#include <vector>

#include "keywords.hpp"
#include "tallyrates/counts.hpp"

namespace tallyrates::convert {

using range = css::uno::Sequence<css::uno::Sequence<css::uno::Any>>;

// One column or one row of cells, in order. invalid_input for a block of
// several rows and columns.
std::vector<entry> range_entries(const range& cells, const char* argument);

// One cell value. Calc sends booleans as doubles too; a cell styled as
// boolean cannot be told from 1/0 here, which the count rules accept.
entry cell_entry(const css::uno::Any& cell);

bool omitted(const css::uno::Any& a);

double optional_number(const css::uno::Any& a, double fallback, const char* argument);
// A whole number in [low, high].
std::int64_t optional_whole(const css::uno::Any& a, std::int64_t fallback, double low, double high,
                            const char* argument);
std::string optional_text(const css::uno::Any& a, const std::string& fallback, const char* argument);

template <class E, std::size_t K>
E optional_keyword(const css::uno::Any& a, E fallback, const std::array<keywords::word<E>, K>& words,
                   const char* argument) {
    if (omitted(a)) return fallback;
    return keywords::parse(optional_text(a, "", argument), words, argument);
}

// An optional range argument (e.g. scores): empty when omitted.
std::vector<entry> optional_range(const css::uno::Any& a, const char* argument);

}  // namespace tallyrates::convert
