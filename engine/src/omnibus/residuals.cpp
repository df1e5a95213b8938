// residuals.cpp - adjusted standardized residuals of each group's successes
// under one shared rate (Haberman 1973, Biometrics 29:205).
#include "tallyrates/omnibus/residuals.hpp"

#include <cmath>

#include "tallyrates/omnibus/table.hpp"

namespace tallyrates::omnibus {

// Longer ranges are handed back only down to their last group.
constexpr std::size_t residual_rows_whole = 65536;

std::vector<std::optional<double>> adjusted_residuals(const counts& c) {
    const table t = table_of(c);
    std::vector<std::optional<double>> out(c.range_size());
    const double N = static_cast<double>(t.attempts), S = static_cast<double>(t.successes);
    for (std::size_t g = 0; g < t.groups(); ++g) {
        const double n = static_cast<double>(t.n[g]);
        const double expected = n * S / N;
        const double variance = expected * (1 - n / N) * (1 - S / N);
        out[t.position[g] - 1] = t.all_alike() ? 0.0 : (static_cast<double>(t.x[g]) - expected) / std::sqrt(variance);
    }
    if (out.size() > residual_rows_whole) out.resize(t.position.back());
    return out;
}

}  // namespace tallyrates::omnibus
