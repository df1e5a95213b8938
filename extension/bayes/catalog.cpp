// bayes/catalog.cpp - wizard texts of the Bayesian family (functions.md,
// "Bayesian"): answers as probabilities about the rates themselves, computed
// exactly (no random draws). Written for an engineer who knows the process,
// not the statistics. Wording is ours.
#include <array>

#include "../catalog.hpp"
#include "../shared_arguments.hpp"
#include "tallyrates/bayes/alike.hpp"

namespace tallyrates::catalog {

namespace {

using shared::attempts;
using shared::i;
using shared::prior_a;
using shared::prior_b;
using shared::successes;

// `also`: the function's other arguments and their rules.
#define WHY_502_POST(also)                                                                                  \
    " If the cell shows Err:502: i must name a filled row of the range (a group with 0 attempts is fine: it "   \
    "keeps the prior), priors must lie from 0.01 to 1000000" also "; RATES.CHECK on the same ranges checks "  \
    "the counts."
// The same for functions of two groups (i and j).
#define WHY_502_POST_PAIR_ALSO(also)                                                                        \
    " If the cell shows Err:502: i and j must name two different filled rows of the range (a group with 0 "   \
    "attempts is fine: it keeps the prior), priors must lie from 0.01 to 1000000" also "; RATES.CHECK on the " \
    "same ranges checks the counts."
#define WHY_502_POST_PAIR WHY_502_POST_PAIR_ALSO("")
// The same for functions of every group (no i): what else they take is
// named where they are described.
#define WHY_502_POST_ALL(also)                                                                              \
    " If the cell shows Err:502: priors must lie from 0.01 to 1000000" also "; RATES.CHECK on the same ranges " \
    "checks the counts."
// Where the answer is an integral over the groups' laws (P(best), the loss,
// P(ahead) when no finite sum applies).
#define WHY_523_WORK                                                                                         \
    " Err:523 when the groups' laws need more than about 2 s of work (many groups of 10^6 attempts or more)."

constexpr argument credible_level{
    "level", "Probability the interval holds, between 0 and 1: 0.95 means the rate lies inside with probability 95 %.",
    arguments::default_level};
constexpr argument kind{
    "kind",
    "\"central\" (equal chance of lying below and above: each bound is passed with probability (1 - level)/2), "
    "\"hpd\" (the shortest interval: starts at 0 % or ends at 100 % when the counts are all failures or all "
    "successes), or \"one-sided\" (each bound alone holds with probability level: \"the rate is at least LOW "
    "with probability 95 %\"; level at least 0.5).",
    "\"central\""};
constexpr argument rate{"rate",
                        "The target rate as a fraction, e.g. 0.99 for 99 % within specification (or, with goal "
                        "\"low\", the largest defect rate you accept).",
                        ""};
constexpr argument further{
    "m", "How many further attempts (units, runs) you plan: a whole number, 0 or more, up to 10^15 (beyond: Err:523).",
    ""};
constexpr argument at_least{"k", "How many of those must succeed: a whole number from 0 to m.", "m: every one"};

constexpr std::array mean_args{successes, attempts, i, prior_a, prior_b};
constexpr std::array bound_args{successes, attempts, i, credible_level, kind, prior_a, prior_b};
constexpr std::array above_args{successes, attempts, i, rate, shared::goal, prior_a, prior_b};
constexpr std::array next_args{successes, attempts, i, further, at_least, prior_a, prior_b};
constexpr std::array ahead_args{successes, attempts, i, shared::j, shared::goal, prior_a, prior_b};
constexpr std::array order_args{successes, attempts, shared::goal, prior_a, prior_b};
constexpr std::array diff_args{successes, attempts, i, shared::j, credible_level, prior_a, prior_b};
constexpr std::array best_args{successes, attempts, i, shared::goal, prior_a, prior_b};
constexpr argument prior_same{
    "prior_same",
    "How likely you thought, before these counts, that every group shares one rate: between 0 and 1.",
    bayes::default_prior_same};
constexpr std::array same_args{successes, attempts, prior_same, prior_a, prior_b};
constexpr std::array curve_args{
    successes, attempts,
    argument{"points", "How many rates the curves are drawn at, evenly over the span (2 to 10001; with span "
             "\"whole\", 101 is every percent).",
             static_cast<double>(bayes::default_curve_points)},
    prior_a, prior_b, shared::labels,
    argument{"span", "Which rates the curves cover: \"whole\" every rate from 0 % to 100 %; \"likely\" only "
             "where some group's rate is likely to lie (from the lowest group's 0.01 % quantile to the highest "
             "group's 99.99 %, widened to whole percents), so that a chart with automatic axes follows the "
             "counts as they change.",
             "\"whole\""}};
constexpr std::array table_args{successes, attempts, credible_level, shared::goal, prior_a, prior_b, shared::labels};

constexpr std::array table{
    function{"postMean", "RATES.POST.MEAN",
             "Expected success rate of group i given its counts and the prior (a fraction; format as %). With the "
             "default prior, (successes + 1) / (attempts + 2): 14 of 14 gives 93.8 %." WHY_502_POST(""),
             mean_args},
    function{"postLow", "RATES.POST.LOW",
             "Lower credible bound for the rate of group i (a fraction; format as %): with kind \"central\" (the "
             "default) the rate lies below it with probability (1 - level)/2, 2.5 % at 0.95; with \"one-sided\" "
             "the rate is at least this with probability level. A group with no attempts yet gives the prior's "
             "bound." WHY_502_POST(", level strictly between 0 and 1 and kind one of the words listed"),
             bound_args},
    function{"postHigh", "RATES.POST.HIGH",
             "Upper credible bound for the rate of group i (a fraction; format as %): passed with probability "
             "(1 - level)/2 for kind \"central\", the rate at most this with probability level for "
             "\"one-sided\"."
             WHY_502_POST(", level strictly between 0 and 1 and kind one of the words listed"),
             bound_args},
    function{"postAbove", "RATES.POST.ABOVE",
             "Probability that the rate of group i is above the target rate, given its counts: \"how sure are we "
             "that this lot meets 99 %\". With goal \"low\" (defect counts), the probability that it is below."
             WHY_502_POST(", rate from 0 to 1 and goal one of the words listed"),
             above_args},
    function{"postNext", "RATES.POST.NEXT",
             "Probability that at least k of the next m attempts of group i succeed, given its counts so far "
             "(k = m: all of them, e.g. the chance that the next 20 units all pass)."
             WHY_502_POST(", m and k whole numbers with k from 0 to m"),
             next_args},
    function{"postAhead", "RATES.POST.AHEAD",
             "Probability that group i has the better rate than group j, given both groups' counts: the higher "
             "rate, or the lower with goal \"low\" (defect counts). \"The pilot line is better than line 2 with "
             "probability 0.93\". i and j must differ." WHY_502_POST_PAIR_ALSO(" and goal one of the words listed")
             WHY_523_WORK,
             ahead_args},
    function{"postDiffLow", "RATES.POST.DIFF.LOW",
             "Lower end of the central credible interval for rate of group i minus rate of group j (a fraction; "
             "format as %): the difference lies below it with probability (1 - level) / 2, 2.5 % at the default "
             "level. Above 0: the rate of group i is the higher one with probability at least 97.5 % (at 0.95); "
             "higher is better for counts of good units, worse for defect counts (RATES.POST.AHEAD with goal "
             "\"low\" gives that probability directly)."
             WHY_502_POST_PAIR,
             diff_args},
    function{"postDiffHigh", "RATES.POST.DIFF.HIGH",
             "Upper end of the central credible interval for rate of group i minus rate of group j (a fraction; "
             "format as %): the difference lies above it with probability (1 - level) / 2. Below 0: the rate of "
             "group i is the lower one with probability at least 97.5 % (at 0.95)." WHY_502_POST_PAIR,
             diff_args},
    function{"postOrder", "RATES.POST.ORDER",
             "Square array, one row and one column per filled row of the tally: the probability that the row "
             "group's rate is better than the column group's (above it; below it with goal \"low\"). Enter as an array formula G rows by G columns for G "
             "groups; the diagonal stays blank. Up to 100 groups; more give Err:523."
             WHY_502_POST_ALL(" and goal one of the words listed") WHY_523_WORK,
             order_args, true},
    function{"postBest", "RATES.POST.BEST",
             "Probability that group i has the best rate of all the groups (the highest; the lowest with goal "
             "\"low\" for defect counts). Over all groups these add up to 1. Up to 500 groups; more give Err:523."
             WHY_502_POST(" and goal one of the words listed") WHY_523_WORK,
             best_args},
    function{"postLoss", "RATES.POST.LOSS",
             "Expected shortfall of choosing group i: how much rate (a fraction; format as %) you expect to give "
             "up against the truly best group. Near 0: choosing i costs little even if it is not the best. Up to "
             "500 groups; more give Err:523." WHY_502_POST(" and goal one of the words listed") WHY_523_WORK,
             best_args},
    function{"postSame", "RATES.POST.SAME",
             "Probability that every group shares one rate rather than each having its own, given the counts. "
             "It leans towards \"one rate\" when differences are small, more than a p-value does, and depends "
             "on the prior: read it beside RATES.SAME.P." WHY_502_POST_ALL(" and prior_same strictly between 0 and 1"),
             same_args},
    function{"postCurve", "RATES.POST.CURVE",
             "Array for a chart of what each group's rate may be: a header row (the labels, for the chart's "
             "legend), then one row per rate (from 0 to 1, or with span \"likely\" where the rates probably "
             "lie) with the posterior density of every filled row of the tally beside it (a column per group). "
             "Enter "
             "as an array formula points + 1 rows by G + 1 columns; chart it as lines (x: the first column)."
             WHY_502_POST_ALL(", points a whole number from 2 to 10001 and span one of the words listed"),
             curve_args, true},
    function{"postTable", "RATES.POST.TABLE",
             "Array with a header row, then one row per group: its name or position, expected rate, credible "
             "interval low and high (central), probability of being the best, and expected loss of choosing it. "
             "Enter as an array formula 6 columns wide and G + 1 rows high. Up to 500 groups; more give Err:523."
             WHY_502_POST_ALL(", level strictly between 0 and 1 and goal one of the words listed") WHY_523_WORK,
             table_args, true},
};

#undef WHY_502_POST
#undef WHY_502_POST_PAIR
#undef WHY_502_POST_PAIR_ALSO
#undef WHY_502_POST_ALL
#undef WHY_523_WORK

}  // namespace

std::span<const function> bayes_functions() { return table; }

}  // namespace tallyrates::catalog
