// network.cpp - exact conditional p-value for the 2 x G table with fixed margins.
//
// Under the hypothesis of one shared rate and given the margins, the table
// follows the multivariate hypergeometric law; taking the groups one at a time,
// group k's successes given the successes s already placed are hypergeometric
// (population = attempts still to place, marked = S - s, draws = n_k). The
// p-value sums the probabilities of all tables whose statistic is at least the
// observed one (Freeman & Halton 1951 for the probability ordering; Mehta &
// Patel 1983, JASA 78:427, for the network idea of summing over paths).
//
// The network: levels of groups with the cumulative success count as node.
// Each node holds buckets of partial statistic values [lo, hi] with their
// probability, sorted by lo. Buckets closer than `merge_width` (relative to
// the observed statistic) are merged, keeping the union interval, so results
// are certified: p_low counts only tables proven extreme, p_high adds the
// tables that could not be decided. With the default width 1e-9 every bucket
// is far narrower than the 1e-7 tie tolerance and p is the exact answer.
// Pruning on both sides (methods.md): `reach` (plan.cpp) bounds what the other groups
// can still add; a bucket whose every completion is extreme adds its whole
// probability at once (the completions' conditional probabilities sum to 1),
// one with no extreme completion is dropped.
//
// Building a level: node j of the next level receives, from each node s of
// this one, that node's list shifted by the term of x = j - s and scaled by
// P(x | s). Each such run is already sorted, so the node is a k-way merge of
// its runs (rounds of two-way merges, Knuth 1998, TAOCP vol. 3, 5.4.1),
// merged within the width as it is written: no sort at all. The part of a
// run that is surely extreme is one suffix sum of its weights.
//
// Meet in the middle (the split-and-join of subset sums, Horowitz & Sahni
// 1974, JACM 21:277, applied to the network): one pass takes groups from the
// front, the other from the back (the same pass over the groups in reverse
// order), each pruned by the exact minimum and maximum of what all the other
// groups can add per success count, so neither pass needs the other's
// lists. The front pass starts alone and the back pass starts only once the
// front pass's lists have grown enough to pay for it (near one shared rate
// they never do); then the pass whose next level reads fewer buckets (its
// list sizes now, times the values its next group can take) takes that
// group, so the halves end balanced by measured sizes. The one group
// left between them is summed over in the join, never stored:
// P(table) = P(front part) P(x | front part) P(back part) / P(back total),
// walking the sorted front and back lists with moving pointers over the band
// of front buckets where the outcome is open.
//
// Threads: each level (and the join) is cut into chunks of destination nodes
// by the input they read; the chunks are the same whatever the thread count,
// each is computed alone and the sums are added in node order, so p, its
// bounds and every refusal are bit for bit the same with 1 or 2 threads.
//
// Work unit: one law value built, one bucket moved by a merge round, one step
// of a search, one front bucket walked in the join (four units). On this
// project's 2-core machine a unit takes 1.3-2 ns with two threads
// (bench_exact). The cap makes the cost deterministic; memory is capped in
// buckets held at once (24 bytes each), merge buffers included.
#include "omnibus/exact/network.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"
#include "tallyrates/omnibus/exact.hpp"

namespace tallyrates::omnibus {

namespace exact_network {

namespace {

// When the back pass starts (takes_next).
constexpr double back_bounds_factor = 1.5, front_levels_factor = 2;

}  // namespace

bool network::run() {
    if (!prepare()) return false;
    const std::size_t G = t_.groups();
    std::vector<std::size_t> order(G);
    std::iota(order.begin(), order.end(), std::size_t{0});
    pass front{pass_plan(t_, order), {}, direction::front};
    std::reverse(order.begin(), order.end());
    pass back{pass_plan(t_, order), {}, direction::back};
    // Both passes' bounds are held throughout: two doubles per node and
    // level, a third of a bucket each. Past half the memory cap the table
    // is refused before they are built (10,000 groups of 2 would need 1.6 GB).
    std::size_t nodes = 0;
    for (std::size_t k = 0; k <= G; ++k) nodes += front.plan.width(k) + back.plan.width(k);
    reach_held_ = nodes * 2 / 3;
    if (reach_held_ > max_buckets_ / 2) {
        out_.too_large = true;
        return over_memory();
    }
    // For the start of the back pass (takes_next): the values the front
    // pass's groups take from each level to its last, and the cost of the
    // back pass's bounds; computed once (a million groups are possible).
    ahead_.assign(G + 1, 0.0);
    for (std::size_t k = G; k-- > 1;) ahead_[k - 1] = ahead_[k] + values_of(t_, front.plan.groups[k - 1]);
    back_bounds_ = 0;
    for (std::size_t k = 0; k < G; ++k)
        back_bounds_ += static_cast<double>(back.plan.width(k)) * values_of(t_, back.plan.groups[k]);
    double front_spent = 0;  // the front pass's level costs so far
    while (front.k + back.k + 1 < G) {
        pass& p = takes_next(front, back, front_spent);
        pass& other = &p == &front ? back : front;
        if (&p == &front) front_spent += level_cost(front);
        if (!step(p, other.cur.total())) return false;
    }
    return join(front, back);
}

// Set-up cost check, term tables, threshold and merge width.
bool network::prepare() {
    // The set-up alone needs `pre`; the enumeration at least as much again.
    const double pre = setup_work(t_, o_);
    if (pre > static_cast<double>(work_cap_) / 2) {
        out_.work = work_cap_;
        out_.too_large = true;
        out_.stopped = "the exact enumeration needs more than " +
                       format_number(static_cast<double>(work_cap_)) + " steps, the table is too large";
        return false;
    }
    out_.work = static_cast<std::uint64_t>(pre);
    try {
        terms_ = detail::term_tables(t_, o_);
    } catch (const budget_exceeded& e) {
        out_.stopped = e.what();
        out_.too_large = true;
        return false;
    }
    const double observed = detail::observed_total(t_, o_);
    threshold_ = detail::extreme_threshold(observed, o_);
    width_ = merge_width_ * std::max(1.0, std::fabs(observed));
    return true;
}

bool network::over_cap() {
    if (out_.work <= work_cap_) return false;
    out_.stopped = "the exact enumeration needs more than " + format_number(static_cast<double>(work_cap_)) +
                   " steps";
    return true;
}

bool network::over_memory() {
    out_.stopped = "the exact enumeration needs more than " + format_number(static_cast<double>(max_buckets_)) +
                   " partial results in memory at once";
    return false;
}

// Buckets the pass's next level reads, times the values its group takes.
double network::level_cost(const pass& p) const {
    if (p.k == p.plan.levels()) return inf;
    return static_cast<double>(p.cur.total()) * values_of(t_, p.plan.groups[p.k]);
}

// Which pass takes the next group. The front pass starts alone: near one
// shared rate its lists stay small (its bounds tighten as fewer groups
// remain), and a back pass costs more to start than it saves. The back
// pass starts once the front pass's remaining levels, at its present list
// size, would cost more than back_bounds_factor times the back pass's bounds
// (building them, and the laws of its nodes that carry only surely extreme
// mass) plus front_levels_factor times the front levels so far (the back
// pass's first levels mirror them, at about twice the cost, as its nodes
// also carry surely extreme mass). Both factors measured on 2 x 12 tables
// near one shared rate, N = 120 to 420: N = 150, 31 us alone against 48 us
// with both passes; N = 300 (G^2), 306 us with both against 479 us alone.
// Once both have started, the one whose next level reads fewer buckets
// takes the group, so the halves end balanced by measured sizes.
pass& network::takes_next(pass& front, pass& back, double front_spent) const {
    if (back.k > 0) return level_cost(front) <= level_cost(back) ? front : back;
    if (front.k == 0) return front;
    const double alone = static_cast<double>(front.cur.total()) * ahead_[front.k];
    return alone > back_bounds_factor * back_bounds_ + front_levels_factor * front_spent ? back : front;
}

// Small groups first keeps early levels narrow; the p-value does not depend
// on the order.
table smallest_first(const table& t_in) {
    std::vector<std::size_t> idx(t_in.groups());
    std::iota(idx.begin(), idx.end(), std::size_t{0});
    std::stable_sort(idx.begin(), idx.end(), [&](auto a, auto b) { return t_in.n[a] < t_in.n[b]; });
    table t = t_in;
    for (std::size_t i = 0; i < idx.size(); ++i) {
        t.n[i] = t_in.n[idx[i]];
        t.x[i] = t_in.x[idx[i]];
        if (i < t_in.position.size()) t.position[i] = t_in.position[idx[i]];
    }
    return t;
}

}  // namespace exact_network

exact_outcome exact_p(const table& t_in, ordering o, std::uint64_t work_cap, std::size_t max_buckets,
                      double merge_width, unsigned threads) {
    exact_outcome out;
    if (t_in.all_alike()) {
        // One possible table: it is as extreme as itself.
        out.p = out.p_low = out.p_high = 1.0;
        out.complete = true;
        return out;
    }
    const table t = exact_network::smallest_first(t_in);
    exact_network::network net(t, o, work_cap, max_buckets, merge_width, threads, out);
    out.complete = net.run();
    return out;
}

}  // namespace tallyrates::omnibus
