// table.cpp - the 2 x G table, expected counts and the observed
// statistics X^2, G^2 and the table probability (Agresti 2002, Categorical
// Data Analysis, 3.2); the per-group terms are in detail/terms.cpp.
#include <cmath>

#include "detail/terms.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/table.hpp"

namespace tallyrates::omnibus {

table table_of(const counts& c) {
    table t;
    for (const auto& g : c.with_attempts()) {
        t.x.push_back(g.successes);
        t.n.push_back(g.attempts);
        t.position.push_back(g.position);
        t.successes += g.successes;
        t.attempts += g.attempts;
    }
    if (t.groups() < 2)
        throw invalid_input("At least two groups with attempts are needed to compare rates; " +
                            std::to_string(t.groups()) + (t.groups() == 1 ? " has" : " have") + " any.");
    return t;
}

expected_summary expected_counts(const table& t) {
    expected_summary e;
    e.cells = 2 * t.groups();
    e.smallest = INFINITY;
    const double N = static_cast<double>(t.attempts);
    const double S = static_cast<double>(t.successes);
    for (std::size_t g = 0; g < t.groups(); ++g) {
        const double n = static_cast<double>(t.n[g]);
        const double E[2] = {n * S / N, n * (N - S) / N};
        for (int failures = 0; failures < 2; ++failures) {
            if (E[failures] < e.smallest) {
                e.smallest = E[failures];
                e.smallest_position = t.position.empty() ? g + 1 : t.position[g];
                e.smallest_is_failures = failures == 1;
            }
            if (E[failures] < min_expected_count) ++e.below_five;
        }
    }
    return e;
}


double statistic(const table& t, ordering o) {
    if (t.all_alike()) return o == ordering::probability ? 1.0 : 0.0;
    const double total = detail::observed_total(t, o);
    if (o != ordering::probability) return total;
    // Probability of the observed table: prod C(n_g, x_g) / C(N, S).
    double log_p = -detail::log_choose(t.attempts, t.successes);
    for (std::size_t g = 0; g < t.groups(); ++g) log_p += detail::log_choose(t.n[g], t.x[g]);
    return std::exp(log_p);
}

}  // namespace tallyrates::omnibus
