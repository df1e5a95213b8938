// planning.hpp - how many more attempts: the size of a demonstration test,
// of a tally whose interval has a given width, of two groups that are to
// show a given difference, and how long a perfect pilot must keep going.
//
// - demonstration (RATES.PLAN.DEMO): the fewest attempts n such that, with at
//   most f failures among them, the one-sided Clopper-Pearson lower bound
//   at confidence C for the rate is at least R, i.e.
//   P(at most f failures in n | rate R) <= 1 - C (the binomial tail, by
//   Boost.Math's incomplete beta). For f = 0 that is the success-run formula
//   n = ln(1 - C) / ln(R) (common practice in reliability demonstration, no
//   single source), taken with log1p so that R near 1 keeps its digits.
// - width (RATES.PLAN.WIDTH): the fewest n for which the two-sided interval
//   of RATES.ONE.LOW/HIGH at the expected count x = round(rate n) has
//   half-width (high - low) / 2 at most E. Widths of whole counts saw-tooth
//   in n (Brown, Cai & DasGupta 2001, Stat Sci 16:101), so n is searched
//   directly: a root search (TOMS 748) on a smooth lower envelope (the narrower of the
//   intervals at the real counts rate n -+ 1/2: a half-width is largest
//   mid-range and falls towards either end, so no whole count within 1/2 of
//   rate n gives a narrower one) finds the first n where the target is
//   possible, and n is then stepped up one at a time until the interval of
//   the whole count meets it.
// - power (RATES.PLAN.POWER): attempts n of group 1, and r n of group 2, to
//   detect rate_1 against rate_2 with a two-sided test at level alpha:
//   Fleiss, Levin & Paik (2003, Statistical Methods for Rates and
//   Proportions, 3rd ed., sections 4.2 and 4.4),
//     n' = (z_{alpha/2} sqrt((r + 1) pbar qbar) + z_power sqrt(r p1 q1 + p2 q2))^2 / (r (p1 - p2)^2),
//   pbar = (p1 + r p2) / (r + 1), and with the continuity correction of
//   Fleiss, Tytun & Ury (1980, Biometrics 36:343),
//   n = n'/4 (1 + sqrt(1 + 2 (r + 1) / (r n' |p1 - p2|)))^2. Each inverts
//   exactly the normal approximation to the power of the uncorrected or
//   corrected test, so the smallest whole n is the ceiling; r = 1 is the
//   equal-groups formula.
// - more (RATES.PLAN.MORE): the fewest further units m, all passing, after
//   which a record of run + m units with `failed` failures demonstrates the
//   rate as above: the demonstration size for f = failed, less the run so
//   far (the binomial tail falls as units are added, so no smaller m can
//   meet it), 0 when the record already shows the rate.
// - ahead (RATES.PLAN.AHEAD): the fewest further attempts m of a group, all
//   successful (for goal low: all without a defect), after which P(its rate
//   is the better one) reaches the confidence (bayes::ahead). The probability rises with m, so m is found by
//   doubling, then bisection.
//
// Every answer is capped at max_attempts; an answer beyond it, or a target
// no number of attempts meets, is unreachable_target (Err:523), found before
// any long search.
#pragma once

#include <cstdint>
#include <optional>

#include "tallyrates/bayes/law.hpp"
#include "tallyrates/pairs/one_rate.hpp"

namespace tallyrates::planning {

inline constexpr double max_attempts = 1e9;

// RATES.PLAN.DEMO. rate in (0, 1] (1 is unreachable), confidence in (0, 1).
std::int64_t demonstration(double rate, double confidence, std::int64_t failures);

// RATES.PLAN.MORE. run >= 0 units so far, of which 0 <= failed <= run failed
// (invalid_input otherwise); rate and confidence as for demonstration. The
// answer is at most max_attempts (unreachable_target beyond it).
std::int64_t more_units(double rate, double confidence, std::int64_t run, std::int64_t failed);

// Half-width of the interval of RATES.ONE.LOW/HIGH for round(rate n)
// successes in n attempts.
double half_width(double rate, std::int64_t n, double level, one_rate::method how);
// RATES.PLAN.WIDTH. rate in [0, 1], half_width in (0, 1) (0 is unreachable).
std::int64_t width(double rate, double half_width, double level, one_rate::method how);

enum class correction { none, continuity };
// The score test without correction is what RATES.PAIR.P uses by default.
inline constexpr correction default_correction = correction::none;
// A zero-failure (success-run) plan unless failures are allowed.
inline constexpr std::int64_t default_failures = 0;
// What a cell holding TRUE or FALSE passes (1 or 0); other numbers are refused.
correction correction_from_number(double value);
// The size of group 2 as a multiple of group 1's (a running line beside a
// pilot with a tenth of its output: 10); equal groups when none is given.
inline constexpr double default_ratio = 1, min_ratio = 0.001, max_ratio = 1000;
// RATES.PLAN.POWER: attempts of group 1 (group 2 gets ratio times as many).
// Rates in [0, 1] and different, power and alpha in (0, 1) (power 1 is
// unreachable), ratio in [min_ratio, max_ratio].
std::int64_t power(double rate_1, double rate_2, double power, double alpha, correction how,
                   double ratio = default_ratio);
// The power and false-alarm risk used when none is given (the usual 80 % and
// 5 %; common practice, no source).
inline constexpr double default_power = 0.8, default_alpha = 0.05;
// The power the formula gives at n attempts of group 1 and ratio n of group 2
// (for tests and the docs).
double power_at(double rate_1, double rate_2, double n, double alpha, correction how, double ratio = default_ratio);

// RATES.PLAN.AHEAD: further successes of `pilot` until P(rate_pilot >
// rate_other) >= confidence; 0 when it already is. Goal low (the counts are
// defects): further attempts without a defect until P(rate_pilot <
// rate_other) >= confidence, the same search on the mirrored laws.
std::int64_t ahead(const bayes::beta_law& pilot, const bayes::beta_law& other, double confidence,
                   goal g = default_goal);

}  // namespace tallyrates::planning
