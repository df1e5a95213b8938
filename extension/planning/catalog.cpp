// planning/catalog.cpp - wizard texts of the planning family (functions.md,
// "Planning more runs"): how many more attempts a demonstration test, a
// precise rate, a comparison of two groups or a pilot needs. Written in the
// words of reliability and quality work. Wording is ours.
#include <array>

#include "../catalog.hpp"
#include "../shared_arguments.hpp"
#include "tallyrates/planning/planning.hpp"

namespace tallyrates::catalog {

namespace {

#define WHY_502_PLAN                                                                                            \
    " Err:502: an argument is outside what its text allows (rates from 0 to 1, probabilities strictly between " \
    "0 and 1, whole numbers where asked)."
#define WHY_523_PLAN " Err:523: more than 10^9 attempts would be needed, or the target cannot be met at all"

constexpr argument demo_rate{
    "rate",
    "The success rate (reliability) to demonstrate, as a fraction: 0.99 means at least 99 % of units within "
    "specification. Above 0 and below 1.",
    ""};
constexpr argument demo_confidence{
    "confidence",
    "Confidence of the demonstration, between 0 and 1: at 0.95, a process whose true rate is below the one to "
    "demonstrate "
    "passes the test at most 5 times in 100.",
    ""};
constexpr argument failures{
    "failures",
    "Failures the test plan allows: 0 for a zero-failure (success-run) plan, the shortest; allowing 1 or 2 "
    "costs more units, but one stray failure no longer sinks the test. A whole number.",
    static_cast<double>(planning::default_failures)};
constexpr std::array demo_args{demo_rate, demo_confidence, failures};
constexpr std::array more_args{
    demo_rate, demo_confidence,
    argument{"run", "Units tested so far (the record to build on), a whole number: 0 when starting afresh.", ""},
    argument{"failed", "How many of those units failed, a whole number from 0 to run. Each failure makes the "
                       "record longer to build.",
             ""}};

constexpr argument expected_rate{
    "rate",
    "The rate you expect the tally to show, as a fraction (0.9 for 90 %). Unsure? 0.5 is the cautious guess: "
    "it needs the most attempts for a given precision.",
    ""};
constexpr argument half_width{
    "half_width",
    "Precision wanted, as a fraction: 0.02 for plus or minus 2 percentage points (half the interval's width). "
    "Above 0 and below 1.",
    ""};
constexpr std::array width_args{expected_rate, half_width, shared::level, shared::one_rate_method};

constexpr argument rate_1{
    "rate_1", "The rate you expect in one group (today's line, the current supplier), as a fraction: 0.90.", ""};
constexpr argument rate_2{
    "rate_2",
    "The rate in the other group that should be told apart from rate_1 (the improved line), as a fraction: 0.95. "
    "The closer the two, the more attempts.",
    ""};
constexpr argument power{
    "power",
    "Chance of detecting the difference if it is real, between 0 and 1: 0.8 misses a real difference 1 time in "
    "5; choose 0.9 or 0.95 when missing it is costly.",
    planning::default_power};
constexpr argument alpha{
    "alpha",
    "Chance of a false alarm (calling the groups different when they are not), between 0 and 1, two-sided.",
    planning::default_alpha};
constexpr argument correction{
    "correction",
    "FALSE or \"none\": sized for the comparison RATES.PAIR.P makes by default (the score test, no "
    "correction). TRUE or \"continuity\": sized for Fisher's exact test (RATES.PAIR.P with \"exact\"), more "
    "cautious, by the continuity correction of Fleiss, Tytun & Ury (1980); it adds attempts.",
    "FALSE (\"none\"), to match RATES.PAIR.P's default test"};
constexpr argument ratio{
    "ratio",
    "Attempts of group 2 for each attempt of group 1, when the groups cannot be the same size: 10 for a running "
    "line beside a pilot line with a tenth of its output, 0.5 when group 2 gets half as many. From 0.001 to "
    "1000.",
    planning::default_ratio};
constexpr std::array power_args{rate_1, rate_2, power, alpha, correction, ratio};

constexpr std::array ahead_args{
    shared::successes,
    shared::attempts,
    argument{"i", "Position of the group still proving itself (the pilot oven, the new process) in the range.", ""},
    argument{"j", "Position of the group it must beat (the established line), counted the same way.", ""},
    argument{"confidence",
             "How sure you want to be that group i has the better rate, between 0 and 1: 0.95 for 95 in 100 "
             "(as RATES.POST.AHEAD gives it).",
             ""},
    argument{"goal",
             "\"high\" when the counts are good units: further attempts must all succeed; \"low\" when they are "
             "defects: further attempts must all be free of the defect, and group i must reach the lower rate.",
             "\"high\""},
    shared::prior_a,
    shared::prior_b};

constexpr std::array table{
    function{"planDemo", "RATES.PLAN.DEMO",
             "Units to test in a demonstration test: if no more of them fail than the failures allowed, the rate "
             "is shown to be at least the one given, with the chosen confidence. With no failure allowed (a zero-failure plan), "
             "0.99 at 95 % confidence takes 299 units in a row. The claim is one-sided: once the test is run, "
             "RATES.ONE.LOW of the result with the same confidence, \"clopper-pearson\" and sides \"one\" "
             "reaches the rate (59 of 59 at 0.95 gives 95.05 %), and with one unit fewer it would not."
             WHY_502_PLAN WHY_523_PLAN
             " (a rate of 1: 100 % can never be shown by testing).",
             demo_args},
    function{"planMore", "RATES.PLAN.MORE",
             "Further units to test, every one passing, before the whole record (run units so far, failed of them "
             "failed, and the new ones) shows the rate is at least the one given with the chosen confidence, judged as "
             "RATES.PLAN.DEMO judges a plan; 0 when the record already shows it. With 120 units run and none "
             "failed, 0.99 at 95 % confidence takes 179 more." WHY_502_PLAN WHY_523_PLAN
             " (a rate of 1: 100 % can never be shown by testing).",
             more_args},
    function{"planWidth", "RATES.PLAN.WIDTH",
             "Attempts needed so that the confidence interval of RATES.ONE.LOW and RATES.ONE.HIGH is no wider "
             "than plus or minus half_width, if the rate comes out as expected: the smallest such number (counts "
             "are whole, so a few slightly larger numbers can give an interval a hair wider)." WHY_502_PLAN
                 WHY_523_PLAN " (half_width 0).",
             width_args},
    function{"planPower", "RATES.PLAN.POWER",
             "Attempts needed in group 1 (group 2 then gets ratio times as many; equal groups by default) for a "
             "real difference between rate_1 and rate_2 (lines, ovens, suppliers) to show up as significant "
             "(two-sided) with the chosen power. Fleiss, Levin & Paik (2003): 0.10 against 0.15 needs 686 per "
             "group at the defaults, 726 with the continuity correction." WHY_502_PLAN WHY_523_PLAN
             " (equal rates, or power 1).",
             power_args},
    function{"planAhead", "RATES.PLAN.AHEAD",
             "Further attempts group i must complete, every one a success, before its rate is above group j's "
             "with probability at least confidence (RATES.POST.AHEAD): how long a perfect pilot must keep going before "
             "it is trusted over the established line. 0 when it already is; after a failure, enter it and read "
             "the new answer. Err:502: RATES.CHECK on the same ranges with the same i and j checks the counts "
             "and positions; confidence must lie strictly between 0 and 1, priors from 0.01 to 1000000." WHY_523_PLAN
             " (confidence 1, or group j practically perfect).",
             ahead_args},
};

#undef WHY_502_PLAN
#undef WHY_523_PLAN

}  // namespace

std::span<const function> planning_functions() { return table; }

}  // namespace tallyrates::catalog
