// pairs/catalog.cpp - wizard texts of the pairs family: comparisons of two
// groups, the table of all pairs, and intervals for one group (functions.md,
// "Pairs of groups and single groups"). Written for an engineer who knows
// the process, not the statistics. Wording is ours.
#include <array>

#include "../catalog.hpp"
#include "../shared_arguments.hpp"

namespace tallyrates::catalog {

namespace {

using shared::attempts;
using shared::i;
using shared::j;
using shared::level;
using shared::successes;

constexpr argument difference_method{
    "method",
    "Leave empty or \"newcombe\" (recommended): holds its level well even at 0 % or 100 % and with a dozen "
    "units. \"score\" (Miettinen-Nurminen) is as good; \"agresti-caffo\" is a simple adjusted form; \"wald\" is "
    "the textbook formula, too narrow for small counts (for comparison only).",
    "\"newcombe\""};
constexpr argument simultaneous{
    "adjust",
    "Leave empty or \"none\" for this comparison alone. \"bonferroni\" or \"sidak\" widen the interval so that "
    "all the comparisons of the family hold together at the level: use them when you look at many pairs and act "
    "on any that stands out.",
    "\"none\""};
constexpr argument family{
    "family",
    "Which comparisons share the error rate when adjusting: \"all\" (every pair of groups with attempts) or "
    "\"against\" (each group against group j only, e.g. every line against the reference line).",
    "\"all\""};
constexpr std::array diff_args{successes, attempts, i, j};
constexpr std::array diff_bound_args{successes, attempts, i, j, level, difference_method, simultaneous, family};

constexpr argument p_adjust{
    "adjust",
    "Leave empty or \"none\" for this comparison alone. When many pairs are tested: \"holm\" (recommended: "
    "controls the chance of any false alarm), \"bonferroni\" (simpler, more cautious), \"hochberg\", \"sidak\", "
    "or \"bh\" (Benjamini-Hochberg: controls the share of false alarms among the pairs called different).",
    "\"none\""};
constexpr argument pair_test{
    "method",
    "\"score\" (the chi-square test of the two rows) or \"exact\" (Fisher's exact test, for small counts; "
    "refused when the counts are too large to enumerate, where the score test is as accurate).",
    "\"score\""};
constexpr std::array pair_p_args{successes, attempts, i, j, p_adjust, pair_test, family};

constexpr std::array pairs_args{
    successes, attempts, level,
    argument{"method", "Interval method, as for RATES.DIFF.LOW: \"newcombe\", \"score\", \"agresti-caffo\" or \"wald\".",
             "\"newcombe\""},
    argument{"adjust",
             "Over all pairs: \"holm\" (adjusted p only), \"hochberg\", \"bh\", or \"bonferroni\" / \"sidak\" "
             "(adjusted p, and intervals that hold jointly), or \"none\".",
             "\"holm\""},
    shared::labels};

constexpr std::array one_args{successes, attempts, i, level, shared::one_rate_method};

constexpr std::array table{
    function{"diff", "RATES.DIFF",
             "Observed rate of group i minus rate of group j, as a fraction: format the cell as % to read it in "
             "percentage points (0.047 is 4.7 points), not as a relative change. i and j must differ."
             TALLYRATES_WHY_502_PAIR,
             diff_args},
    function{"diffLow", "RATES.DIFF.LOW",
             "Lower end of the confidence interval for rate of group i minus rate of group j (a fraction; format "
             "as %). Above 0: group i is better by at least this much." TALLYRATES_WHY_502_POSITIONS,
             diff_bound_args},
    function{"diffHigh", "RATES.DIFF.HIGH",
             "Upper end of the confidence interval for rate of group i minus rate of group j (a fraction; format "
             "as %). Below 0: group i is worse by at least this much." TALLYRATES_WHY_502_POSITIONS,
             diff_bound_args},
    function{"pairP", "RATES.PAIR.P",
             "p-value for \"groups i and j share one rate\" (two-sided): small (below 0.05, say) means these two "
             "differ by more than chance explains." TALLYRATES_WHY_502_POSITIONS,
             pair_p_args},
    function{"pairs", "RATES.PAIRS",
             "Table of every pair of groups: the two groups, difference, interval low and high, p-value and "
             "adjusted p-value. Enter as an array formula 7 columns wide and G(G-1)/2 + 1 rows high for G groups "
             "(the first cell says how many rows the table needs; surplus rows stay blank). Problems with the "
             "input are shown in the first cell.",
             pairs_args, true},
    function{"oneLow", "RATES.ONE.LOW",
             "Lower end of the confidence interval for the success rate of group i (a fraction; format as %). "
             "With 14 of 14 passing, 95 % Wilson gives 78.5 %: the run shows the rate is at least that." TALLYRATES_WHY_502_ONE,
             one_args},
    function{"oneHigh", "RATES.ONE.HIGH",
             "Upper end of the confidence interval for the success rate of group i (a fraction; format as %). "
             "With 0 defects in 40, a defect rate is below this with the chosen confidence." TALLYRATES_WHY_502_ONE,
             one_args},
};

}  // namespace

std::span<const function> pairs_functions() { return table; }

}  // namespace tallyrates::catalog
