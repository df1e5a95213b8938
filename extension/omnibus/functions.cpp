// omnibus/functions.cpp - the worksheet methods of the omnibus family:
// RATES.CHECK, RATES.SAME.P / .STAT / .REPORT, RATES.TREND.P / .Z. Each
// converts its arguments, calls the engine and returns, inside `guarded`.
#include "../addin.hpp"
#include "../guard.hpp"
#include "keywords.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"
#include "tallyrates/omnibus/check.hpp"
#include "tallyrates/omnibus/report.hpp"
#include "tallyrates/omnibus/residuals.hpp"
#include "tallyrates/omnibus/trend.hpp"

namespace tallyrates::uno {

namespace {

omnibus::options omnibus_options(const Any& method, const Any& draws, const Any& seed) {
    omnibus::options o;
    o.how = arguments::keyword_or(convert::word(method, "method"), o.how, keywords::omnibus_method, "method");
    o.draws = arguments::whole_or(convert::number(draws, "draws"), o.draws, 1, static_cast<double>(o.caps.max_draws),
                                  "draws");
    o.seed = static_cast<std::uint64_t>(arguments::whole_or(
        convert::number(seed, "seed"), static_cast<std::int64_t>(o.seed), 0, omnibus::max_seed, "seed"));
    return o;
}

// RATES.CHECK and RATES.SAME.REPORT answer a problem with a sentence instead
// of an error, so they read their arguments through this and show the
// problem when there is one.
struct omnibus_inputs {
    convert::count_lines counts;
    std::vector<std::string> labels;
    omnibus::options options;
    std::string problem;
};
omnibus_inputs read_inputs(const caller& document, const cells& successes, const cells& attempts, const Any& method,
                           const Any& draws, const Any& seed, const Any& labels) {
    omnibus_inputs in;
    try {
        in.counts = convert::lines_of(document, successes, attempts);
        in.options = omnibus_options(method, draws, seed);
        in.labels = convert::optional_texts(labels, "labels");
    } catch (const invalid_input& e) {
        in.problem = e.what();
    } catch (const budget_exceeded& e) {
        in.problem = e.what();
    }
    return in;
}

trend::result trend_of(const caller& document, const cells& successes, const cells& attempts, const Any& scores,
                       const Any& variance) {
    const auto v = arguments::keyword_or(convert::word(variance, "variance"), trend::default_variance,
                                         keywords::trend_variance, "variance");
    return trend::test(convert::counts_of(document, successes, attempts), convert::optional_range(scores, "scores"), v);
}

}  // namespace

OUString rates::check(const caller& document, const cells& successes, const cells& attempts, const Any& method,
                      const Any& labels, const Any& i, const Any& j) {
    return guarded([&] {
        const auto in = read_inputs(document, successes, attempts, method, Any(), Any(), labels);
        if (!in.problem.empty()) return ou(problem_text(in.problem));
        const positions_asked positions{convert::number(i, "i"), convert::number(j, "j")};
        return ou(check_text(in.counts.successes, in.counts.attempts, in.labels, &in.options, &cache_, positions));
    });
}

double rates::sameP(const caller& document, const cells& successes, const cells& attempts, const Any& method,
                    const Any& draws, const Any& seed) {
    return guarded([&] {
        const auto o = omnibus_options(method, draws, seed);
        return finite(omnibus::same_rates(convert::counts_of(document, successes, attempts), o, &cache_).p);
    });
}

double rates::sameStat(const caller& document, const cells& successes, const cells& attempts, const Any& statistic) {
    return guarded([&] {
        const auto which = arguments::keyword_or(convert::word(statistic, "statistic"), omnibus::default_statistic,
                                                 keywords::statistic, "statistic");
        return finite(omnibus::statistic(omnibus::table_of(convert::counts_of(document, successes, attempts)), which));
    });
}

array rates::sameReport(const caller& document, const cells& successes, const cells& attempts, const Any& method,
                        const Any& draws, const Any& seed, const Any& labels) {
    return guarded([&] {
        const auto in = read_inputs(document, successes, attempts, method, draws, seed, labels);
        if (!in.problem.empty()) return convert::to_array(problem_report(in.problem));
        return convert::to_array(
            same_rates_report(in.counts.successes, in.counts.attempts, in.labels, in.options, &cache_));
    });
}

array rates::sameResid(const caller& document, const cells& successes, const cells& attempts) {
    return guarded([&] {
        const auto lines = convert::lines_of(document, successes, attempts);
        const auto c = counts::from_entries(lines.successes, lines.attempts);
        return convert::along_the_counts(omnibus::adjusted_residuals(c), lines.down);
    });
}

double rates::trendP(const caller& document, const cells& successes, const cells& attempts, const Any& scores,
                     const Any& variance) {
    return guarded([&] { return finite(trend_of(document, successes, attempts, scores, variance).p); });
}

double rates::trendZ(const caller& document, const cells& successes, const cells& attempts, const Any& scores,
                     const Any& variance) {
    return guarded([&] { return finite(trend_of(document, successes, attempts, scores, variance).z); });
}

}  // namespace tallyrates::uno
