// fuzz_apart.cpp - libFuzzer target for the decision-limits family:
// RATES.APART.LOW / .HIGH, RATES.APART, RATES.APART.CURVE and
// RATES.PRIOR.FIT, each called the way its worksheet method calls the engine
// (extension/apart/functions.cpp).
#include "apart/keywords.hpp"
#include "input.hpp"
#include "tallyrates/apart/limits.hpp"
#include "tallyrates/apart/prior_fit.hpp"

using namespace tallyrates;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    fuzz::input in(data, size);
    const auto which = in.byte() % 4;
    fuzz::as_a_cell([&] {
        const auto c = in.tally_counts(24);
        switch (which) {
        case 0:
        case 1: {  // RATES.APART.LOW / .HIGH and the RATES.APART table
            apart::options o;
            o.level = in.maybe_number().value_or(arguments::default_level);
            o.together = arguments::keyword_or(in.word(keywords::apart_family), o.together, keywords::apart_family,
                                               "family");
            o.target = in.maybe_number();
            o.how = arguments::keyword_or(in.word(keywords::apart_method), o.how, keywords::apart_method, "method");
            o.variation = arguments::keyword_or(in.word(keywords::apart_spread), o.variation, keywords::apart_spread,
                                                "spread");
            if (which == 0) {
                c.with_attempts_at(in.position(24), "i");
                for (const auto& row : apart::limits(c, o).rows)
                    if (!(uno::finite(row.limits.low) <= uno::finite(row.limits.high))) __builtin_trap();
            } else {
                apart::table(c, o);
            }
            break;
        }
        case 2: {  // RATES.APART.CURVE
            const double level = in.maybe_number().value_or(arguments::default_level);
            const auto target = in.maybe_number();
            const auto count = arguments::whole_or(in.maybe_number(), apart::default_curve_points,
                                                   static_cast<double>(apart::min_curve_points),
                                                   static_cast<double>(apart::max_curve_points), "sizes");
            for (const auto& line : apart::funnel(c, level, target, count))
                if (!(uno::finite(line[1]) <= uno::finite(line[2]))) __builtin_trap();
            apart::funnel_header(level, target);
            break;
        }
        default: {  // RATES.PRIOR.FIT
            const auto fit = apart::fit_prior(c);
            if (!(uno::finite(fit.prior.a) > 0 && uno::finite(fit.prior.b) > 0)) __builtin_trap();
        }
        }
        return 0.0;
    });
    return 0;
}
