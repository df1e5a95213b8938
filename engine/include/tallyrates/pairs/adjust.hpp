// adjust.hpp - multiplicity control over a family of m comparisons.
//
// Simultaneous intervals: Bonferroni (each at 1 - (1 - level) / m) and Sidak
// (each at level^(1/m), Sidak 1967, JASA 62:626). Adjusted p-values: Holm
// (1979, Scand J Stat 6:65), Hochberg (1988, Biometrika 75:800; valid under
// positive dependence), Benjamini & Hochberg (1995, JRSS B 57:289; controls
// the false discovery rate, not the chance of any false call), Bonferroni
// and single-step Sidak (1 - (1 - p)^m). Adjusted values are monotone in the raw ones and capped at 1.
#pragma once

#include <cstddef>
#include <span>
#include <vector>

namespace tallyrates::adjust {

enum class simultaneous { none, bonferroni, sidak };
enum class p_values { none, holm, hochberg, benjamini_hochberg, bonferroni, sidak };

// The level each of m intervals needs so that all m hold together at `level`.
double per_comparison_level(double level, std::size_t m, simultaneous how);

// Adjusted p-values in the order given.
std::vector<double> adjusted(std::span<const double> p, p_values how);

}  // namespace tallyrates::adjust
