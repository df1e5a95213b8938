// shared_arguments.hpp - catalog entries for the arguments that several
// function families take, written once. Wording is ours.
#pragma once

#include "catalog.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/arguments.hpp"

// Ends every description of a function that can fail with Err:502.
#define TALLYRATES_WHY_502 " If the cell shows Err:502, RATES.CHECK on the same ranges says why."
// The same for functions that name two groups by position (i, j) and take words.
#define TALLYRATES_WHY_502_POSITIONS                                                                      \
    " If the cell shows Err:502, RATES.CHECK on the same ranges with the same i and j says why (a word that " \
    "is not one of those listed here is the other cause)."
// Two groups by position, no words.
#define TALLYRATES_WHY_502_PAIR " If the cell shows Err:502, RATES.CHECK on the same ranges with the same i and j says why."
// One group by position (i), with words.
#define TALLYRATES_WHY_502_ONE                                                                            \
    " If the cell shows Err:502, RATES.CHECK on the same ranges with the same i says why (a word that is not " \
    "one of those listed here is the other cause)."

namespace tallyrates::catalog::shared {

inline constexpr argument successes{
    "successes",
    "Cells with the success counts, one group per row (or per column): units within specification, passes. "
    "Rows blank in both ranges are skipped, so include spare rows for counts still to come; a whole column "
    "such as B:B works as fast, and a heading row above the counts is skipped. Cells of a sheet only (another "
    "sheet or a named range is fine): a typed or computed array gives Err:504, so put such values in cells.",
    ""};
inline constexpr argument attempts{
    "attempts",
    "Cells with the attempt counts, selected like successes and the same size: units made, runs tried. A group "
    "with 0 attempts is allowed and left out of tests.",
    ""};
inline constexpr argument i{"i", "Position of the first group in the range (1 = first row of the range, blank rows counted).",
                            ""};
inline constexpr argument j{"j", "Position of the second group, counted the same way.", ""};
inline constexpr argument level{
    "level", "Confidence level between 0 and 1: 0.95 means the interval covers the true value 95 times in 100.",
    arguments::default_level};
inline constexpr argument prior_a{
    "prior_a",
    "What you believed before these counts, as successes: with prior_b, a Beta prior shared by every group. "
    "1 and 1 (the default) treat every rate as equally likely; 0.5 and 0.5 is Jeffreys' prior. From 0.01 to "
    "1000000.",
    bayes::prior{}.a};
inline constexpr argument prior_b{"prior_b", "What you believed before these counts, as failures (see prior_a). From 0.01 to 1000000.",
                                  bayes::prior{}.b};
inline constexpr argument goal{
    "goal",
    "\"high\" when the counts are good units (within specification, passes), \"low\" when they are defects, so "
    "that the lower rate is the better one.",
    "\"high\""};
inline constexpr argument one_rate_method{
    "method",
    "Leave empty or \"wilson\" (recommended). \"clopper-pearson\" (never too narrow, often wider than needed; "
    "the usual choice for demonstrating reliability, and the one RATES.PLAN.DEMO plans for), \"jeffreys\" (its "
    "lower bound is 0 when no unit passed and its upper bound 1 when all did, as Brown, Cai and DasGupta 2001 "
    "advise), or \"agresti-coull\".",
    "\"wilson\""};
inline constexpr argument sides{
    "sides",
    "Leave empty or \"two\": the bound is one end of an interval that holds with probability level (a chance of "
    "(1 - level)/2 on each side). \"one\": the bound alone holds with probability level, the claim of a "
    "demonstration (\"at least 95 % with 95 % confidence\"); level must then be at least 0.5.",
    "\"two\""};
inline constexpr argument labels{
    "labels",
    "Cells with the group names (oven, line, lot), the same size as the count ranges; messages then name the "
    "group as well as its row. Select the rows in use (C2:C200): a whole column works but costs about 0.3 s at "
    "every recalculation.",
    "none: groups are named by position"};

}  // namespace tallyrates::catalog::shared
