// addin.hpp - the UNO add-in class. Its worksheet methods (XRates) are
// declared and defined one family per folder (<family>/methods.inc and
// <family>/functions.cpp), each about ten lines: convert, call the engine,
// return, inside `guarded`.
// The XAddIn, XServiceName and XServiceInfo answers and the factory are in
// addin.cpp; names and descriptions come from the catalog.
#pragma once

#include <com/sun/star/lang/Locale.hpp>
#include <com/sun/star/lang/XServiceInfo.hpp>
#include <com/sun/star/lang/XServiceName.hpp>
#include <com/sun/star/sheet/XAddIn.hpp>
#include <cppuhelper/implbase4.hxx>
#include <mutex>
#include <org/tallyrates/sheet/XRates.hpp>

#include "convert.hpp"
#include "tallyrates/bayes/across.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/pairs/pairwise.hpp"

namespace tallyrates::uno {

using convert::caller;
using convert::cells;
using convert::range;
using css::uno::Any;
using rtl::OUString;
using array = css::uno::Sequence<css::uno::Sequence<css::uno::Any>>;

class rates final : public cppu::WeakImplHelper4<org::tallyrates::sheet::XRates, css::sheet::XAddIn,
                                                 css::lang::XServiceName, css::lang::XServiceInfo> {
public:
    // ---- the worksheet methods (XRates): each family declares its own in
    // <family>/methods.inc, read here inside the class, and defines them in
    // <family>/functions.cpp ----
#include "omnibus/methods.inc"
#include "pairs/methods.inc"
#include "bayes/methods.inc"
#include "planning/methods.inc"
#include "apart/methods.inc"

    // ---- XAddIn, XServiceName, XServiceInfo (addin.cpp) ----
    OUString SAL_CALL getProgrammaticFuntionName(const OUString& display) override;
    OUString SAL_CALL getDisplayFunctionName(const OUString& name) override;
    OUString SAL_CALL getFunctionDescription(const OUString& name) override;
    OUString SAL_CALL getDisplayArgumentName(const OUString& name, sal_Int32 index) override;
    OUString SAL_CALL getArgumentDescription(const OUString& name, sal_Int32 index) override;
    OUString SAL_CALL getProgrammaticCategoryName(const OUString& name) override;
    OUString SAL_CALL getDisplayCategoryName(const OUString& name) override;
    void SAL_CALL setLocale(const css::lang::Locale& locale) override;
    css::lang::Locale SAL_CALL getLocale() override;
    OUString SAL_CALL getServiceName() override;
    OUString SAL_CALL getImplementationName() override;
    sal_Bool SAL_CALL supportsService(const OUString& name) override;
    css::uno::Sequence<OUString> SAL_CALL getSupportedServiceNames() override;

private:
    std::mutex mutex_;
    css::lang::Locale locale_;
    // Analyses already made, keyed by their exact inputs (thread-safe).
    omnibus::result_cache cache_{64};
    pairwise::p_cache pairs_cache_{64};
    bayes::across_cache across_cache_{64};
};

}  // namespace tallyrates::uno
