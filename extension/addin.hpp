// addin.hpp - the UNO add-in class. Its worksheet methods (XRates) are
// defined one file per family (omnibus/, pairs/, bayes/, planning/ functions.cpp),
// each about ten lines: convert, call the engine, return, inside `guarded`.
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
    // ---- omnibus family (omnibus/functions.cpp) ----
    OUString SAL_CALL check(const caller& document, const cells& successes, const cells& attempts, const Any& method,
                           const Any& labels, const Any& i, const Any& j) override;
    double SAL_CALL sameP(const caller& document, const cells& successes, const cells& attempts, const Any& method,
                          const Any& draws, const Any& seed) override;
    double SAL_CALL sameStat(const caller& document, const cells& successes, const cells& attempts,
                             const Any& statistic) override;
    array SAL_CALL sameReport(const caller& document, const cells& successes, const cells& attempts, const Any& method,
                              const Any& draws, const Any& seed, const Any& labels) override;
    double SAL_CALL trendP(const caller& document, const cells& successes, const cells& attempts, const Any& scores,
                           const Any& variance) override;
    array SAL_CALL sameResid(const caller& document, const cells& successes, const cells& attempts) override;
    double SAL_CALL trendZ(const caller& document, const cells& successes, const cells& attempts, const Any& scores,
                           const Any& variance) override;

    // ---- pairs family (pairs/functions.cpp) ----
    double SAL_CALL diff(const caller& document, const cells& successes, const cells& attempts, double i,
                         double j) override;
    double SAL_CALL diffLow(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                            const Any& level, const Any& method, const Any& adjust, const Any& family) override;
    double SAL_CALL diffHigh(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                             const Any& level, const Any& method, const Any& adjust, const Any& family) override;
    double SAL_CALL pairP(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                          const Any& adjust, const Any& method, const Any& family) override;
    array SAL_CALL pairs(const caller& document, const cells& successes, const cells& attempts, const Any& level,
                         const Any& method, const Any& adjust, const Any& labels) override;
    double SAL_CALL oneLow(const caller& document, const cells& successes, const cells& attempts, double i,
                           const Any& level, const Any& method) override;
    double SAL_CALL oneHigh(const caller& document, const cells& successes, const cells& attempts, double i,
                            const Any& level, const Any& method) override;

    // ---- Bayesian family (bayes/functions.cpp) ----
    double SAL_CALL postMean(const caller& document, const cells& successes, const cells& attempts, double i,
                             const Any& prior_a, const Any& prior_b) override;
    double SAL_CALL postLow(const caller& document, const cells& successes, const cells& attempts, double i,
                            const Any& level, const Any& kind, const Any& prior_a, const Any& prior_b) override;
    double SAL_CALL postHigh(const caller& document, const cells& successes, const cells& attempts, double i,
                             const Any& level, const Any& kind, const Any& prior_a, const Any& prior_b) override;
    double SAL_CALL postAbove(const caller& document, const cells& successes, const cells& attempts, double i,
                              double rate, const Any& goal, const Any& prior_a, const Any& prior_b) override;
    double SAL_CALL postNext(const caller& document, const cells& successes, const cells& attempts, double i,
                             double m, const Any& k, const Any& prior_a, const Any& prior_b) override;

    double SAL_CALL postAhead(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                              const Any& prior_a, const Any& prior_b) override;
    array SAL_CALL postOrder(const caller& document, const cells& successes, const cells& attempts,
                             const Any& prior_a, const Any& prior_b) override;
    double SAL_CALL postBest(const caller& document, const cells& successes, const cells& attempts, double i,
                             const Any& goal, const Any& prior_a, const Any& prior_b) override;
    double SAL_CALL postLoss(const caller& document, const cells& successes, const cells& attempts, double i,
                             const Any& goal, const Any& prior_a, const Any& prior_b) override;
    double SAL_CALL postSame(const caller& document, const cells& successes, const cells& attempts,
                             const Any& prior_same, const Any& prior_a, const Any& prior_b) override;

    array SAL_CALL postCurve(const caller& document, const cells& successes, const cells& attempts,
                             const Any& points, const Any& prior_a, const Any& prior_b, const Any& labels) override;
    array SAL_CALL postTable(const caller& document, const cells& successes, const cells& attempts,
                             const Any& level, const Any& goal, const Any& prior_a, const Any& prior_b,
                             const Any& labels) override;

    double SAL_CALL postDiffLow(const caller& document, const cells& successes, const cells& attempts, double i,
                                double j, const Any& level, const Any& prior_a, const Any& prior_b) override;
    double SAL_CALL postDiffHigh(const caller& document, const cells& successes, const cells& attempts, double i,
                                 double j, const Any& level, const Any& prior_a, const Any& prior_b) override;

    // ---- planning family (planning/functions.cpp) ----
    double SAL_CALL planDemo(const caller& document, double rate, double confidence, const Any& failures) override;
    double SAL_CALL planMore(const caller& document, double rate, double confidence, double run,
                             double failed) override;
    double SAL_CALL planWidth(const caller& document, double rate, double half_width, const Any& level,
                              const Any& method) override;
    double SAL_CALL planPower(const caller& document, double rate_1, double rate_2, const Any& power,
                              const Any& alpha, const Any& correction) override;
    double SAL_CALL planAhead(const caller& document, const cells& successes, const cells& attempts, double i,
                              double j, double confidence, const Any& prior_a, const Any& prior_b) override;

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
