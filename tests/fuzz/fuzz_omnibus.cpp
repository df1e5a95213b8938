// fuzz_omnibus.cpp - libFuzzer target for the omnibus family: RATES.CHECK,
// RATES.SAME.P / .STAT / .REPORT / .RESID and RATES.TREND.P / .Z, each called
// the way its worksheet method calls the engine (extension/omnibus/
// functions.cpp), on tallies and arguments read from the fuzzer's bytes.
#include "input.hpp"
#include "omnibus/keywords.hpp"
#include "tallyrates/omnibus/check.hpp"
#include "tallyrates/omnibus/report.hpp"
#include "tallyrates/omnibus/residuals.hpp"
#include "tallyrates/omnibus/trend.hpp"

using namespace tallyrates;

namespace {

omnibus::result_cache cache{8};

omnibus::options options_from(fuzz::input& in) {
    omnibus::options o;
    // The work caps and the draws when none are given a thousandth of the
    // product's: the instrumented build runs the exact network about 150
    // times slower (0.24 s in the release build became 42 s), and every path,
    // refusals past a cap included, stays reachable at tens of inputs a second.
    o.caps.exact_work /= 1000;
    o.caps.auto_exact_work /= 1000;
    o.caps.monte_carlo_work /= 1000;
    o.caps.auto_monte_carlo_work /= 1000;
    o.caps.max_buckets /= 1000;
    o.caps.auto_max_buckets /= 1000;
    o.draws /= 1000;
    o.how = arguments::keyword_or(in.word(keywords::omnibus_method), o.how, keywords::omnibus_method, "method");
    o.draws = arguments::whole_or(in.maybe_number(), o.draws, 1, static_cast<double>(o.caps.max_draws), "draws");
    o.seed = static_cast<std::uint64_t>(
        arguments::whole_or(in.maybe_number(), static_cast<std::int64_t>(o.seed), 0, omnibus::max_seed, "seed"));
    return o;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    fuzz::input in(data, size);
    const auto which = in.byte() % 6;
    fuzz::as_a_cell([&] {
        const auto [s, n] = in.tally(12);
        switch (which) {
        case 0: {  // RATES.CHECK: a sentence, whatever the cells hold
            const auto o = options_from(in);
            const positions_asked at{in.maybe_number(), in.maybe_number()};
            if (check_text(s, n, {}, &o, &cache, at).empty()) __builtin_trap();
            break;
        }
        case 1: {  // RATES.SAME.P
            const auto o = options_from(in);
            fuzz::probability(uno::finite(omnibus::same_rates(counts::from_entries(s, n), o, &cache).p));
            break;
        }
        case 2: {  // RATES.SAME.STAT
            const auto which_statistic = arguments::keyword_or(in.word(keywords::statistic), omnibus::default_statistic,
                                                               keywords::statistic, "statistic");
            uno::finite(omnibus::statistic(omnibus::table_of(counts::from_entries(s, n)), which_statistic));
            break;
        }
        case 3: {  // RATES.SAME.REPORT: rows of text and numbers, never empty
            const auto o = options_from(in);
            if (same_rates_report(s, n, {}, o, &cache).empty()) __builtin_trap();
            break;
        }
        case 4:  // RATES.SAME.RESID
            omnibus::adjusted_residuals(counts::from_entries(s, n));
            break;
        default: {  // RATES.TREND.P / .Z, scores of any cells
            const auto v = arguments::keyword_or(in.word(keywords::trend_variance), trend::default_variance,
                                                 keywords::trend_variance, "variance");
            std::vector<entry> scores;
            const std::size_t k = in.below(14);
            for (std::size_t r = 0; r < k; ++r) scores.push_back(in.cell());
            const auto t = trend::test(counts::from_entries(s, n), scores, v);
            fuzz::probability(uno::finite(t.p));
            uno::finite(t.z);
        }
        }
        return 0.0;
    });
    return 0;
}
