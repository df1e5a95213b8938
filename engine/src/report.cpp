// report.cpp - the rows of RATES.SAME.REPORT (see report.hpp).
#include "tallyrates/report.hpp"

#include "tallyrates/errors.hpp"
#include "tallyrates/text.hpp"

namespace tallyrates {

namespace {

const char* statistic_label(omnibus::ordering o) {
    switch (o) {
        case omnibus::ordering::pearson: return "statistic: Pearson X²";
        case omnibus::ordering::lr: return "statistic: likelihood ratio G²";
        case omnibus::ordering::probability: return "statistic: probability of the observed table";
    }
    return "";
}

const char* route_text(omnibus::route r) {
    switch (r) {
        case omnibus::route::pearson: return "chi-square approximation (Pearson)";
        case omnibus::route::lr: return "chi-square approximation (likelihood ratio)";
        case omnibus::route::exact: return "exact conditional";
        case omnibus::route::monte_carlo: return "Monte Carlo";
        case omnibus::route::all_alike: return "none needed (all rates alike)";
    }
    return "";
}

std::vector<report_row> blank_rows() {
    return {{"statistic", {}},
            {"degrees of freedom", {}},
            {"p-value", {}},
            {"route used", {}},
            {"why", {}},
            {"groups compared", {}},
            {"smallest expected count", {}},
            {"expected counts below 5", {}},
            {"standard error of p", {}},
            {"p lies above", {}},
            {"p lies below", {}}};
}

}  // namespace

std::vector<report_row> problem_report(const std::string& problem) {
    auto rows = blank_rows();
    rows[3].value = std::string("none: the input has a problem");
    rows[4].value = problem;
    return rows;
}

std::vector<report_row> same_rates_report(std::span<const entry> successes, std::span<const entry> attempts,
                                          const omnibus::options& opt, omnibus::result_cache* cache) {
    counts c;
    omnibus::table t;
    try {
        c = counts::from_entries(successes, attempts);
        t = omnibus::table_of(c);
    } catch (const invalid_input& e) {
        return problem_report(e.what());
    }
    auto rows = blank_rows();
    const auto e = omnibus::expected_counts(t);
    rows[5].value = static_cast<double>(t.groups());
    rows[6].value = e.smallest;
    rows[7].value = static_cast<double>(e.below_five);
    omnibus::result r;
    try {
        r = omnibus::same_rates(c, opt, cache);
    } catch (const exact_refused& err) {
        rows[3].value = std::string("none: the exact route does not fit the budget");
        rows[4].value = std::string(err.what());
        if (err.has_bounds) {  // certified bounds from a coarse enumeration
            rows[9].value = err.p_low;
            rows[10].value = err.p_high;
        }
        return rows;
    } catch (const invalid_input& err) {
        rows[3].value = std::string("none: an argument has a problem");
        rows[4].value = std::string(err.what());
        return rows;
    } catch (const budget_exceeded& err) {
        rows[3].value = std::string("none: the route asked for does not fit the budget");
        rows[4].value = std::string(err.what());
        return rows;
    }
    rows[0].label = statistic_label(r.order);
    rows[0].value = r.statistic;
    rows[1].value = static_cast<double>(r.df);
    rows[2].value = r.p;
    rows[3].value = std::string(route_text(r.used));
    rows[4].value = r.why;
    if (r.has_monte_carlo) {
        rows[8].value = r.mc.standard_error;
        rows[9].value = r.mc.low;
        rows[10].value = r.mc.high;
        rows[9].label = "p lies above (95% Monte Carlo interval)";
        rows[10].label = "p lies below (95% Monte Carlo interval)";
    } else if (r.has_exact || r.used == omnibus::route::all_alike) {
        // Exact answers carry no sampling error; the certified bounds show the
        // enumeration's own rounding (normally equal to p).
        rows[8].value = 0.0;
        rows[9].value = r.has_exact ? r.exact.p_low : 1.0;
        rows[10].value = r.has_exact ? r.exact.p_high : 1.0;
    }
    return rows;
}

}  // namespace tallyrates
