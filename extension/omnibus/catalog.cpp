// omnibus/catalog.cpp - wizard texts of the omnibus family: RATES.CHECK,
// RATES.SAME.*, RATES.TREND.* (functions.md, "Checks" and "All groups
// alike?"). Written for an engineer who knows the process, not the
// statistics. Wording is ours.
#include <array>

#include "../catalog.hpp"
#include "../shared_arguments.hpp"
#include "tallyrates/omnibus/same_rates.hpp"

namespace tallyrates::catalog {

namespace {

using shared::attempts;
using shared::successes;

#define WHY_502 TALLYRATES_WHY_502

constexpr argument method{
    "method",
    "Leave empty or \"auto\" (recommended): the counts decide. Otherwise \"exact\" (exact test, for small counts; "
    "Err:523 when it would need more than about 5 s), "
    "\"pearson\" (chi-square approximation) or \"montecarlo\" (random tables with the same totals). Specialist "
    "variants: \"lr\" (likelihood-ratio chi-square), \"exact-lr\" and \"exact-prob\" (exact test ordering tables "
    "by G² or by their probability). \"tarone\" asks another question: do the groups vary more than counting "
    "alone explains (Tarone 1979; one-sided; many small groups; Err:502 when every group has one attempt or "
    "every unit passed or none did)? A small p says intervals and limits that assume independent units are too "
    "narrow.",
    "\"auto\": chi-square when every expected count is at least 5, else the exact test when it fits the time "
    "budget, else Monte Carlo"};
constexpr argument draws{"draws",
                         "How many random tables \"montecarlo\" draws (and \"auto\" when it simulates), at most "
                         "10,000,000 and at most what about 5 s of work allows: Err:523 at once beyond that, the "
                         "report saying how many fit. More draws, a steadier p-value, a slower cell.",
                         static_cast<double>(omnibus::default_draws)};
constexpr argument seed{"seed",
                        "Whole number that fixes the random tables: the same seed gives the same p-value on every "
                        "machine and at every recalculation.",
                        static_cast<double>(omnibus::default_seed)};

constexpr std::array check_args{
    successes, attempts,
    argument{"method",
             "A method word of RATES.SAME.P to try as well: the answer then says whether that route fits and what "
             "it would do.",
             "\"auto\""},
    shared::labels,
    argument{"i",
             "The position a pairs or one-rate function names as i (RATES.DIFF.LOW, RATES.ONE.LOW, ...): the answer "
             "then says whether it is a group with attempts.",
             "none"},
    argument{"j", "The position named as j, checked the same way (and that it differs from i).", "none"}};
constexpr std::array same_p_args{successes, attempts, method, draws, seed};
constexpr std::array resid_args{successes, attempts};
constexpr std::array report_args{successes, attempts, method, draws, seed, shared::labels};
constexpr std::array same_stat_args{
    successes, attempts,
    argument{"statistic", "\"pearson\" for Pearson's X² or \"lr\" for the likelihood-ratio G².", "\"pearson\""}};
constexpr std::array trend_args{
    successes, attempts,
    argument{"scores",
             "Cells with one number per row giving each group's place in the ordered factor (belt speed, "
             "temperature step); only the rows with counts are read. Cells or a typed list such as {1;2;4}; select "
             "the rows in use, since a whole column costs about 0.3 s at every recalculation.",
             "the positions 1, 2, 3, ..."},
    argument{"variance",
             "\"binomial\" (Armitage 1955) or \"conditional\" (the hypergeometric form, N/(N-1) times larger).",
             "\"binomial\""}};

constexpr std::array table{
    function{"check", "RATES.CHECK",
             "Checks the two count ranges: \"ok\" with the number of groups, total attempts, smallest expected count "
             "and the route the automatic test takes, or the first problem with its row. Give i and j to check the "
             "positions a pairs function names as well.",
             check_args},
    function{"sameP", "RATES.SAME.P",
             "p-value for \"all groups share one success rate\": a small value (below 0.05, say) means the rates "
             "differ by more than chance explains; a large one means the counts show no clear difference." WHY_502,
             same_p_args},
    function{"sameStat", "RATES.SAME.STAT",
             "Test statistic for \"all groups share one rate\": Pearson X² or likelihood-ratio G², with "
             "(groups - 1) degrees of freedom." WHY_502,
             same_stat_args},
    function{"sameReport", "RATES.SAME.REPORT",
             "Two-column array (label, value) about the test that all groups share one rate: statistic, degrees of "
             "freedom, p-value, route used and why, expected counts, Monte Carlo error or exact bounds. Enter as an "
             "array formula over 11 rows and 2 columns; problems with the input are shown in it.",
             report_args, true},
    function{"sameResid", "RATES.SAME.RESID",
             "One value per row of the tally: how far the group's successes lie from what one shared rate "
             "predicts, in standard units (adjusted residual, Haberman 1973). Beyond about +2 or -2 the group "
             "stands out; negative means fewer successes than expected. Enter as an array formula beside the "
             "tally, as many cells as the count ranges; blank rows stay blank." WHY_502,
             resid_args, true},
    function{"trendP", "RATES.TREND.P",
             "p-value of the Cochran-Armitage test for a rate that rises or falls steadily across the groups in "
             "order (two-sided)." WHY_502,
             trend_args},
    function{"trendZ", "RATES.TREND.Z",
             "Signed z of the Cochran-Armitage trend test: positive when the rate rises with the score, negative "
             "when it falls; beyond about +-2 the trend is clear at the 5 % level." WHY_502,
             trend_args},
};

#undef WHY_502

}  // namespace

std::span<const function> omnibus_functions() { return table; }

}  // namespace tallyrates::catalog
