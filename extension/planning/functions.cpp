// planning/functions.cpp - the worksheet methods of the planning family
// (RATES.PLAN.*). Each converts its arguments, calls the engine and returns,
// inside `guarded`.
#include "../addin.hpp"
#include "../guard.hpp"
#include "../bayes/prior.hpp"
#include "../pairs/keywords.hpp"
#include "keywords.hpp"
#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "tallyrates/planning/planning.hpp"

namespace tallyrates::uno {

namespace {

double attempts_of(std::int64_t n) { return static_cast<double>(n); }

// TRUE/FALSE arrive as 1/0; the words name the same two choices.
planning::correction correction_of(const Any& a) {
    const auto v = convert::switch_value(a, "correction");
    if (v.number) return planning::correction_from_number(*v.number);
    return arguments::keyword_or(v.word, planning::default_correction, keywords::correction, "correction");
}

}  // namespace

double rates::planDemo(const caller&, double rate, double confidence, const Any& failures) {
    return guarded([&] {
        const auto allowed = arguments::whole_or(convert::number(failures, "failures"), planning::default_failures, 0, 1e9,
                                                   "failures");
        return attempts_of(planning::demonstration(rate, confidence, allowed));
    });
}

double rates::planMore(const caller&, double rate, double confidence, double run, double failed) {
    return guarded([&] {
        const auto units = arguments::whole(run, 0, max_count, "run");
        const auto failures = arguments::whole(failed, 0, max_count, "failed");
        return attempts_of(planning::more_units(rate, confidence, units, failures));
    });
}

double rates::planWidth(const caller&, double rate, double half_width, const Any& level, const Any& method) {
    return guarded([&] {
        return attempts_of(planning::width(rate, half_width, convert::number(level, "level").value_or(arguments::default_level),
                                           keywords::one_rate_method_or_wilson(convert::word(method, "method"))));
    });
}

double rates::planPower(const caller&, double rate_1, double rate_2, const Any& power, const Any& alpha,
                        const Any& correction, const Any& ratio) {
    return guarded([&] {
        return attempts_of(planning::power(rate_1, rate_2, convert::number(power, "power").value_or(planning::default_power),
                                           convert::number(alpha, "alpha").value_or(planning::default_alpha),
                                           correction_of(correction),
                                           convert::number(ratio, "ratio").value_or(planning::default_ratio)));
    });
}

double rates::planAhead(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                        double confidence, const Any& goal, const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto better = keywords::goal_or_default(convert::word(goal, "goal"));
        const auto c = convert::counts_of(document, successes, attempts);
        const group& a = c.at_position(i, "i");
        const group& b = c.at_position(j, "j");
        pairwise::distinct(a, b);
        const auto p = prior_of(prior_a, prior_b);
        return attempts_of(planning::ahead(bayes::posterior(a, p), bayes::posterior(b, p), confidence, better));
    });
}

}  // namespace tallyrates::uno
