// residuals.hpp - how far each group's successes stand from one shared rate
// (Haberman 1973, Biometrics 29:205).
#pragma once

#include <optional>
#include <vector>

#include "tallyrates/core/counts.hpp"

namespace tallyrates::omnibus {

// Adjusted standardized residual of each group's successes under one shared
// rate (Haberman 1973, Biometrics 29:205): (x - E) / sqrt(E (1 - n/N)(1 - S/N)),
// about standard normal when the rates are alike, so a group beyond about +-2
// stands out. One value per position of the range (a range longer than
// 65,536 rows, such as a whole column, only down to its last group); blank
// rows and groups without attempts have none. All 0 when every attempt (or
// none) succeeded.
std::vector<std::optional<double>> adjusted_residuals(const counts& c);

}  // namespace tallyrates::omnibus
