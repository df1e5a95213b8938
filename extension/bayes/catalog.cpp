// bayes/catalog.cpp - wizard texts of the Bayesian family (functions.md,
// "Bayesian"): answers as probabilities about the rates themselves, computed
// exactly (no random draws). Written for an engineer who knows the process,
// not the statistics. Wording is ours.
#include <array>

#include "../catalog.hpp"
#include "../shared_arguments.hpp"

namespace tallyrates::catalog {

namespace {

using shared::attempts;
using shared::i;
using shared::prior_a;
using shared::prior_b;
using shared::successes;

#define WHY_502_POST                                                                                        \
    " If the cell shows Err:502: i must name a filled row of the range (a group with 0 attempts is fine: it "   \
    "keeps the prior), priors must be above 0 and words as listed; RATES.CHECK on the same ranges checks the " \
    "counts."

constexpr argument credible_level{
    "level", "Probability the interval holds, between 0 and 1: 0.95 means the rate lies inside with probability 95 %.",
    "0.95"};
constexpr argument kind{
    "kind",
    "\"central\" (equal chance of lying below and above) or \"hpd\" (the shortest interval: starts at 0 % or "
    "ends at 100 % when the counts are all failures or all successes).",
    "\"central\""};
constexpr argument rate{"rate",
                        "The target rate as a fraction, e.g. 0.99 for 99 % within specification (or, with goal "
                        "\"low\", the largest defect rate you accept).",
                        ""};
constexpr argument further{"m", "How many further attempts (units, runs) you plan: a whole number, 0 or more.", ""};
constexpr argument at_least{"k", "How many of those must succeed: a whole number from 0 to m.", "m: every one"};

constexpr std::array mean_args{successes, attempts, i, prior_a, prior_b};
constexpr std::array bound_args{successes, attempts, i, credible_level, kind, prior_a, prior_b};
constexpr std::array above_args{successes, attempts, i, rate, shared::goal, prior_a, prior_b};
constexpr std::array next_args{successes, attempts, i, further, at_least, prior_a, prior_b};

constexpr std::array table{
    function{"postMean", "RATES.POST.MEAN",
             "Expected success rate of group i given its counts and the prior (a fraction; format as %). With the "
             "default prior, (successes + 1) / (attempts + 2): 14 of 14 gives 93.8 %." WHY_502_POST,
             mean_args},
    function{"postLow", "RATES.POST.LOW",
             "Lower end of the credible interval for the rate of group i: the rate lies above it with the chosen "
             "probability split (a fraction; format as %). A group with no attempts yet gives the prior's "
             "interval." WHY_502_POST,
             bound_args},
    function{"postHigh", "RATES.POST.HIGH",
             "Upper end of the credible interval for the rate of group i (a fraction; format as %)." WHY_502_POST,
             bound_args},
    function{"postAbove", "RATES.POST.ABOVE",
             "Probability that the rate of group i is above the target rate, given its counts: \"how sure are we "
             "that this lot meets 99 %\". With goal \"low\" (defect counts), the probability that it is below."
             WHY_502_POST,
             above_args},
    function{"postNext", "RATES.POST.NEXT",
             "Probability that at least k of the next m attempts of group i succeed, given its counts so far "
             "(k = m: all of them, e.g. the chance that the next 20 units all pass)." WHY_502_POST,
             next_args},
};

#undef WHY_502_POST

}  // namespace

std::span<const function> bayes_functions() { return table; }

}  // namespace tallyrates::catalog
