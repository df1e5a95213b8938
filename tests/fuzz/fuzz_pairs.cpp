// fuzz_pairs.cpp - libFuzzer target for the pairs family: RATES.DIFF and its
// bounds, RATES.PAIR.P, RATES.PAIRS, RATES.MARGIN.P and RATES.ONE.LOW/HIGH,
// each called the way its worksheet method calls the engine
// (extension/pairs/functions.cpp).
#include "input.hpp"
#include "pairs/keywords.hpp"
#include "tallyrates/pairs/margin.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"

using namespace tallyrates;

namespace {

pairwise::p_cache cache{8};

void ordered(const interval& b) {
    if (!(uno::finite(b.low) <= uno::finite(b.high))) __builtin_trap();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    fuzz::input in(data, size);
    const auto which = in.byte() % 6;
    fuzz::as_a_cell([&] {
        const auto c = in.tally_counts(12);
        const double i = in.position(12), j = in.position(12);
        switch (which) {
        case 0: {  // RATES.DIFF
            const auto [a, b] = pairwise::pair_at(c, i, j);
            uno::finite(pairwise::difference(a, b));
            break;
        }
        case 1: {  // RATES.DIFF.LOW / .HIGH
            pairwise::interval_options o;
            o.level = in.maybe_number().value_or(arguments::default_level);
            o.side = keywords::sides_or_default(in.word(keywords::sides));
            o.how = arguments::keyword_or(in.word(keywords::difference_method), o.how, keywords::difference_method,
                                          "method");
            o.adjust =
                arguments::keyword_or(in.word(keywords::simultaneous), o.adjust, keywords::simultaneous, "adjust");
            o.comparisons = arguments::keyword_or(in.word(keywords::family), o.comparisons, keywords::family, "family");
            const auto [a, b] = pairwise::pair_at(c, i, j);
            ordered(pairwise::difference_interval(c, a, b, o));
            break;
        }
        case 2: {  // RATES.PAIR.P
            pairwise::test_options o;
            o.adjust = arguments::keyword_or(in.word(keywords::p_adjust), o.adjust, keywords::p_adjust, "adjust");
            o.how = arguments::keyword_or(in.word(keywords::pair_test), o.how, keywords::pair_test, "method");
            o.comparisons = arguments::keyword_or(in.word(keywords::family), o.comparisons, keywords::family, "family");
            const auto [a, b] = pairwise::pair_at(c, i, j);
            fuzz::probability(uno::finite(pairwise::same_rate_p(c, a, b, o, &cache)));
            break;
        }
        case 3: {  // RATES.PAIRS
            pairwise::table_options o;
            o.level = arguments::level(in.maybe_number().value_or(arguments::default_level), "level");
            o.how = arguments::keyword_or(in.word(keywords::difference_method), o.how, keywords::difference_method,
                                          "method");
            std::tie(o.intervals, o.p) = arguments::keyword_or(
                in.word(keywords::pairs_adjust), std::pair{o.intervals, o.p}, keywords::pairs_adjust, "adjust");
            o.better = keywords::goal_or_default(in.word(keywords::goal));
            for (const auto& row : pairwise::pairs_table(c, o, &cache)) {
                fuzz::probability(row.p);
                fuzz::probability(row.p_adjusted);
                if (pairwise::verdict(c, row, o.better).empty()) __builtin_trap();
            }
            break;
        }
        case 4: {  // RATES.MARGIN.P
            const double margin = in.number();
            const auto what = arguments::keyword_or(in.word(keywords::claim), pairwise::default_claim, keywords::claim,
                                                    "claim");
            const auto better = keywords::goal_or_default(in.word(keywords::goal));
            const auto [a, b] = pairwise::pair_at(c, i, j);
            fuzz::probability(uno::finite(pairwise::margin_p(a, b, margin, what, better)));
            break;
        }
        default: {  // RATES.ONE.LOW / .HIGH
            const double level = in.maybe_number().value_or(arguments::default_level);
            const auto how = keywords::one_rate_method_or_wilson(in.word(keywords::one_rate_method));
            const auto side = keywords::sides_or_default(in.word(keywords::sides));
            ordered(one_rate::bounds(c.with_attempts_at(i, "i"), level, how, side));
        }
        }
        return 0.0;
    });
    return 0;
}
