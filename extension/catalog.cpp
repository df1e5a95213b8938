// catalog.cpp - names, argument names and descriptions of every worksheet
// function (functions.md). Wording is ours.
#include "catalog.hpp"

#include <algorithm>
#include <array>
#include <cctype>

#include "keywords.hpp"

namespace tallyrates::catalog {

namespace {

constexpr argument successes{"successes",
                             "Range of success counts, one group per row (or per column): units within "
                             "specification, passes. Rows left blank in both ranges are skipped.",
                             ""};
constexpr argument attempts{"attempts",
                            "Range of attempt counts of the same size as successes: units made, runs tried. "
                            "A group with 0 attempts is allowed and left out of tests.",
                            ""};

constexpr std::array check_args{
    successes, attempts,
    argument{"method", "Omnibus method word to try as well (see RATES.SAME.P): the answer then says whether that route fits and what it would do.", "\"auto\""}};

constexpr std::array same_p_args{
    successes, attempts,
    argument{"method",
             "How the p-value is found: \"auto\", \"pearson\", \"lr\" (likelihood ratio), \"exact\" (conditional, "
             "tables ordered by X²), \"exact-lr\" (ordered by G²), \"exact-prob\" (ordered by table probability), "
             "\"montecarlo\" (random tables with the same totals, ordered by X²).",
             "\"auto\": chi-square when every expected count is at least 5, else exact when it fits the time "
             "budget, else Monte Carlo"},
    argument{"draws", "Number of random tables for \"montecarlo\" (and for \"auto\" when it simulates), at most "
                      "10,000,000.",
             "100000"},
    argument{"seed", "Whole number that fixes the random tables; the same seed gives the same p-value on every "
                     "machine.",
             "20260101"}};

constexpr std::array same_stat_args{
    successes, attempts,
    argument{"statistic", "\"pearson\" for Pearson's X² or \"lr\" for the likelihood-ratio G².", "\"pearson\""}};

constexpr std::array trend_args{
    successes, attempts,
    argument{"scores", "Range of one number per row giving the groups' order or dose (blank rows ignored).",
             "the positions 1, 2, 3, ..."},
    argument{"variance",
             "\"binomial\" (Armitage 1955) or \"conditional\" (the hypergeometric form, N/(N-1) times larger).",
             "\"binomial\""}};

constexpr std::array diff_args{
    successes, attempts,
    argument{"i", "Position of the first group in the range (1 = first row), counting blank rows.", ""},
    argument{"j", "Position of the second group.", ""}};

constexpr std::array table{
    function{"check", "RATES.CHECK",
             "Checks the two count ranges: \"ok\" with the number of groups, total attempts, smallest expected count "
             "and the route the automatic test takes, or the first problem with its position.",
             check_args},
    function{"sameP", "RATES.SAME.P",
             "p-value for the hypothesis that all groups share one success rate (2 x G table), by the chosen "
             "route.",
             same_p_args},
    function{"sameStat", "RATES.SAME.STAT",
             "Test statistic for \"all groups share one rate\": Pearson X² or likelihood-ratio G², with "
             "(groups - 1) degrees of freedom.",
             same_stat_args},
    function{"sameReport", "RATES.SAME.REPORT",
             "Two-column array (label, value) about the test that all groups share one rate: statistic, degrees of "
             "freedom, p-value, route used and why, expected counts, Monte Carlo error or exact bounds. Enter as an "
             "array formula over 11 rows and 2 columns.",
             same_p_args, true},
    function{"trendP", "RATES.TREND.P",
             "Two-sided p-value of the Cochran-Armitage test for a trend in the rate across the groups in order.",
             trend_args},
    function{"diff", "RATES.DIFF", "Observed difference of rates, rate of group i minus rate of group j.",
             diff_args},
};

bool same_text_ignoring_case(std::string_view a, std::string_view b) {
    return a.size() == b.size() && std::equal(a.begin(), a.end(), b.begin(), [](char x, char y) {
               return std::tolower(static_cast<unsigned char>(x)) == std::tolower(static_cast<unsigned char>(y));
           });
}

}  // namespace

std::span<const function> functions() { return table; }

const function* by_programmatic(std::string_view name) {
    for (const auto& f : table)
        if (f.programmatic == name) return &f;
    return nullptr;
}

const function* by_display(std::string_view name) {
    for (const auto& f : table)
        if (same_text_ignoring_case(f.display, name)) return &f;
    return nullptr;
}

std::string argument_text(const argument& a) {
    std::string text(a.description);
    if (!a.default_text.empty()) text += " Optional; default " + std::string(a.default_text) + ".";
    return text;
}

}  // namespace tallyrates::catalog
