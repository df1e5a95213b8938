// guard.hpp - the one place where engine outcomes become what a Calc cell
// shows (architecture.md, addin-recipe.md):
//   invalid_input                              -> IllegalArgumentException -> Err:502
//   budget_exceeded, no_convergence, a Boost.Math error (domain, pole,
//   overflow, evaluation, rounding), out of memory, a non-finite result
//                                              -> NoConvergenceException  -> Err:523
//   anything else                              -> RuntimeException        -> #VALUE!
// Every worksheet method runs inside `guarded`: an exception escaping the
// component would take LibreOffice, and the user's unsaved work, down with it.
#pragma once

#include <rtl/ustring.hxx>
#include <string>
#include <string_view>

namespace tallyrates::uno {

inline rtl::OUString ou(std::string_view s) {
    return rtl::OUString(s.data(), static_cast<sal_Int32>(s.size()), RTL_TEXTENCODING_UTF8);
}
inline std::string utf8(const rtl::OUString& s) { return rtl::OUStringToOString(s, RTL_TEXTENCODING_UTF8).getStr(); }

// Called inside a catch block: throws the UNO exception for the exception
// being handled.
[[noreturn]] void rethrow_for_calc();

template <class F>
auto guarded(F&& f) -> decltype(f()) {
    try {
        return f();
    } catch (...) {
        rethrow_for_calc();
    }
}

// A result a cell may show: NaN or infinity become no_convergence (Err:523).
double finite(double v);

}  // namespace tallyrates::uno
