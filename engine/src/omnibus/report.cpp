// report.cpp - the rows of RATES.SAME.REPORT (see report.hpp).
#include "tallyrates/omnibus/report.hpp"

#include "tallyrates/omnibus/check.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

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
        case omnibus::route::tarone: return "Tarone's test for variation beyond counting";
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
            {"expected counts below " + format_number(omnibus::min_expected_count), {}},
            // Rows 8 to 10 belong to the route: blank unless it fills them.
            {"", {}},
            {"", {}},
            {"", {}}};
}

// Rows 9 and 10: where the p-value lies, and what kind of range that is.
void range_rows(std::vector<report_row>& rows, const char* kind, double low, double high) {
    rows[9] = {std::string(kind) + ": from", low};
    rows[10] = {std::string(kind) + ": to", high};
}

// The rows the route fills: Monte Carlo's draws and 95 % range for the exact
// p; an exact route's certified bounds only where they differ from p.
void route_rows(std::vector<report_row>& rows, const omnibus::result& r) {
    rows[0].label = r.used == omnibus::route::tarone ? "statistic: Tarone's z" : statistic_label(r.order);
    rows[0].value = r.statistic;
    if (r.used != omnibus::route::tarone) rows[1].value = static_cast<double>(r.df);  // z has none
    rows[2].value = r.p;
    rows[3].value = std::string(route_text(r.used));
    rows[4].value = r.why;
    if (r.has_monte_carlo) {
        rows[8] = {"random tables drawn", static_cast<double>(r.mc.draws)};
        range_rows(rows, "95 % range for the exact p", r.mc.low, r.mc.high);
    } else if (r.has_exact && r.exact.p_low != r.exact.p_high) {
        range_rows(rows, "exact p certified", r.exact.p_low, r.exact.p_high);
    }
}

}  // namespace

std::vector<report_row> problem_report(const std::string& problem) {
    auto rows = blank_rows();
    rows[3].value = std::string("none: the input has a problem");
    rows[4].value = problem;
    return rows;
}

std::vector<report_row> same_rates_report(const cell_line& successes, const cell_line& attempts,
                                          std::span<const std::string> labels, const omnibus::options& opt,
                                          omnibus::result_cache* cache) {
    counts c;
    omnibus::table t;
    try {
        c = counts::from_entries(successes, attempts, labels);
        t = omnibus::table_of(c);
    } catch (const invalid_input& e) {
        return problem_report(e.what());
    }
    auto rows = blank_rows();
    const auto e = omnibus::expected_counts(t);
    rows[5].value = static_cast<double>(t.groups());
    rows[6] = {"smallest expected count: " + smallest_expected_place(c, e), e.smallest};
    rows[7].value = static_cast<double>(e.below_five);
    try {
        route_rows(rows, omnibus::same_rates(c, opt, cache));
    } catch (const exact_refused& err) {
        rows[3].value = std::string("none: the exact route does not fit the budget");
        rows[4].value = std::string(err.what());
        if (err.has_bounds) range_rows(rows, "exact p certified", err.p_low, err.p_high);
    } catch (const invalid_input& err) {
        rows[3].value = std::string("none: an argument has a problem");
        rows[4].value = std::string(err.what());
    } catch (const budget_exceeded& err) {
        rows[3].value = std::string("none: the route asked for does not fit the budget");
        rows[4].value = std::string(err.what());
    }
    return rows;
}

}  // namespace tallyrates
