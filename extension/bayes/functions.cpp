// bayes/functions.cpp - the worksheet methods of the Bayesian family
// (RATES.POST.*). Each converts its arguments, calls the engine and returns,
// inside `guarded`.
#include "../addin.hpp"
#include "../guard.hpp"
#include "keywords.hpp"
#include "tallyrates/bayes.hpp"

namespace tallyrates::uno {

namespace {

bayes::prior prior_of(const Any& a, const Any& b) {
    const bayes::prior defaults;
    return bayes::checked({convert::number(a, "prior_a").value_or(defaults.a),
                           convert::number(b, "prior_b").value_or(defaults.b)});
}

bayes::beta_law law_of(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& prior_a, const Any& prior_b) {
    return bayes::posterior(convert::counts_of(document, successes, attempts), i, prior_of(prior_a, prior_b));
}

interval credible_of(const caller& document, const cells& successes, const cells& attempts, double i,
                     const Any& level, const Any& kind, const Any& prior_a, const Any& prior_b) {
    const auto law = law_of(document, successes, attempts, i, prior_a, prior_b);
    const auto how = arguments::keyword_or(convert::word(kind, "kind"), bayes::kind::central, keywords::credible_kind,
                                           "kind");
    return bayes::credible(law, convert::number(level, "level").value_or(0.95), how);
}

}  // namespace

double rates::postMean(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& prior_a, const Any& prior_b) {
    return guarded([&] { return finite(bayes::mean(law_of(document, successes, attempts, i, prior_a, prior_b))); });
}

double rates::postLow(const caller& document, const cells& successes, const cells& attempts, double i,
                      const Any& level, const Any& kind, const Any& prior_a, const Any& prior_b) {
    return guarded(
        [&] { return finite(credible_of(document, successes, attempts, i, level, kind, prior_a, prior_b).low); });
}

double rates::postHigh(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& level, const Any& kind, const Any& prior_a, const Any& prior_b) {
    return guarded(
        [&] { return finite(credible_of(document, successes, attempts, i, level, kind, prior_a, prior_b).high); });
}

double rates::postAbove(const caller& document, const cells& successes, const cells& attempts, double i, double rate,
                        const Any& goal, const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto g = arguments::keyword_or(convert::word(goal, "goal"), bayes::goal::high, keywords::goal, "goal");
        return finite(bayes::above(law_of(document, successes, attempts, i, prior_a, prior_b), rate, g));
    });
}

double rates::postNext(const caller& document, const cells& successes, const cells& attempts, double i, double m,
                       const Any& k, const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto further = arguments::whole(m, 0, 1e15, "m");
        const auto needed = arguments::whole_or(convert::number(k, "k"), further, 0, 1e15, "k");
        return finite(bayes::next_at_least(law_of(document, successes, attempts, i, prior_a, prior_b), further, needed));
    });
}

}  // namespace tallyrates::uno
