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
// probability. Buckets closer than `merge_width` (relative to the observed
// statistic) are merged, keeping the union interval, so results are
// certified: p_low counts only tables proven extreme, p_high adds the tables
// that could not be decided. With the default width 1e-9 every bucket is far
// narrower than the 1e-7 tie tolerance and p is the exact answer.
// Pruning on both sides (methods.md): `reach` bounds what the groups after a
// level can still add; a bucket whose every completion is extreme adds its
// whole probability at once (the completions' conditional probabilities sum
// to 1), one with no extreme completion is dropped.
//
// Meet in the middle (the split-and-join of subset sums, Horowitz & Sahni
// 1974, JACM 21:277, applied to the network): the first half of the groups
// goes forward, the second half backward (the same pass, over the groups in
// reverse order), each pruned; the halves are joined per split of the
// successes with P(table) = P(first half) P(second half) / P(second half's
// total). A one-way pass spends most of its time in the late levels, where
// the lists of partial values grow fastest.
//
// Work unit: one bucket carried across one value of x, one per support point
// of each conditional law built, and m log2 m per sort of m buckets (about
// 5-7 ns each on this project's machine). The cap makes the cost deterministic.
#include <algorithm>
#include <bit>
#include <cmath>
#include <limits>
#include <numeric>

#include "detail/hypergeometric.hpp"
#include "detail/terms.hpp"
#include "tallyrates/errors.hpp"
#include "tallyrates/omnibus.hpp"
#include "tallyrates/text.hpp"

namespace tallyrates::omnibus {

namespace {

constexpr double inf = std::numeric_limits<double>::infinity();

struct bucket {
    double lo, hi, w;
};
using node = std::vector<bucket>;

// Weight of the buckets from index b on, for every b (one more entry, 0).
void suffix_sums(const node& list, std::vector<double>& suffix) {
    suffix.assign(list.size() + 1, 0.0);
    for (std::size_t b = list.size(); b-- > 0;) suffix[b] = suffix[b + 1] + list[b].w;
}

// Index of the first bucket with lo >= c in a list sorted by lo.
std::size_t first_from(const node& list, double c) {
    return static_cast<std::size_t>(
        std::lower_bound(list.begin(), list.end(), c, [](const bucket& b, double v) { return b.lo < v; }) -
        list.begin());
}

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
// (likewise max).
void reach_level(const detail::term_row& term, std::int64_t n_g, std::int64_t lo, std::int64_t hi,
                 std::int64_t next_lo, std::int64_t next_hi, const std::vector<double>& next_mn,
                 const std::vector<double>& next_mx, std::vector<double>& mn, std::vector<double>& mx) {
    mn.assign(static_cast<std::size_t>(hi - lo + 1), inf);
    mx.assign(mn.size(), -inf);
    for (std::int64_t s = lo; s <= hi; ++s) {
        const std::int64_t xa = std::max<std::int64_t>(0, next_lo - s);
        const std::int64_t xb = std::min<std::int64_t>(n_g, next_hi - s);
        double a = inf, b = -inf;
        for (std::int64_t x = xa; x <= xb; ++x) {
            const std::size_t j = static_cast<std::size_t>(s + x - next_lo);
            a = std::min(a, term[x] + next_mn[j]);
            b = std::max(b, term[x] + next_mx[j]);
        }
        mn[static_cast<std::size_t>(s - lo)] = a;
        mx[static_cast<std::size_t>(s - lo)] = b;
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

// Work before the forward pass: the term tables (lgamma calls for the
// probability ordering cost about 16 units a value) and the forward reach
// (every (node, x) pair once).
double setup_work(const table& t, ordering o) {
    const double S = static_cast<double>(t.successes), N = static_cast<double>(t.attempts);
    double work = 0, placed = 0;
    for (std::size_t k = 0; k < t.groups(); ++k) {
        const double lo = std::max<double>(0, S - (N - placed));
        const double hi = std::min<double>(S, placed);
        // x ranges over at most min(n_k, S, N - S) + 1 values at each node.
        const double xs = std::min({static_cast<double>(t.n[k]), S, N - S});
        work += (hi - lo + 1) * (xs + 1) + (xs + 1) * (o == ordering::probability ? 16 : 2);
        placed += static_cast<double>(t.n[k]);
    }
    return work;
}

// The buckets of every node of one level, and for the backward pass the mass
// per node already known to be extreme whatever the forward half holds.
struct level {
    std::vector<node> nodes;
    std::vector<double> sure;
};

class network {
public:
    network(const table& t, ordering o, std::uint64_t work_cap, std::size_t max_buckets, double merge_width,
            exact_outcome& out)
        : t_(t), o_(o), work_cap_(work_cap), max_buckets_(max_buckets), merge_width_(merge_width), out_(out) {}

    // The whole enumeration; false (with out_.stopped) when a cap stops it.
    bool run() {
        if (!prepare()) return false;
        const std::size_t G = t_.groups(), h = G / 2;
        std::vector<std::size_t> all(G);
        std::iota(all.begin(), all.end(), std::size_t{0});
        // Forward over groups 0..h-1, pruned by what every later group can add.
        const pass_plan whole(t_, all);
        const reach ahead = reach_of(whole, t_, terms_, {0.0}, {0.0});
        const pass_plan fwd(t_, std::vector<std::size_t>(all.begin(), all.begin() + static_cast<std::ptrdiff_t>(h)));
        level front{{node{{0.0, 0.0, 1.0}}}, {}};
        if (!advance(fwd, ahead, front, false)) return false;
        // Backward over groups G-1..h, pruned against the forward buckets left
        // at the middle. Forward prefixes already counted are no longer among
        // them, so nothing is counted twice.
        const pass_plan bwd(t_, std::vector<std::size_t>(all.rbegin(), all.rend() - static_cast<std::ptrdiff_t>(h)));
        const reach behind = backward_reach(bwd, fwd, front);
        level back{{node{{0.0, 0.0, 1.0}}}, {0.0}};
        if (!advance(bwd, behind, back, true)) return false;
        return join(fwd, front, bwd, back);
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

    // Sorts each node's buckets by lo and merges those within `width_`,
    // keeping the union interval. False when memory would pass the cap.
    // Merging is idempotent, so a level that grows past the cap while it is
    // built is merged early: memory stays near 2 x max_buckets buckets (this
    // level and the one before).
    bool merge(std::vector<node>& nodes) {
        std::size_t live = 0;
        for (auto& list : nodes) {
            if (list.size() > 1) {
                // Sorting is a large share of the cost: charge m log2 m.
                out_.work += list.size() * static_cast<std::uint64_t>(std::bit_width(list.size()));
                std::sort(list.begin(), list.end(), [](const bucket& a, const bucket& b) { return a.lo < b.lo; });
                std::size_t w = 0;
                for (std::size_t r = 1; r < list.size(); ++r) {
                    bucket& m = list[w];
                    const bucket& c = list[r];
                    if (std::max(m.hi, c.hi) - m.lo <= width_) {
                        m.hi = std::max(m.hi, c.hi);
                        m.w += c.w;
                    } else {
                        list[++w] = c;
                    }
                }
                list.resize(w + 1);
            }
            live += list.size();
        }
        pending_ = live;
        if (live > max_buckets_) {
            out_.stopped = "the exact enumeration needs more than " +
                           format_number(static_cast<double>(max_buckets_)) + " partial results in memory at once";
            return false;
        }
        return true;
    }

    // Carries one node's buckets (and its mass already known to be extreme,
    // `node_sure`) across every x of a group whose conditional law is in
    // pmf_/sup. A bucket whose every completion is extreme becomes mass in
    // `sure`; one with no extreme completion is dropped; the rest go to
    // dst[j]. `mn`/`mx` bound what the groups after this one add.
    void carry(node& list, double node_sure, const detail::term_row& term, const detail::hypergeometric_support& sup,
               std::int64_t from, std::int64_t dst_lo, const std::vector<double>& mn, const std::vector<double>& mx,
               std::vector<node>& dst, double* sure, bool sure_per_node) {
        out_.work += pmf_.size();
        suffix_sums(list, suffix_);
        for (std::int64_t x = sup.first; x <= sup.last; ++x) {
            const double hx = pmf_[static_cast<std::size_t>(x - sup.first)];
            if (hx == 0.0) continue;
            const double v = term[x];
            const std::size_t j = static_cast<std::size_t>(from + x - dst_lo);
            // Extreme for sure when lo + v + mn >= thr; never when hi + v + mx < thr.
            // Buckets are sorted by lo, and hi <= lo + width.
            const std::size_t first_sure = first_from(list, thr_ - v - mn[j]);
            const double never_below = thr_ - v - mx[j];
            (sure_per_node ? sure[j] : *sure) += hx * (suffix_[first_sure] + node_sure);
            auto& out_node = dst[j];
            for (std::size_t b = 0; b < first_sure; ++b) {
                const bucket& src = list[b];
                if (src.hi < never_below) continue;
                out_node.push_back({src.lo + v, src.hi + v, src.w * hx});
            }
            pending_ += first_sure;
            out_.work += first_sure;
        }
        node().swap(list);
    }

    // Runs a pass from its first level to its last. The forward pass adds
    // surely extreme mass to p_sure_ at once (its weights are complete
    // conditional chains); the backward pass keeps it per node (`per_node`),
    // to be joined with the forward half.
    bool advance(const pass_plan& plan, const reach& bound, level& cur, bool per_node) {
        for (std::size_t k = 0; k < plan.levels(); ++k) {
            const std::size_t g = plan.groups[k];
            level next{std::vector<node>(plan.width(k + 1)), {}};
            if (per_node) next.sure.assign(next.nodes.size(), 0.0);
            pending_ = 0;
            for (std::int64_t s = plan.lo[k]; s <= plan.hi[k]; ++s) {
                const auto at = static_cast<std::size_t>(s - plan.lo[k]);
                const double node_sure = per_node ? cur.sure[at] : 0.0;
                if (cur.nodes[at].empty() && node_sure == 0.0) continue;
                const auto sup =
                    detail::hypergeometric_pmf(t_.attempts - plan.used[k], t_.successes - s, t_.n[g], pmf_);
                carry(cur.nodes[at], node_sure, terms_[g], sup, s, plan.lo[k + 1], bound.mn[k + 1], bound.mx[k + 1],
                      next.nodes, per_node ? next.sure.data() : &p_sure_, per_node);
                if (over_cap() || (pending_ > max_buckets_ && !merge(next.nodes))) return false;
            }
            if (!merge(next.nodes)) return false;
            cur = std::move(next);
        }
        return true;
    }

    // The backward pass's reach ends in the forward buckets left at the
    // middle: per total t of the backward groups, the smallest lo and largest
    // hi of the forward node holding S - t.
    reach backward_reach(const pass_plan& bwd, const pass_plan& fwd, const level& front) {
        const std::size_t R = bwd.levels(), h = fwd.levels();
        std::vector<double> end_mn(bwd.width(R), inf), end_mx(bwd.width(R), -inf);
        for (std::int64_t tt = bwd.lo[R]; tt <= bwd.hi[R]; ++tt) {
            const std::int64_t s_mid = t_.successes - tt;
            if (s_mid < fwd.lo[h] || s_mid > fwd.hi[h]) continue;
            const auto j = static_cast<std::size_t>(tt - bwd.lo[R]);
            for (const bucket& f : front.nodes[static_cast<std::size_t>(s_mid - fwd.lo[h])]) {
                end_mn[j] = std::min(end_mn[j], f.lo);
                end_mx[j] = std::max(end_mx[j], f.hi);
            }
        }
        for (std::size_t r = 0; r < R; ++r)
            out_.work += static_cast<std::uint64_t>(bwd.width(r)) * static_cast<std::uint64_t>(t_.n[bwd.groups[r]] + 1);
        return reach_of(bwd, t_, terms_, std::move(end_mn), std::move(end_mx));
    }

    // P(table) = P(first half) P(second half) / P(second half total), summed
    // per split of the successes: forward bucket f with backward buckets whose
    // lo is at least thr - f.lo (surely extreme), thr - f.hi - width (possibly
    // extreme) and thr - mid(f) (extreme at representative values).
    bool join(const pass_plan& fwd, const level& front, const pass_plan& bwd, const level& back) {
        const std::size_t h = fwd.levels(), R = bwd.levels();
        const auto q_sup = detail::hypergeometric_pmf(t_.attempts, t_.successes, bwd.used[R], pmf_);
        double p_open = 0.0, p_mid = 0.0;
        for (std::int64_t s = fwd.lo[h]; s <= fwd.hi[h]; ++s) {
            const auto& fl = front.nodes[static_cast<std::size_t>(s - fwd.lo[h])];
            const std::int64_t tt = t_.successes - s;
            if (fl.empty() || tt < bwd.lo[R] || tt > bwd.hi[R] || tt < q_sup.first || tt > q_sup.last) continue;
            const auto& bl = back.nodes[static_cast<std::size_t>(tt - bwd.lo[R])];
            const double always = back.sure[static_cast<std::size_t>(tt - bwd.lo[R])];
            const double q = pmf_[static_cast<std::size_t>(tt - q_sup.first)];
            if ((bl.empty() && always == 0.0) || q == 0.0) continue;
            suffix_sums(bl, suffix_);
            for (const bucket& f : fl) {
                const double yes = suffix_[first_from(bl, thr_ - f.lo)];
                const double maybe = suffix_[first_from(bl, thr_ - f.hi - width_)];
                const double mid = suffix_[first_from(bl, thr_ - 0.5 * (f.lo + f.hi))];
                p_sure_ += f.w * (yes + always) / q;
                p_open += f.w * (maybe - yes) / q;
                p_mid += f.w * (mid - yes) / q;
            }
            out_.work += fl.size() * 3 * static_cast<std::uint64_t>(std::bit_width(bl.size()));
            if (over_cap()) return false;
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
    exact_outcome& out_;
    std::vector<detail::term_row> terms_;
    double thr_ = 0, width_ = 0;
    double p_sure_ = 0.0;
    std::size_t pending_ = 0;  // buckets in the level being built, merged or not
    std::vector<double> pmf_, suffix_;
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
                      double merge_width) {
    exact_outcome out;
    if (t_in.all_alike()) {
        // One possible table: it is as extreme as itself.
        out.p = out.p_low = out.p_high = 1.0;
        out.complete = true;
        return out;
    }
    const table t = smallest_first(t_in);
    network net(t, o, work_cap, max_buckets, merge_width, out);
    out.complete = net.run();
    return out;
}

}  // namespace tallyrates::omnibus
