// rules.hpp - rules of comparison shared by several families, kept in one
// place so that every test and every message uses the same value.
#pragma once

namespace tallyrates {

// Two statistics (or table probabilities) within this relative distance
// count as tied, so a table tied with the observed one counts as "as
// extreme" despite rounding (methods.md; the usual choice of exact-test
// implementations, common practice, no source).
inline constexpr double tie_tolerance = 1e-7;

}  // namespace tallyrates
