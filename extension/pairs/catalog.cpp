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
    "Leave empty or \"miettinen-nurminen\" (recommended): holds its level well even at 0 % or 100 % and with a "
    "dozen units, and is the interval of the test RATES.PAIR.P makes, so the two never disagree. \"newcombe\" "
    "(hybrid score) is as good on its own but may disagree with that test near the edge; \"agresti-caffo\" is a "
    "simple adjusted form; \"wald\" is the textbook formula, too narrow for small counts (for comparison only).",
    "\"miettinen-nurminen\""};
constexpr argument simultaneous{
    "adjust",
    "Leave empty or \"bonferroni\": the bounds of every comparison of the family hold together at the level, "
    "the same control RATES.PAIR.P and RATES.PAIRS use, so the cells agree. \"sidak\" is a little narrower; "
    "\"none\" treats this one comparison as the only one looked at (right only when it was chosen before the "
    "counts were seen).",
    "\"bonferroni\""};
constexpr argument family{
    "family",
    "Which comparisons share the error rate when adjusting: \"all\" (every pair of groups with attempts) or "
    "\"against\" (each group against group j only, e.g. every line against the reference line).",
    "\"all\""};
constexpr std::array diff_args{successes, attempts, i, j};
constexpr std::array diff_bound_args{successes, attempts, i, j, level, difference_method, simultaneous, family,
                                     shared::sides};

constexpr argument p_adjust{
    "adjust",
    "Leave empty or \"bonferroni\" (recommended: controls the chance of any false alarm among all the pairs "
    "compared, and matches the intervals of RATES.DIFF.LOW and RATES.PAIRS). \"holm\" is a little more "
    "sensitive but has no matching interval; \"hochberg\", \"sidak\"; \"benjamini-hochberg\" controls the "
    "share of false alarms among the pairs called different; \"none\" for one comparison chosen beforehand.",
    "\"bonferroni\""};
constexpr argument pair_test{
    "method",
    "\"score\" (the chi-square test of the two rows in its N - 1 form, the test the default interval of "
    "RATES.DIFF.LOW inverts) or \"exact\" (Fisher's exact test, for small counts; refused when the counts are "
    "too large to enumerate, where the score test is as accurate).",
    "\"score\""};
constexpr std::array pair_p_args{successes, attempts, i, j, p_adjust, pair_test, family};

constexpr std::array pairs_args{
    successes, attempts, level,
    argument{"method",
             "Interval method, as for RATES.DIFF.LOW: \"miettinen-nurminen\", \"newcombe\", \"agresti-caffo\" or "
             "\"wald\".",
             "\"miettinen-nurminen\""},
    argument{"adjust",
             "Over all pairs: \"bonferroni\" or \"sidak\" (adjusted p, and intervals that hold jointly, so the "
             "two always agree), \"holm\", \"hochberg\" or \"benjamini-hochberg\" (adjusted p only; intervals "
             "each at the level), or \"none\". The header says which applies.",
             "\"bonferroni\""},
    argument{"goal",
             "Words of the verdict column: \"high\" when the counts are good units (\"Oven A higher\"), \"low\" "
             "when they are defects (\"Lot 3 fewer defects\").",
             "\"high\""},
    shared::labels};

constexpr argument margin{
    "margin",
    "The difference of rates that does not matter in practice, as a fraction: 0.01 is 1 point. From 0 up to 1; "
    "above 0 for \"equivalent\". Choose it from the process, before the counts are in.",
    ""};
constexpr argument claim{
    "claim",
    "Leave empty or \"not-worse\": group i's rate is not below group j's by margin or more (a new supplier "
    "against the old one). \"better\": above group j's by more than margin. \"equivalent\": within +- margin "
    "of it (two one-sided tests, Schuirmann 1987). With goal \"low\" the claims are about defects: not worse "
    "means not above group j's defect rate by margin or more, better means below it by more than margin.",
    "\"not-worse\""};
constexpr std::array margin_args{successes, attempts, i, j, margin, claim, shared::goal};

constexpr std::array one_args{successes, attempts, i, level, shared::one_rate_method, shared::sides};

constexpr std::array table{
    function{"diff", "RATES.DIFF",
             "Observed rate of group i minus rate of group j, as a fraction: format the cell as % to read it in "
             "percentage points (0.047 is 4.7 points), not as a relative change. i and j must differ."
             TALLYRATES_WHY_502_PAIR,
             diff_args},
    function{"diffLow", "RATES.DIFF.LOW",
             "Lower confidence bound for rate of group i minus rate of group j (a fraction; format as %). Above "
             "0: group i's rate is higher by at least this much (better when the counts are good units, worse when "
             "they are defects). By default every pair of the tally is allowed for (Bonferroni), as in "
             "RATES.PAIRS, and the bound is one end of a two-sided interval; sides \"one\" for a one-sided "
             "claim." TALLYRATES_WHY_502_POSITIONS,
             diff_bound_args},
    function{"diffHigh", "RATES.DIFF.HIGH",
             "Upper confidence bound for rate of group i minus rate of group j (a fraction; format as %). Below "
             "0: group i's rate is lower by at least this much. Allows for every pair and makes a two-sided claim "
             "unless told otherwise, as RATES.DIFF.LOW." TALLYRATES_WHY_502_POSITIONS,
             diff_bound_args},
    function{"pairP", "RATES.PAIR.P",
             "p-value for \"groups i and j share one rate\" (two-sided: either may be the higher), by default "
             "adjusted for comparing every pair of the tally (Bonferroni). Below 1 - level (0.05, say) exactly when "
             "the default RATES.DIFF.LOW and HIGH at that level both lie on one side of 0." TALLYRATES_WHY_502_POSITIONS,
             pair_p_args},
    function{"pairs", "RATES.PAIRS",
             "Table of every pair of groups: the two groups, difference (rate of the first minus rate of the "
             "second, as RATES.DIFF), confidence interval low and high, p-value, adjusted p-value, and the verdict "
             "in words (\"Oven A higher\", \"no clear difference\"): a difference is called only when the "
             "interval is clear of 0 and the adjusted p is below 1 - level. Enter as an array formula 8 columns "
             "wide and G(G-1)/2 + 1 rows high for G groups (the first cell says how many rows the table needs; "
             "surplus rows stay blank). Problems with the input are shown in the first cell.",
             pairs_args, true},
    function{"marginP", "RATES.MARGIN.P",
             "p-value for a claim about group i against group j with a margin: not worse by margin or more "
             "(non-inferiority), better by more than margin, or equivalent within +- margin (Farrington and "
             "Manning 1990 score test). Small (below 0.05, say) supports the claim: the counts rule out the "
             "opposite. Statistical support is not engineering acceptance; the margin must come from the "
             "process. If the cell shows Err:502, RATES.CHECK on the same ranges with the same i and j says why "
             "(a margin outside 0 to 1, or a word that is not one of those listed here, are the other causes).",
             margin_args},
    function{"oneLow", "RATES.ONE.LOW",
             "Lower confidence bound for the success rate of group i (a fraction; format as %). With sides "
             "\"two\" (the default) it is one end of an interval holding at level; with \"one\" the bound "
             "alone holds at level: with 59 of 59 passing, RATES.ONE.LOW at 0.95, \"clopper-pearson\", \"one\" "
             "gives 95.05 %: the run shows the rate is at least that with 95 % confidence." TALLYRATES_WHY_502_ONE,
             one_args},
    function{"oneHigh", "RATES.ONE.HIGH",
             "Upper confidence bound for the success rate of group i (a fraction; format as %). With 0 defects in "
             "40 and sides \"one\", the defect rate is below this with confidence level; with \"two\" (the "
             "default) it is one end of an interval holding at level." TALLYRATES_WHY_502_ONE,
             one_args},
};

}  // namespace

std::span<const function> pairs_functions() { return table; }

}  // namespace tallyrates::catalog
