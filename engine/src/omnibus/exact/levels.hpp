// levels.hpp (exact route, internal) - the data of the network of partial
// tables: buckets of partial statistic values, the levels of a pass, its plan
// over the groups and the bounds on what the groups it has not taken can add.
// Method and sources in network.cpp.
#pragma once

#include <algorithm>
#include <cstddef>
#include <cstdint>
#include <limits>
#include <vector>

#include "detail/hypergeometric.hpp"
#include "detail/terms.hpp"
#include "tallyrates/omnibus/table.hpp"

namespace tallyrates::omnibus::exact_network {

inline constexpr double inf = std::numeric_limits<double>::infinity();

// Partial statistic values within [lo, hi], with their probability w.
struct bucket {
    double lo, hi, w;
};

// Index of the first bucket with lo >= c in a list sorted by lo.
inline std::size_t first_from(const bucket* list, std::size_t n, double c) {
    return static_cast<std::size_t>(
        std::lower_bound(list, list + n, c, [](const bucket& b, double v) { return b.lo < v; }) - list);
}

// The same index, found by moving from p: a few steps when c moves little
// from one call to the next, as it does along a sorted list.
inline std::size_t move_to(const bucket* list, std::size_t n, std::size_t p, double c) {
    while (p > 0 && list[p - 1].lo >= c) --p;
    while (p < n && list[p].lo < c) ++p;
    return p;
}

// The nodes of one level of a pass: node i's buckets are first(i) ..
// first(i) + size(i), sorted by lo, stored in the parts written by the
// chunks that built the level (never copied); start[i] counts the buckets of
// the nodes before i. sure[i] is node i's mass already known to be extreme
// whatever the other half holds (kept by the back pass only). A new level is
// the empty table: one node, one bucket of value 0, probability 1.
struct level {
    std::vector<std::vector<bucket>> parts;
    std::vector<const bucket*> at;
    std::vector<std::size_t> start{0};
    std::vector<double> sure;
    static level empty_table() {
        level l;
        l.parts.push_back({{0.0, 0.0, 1.0}});
        l.at.push_back(l.parts[0].data());
        l.start.push_back(1);
        l.sure.push_back(0.0);
        return l;
    }
    std::size_t nodes() const { return at.size(); }
    std::size_t total() const { return start.back(); }
    std::size_t size(std::size_t i) const { return start[i + 1] - start[i]; }
    const bucket* first(std::size_t i) const { return at[i]; }
};

// The groups of one pass, in the order it takes them, and the successes that
// can have been placed after each of its levels (level k has taken k groups).
struct pass_plan {
    std::vector<std::size_t> groups;
    std::vector<std::int64_t> lo, hi, used;
    pass_plan(const table& t, std::vector<std::size_t> order) : groups(std::move(order)) {
        const std::size_t K = groups.size();
        lo.resize(K + 1);
        hi.resize(K + 1);
        used.assign(K + 1, 0);
        for (std::size_t k = 0; k <= K; ++k) {
            if (k > 0) used[k] = used[k - 1] + t.n[groups[k - 1]];
            const auto r = detail::feasible_successes(t.attempts, t.successes, used[k]);
            lo[k] = r.first;
            hi[k] = r.last;
        }
    }
    std::size_t levels() const { return groups.size(); }
    std::size_t width(std::size_t k) const { return static_cast<std::size_t>(hi[k] - lo[k] + 1); }
};

// Bounds on what the groups from level k of a pass to its end still add, per
// node: least[k][s - lo_k], most[k][...].
struct reach {
    std::vector<std::vector<double>> least, most;
};
// The bounds of a pass from given bounds at its last level.
reach reach_of(const pass_plan& plan, const table& t, const std::vector<detail::term_row>& terms,
               std::vector<double> end_least, std::vector<double> end_most);

// The values group g's successes can take at one node: at most
// min(n_g, S, F) + 1. A level costs its nodes (or buckets) times this.
double values_of(const table& t, std::size_t g);

// Work before the enumeration: the term tables and both passes' bounds.
double setup_work(const table& t, ordering o);

// One pass: its plan over all the groups, the bounds on what the groups it
// has not taken can add, and the level it has reached (k groups taken).
enum class direction { front, back };  // the back pass keeps surely extreme mass per node
struct pass {
    pass_plan plan;
    reach bound;
    direction from;
    level cur = level::empty_table();
    std::size_t k = 0;
};

}  // namespace tallyrates::omnibus::exact_network
