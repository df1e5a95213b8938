// rules.hpp - rules of comparison shared by several families, kept in one
// place so that every test and every message uses the same value.
#pragma once

namespace tallyrates {

// Two statistics (or table probabilities) within this relative distance
// count as tied, so a table tied with the observed one counts as "as
// extreme" despite rounding (methods.md; the usual choice of exact-test
// implementations, common practice, no source).
inline constexpr double tie_tolerance = 1e-7;

// Which way is better: successes are good (units within specification), or
// the counts are defects, so that the lower rate is the better one. Every
// function whose answer or words mean "better" takes it.
enum class goal { high, low };
inline constexpr goal default_goal = goal::high;

// What a bound claims: "two", it is one end of an interval that holds with
// probability level (each tail (1 - level) / 2); "one", the bound alone holds
// with probability level (its tail 1 - level), the claim of a demonstration
// (methods.md, "One-sided claims").
enum class sides { two, one };
inline constexpr sides default_sides = sides::two;

}  // namespace tallyrates
