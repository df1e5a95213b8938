// fuzz_planning.cpp - libFuzzer target for the planning family:
// RATES.PLAN.DEMO / .MORE / .WIDTH / .POWER / .AHEAD, each called the way its
// worksheet method calls the engine (extension/planning/functions.cpp).
#include "input.hpp"
#include "pairs/keywords.hpp"
#include "planning/keywords.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "tallyrates/planning/planning.hpp"

using namespace tallyrates;

namespace {

// A count of attempts: a cell shows it, so it must be a whole number >= 0.
void attempts(std::int64_t n) {
    if (n < 0) __builtin_trap();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    fuzz::input in(data, size);
    const auto which = in.byte() % 5;
    fuzz::as_a_cell([&] {
        const double rate = in.number(), confidence = in.number();
        switch (which) {
        case 0:  // RATES.PLAN.DEMO
            attempts(planning::demonstration(
                rate, confidence,
                arguments::whole_or(in.maybe_number(), planning::default_failures, 0, 1e9, "failures")));
            break;
        case 1: {  // RATES.PLAN.MORE
            const auto run = arguments::whole(in.number(), 0, max_count, "run");
            const auto failed = arguments::whole(in.number(), 0, max_count, "failed");
            attempts(planning::more_units(rate, confidence, run, failed));
            break;
        }
        case 2:  // RATES.PLAN.WIDTH
            attempts(planning::width(rate, in.number(), in.maybe_number().value_or(arguments::default_level),
                                     keywords::one_rate_method_or_wilson(in.word(keywords::one_rate_method))));
            break;
        case 3: {  // RATES.PLAN.POWER; the correction as TRUE/FALSE (1/0) or a word
            const double rate_2 = in.number();
            const auto power = in.maybe_number().value_or(planning::default_power);
            const auto alpha = in.maybe_number().value_or(planning::default_alpha);
            const auto how = in.flip() ? planning::correction_from_number(in.number())
                                       : arguments::keyword_or(in.word(keywords::correction),
                                                               planning::default_correction, keywords::correction,
                                                               "correction");
            attempts(planning::power(rate, rate_2, power, alpha, how,
                                     in.maybe_number().value_or(planning::default_ratio)));
            break;
        }
        default: {  // RATES.PLAN.AHEAD
            const auto better = keywords::goal_or_default(in.word(keywords::goal));
            const auto c = in.tally_counts(6);
            const group& a = c.at_position(in.position(6), "i");
            const group& b = c.at_position(in.position(6), "j");
            pairwise::distinct(a, b);
            const bayes::prior defaults;
            const auto pa = in.maybe_number(), pb = in.maybe_number();
            const auto p = bayes::checked({pa.value_or(defaults.a), pb.value_or(defaults.b)});
            attempts(planning::ahead(bayes::posterior(a, p), bayes::posterior(b, p), confidence, better));
        }
        }
        return 0.0;
    });
    return 0;
}
