// apart/catalog.cpp - wizard texts of the apart family: which groups stand
// apart from the whole (decision limits: analysis of means, funnel and
// p-chart limits). Written in plant words; wording is ours.
#include <array>

#include "../catalog.hpp"
#include "../shared_arguments.hpp"
#include "tallyrates/apart/limits.hpp"

namespace tallyrates::catalog {

namespace {

#define WHY_502_APART                                                                                              \
    " If the cell shows Err:502, RATES.CHECK on the same ranges says why (a word that is not one of those listed " \
    "here, a target outside 0 to 1, fewer than two groups with attempts and no target, every unit passing or "   \
    "none, or spread \"time\" with method \"exact\" are the other causes). Err:523 when exact limits for every " \
    "group at once would store more than 4,000,000 probabilities (counts in the billions): use \"normal\"."

constexpr argument level{
    "level",
    "How sure the limits are, between 0 and 1: 0.95 means a group sharing the others' rate falls outside with "
    "chance 5 % or less; 0.9973 gives the three-sigma limits of a p-chart.",
    arguments::default_level};
constexpr argument family{
    "family",
    "Leave empty or \"all\": the limits hold for every group at once, so looking at all of them and acting on "
    "any outside stays honest (analysis of means). \"each\": one group at a time (a funnel chart, or with rows "
    "as days and level 0.9973, a p-chart).",
    "\"all\""};
constexpr argument target{
    "target",
    "A standard rate to judge against, as a fraction (the plant target, 0.95 for 95 %). Leave empty to judge "
    "each group against the overall rate of the tally.",
    "none: the tally's overall rate"};
constexpr argument method{
    "method",
    "Leave empty or \"exact\": whole counts, right for small groups and rates near 0 % or 100 %. \"normal\": "
    "centre plus or minus a multiple of the standard error, the textbook chart (needs about 5 passing and 5 "
    "failing units expected per group).",
    "\"exact\""};
constexpr argument spread{
    "spread",
    "Leave empty or \"none\": counting is the only variation. \"time\", for rows in time order (days, lots in "
    "sequence) with method \"normal\": widens the limits by the variation seen from row to row (Laney's "
    "p'-chart), when the groups vary more than counting explains.",
    "\"none\""};
constexpr std::array bound_args{shared::successes, shared::attempts, shared::i, level, family, target, method, spread};
constexpr std::array table_args{shared::successes, shared::attempts, level, family, target, method, spread,
                                shared::labels};

constexpr std::array curve_args{
    shared::successes, shared::attempts, level,
    argument{"target", "A standard rate to draw the funnel around (0.95 for 95 %); empty: the tally's overall rate.",
             "none: the tally's overall rate"},
    argument{"sizes", "How many group sizes the curves are drawn at, from the smallest group's attempts to the "
                      "largest's (2 to 1000).",
             static_cast<double>(apart::default_curve_points)}};
constexpr std::array fit_args{
    shared::successes, shared::attempts,
    argument{"part", "\"a\" for the prior's successes (prior_a of the POST functions), \"b\" for its failures "
                     "(prior_b).",
             ""}};

constexpr std::array table{
    function{"apartLow", "RATES.APART.LOW",
             "Lower decision limit for the rate of group i, around the whole (the tally's overall rate, or the "
             "target): a group below it is unlikely to share the others' rate. A point outside the limits is a "
             "signal to investigate, not a verdict on a line or supplier." WHY_502_APART,
             bound_args},
    function{"apartHigh", "RATES.APART.HIGH",
             "Upper decision limit for the rate of group i, around the whole: a group above it is unlikely to "
             "share the others' rate (for defect counts, a group above is the worse one)." WHY_502_APART,
             bound_args},
    function{"apart", "RATES.APART",
             "Table of every group against limits around the whole: name, attempts, rate, lower and upper limit, "
             "and the verdict (above, below, within). Enter as an array formula 6 columns wide and as many rows "
             "as the range plus 3 (the header, then one row per row of the range, blank rows blank, then room for "
             "a note and a caution when the groups vary more than counting explains). Problems with the input "
             "are shown in the first cell. A point outside is a signal to investigate, not a verdict.",
             table_args, true},
    function{"apartCurve", "RATES.APART.CURVE",
             "The limits of one group at a time (exact, smoothed between whole counts as Spiegelhalter 2005 does) "
             "as curves over group size, for a funnel chart: a header row, then one row per size with attempts, "
             "lower and upper limit. Plot the curves as lines and the groups (attempts, rate) as points: a point "
             "outside the funnel is a signal to investigate. Enter as an array formula 3 columns wide and sizes "
             "+ 1 rows high. If the cell shows Err:502, RATES.CHECK on the same ranges says why (a target outside "
             "0 to 1, sizes outside 2 to 1000, fewer than two groups with attempts and no target, or every unit "
             "passing or none are the other causes).",
             curve_args, true},
    function{"priorFit", "RATES.PRIOR.FIT",
             "The Beta prior that fits the groups themselves (beta-binomial, largest marginal likelihood, Williams "
             "1975): put part \"a\" and part \"b\" into prior_a and prior_b of the POST functions, and a short "
             "run such as a pilot's 10 of 10 is pulled toward what the other lines show. When the groups vary no "
             "more than counting explains, the fit would grow without end: it stops at a + b = 1,000,000, the "
             "largest prior the POST functions take. Needs two or more groups with attempts. If the cell shows "
             "Err:502, RATES.CHECK on the same ranges says why (a part that is not one of the words listed here is "
             "the other cause).",
             fit_args},
};

#undef WHY_502_APART

}  // namespace

std::span<const function> apart_functions() { return table; }

}  // namespace tallyrates::catalog
