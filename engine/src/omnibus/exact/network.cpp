// exact.cpp - exact conditional p-value for the 2 x G table with fixed margins.
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
// Pruning on both sides (methods.md): `reach` bounds what the other groups
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
#include <algorithm>
#include <array>
#include <atomic>
#include <bit>
#include <cmath>
#include <limits>
#include <new>
#include <numeric>
#include <thread>

#include "detail/hypergeometric.hpp"
#include "detail/terms.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/exact.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::omnibus {

namespace {

constexpr double inf = std::numeric_limits<double>::infinity();

struct bucket {
    double lo, hi, w;
};

// Index of the first bucket with lo >= c in a list sorted by lo.
std::size_t first_from(const bucket* list, std::size_t n, double c) {
    return static_cast<std::size_t>(
        std::lower_bound(list, list + n, c, [](const bucket& b, double v) { return b.lo < v; }) - list);
}

// The same index, found by moving from p: a few steps when c moves little
// from one call to the next, as it does along a sorted list.
std::size_t move_to(const bucket* list, std::size_t n, std::size_t p, double c) {
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
// node: mn[k][s - lo_k], mx[k][...], from given bounds at the last level.
struct reach {
    std::vector<std::vector<double>> mn, mx;
};

// One level of `reach`: mn[s] = min over x of term(x) + next_mn[s + x]
// (likewise max). The loop runs over s inside x: every s is its own running
// minimum, so there is no chain of dependent min/max from one x to the next
// and the compiler vectorises it (the other way round made a near-table call
// at N = 150 a fifth slower: 61 against 49 us, 2026-12-02).
void reach_level(const detail::term_row& term, std::int64_t n_g, std::int64_t lo, std::int64_t hi,
                 std::int64_t next_lo, std::int64_t next_hi, const std::vector<double>& next_mn,
                 const std::vector<double>& next_mx, std::vector<double>& mn, std::vector<double>& mx) {
    mn.assign(static_cast<std::size_t>(hi - lo + 1), inf);
    mx.assign(mn.size(), -inf);
    const std::int64_t xa = std::max<std::int64_t>(0, next_lo - hi), xb = std::min(n_g, next_hi - lo);
    for (std::int64_t x = xa; x <= xb; ++x) {
        // s + x must be a node of the next level.
        const std::int64_t sa = std::max(lo, next_lo - x), sb = std::min(hi, next_hi - x);
        if (sa > sb) continue;
        const double v = term[x];
        const std::size_t count = static_cast<std::size_t>(sb - sa + 1);
        double* a = mn.data() + (sa - lo);
        double* b = mx.data() + (sa - lo);
        const double* na = next_mn.data() + (sa + x - next_lo);
        const double* nb = next_mx.data() + (sa + x - next_lo);
        for (std::size_t i = 0; i < count; ++i) {
            a[i] = std::min(a[i], v + na[i]);
            b[i] = std::max(b[i], v + nb[i]);
        }
    }
}

reach reach_of(const pass_plan& plan, const table& t, const std::vector<detail::term_row>& terms,
               std::vector<double> end_mn, std::vector<double> end_mx) {
    const std::size_t K = plan.levels();
    reach r{std::vector<std::vector<double>>(K + 1), std::vector<std::vector<double>>(K + 1)};
    r.mn[K] = std::move(end_mn);
    r.mx[K] = std::move(end_mx);
    for (std::size_t k = K; k-- > 0;) {
        const std::size_t g = plan.groups[k];
        reach_level(terms[g], t.n[g], plan.lo[k], plan.hi[k], plan.lo[k + 1], plan.hi[k + 1], r.mn[k + 1],
                    r.mx[k + 1], r.mn[k], r.mx[k]);
    }
    return r;
}

// The values group g's successes can take at one node: at most
// min(n_g, S, F) + 1. A level costs its nodes (or buckets) times this.
double values_of(const table& t, std::size_t g) {
    return static_cast<double>(std::min({t.n[g], t.successes, t.attempts - t.successes}) + 1);
}

// Work before the enumeration: the term tables (the three lgamma calls of a
// probability-ordering value take about 120 ns, some 64 units; measured
// 2026-12-02, 2 x 12, N = 60: 17 us against 8 us for X^2) and the reach of
// both passes (every (node, x) pair once each).
double setup_work(const table& t, ordering o) {
    const double S = static_cast<double>(t.successes), N = static_cast<double>(t.attempts);
    double work = 0, placed = 0;
    for (std::size_t k = 0; k < t.groups(); ++k) {
        const double lo = std::max<double>(0, S - (N - placed));
        const double hi = std::min<double>(S, placed);
        work += 2 * (hi - lo + 1) * values_of(t, k) + values_of(t, k) * (o == ordering::probability ? 64 : 2);
        placed += static_cast<double>(t.n[k]);
    }
    return work;
}

// One pass: its plan over all the groups, the bounds on what the groups it
// has not taken can add, and the level it has reached (k groups taken).
struct pass {
    pass_plan plan;
    reach bound;
    bool back;  // the back pass keeps surely extreme mass per node
    level cur = level::empty_table();
    std::size_t k = 0;
};

// A run into one destination node: a source list from `at` to `end`, shifted
// by the term v and scaled by P(x | s); buckets with hi < never_below (no
// extreme completion) are skipped.
struct run {
    const bucket* at;
    const bucket* end;
    double v, hx, never_below;
};

// Appends c to the node that starts at out[first], merging it into the last
// bucket when the union stays within `width` (the buckets come in order of lo).
inline void put(std::vector<bucket>& out, std::size_t first, const bucket& c, double width) {
    if (out.size() > first) {
        bucket& m = out.back();
        if (std::max(m.hi, c.hi) - m.lo <= width) {
            m.hi = std::max(m.hi, c.hi);
            m.w += c.w;
            return;
        }
    }
    out.push_back(c);
}

// The k-way merge of the runs into one node, as rounds of two-way merges of
// neighbouring runs (a balanced merge tree, Knuth 1998, TAOCP vol. 3,
// 5.4.1): each bucket is moved once per round, log2(runs) rounds, with no
// data-dependent branch in the inner loop. A binary heap of run heads took
// 1.8-2.1 s instead of 1.3-1.5 s on the level-heavy X^2 run of bench_exact's
// wide N = 500 table, and the same time elsewhere (2026-12-02). Ties keep the
// order of the runs, so the output depends on the inputs only.
class merger {
public:
    std::vector<run> runs;
    static constexpr std::size_t small_merge = 48;

    // Writes the node; returns its work (buckets moved, one per round).
    std::uint64_t merge(std::vector<bucket>& out, double width) {
        a_.clear();
        ends_.clear();
        for (const run& r : runs) {
            for (const bucket* p = r.at; p != r.end; ++p)
                if (p->hi >= r.never_below) a_.push_back({p->lo + r.v, p->hi + r.v, p->w * r.hx});
            if (a_.size() > (ends_.empty() ? 0 : ends_.back())) ends_.push_back(a_.size());
        }
        const std::size_t n = a_.size();
        std::uint64_t work = n + runs.size();
        if (n <= small_merge && ends_.size() > 1) {
            // Few buckets: one insertion sort (stable, like the rounds) beats
            // log2(runs) rounds of copying.
            for (std::size_t k = 1; k < n; ++k) {
                const bucket c = a_[k];
                std::size_t i = k;
                for (; i > 0 && c.lo < a_[i - 1].lo; --i) a_[i] = a_[i - 1];
                a_[i] = c;
            }
            ends_.assign(1, n);
            work += n;
        }
        while (ends_.size() > 1) {
            if (b_.size() < n) b_.resize(n);
            next_.clear();
            std::size_t from = 0;
            for (std::size_t r = 0; r < ends_.size(); r += 2) {
                const std::size_t mid = ends_[r], to = r + 1 < ends_.size() ? ends_[r + 1] : mid;
                merge_two(a_.data() + from, a_.data() + mid, a_.data() + to, b_.data() + from);
                next_.push_back(to);
                from = to;
            }
            std::swap(a_, b_);
            a_.resize(n);
            std::swap(ends_, next_);
            work += n;
        }
        const std::size_t first = out.size();
        for (std::size_t k = 0; k < n; ++k) put(out, first, a_[k], width);
        return work;
    }

private:
    // [x, mid) and [mid, end), each sorted by lo, into dst; ties take the first.
    static void merge_two(const bucket* x, const bucket* mid, const bucket* end, bucket* dst) {
        const bucket* y = mid;
        while (x != mid && y != end) {
            const bool take_y = y->lo < x->lo;
            *dst++ = *(take_y ? y : x);
            y += take_y;
            x += !take_y;
        }
        dst = std::copy(x, mid, dst);
        std::copy(y, end, dst);
    }

    std::vector<bucket> a_, b_;
    std::vector<std::size_t> ends_, next_;
};

// A chunk of the destination nodes of a level, built on its own: the
// buckets, their count and the surely extreme mass per node, its work, and
// why it stopped (0 it did not, 1 work cap, 2 memory cap).
struct chunk {
    std::size_t from = 0, to = 0;
    std::vector<bucket> out;
    std::vector<std::size_t> count;
    std::vector<double> sure;
    double bound = 0;    // at most this many buckets (those its nodes read)
    double largest = 0;  // the most one of its nodes reads
    std::uint64_t work = 0;
    int failed = 0;
};

// The conditional law of the next group at one source node: its values are
// law_values[at + x - first] for x in [first, last] (empty: first > last).
struct law {
    std::size_t at = 0;
    std::int64_t first = 1, last = 0;
};

// Chunk boundaries over [0, D) (D + 1 of them or fewer) cutting `cost` (one
// entry per item) into `parts` nearly equal shares. The cut depends on the
// costs only, never on the thread count.
std::vector<std::size_t> cut(const std::vector<double>& cost, std::size_t parts) {
    const double total = std::accumulate(cost.begin(), cost.end(), 0.0);
    std::vector<std::size_t> at{0};
    double run_sum = 0;
    for (std::size_t d = 0; d < cost.size() && at.size() < parts; ++d) {
        run_sum += cost[d];
        if (run_sum >= total * static_cast<double>(at.size()) / static_cast<double>(parts)) at.push_back(d + 1);
    }
    if (at.back() != cost.size()) at.push_back(cost.size());
    return at;
}

// Inputs whose levels are cut in two (about 0.2 ms of work): below it a
// second thread costs more to start than it saves.
constexpr double split_above = 100'000;
// The join's work is cut finer, so that threads taking chunks as they free
// up end together.
constexpr std::size_t join_chunks = 32;

class network {
public:
    network(const table& t, ordering o, std::uint64_t work_cap, std::size_t max_buckets, double merge_width,
            unsigned threads, exact_outcome& out)
        : t_(t), o_(o), work_cap_(work_cap), max_buckets_(max_buckets), merge_width_(merge_width),
          threads_(std::max(1u, threads)), out_(out) {}

    // The whole enumeration; false (with out_.stopped) when a cap stops it.
    bool run() {
        if (!prepare()) return false;
        const std::size_t G = t_.groups();
        std::vector<std::size_t> order(G);
        std::iota(order.begin(), order.end(), std::size_t{0});
        pass front{pass_plan(t_, order), {}, false};
        std::reverse(order.begin(), order.end());
        pass back{pass_plan(t_, order), {}, true};
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

private:
    // Set-up cost check, term tables, threshold and merge width.
    bool prepare() {
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
        thr_ = detail::extreme_threshold(observed, o_);
        width_ = merge_width_ * std::max(1.0, std::fabs(observed));
        return true;
    }

    bool over_cap() {
        if (out_.work <= work_cap_) return false;
        out_.stopped = "the exact enumeration needs more than " + format_number(static_cast<double>(work_cap_)) +
                       " steps";
        return true;
    }

    bool over_memory() {
        out_.stopped = "the exact enumeration needs more than " + format_number(static_cast<double>(max_buckets_)) +
                       " partial results in memory at once";
        return false;
    }

    // Buckets the pass's next level reads, times the values its group takes.
    double level_cost(const pass& p) const {
        if (p.k == p.plan.levels()) return inf;
        return static_cast<double>(p.cur.total()) * values_of(t_, p.plan.groups[p.k]);
    }

    // Which pass takes the next group. The front pass starts alone: near one
    // shared rate its lists stay small (its bounds tighten as fewer groups
    // remain), and a back pass costs more to start than it saves. The back
    // pass starts once the front pass's remaining levels, at its present list
    // size, would cost more than 1.5 times the back pass's bounds (building
    // them, and the laws of its nodes that carry only surely extreme mass)
    // plus twice the front levels so far (the back pass's first levels mirror
    // them, at about twice the cost, as its nodes also carry surely extreme
    // mass). Both factors measured on 2 x 12 tables near one shared rate,
    // N = 120 to 420 (2026-12-02): N = 150, 31 us alone against 48 us with
    // both passes; N = 300 (G^2), 306 us with both against 479 us alone.
    // Once both have started, the one whose next level reads fewer buckets
    // takes the group, so the halves end balanced by measured sizes.
    pass& takes_next(pass& front, pass& back, double front_spent) const {
        if (back.k > 0) return level_cost(front) <= level_cost(back) ? front : back;
        if (front.k == 0) return front;
        const double alone = static_cast<double>(front.cur.total()) * ahead_[front.k];
        return alone > 1.5 * back_bounds_ + 2 * front_spent ? back : front;
    }

    // The next group's law at every live node of the pass's level, and the
    // suffix sums of each node's weights (node i's from suffix_[start[i] + i]).
    void build_laws(const pass& p) {
        const std::size_t k = p.k, g = p.plan.groups[k];
        const level& cur = p.cur;
        laws_.assign(cur.nodes(), law{});
        live_.clear();
        law_values_.clear();
        suffix_.resize(cur.total() + cur.nodes());
        for (std::size_t i = 0; i < cur.nodes(); ++i) {
            const std::size_t n = cur.size(i), base = cur.start[i] + i;
            const bucket* list = cur.first(i);
            suffix_[base + n] = 0.0;
            for (std::size_t b = n; b-- > 0;) suffix_[base + b] = suffix_[base + b + 1] + list[b].w;
            if (n == 0 && cur.sure[i] == 0.0) continue;
            const std::int64_t s = p.plan.lo[k] + static_cast<std::int64_t>(i);
            const auto sup =
                detail::hypergeometric_pmf(t_.attempts - p.plan.used[k], t_.successes - s, t_.n[g], pmf_);
            laws_[i] = {law_values_.size(), sup.first, sup.last};
            live_.push_back(i);
            law_values_.insert(law_values_.end(), pmf_.begin(), pmf_.end());
            out_.work += pmf_.size() + n;
        }
    }

    // Node d of the pass's next level into `out`; returns the mass that
    // becomes surely extreme there. A bucket is extreme for sure when
    // lo + v + mn >= thr and never when hi + v + mx < thr, where mn / mx bound
    // what the groups not yet taken add.
    double build_node(const pass& p, std::size_t d, std::vector<bucket>& out, merger& m,
                      std::uint64_t& work) const {
        const std::size_t k = p.k, g = p.plan.groups[k];
        const std::int64_t j = p.plan.lo[k + 1] + static_cast<std::int64_t>(d);
        const std::int64_t s_from = std::max(p.plan.lo[k], j - t_.n[g]), s_to = std::min(p.plan.hi[k], j);
        const double mn = p.bound.mn[k + 1][d], mx = p.bound.mx[k + 1][d];
        double sure = 0.0;
        m.runs.clear();
        // Near one shared rate most source nodes are pruned empty: only the
        // live ones (those with a law) are visited.
        const auto i_from = static_cast<std::size_t>(s_from - p.plan.lo[k]);
        const auto i_to = static_cast<std::size_t>(s_to - p.plan.lo[k]);
        for (auto it = std::lower_bound(live_.begin(), live_.end(), i_from); it != live_.end() && *it <= i_to; ++it) {
            const std::size_t i = *it;
            const std::int64_t s = p.plan.lo[k] + static_cast<std::int64_t>(i);
            const law& l = laws_[i];
            const std::int64_t x = j - s;
            if (x < l.first || x > l.last) continue;
            const double hx = law_values_[l.at + static_cast<std::size_t>(x - l.first)];
            if (hx == 0.0) continue;
            const double v = terms_[g][x];
            const bucket* list = p.cur.first(i);
            const std::size_t n = p.cur.size(i);
            const std::size_t sure_from = first_from(list, n, thr_ - v - mn);
            sure += hx * (suffix_[p.cur.start[i] + i + sure_from] + p.cur.sure[i]);
            // hi <= lo + width up to rounding: no bucket before `a` reaches never_below.
            const double never_below = thr_ - v - mx;
            const std::size_t a = first_from(list, sure_from, never_below - 2 * width_ - 1e-12 * std::fabs(never_below));
            work += 2 * static_cast<std::uint64_t>(std::bit_width(n)) + (sure_from - a);
            if (a < sure_from) m.runs.push_back({list + a, list + sure_from, v, hx, never_below});
        }
        work += m.merge(out, width_);
        return sure;
    }

    // Builds the chunk's nodes; stops early once it alone passes the work
    // left (`budget`) or the buckets memory has room for (`room`).
    void build_chunk(const pass& p, chunk& c, std::uint64_t budget, std::size_t room, merger& m) const {
        try {
            // Reserved, not touched: pages not written cost no memory. The
            // chunk stops once past `room`, so with one node's worth more the
            // buckets never move once written (the level points at them).
            c.out.reserve(static_cast<std::size_t>(std::min(c.bound, static_cast<double>(room) + c.largest)));
            c.count.reserve(c.to - c.from);
            c.sure.reserve(c.to - c.from);
            for (std::size_t d = c.from; d < c.to; ++d) {
                const std::size_t before = c.out.size();
                c.sure.push_back(build_node(p, d, c.out, m, c.work));
                c.count.push_back(c.out.size() - before);
                if (c.work > budget) c.failed = 1;
                if (c.out.size() > room) c.failed = 2;
                if (c.failed != 0) return;
            }
        } catch (const std::bad_alloc&) {
            c.failed = 2;  // never let an exception leave a worker thread
        }
    }

    // Runs job(0) ... job(n - 1), on up to threads_ threads, each taking the
    // next job not yet taken. Jobs write only their own results, so which
    // thread runs which job changes nothing.
    template <class F>
    void on_threads(std::size_t n, F job) const {
        const auto use = static_cast<unsigned>(std::min<std::size_t>(threads_, n));
        if (use <= 1) {
            for (std::size_t c = 0; c < n; ++c) job(c);
            return;
        }
        std::atomic<std::size_t> next{0};
        auto worker = [&] {
            for (std::size_t c = next++; c < n; c = next++) job(c);
        };
        std::vector<std::thread> helpers;
        for (unsigned id = 1; id < use; ++id) helpers.emplace_back(worker);
        worker();
        for (auto& h : helpers) h.join();
    }

    // The chunks of the pass's next level, cut by the buckets each node
    // reads, which also bound the buckets it can hold.
    std::vector<chunk> level_chunks(const pass& p) const {
        const std::size_t k = p.k, g = p.plan.groups[k], W = p.cur.nodes();
        std::vector<double> before(W + 1, 0.0);  // buckets (plus one) of the nodes below i
        for (std::size_t i = 0; i < W; ++i) before[i + 1] = before[i] + static_cast<double>(p.cur.size(i) + 1);
        std::vector<double> cost(p.plan.width(k + 1));
        for (std::size_t d = 0; d < cost.size(); ++d) {
            const std::int64_t j = p.plan.lo[k + 1] + static_cast<std::int64_t>(d);
            const std::int64_t a = std::max(p.plan.lo[k], j - t_.n[g]), b = std::min(p.plan.hi[k], j);
            if (a <= b) cost[d] = before[static_cast<std::size_t>(b - p.plan.lo[k] + 1)] -
                                  before[static_cast<std::size_t>(a - p.plan.lo[k])];
        }
        const double total = before[W] * static_cast<double>(std::min<std::int64_t>(t_.n[g], t_.successes) + 1);
        const auto at = cut(cost, total > split_above ? 2 : 1);
        std::vector<chunk> chunks(at.size() - 1);
        for (std::size_t c = 0; c < chunks.size(); ++c) {
            chunks[c].from = at[c];
            chunks[c].to = at[c + 1];
            const auto from = cost.begin() + static_cast<std::ptrdiff_t>(at[c]);
            const auto to = cost.begin() + static_cast<std::ptrdiff_t>(at[c + 1]);
            chunks[c].bound = std::accumulate(from, to, 0.0);
            chunks[c].largest = from == to ? 0.0 : *std::max_element(from, to);
        }
        return chunks;
    }

    // The pass's next level from its chunks, in node order (the front pass's
    // surely extreme mass goes to p_sure_); false when a chunk stopped, the
    // first in order deciding why.
    bool assemble(const pass& p, std::vector<chunk>& chunks, level& next) {
        const std::size_t width = p.plan.width(p.k + 1);
        next.at.reserve(width);
        next.start.reserve(width + 1);
        next.sure.reserve(width);
        next.parts.reserve(chunks.size());
        for (auto& c : chunks) {
            out_.work += c.work;
            if (c.failed == 1) {
                over_cap();  // c.work > budget: the cap is passed, and says so
                return false;
            }
            if (c.failed == 2) return over_memory();
            const bucket* at = c.out.data();
            for (std::size_t d = 0; d < c.count.size(); ++d) {
                next.at.push_back(at);
                at += c.count[d];
                next.start.push_back(next.start.back() + c.count[d]);
                // The front pass's weights are whole chains: their sure mass is final.
                next.sure.push_back(p.back ? c.sure[d] : 0.0);
                if (!p.back) p_sure_ += c.sure[d];
            }
            next.parts.push_back(std::move(c.out));  // moving keeps the buckets where they are
        }
        return true;
    }

    // Takes the pass's next group. `other` is the size of the other pass's
    // level, held in memory meanwhile.
    bool step(pass& p, std::size_t other) {
        // A pass's bounds are built when it takes its first group: near one
        // shared rate the front pass often prunes everything before the back
        // pass starts (its bounds are charged in the set-up work all the same).
        if (p.k == 0) p.bound = reach_of(p.plan, t_, terms_, {0.0}, {0.0});
        build_laws(p);
        if (over_cap()) return false;
        const std::size_t held = other + p.cur.total() + (law_values_.size() + suffix_.size()) / 3 + reach_held_;
        if (held > max_buckets_) return over_memory();
        auto chunks = level_chunks(p);
        const std::uint64_t budget = work_cap_ - out_.work;
        if (mergers_.size() < chunks.size()) mergers_.resize(chunks.size());
        // Each chunk may fill the room left in proportion to what it reads, so
        // that together they never pass the cap.
        double bound = 0;
        for (const auto& c : chunks) bound += c.bound;
        on_threads(chunks.size(), [&](std::size_t c) {
            // The merge buffers hold two copies of one node's input.
            const double share = bound > 0 ? chunks[c].bound / bound : 1.0;
            const double room = static_cast<double>(max_buckets_ - held) * share - 2 * chunks[c].largest;
            if (room < 0)
                chunks[c].failed = 2;
            else
                build_chunk(p, chunks[c], budget, static_cast<std::size_t>(room), mergers_[c]);
        });
        level next;
        if (!assemble(p, chunks, next)) return false;
        if (over_cap()) return false;
        if (held + next.total() > max_buckets_) return over_memory();
        p.cur = std::move(next);
        ++p.k;
        return true;
    }

    // The join at front node i (s successes), with the middle group taking x
    // successes with probability hx and the back part the rest, t: sums over
    // the front buckets f of P(f) hx P(back part) / q(t) for back buckets
    // whose lo is at least thr - v - f.lo (surely extreme), thr - v - f.hi -
    // width (possibly extreme) and thr - v - mid(f) (extreme at representative
    // values), walking both sorted lists; v is the middle group's term.
    struct middle {
        std::size_t bi;      // the back node
        double v, hx, q;     // the middle group's term, its probability, P(back total)
        std::size_t a0, a1;  // the band of front buckets to walk (see join_node)
    };
    std::array<double, 3> join_node(const pass& F, const pass& B, std::size_t i, const std::vector<middle>& at,
                                    std::vector<double>& front_suffix) const {
        const bucket* fl = F.cur.first(i);
        const std::size_t nf = F.cur.size(i);
        front_suffix.assign(nf + 1, 0.0);
        for (std::size_t a = nf; a-- > 0;) front_suffix[a] = front_suffix[a + 1] + fl[a].w;
        double sure = 0.0, open = 0.0, at_mid = 0.0;
        for (const middle& m : at) {
            const bucket* bl = B.cur.first(m.bi);
            const std::size_t nb = B.cur.size(m.bi);
            const double* suffix = back_suffix_.data() + B.cur.start[m.bi] + m.bi;
            const double c = thr_ - m.v, scale = m.hx / m.q;
            sure += B.cur.sure[m.bi] * front_suffix[0] * scale;
            if (nb == 0) continue;
            const std::size_t a0 = m.a0, a1 = m.a1;
            double s_yes = front_suffix[a1] * suffix[0], s_open = 0.0, s_mid = 0.0;
            std::size_t yes = a0 < a1 ? first_from(bl, nb, c - fl[a0].lo) : 0;
            for (std::size_t a = a0; a < a1; ++a) {
                const bucket& f = fl[a];
                yes = move_to(bl, nb, yes, c - f.lo);
                // The other two lie just below `yes`, mostly at it: two
                // comparisons each from there.
                const std::size_t maybe = move_to(bl, nb, yes, c - f.hi - width_);
                const std::size_t mid = move_to(bl, nb, yes, c - 0.5 * (f.lo + f.hi));
                const double y = suffix[yes];
                s_yes += f.w * y;
                s_open += f.w * (suffix[maybe] - y);
                s_mid += f.w * (suffix[mid] - y);
            }
            sure += s_yes * scale;
            open += s_open * scale;
            at_mid += s_mid * scale;
        }
        return {sure, open, at_mid};
    }

    // The pairs (back node, middle term) that front node i meets, and the
    // work of walking them.
    std::vector<middle> meetings(const pass& F, const pass& B, std::size_t i, const detail::hypergeometric_support& q_sup,
                                 const std::vector<double>& q, double& cost) {
        const std::size_t f = F.k, b = B.k, g = F.plan.groups[f];
        const std::int64_t s = F.plan.lo[f] + static_cast<std::int64_t>(i);
        std::vector<middle> out;
        cost += static_cast<double>(F.cur.size(i));  // its suffix sums
        const auto sup = detail::hypergeometric_pmf(t_.attempts - F.plan.used[f], t_.successes - s, t_.n[g], pmf_);
        out.reserve(pmf_.size());
        for (std::int64_t x = sup.first; x <= sup.last; ++x) {
            const double hx = pmf_[static_cast<std::size_t>(x - sup.first)];
            const std::int64_t tt = t_.successes - s - x;
            if (hx == 0.0 || tt < B.plan.lo[b] || tt > B.plan.hi[b] || tt < q_sup.first || tt > q_sup.last) continue;
            const auto bi = static_cast<std::size_t>(tt - B.plan.lo[b]);
            const double qt = q[static_cast<std::size_t>(tt - q_sup.first)];
            if ((B.cur.size(bi) == 0 && B.cur.sure[bi] == 0.0) || qt == 0.0) continue;
            // Front buckets below a0 meet no back bucket that could be
            // extreme; from a1 on they meet only surely extreme ones. Only
            // the band between needs a walk.
            const bucket* fl = F.cur.first(i);
            const bucket* bl = B.cur.first(bi);
            const std::size_t nf = F.cur.size(i), nb = B.cur.size(bi);
            const double v = terms_[g][x], c = thr_ - v;
            std::size_t a0 = 0, a1 = 0;
            if (nb > 0) {
                const double top = c - bl[nb - 1].lo - 2 * width_;
                a0 = first_from(fl, nf, top - 1e-12 * std::fabs(top));
                a1 = first_from(fl, nf, c - bl[0].lo);
            }
            out.push_back({bi, v, hx, qt, a0, a1});
            cost += static_cast<double>(4 * (a1 - a0) + 2 * std::bit_width(nf) + std::bit_width(nb));
        }
        return out;
    }

    // The front pass has taken F.k groups, the back pass all but one of the
    // rest; the group between them is summed over in the join:
    // P(table) = P(front part) P(x | front part) P(back part) / P(back total).
    bool join(const pass& F, const pass& B) {
        const auto q_sup = detail::hypergeometric_pmf(t_.attempts, t_.successes, B.plan.used[B.k], pmf_);
        const std::vector<double> q = pmf_;
        const level& back = B.cur;
        back_suffix_.resize(back.total() + back.nodes());
        for (std::size_t i = 0; i < back.nodes(); ++i) {
            const std::size_t n = back.size(i), base = back.start[i] + i;
            back_suffix_[base + n] = 0.0;
            for (std::size_t k = n; k-- > 0;) back_suffix_[base + k] = back_suffix_[base + k + 1] + back.first(i)[k].w;
        }
        std::vector<std::size_t> fronts;
        std::vector<std::vector<middle>> at;
        std::vector<double> cost;
        for (std::size_t i = 0; i < F.cur.nodes(); ++i) {
            if (F.cur.size(i) == 0) continue;
            double c = 0.0;
            auto m = meetings(F, B, i, q_sup, q, c);
            if (m.empty()) continue;
            fronts.push_back(i);
            at.push_back(std::move(m));
            cost.push_back(c);
        }
        const double total = std::accumulate(cost.begin(), cost.end(), 0.0);
        out_.work += static_cast<std::uint64_t>(total) + back.total();
        if (over_cap()) return false;
        std::vector<std::array<double, 3>> sums(fronts.size());
        const auto cuts = cut(cost, total > split_above ? join_chunks : 1);
        on_threads(cuts.size() - 1, [&](std::size_t c) {
            std::vector<double> front_suffix;  // one buffer per chunk
            for (std::size_t k = cuts[c]; k < cuts[c + 1]; ++k) sums[k] = join_node(F, B, fronts[k], at[k], front_suffix);
        });
        double p_open = 0.0, p_mid = 0.0;
        for (const auto& s : sums) {
            p_sure_ += s[0];
            p_open += s[1];
            p_mid += s[2];
        }
        out_.p_low = std::min(1.0, p_sure_);
        out_.p_high = std::min(1.0, p_sure_ + p_open);
        out_.p = std::min(1.0, p_sure_ + p_mid);
        return true;
    }

    const table& t_;
    const ordering o_;
    const std::uint64_t work_cap_;
    const std::size_t max_buckets_;
    const double merge_width_;
    const unsigned threads_;
    exact_outcome& out_;
    std::vector<detail::term_row> terms_;
    double thr_ = 0, width_ = 0;
    double p_sure_ = 0.0;
    std::vector<double> ahead_;  // values of the front pass's groups from level k to G - 1 (see run)
    double back_bounds_ = 0;      // what building the back pass's bounds costs
    std::size_t reach_held_ = 0;  // the passes' bounds, in buckets' worth of memory
    // The level being built: the next group's law per source node, and the
    // suffix sums of the source lists.
    std::vector<law> laws_;
    std::vector<std::size_t> live_;  // the source nodes with a law, in order
    std::vector<double> law_values_, suffix_, pmf_;
    std::vector<double> back_suffix_;  // suffix sums of the back level's lists, for the join
    std::vector<merger> mergers_;      // one per chunk of a level, kept across levels
};

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

}  // namespace

exact_outcome exact_p(const table& t_in, ordering o, std::uint64_t work_cap, std::size_t max_buckets,
                      double merge_width, unsigned threads) {
    exact_outcome out;
    if (t_in.all_alike()) {
        // One possible table: it is as extreme as itself.
        out.p = out.p_low = out.p_high = 1.0;
        out.complete = true;
        return out;
    }
    const table t = smallest_first(t_in);
    network net(t, o, work_cap, max_buckets, merge_width, threads, out);
    out.complete = net.run();
    return out;
}

}  // namespace tallyrates::omnibus
