// bayes/prior.hpp - the Beta prior arguments (prior_a, prior_b) of every
// function that works with posteriors: the Bayesian family and
// RATES.PLAN.AHEAD. Checked by the engine (bayes::checked).
#pragma once

#include "../convert.hpp"
#include "tallyrates/bayes/law.hpp"

namespace tallyrates::uno {

inline bayes::prior prior_of(const css::uno::Any& a, const css::uno::Any& b) {
    const bayes::prior defaults;
    return bayes::checked({convert::number(a, "prior_a").value_or(defaults.a),
                           convert::number(b, "prior_b").value_or(defaults.b)});
}

}  // namespace tallyrates::uno
