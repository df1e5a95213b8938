// fuzz_bayes.cpp - libFuzzer target for the Bayesian family (RATES.POST.*),
// each function called the way its worksheet method calls the engine
// (extension/bayes/functions.cpp), priors included.
#include "bayes/keywords.hpp"
#include "input.hpp"
#include "tallyrates/bayes/across.hpp"
#include "tallyrates/bayes/alike.hpp"
#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/pairs/pairwise.hpp"

using namespace tallyrates;

namespace {

bayes::across_cache cache{8};

bayes::prior prior_from(fuzz::input& in) {
    const bayes::prior defaults;
    const auto a = in.maybe_number();
    const auto b = in.maybe_number();
    return bayes::checked({a.value_or(defaults.a), b.value_or(defaults.b)});
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    fuzz::input in(data, size);
    const auto which = in.byte() % 12;
    fuzz::as_a_cell([&] {
        // Most calls on a few groups; TABLE, BEST and LOSS also on dozens.
        const auto c = in.tally_counts(which >= 9 ? 40 : 8);
        const double i = in.position(8), j = in.position(8);
        const auto g = keywords::goal_or_default(in.word(keywords::goal));
        const auto p = prior_from(in);
        switch (which) {
        case 0:  // RATES.POST.MEAN
            fuzz::probability(uno::finite(bayes::mean(bayes::posterior(c.at_position(i, "i"), p))));
            break;
        case 1: {  // RATES.POST.LOW / .HIGH
            const auto how = arguments::keyword_or(in.word(keywords::credible_kind), bayes::default_kind,
                                                   keywords::credible_kind, "kind");
            const auto b = bayes::credible(bayes::posterior(c.at_position(i, "i"), p),
                                           in.maybe_number().value_or(arguments::default_level), how);
            if (!(uno::finite(b.low) <= uno::finite(b.high))) __builtin_trap();
            break;
        }
        case 2:  // RATES.POST.ABOVE
            fuzz::probability(uno::finite(bayes::above(bayes::posterior(c.at_position(i, "i"), p), in.number(), g)));
            break;
        case 3: {  // RATES.POST.NEXT
            const auto further = arguments::whole(in.number(), 0, 1e15, "m");
            const auto needed = arguments::whole_or(in.maybe_number(), further, 0, 1e15, "k");
            fuzz::probability(
                uno::finite(bayes::next_at_least(bayes::posterior(c.at_position(i, "i"), p), further, needed)));
            break;
        }
        case 4:
        case 5: {  // RATES.POST.AHEAD, RATES.POST.DIFF.LOW / .HIGH
            const group& a = c.at_position(i, "i");
            const group& b = c.at_position(j, "j");
            pairwise::distinct(a, b);
            const auto x = bayes::posterior(a, p), y = bayes::posterior(b, p);
            if (which == 4) {
                fuzz::probability(uno::finite(bayes::ahead(x, y, g)));
            } else {
                const auto d = bayes::difference(x, y, in.maybe_number().value_or(arguments::default_level));
                if (!(uno::finite(d.low) <= uno::finite(d.high))) __builtin_trap();
            }
            break;
        }
        case 6:  // RATES.POST.ORDER
            for (const auto& row : bayes::order(bayes::posteriors(c, p), g))
                for (double v : row) fuzz::probability(v);
            break;
        case 7:  // RATES.POST.SAME
            fuzz::probability(
                uno::finite(bayes::same(c.groups(), p, in.maybe_number().value_or(bayes::default_prior_same))));
            break;
        case 8: {  // RATES.POST.CURVE
            const auto n = arguments::whole_or(in.maybe_number(), bayes::default_curve_points,
                                               static_cast<double>(bayes::min_curve_points),
                                               static_cast<double>(bayes::max_curve_points), "points");
            const auto over = arguments::keyword_or(in.word(keywords::curve_span), bayes::default_curve_span,
                                                    keywords::curve_span, "span");
            bayes::curves_header(c);
            bayes::curves(c, n, p, over);
            break;
        }
        case 9: {  // RATES.POST.TABLE
            const double level = in.maybe_number().value_or(arguments::default_level);
            for (const auto& r : bayes::summary(c, level, g, p, &cache)) {
                fuzz::probability(uno::finite(r.best));
                uno::finite(r.loss);
            }
            break;
        }
        default: {  // RATES.POST.BEST / .LOSS
            const auto laws = bayes::posteriors(c, p);
            const std::size_t k = c.index_of(c.at_position(i, "i"));
            if (which == 10) fuzz::probability(uno::finite(bayes::best(laws, k, g, &cache)));
            else uno::finite(bayes::loss(laws, k, g, &cache));
        }
        }
        return 0.0;
    });
    return 0;
}
