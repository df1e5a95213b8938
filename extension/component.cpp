// component.cpp - the UNO add-in: each worksheet method converts its
// arguments (convert.hpp), calls the engine and returns; `guarded` maps
// engine errors to Calc's error codes. Names and descriptions come from the
// catalog. This is the only file that implements UNO interfaces.
//
// Error mapping (architecture.md, addin-recipe.md):
//   invalid_input                 -> IllegalArgumentException -> Err:502
//   budget_exceeded, no_convergence, non-finite result
//                                 -> NoConvergenceException  -> Err:523
//   anything else                 -> RuntimeException        -> #VALUE!
// No exception of any other kind leaves this file: an escaping exception
// would take LibreOffice, and the user's unsaved work, down with it.
#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/lang/Locale.hpp>
#include <com/sun/star/lang/XServiceInfo.hpp>
#include <com/sun/star/lang/XServiceName.hpp>
#include <com/sun/star/sheet/NoConvergenceException.hpp>
#include <com/sun/star/sheet/XAddIn.hpp>
#include <com/sun/star/uno/RuntimeException.hpp>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <cppuhelper/implbase4.hxx>
#include <cppuhelper/supportsservice.hxx>
#include <org/tallyrates/sheet/XRates.hpp>

#include <cmath>
#include <mutex>
#include <optional>

#include "catalog.hpp"
#include "convert.hpp"
#include "keywords.hpp"
#include "tallyrates/check.hpp"
#include "tallyrates/errors.hpp"
#include "tallyrates/omnibus.hpp"
#include "tallyrates/pairwise.hpp"
#include "tallyrates/report.hpp"

using css::uno::Any;
using css::uno::Sequence;
using rtl::OUString;
using tallyrates::convert::range;

namespace {

OUString ou(std::string_view s) { return OUString(s.data(), static_cast<sal_Int32>(s.size()), RTL_TEXTENCODING_UTF8); }

template <class F>
auto guarded(F&& f) -> decltype(f()) {
    try {
        return f();
    } catch (const tallyrates::invalid_input& e) {
        throw css::lang::IllegalArgumentException(ou(e.what()), {}, 0);
    } catch (const tallyrates::budget_exceeded& e) {
        throw css::sheet::NoConvergenceException(ou(e.what()), {});
    } catch (const tallyrates::no_convergence& e) {
        throw css::sheet::NoConvergenceException(ou(e.what()), {});
    } catch (const css::uno::Exception&) {
        throw;  // already a UNO exception (from the UNO runtime itself)
    } catch (const std::exception& e) {
        throw css::uno::RuntimeException(ou(std::string("tallyrates internal error: ") + e.what()));
    } catch (...) {
        throw css::uno::RuntimeException("tallyrates internal error");
    }
}

double finite(double v) {
    if (!std::isfinite(v)) throw tallyrates::no_convergence("The result is not a finite number.");
    return v;
}

tallyrates::omnibus::options omnibus_options(const Any& method, const Any& draws, const Any& seed) {
    namespace om = tallyrates::omnibus;
    om::options o;
    o.how = tallyrates::convert::optional_keyword(method, o.how, tallyrates::keywords::omnibus_method, "method");
    o.draws = tallyrates::convert::optional_whole(draws, o.draws, 1, static_cast<double>(o.caps.max_draws), "draws");
    o.seed = static_cast<std::uint64_t>(tallyrates::convert::optional_whole(seed, static_cast<std::int64_t>(o.seed), 0,
                                                                            9007199254740992.0, "seed"));
    return o;
}

tallyrates::counts counts_of(const range& successes, const range& attempts) {
    const auto s = tallyrates::convert::range_entries(successes, "successes");
    const auto n = tallyrates::convert::range_entries(attempts, "attempts");
    return tallyrates::counts::from_entries(s, n);
}

Any to_any(const tallyrates::report_row& row, bool label) {
    if (label) return Any(ou(row.label));
    if (const auto* d = std::get_if<double>(&row.value)) return Any(finite(*d));
    if (const auto* s = std::get_if<std::string>(&row.value)) return Any(ou(*s));
    return Any(OUString());
}

Sequence<Sequence<Any>> rows_to_array(const std::vector<tallyrates::report_row>& rows) {
    Sequence<Sequence<Any>> out(static_cast<sal_Int32>(rows.size()));
    auto* o = out.getArray();
    for (std::size_t r = 0; r < rows.size(); ++r) {
        const Any cells[2] = {to_any(rows[r], true), to_any(rows[r], false)};
        o[r] = Sequence<Any>(cells, 2);
    }
    return out;
}

// The count ranges and omnibus options of one call. RATES.CHECK and
// RATES.SAME.REPORT answer a problem with a sentence instead of an error, so
// they read their arguments through this and show what it returns.
struct omnibus_inputs {
    std::vector<tallyrates::entry> successes, attempts;
    tallyrates::omnibus::options options;
};
std::optional<std::string> read_inputs(const range& successes, const range& attempts, const Any& method,
                                       const Any& draws, const Any& seed, omnibus_inputs& in) {
    try {
        in.successes = tallyrates::convert::range_entries(successes, "successes");
        in.attempts = tallyrates::convert::range_entries(attempts, "attempts");
        in.options = omnibus_options(method, draws, seed);
    } catch (const std::exception& e) {
        return std::string(e.what());
    }
    return std::nullopt;
}

class rates final : public cppu::WeakImplHelper4<org::tallyrates::sheet::XRates, css::sheet::XAddIn,
                                                 css::lang::XServiceName, css::lang::XServiceInfo> {
public:
    // ---- worksheet functions (XRates) ----
    OUString SAL_CALL check(const range& successes, const range& attempts, const Any& method) override {
        return guarded([&] {
            omnibus_inputs in;
            if (const auto problem = read_inputs(successes, attempts, method, Any(), Any(), in))
                return ou("problem: " + *problem);
            return ou(tallyrates::check_text(in.successes, in.attempts, &in.options, &cache_));
        });
    }

    double SAL_CALL sameP(const range& successes, const range& attempts, const Any& method, const Any& draws,
                          const Any& seed) override {
        return guarded([&] {
            const auto o = omnibus_options(method, draws, seed);
            return finite(tallyrates::omnibus::same_rates(counts_of(successes, attempts), o, &cache_).p);
        });
    }

    double SAL_CALL sameStat(const range& successes, const range& attempts, const Any& statistic) override {
        return guarded([&] {
            const auto which = tallyrates::convert::optional_keyword(
                statistic, tallyrates::omnibus::ordering::pearson, tallyrates::keywords::statistic, "statistic");
            const auto t = tallyrates::omnibus::table_of(counts_of(successes, attempts));
            return finite(tallyrates::omnibus::statistic(t, which));
        });
    }

    Sequence<Sequence<Any>> SAL_CALL sameReport(const range& successes, const range& attempts, const Any& method,
                                                const Any& draws, const Any& seed) override {
        return guarded([&] {
            omnibus_inputs in;
            if (const auto problem = read_inputs(successes, attempts, method, draws, seed, in))
                return rows_to_array(tallyrates::problem_report(*problem));
            return rows_to_array(tallyrates::same_rates_report(in.successes, in.attempts, in.options, &cache_));
        });
    }

    double SAL_CALL trendP(const range& successes, const range& attempts, const Any& scores,
                           const Any& variance) override {
        return guarded([&] {
            const auto v = tallyrates::convert::optional_keyword(variance, tallyrates::omnibus::trend_variance::binomial,
                                                                 tallyrates::keywords::trend_variance, "variance");
            const auto sc = tallyrates::convert::optional_range(scores, "scores");
            return finite(tallyrates::omnibus::trend(counts_of(successes, attempts), sc, v).p);
        });
    }

    double SAL_CALL diff(const range& successes, const range& attempts, double i, double j) override {
        return guarded([&] { return finite(tallyrates::pairwise::difference(counts_of(successes, attempts), i, j)); });
    }

    // ---- XAddIn: everything from the catalog ----
    OUString SAL_CALL getProgrammaticFuntionName(const OUString& display) override {
        const auto* f = tallyrates::catalog::by_display(utf8(display));
        return f ? ou(f->programmatic) : OUString();
    }
    OUString SAL_CALL getDisplayFunctionName(const OUString& name) override {
        const auto* f = find(name);
        return f ? ou(f->display) : OUString();
    }
    OUString SAL_CALL getFunctionDescription(const OUString& name) override {
        const auto* f = find(name);
        return f ? ou(f->description) : OUString();
    }
    OUString SAL_CALL getDisplayArgumentName(const OUString& name, sal_Int32 index) override {
        const auto* a = argument(name, index);
        return a ? ou(a->name) : OUString();
    }
    OUString SAL_CALL getArgumentDescription(const OUString& name, sal_Int32 index) override {
        const auto* a = argument(name, index);
        return a ? ou(tallyrates::catalog::argument_text(*a)) : OUString();
    }
    OUString SAL_CALL getProgrammaticCategoryName(const OUString&) override { return ou(tallyrates::catalog::category); }
    OUString SAL_CALL getDisplayCategoryName(const OUString&) override { return ou(tallyrates::catalog::category); }

    // ---- XLocalizable (through XAddIn): one language so far ----
    void SAL_CALL setLocale(const css::lang::Locale& locale) override {
        std::lock_guard lock(mutex_);
        locale_ = locale;
    }
    css::lang::Locale SAL_CALL getLocale() override {
        std::lock_guard lock(mutex_);
        return locale_;
    }

    // ---- XServiceName, XServiceInfo ----
    OUString SAL_CALL getServiceName() override { return ou(tallyrates::catalog::service_name); }
    OUString SAL_CALL getImplementationName() override { return ou(tallyrates::catalog::implementation_name); }
    sal_Bool SAL_CALL supportsService(const OUString& name) override { return cppu::supportsService(this, name); }
    Sequence<OUString> SAL_CALL getSupportedServiceNames() override {
        const OUString names[2] = {ou(tallyrates::catalog::service_name), "com.sun.star.sheet.AddIn"};
        return Sequence<OUString>(names, 2);
    }

private:
    static std::string utf8(const OUString& s) { return rtl::OUStringToOString(s, RTL_TEXTENCODING_UTF8).getStr(); }
    static const tallyrates::catalog::function* find(const OUString& name) {
        return tallyrates::catalog::by_programmatic(utf8(name));
    }
    static const tallyrates::catalog::argument* argument(const OUString& name, sal_Int32 index) {
        const auto* f = find(name);
        if (!f || index < 0 || static_cast<std::size_t>(index) >= f->arguments.size()) return nullptr;
        return &f->arguments[static_cast<std::size_t>(index)];
    }

    std::mutex mutex_;
    css::lang::Locale locale_;
    // Analyses already made, keyed by their exact inputs (thread-safe).
    tallyrates::omnibus::result_cache cache_{64};
};

}  // namespace

// Passive registration: named by the constructor= attribute in
// tallyrates.components.
extern "C" SAL_DLLPUBLIC_EXPORT css::uno::XInterface* org_tallyrates_sheet_Rates_get_implementation(
    css::uno::XComponentContext*, const css::uno::Sequence<css::uno::Any>&) {
    auto* instance = new rates();
    instance->acquire();
    return static_cast<cppu::OWeakObject*>(instance);
}
