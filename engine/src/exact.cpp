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
// Dynamic programme over groups with the cumulative success count as node.
// Each node holds buckets of partial statistic values [lo, hi] with their
// probability. Buckets closer than `merge_width` (relative to the observed
// statistic) are merged, keeping the union interval, so results are
// certified: p_low counts only tables proven extreme, p_high adds the tables
// that could not be decided. With the default width 1e-9 every bucket is far
// narrower than the 1e-7 tie tolerance and p is the exact answer.
// Pruning on both sides (methods.md): rmin/rmax are the smallest and largest
// statistic the remaining groups can add; a bucket whose every completion is
// extreme adds its whole probability at once (the completions' conditional
// probabilities sum to 1), one with no extreme completion is dropped.
//
// Meet in the middle (the classic split-and-join of subset sums, Horowitz &
// Sahni 1974, JACM 21:277, applied to the network): the first half of the
// groups goes forward, the second half backward, each pruned; the halves are
// joined per split of the successes with P(table) = P(first half) P(second
// half) / P(second half's total). A one-way pass spends most of its time in
// the late levels, where the lists of partial values grow fastest.
//
// Work unit: one bucket carried across one value of x, one per support point
// of each conditional law built, and m log2 m per sort of m buckets (about
// 5-7 ns each on this project's machine). The cap makes the cost deterministic.
#include <algorithm>
#include <bit>
#include <cmath>
#include <limits>

#include "tallyrates/errors.hpp"
#include "tallyrates/hypergeometric.hpp"
#include "tallyrates/omnibus.hpp"
#include "terms.hpp"

namespace tallyrates::omnibus {

namespace {

struct bucket {
    double lo, hi, w;
};

// Work before the forward pass: the term tables (lgamma calls for the
// probability ordering cost about 16 units a value) and the remaining-
// statistic bounds (every (node, x) pair once).
double bounds_work(const table& t, ordering o) {
    const std::int64_t S = t.successes, N = t.attempts;
    double work = 0, placed = 0;
    for (std::size_t k = 0; k < t.groups(); ++k) {
        const double lo = std::max<double>(0, static_cast<double>(S) - (static_cast<double>(N) - placed));
        const double hi = std::min<double>(static_cast<double>(S), placed);
        // x ranges over at most min(n_k, S, N - S) + 1 values at each node.
        const double xs = std::min({static_cast<double>(t.n[k]), static_cast<double>(S), static_cast<double>(N - S)});
        work += (hi - lo + 1) * (xs + 1) + (xs + 1) * (o == ordering::probability ? 16 : 2);
        placed += static_cast<double>(t.n[k]);
    }
    return work;
}

// Bounds on what the groups of one level onward can add, from those of the
// next level: mn[s] = min over x of term(x) + next_mn[s + x] (likewise max).
// Nodes of level: [lo, hi]; of the next level: [next_lo, next_hi].
void bounds_level(const detail::term_row& term, std::int64_t n_g, std::int64_t lo, std::int64_t hi,
                  std::int64_t next_lo, std::int64_t next_hi, const std::vector<double>& next_mn,
                  const std::vector<double>& next_mx, std::vector<double>& mn, std::vector<double>& mx) {
    constexpr double inf = std::numeric_limits<double>::infinity();
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

}  // namespace

exact_outcome exact_p(const table& t_in, ordering o, std::uint64_t work_cap, std::size_t max_buckets,
                      double merge_width) {
    exact_outcome out;
    if (t_in.successes == 0 || t_in.successes == t_in.attempts) {
        // One possible table: it is as extreme as itself.
        out.p = out.p_low = out.p_high = 1.0;
        out.complete = true;
        return out;
    }
    // Small groups first keeps early levels narrow; the p-value does not
    // depend on the order.
    table t = t_in;
    {
        std::vector<std::size_t> idx(t.groups());
        for (std::size_t i = 0; i < idx.size(); ++i) idx[i] = i;
        std::stable_sort(idx.begin(), idx.end(), [&](auto a, auto b) { return t_in.n[a] < t_in.n[b]; });
        for (std::size_t i = 0; i < idx.size(); ++i) {
            t.n[i] = t_in.n[idx[i]];
            t.x[i] = t_in.x[idx[i]];
        }
    }
    // The set-up alone needs `pre`; the enumeration at least as much again.
    const double pre = bounds_work(t, o);
    if (pre > static_cast<double>(work_cap) / 2) {
        out.work = work_cap;
        out.too_large = true;
        out.stopped = "the exact enumeration needs more than " + format_number(static_cast<double>(work_cap)) +
                      " steps (the table is too large)";
        return out;
    }
    out.work = static_cast<std::uint64_t>(pre);

    const std::size_t G = t.groups();
    const std::int64_t S = t.successes, N = t.attempts;
    std::vector<detail::term_row> terms;
    try {
        terms = detail::term_tables(t, o);
    } catch (const budget_exceeded& e) {
        out.stopped = e.what();
        out.too_large = true;
        return out;
    }
    const double observed = detail::observed_total(t, o);
    const double thr = detail::extreme_threshold(observed, o);
    const double width = merge_width * std::max(1.0, std::fabs(observed));

    // Node ranges: after k groups, s in [lo_k, hi_k].
    std::vector<std::int64_t> lo(G + 1), hi(G + 1), placed(G + 1, 0);
    for (std::size_t k = 0; k <= G; ++k) {
        if (k > 0) placed[k] = placed[k - 1] + t.n[k - 1];
        lo[k] = std::max<std::int64_t>(0, S - (N - placed[k]));
        hi[k] = std::min<std::int64_t>(S, placed[k]);
    }
    // rmin/rmax[k][s - lo_k]: bounds on what groups k..G-1 add.
    std::vector<std::vector<double>> rmin(G + 1), rmax(G + 1);
    rmin[G].assign(1, 0.0);
    rmax[G].assign(1, 0.0);
    for (std::size_t k = G; k-- > 0;)
        bounds_level(terms[k], t.n[k], lo[k], hi[k], lo[k + 1], hi[k + 1], rmin[k + 1], rmax[k + 1], rmin[k], rmax[k]);

    double p_sure = 0.0, p_open = 0.0, p_mid = 0.0;
    std::vector<double> pmf;
    std::vector<double> suffix;  // suffix sums of bucket weights in one node

    // Sorts each node's buckets by lo and merges those within `width`,
    // keeping the union interval. False when memory would pass the cap.
    // Merging is idempotent, so a level that grows past the cap while
    // it is built is merged early: memory stays near 2 x max_buckets buckets
    // (this level and the one before).
    std::size_t pending = 0;  // buckets in the level being built, merged or not
    auto merge_level = [&](std::vector<std::vector<bucket>>& level) {
        std::size_t live = 0;
        for (auto& node : level) {
            if (node.size() > 1) {
                // Sorting is a large share of the cost: charge m log2 m.
                out.work += node.size() * static_cast<std::uint64_t>(std::bit_width(node.size()));
                std::sort(node.begin(), node.end(), [](const bucket& a, const bucket& b) { return a.lo < b.lo; });
                std::size_t w = 0;
                for (std::size_t r = 1; r < node.size(); ++r) {
                    bucket& m = node[w];
                    const bucket& c = node[r];
                    if (std::max(m.hi, c.hi) - m.lo <= width) {
                        m.hi = std::max(m.hi, c.hi);
                        m.w += c.w;
                    } else {
                        node[++w] = c;
                    }
                }
                node.resize(w + 1);
            }
            live += node.size();
        }
        pending = live;
        if (live > max_buckets) {
            out.stopped = "the exact enumeration needs more than " + format_number(static_cast<double>(max_buckets)) +
                          " partial results in memory at once";
            return false;
        }
        return true;
    };
    auto over_cap = [&] {
        if (out.work <= work_cap) return false;
        out.stopped = "the exact enumeration needs more than " + format_number(static_cast<double>(work_cap)) + " steps";
        return true;
    };

    // Carries one node's buckets (and its mass already known to be extreme,
    // `node_sure`) across every x of a group whose conditional law is in
    // pmf/sup. A bucket whose every completion is extreme becomes mass in
    // sure_mass(j); one with no extreme completion is dropped; the rest go
    // to dst[j]. `mn`/`mx` bound what the groups after this one add.
    auto carry = [&](std::vector<bucket>& node, double node_sure, const detail::term_row& term,
                     const tallyrates::detail::hypergeometric_support& sup, std::int64_t from, std::int64_t dst_lo,
                     const std::vector<double>& mn, const std::vector<double>& mx,
                     std::vector<std::vector<bucket>>& dst, auto&& sure_mass) {
        out.work += pmf.size();
        suffix.assign(node.size() + 1, 0.0);
        for (std::size_t b = node.size(); b-- > 0;) suffix[b] = suffix[b + 1] + node[b].w;
        for (std::int64_t x = sup.first; x <= sup.last; ++x) {
            const double hx = pmf[static_cast<std::size_t>(x - sup.first)];
            if (hx == 0.0) continue;
            const double v = term[x];
            const std::size_t j = static_cast<std::size_t>(from + x - dst_lo);
            // Extreme for sure when lo + v + mn >= thr; never when hi + v + mx < thr.
            const double sure_from = thr - v - mn[j];
            const double never_below = thr - v - mx[j];
            // Buckets are sorted by lo, and hi <= lo + width.
            const auto first_sure = static_cast<std::size_t>(
                std::lower_bound(node.begin(), node.end(), sure_from,
                                 [](const bucket& b, double c) { return b.lo < c; }) -
                node.begin());
            sure_mass(j) += hx * (suffix[first_sure] + node_sure);
            auto& out_node = dst[j];
            for (std::size_t b = 0; b < first_sure; ++b) {
                const bucket& src = node[b];
                if (src.hi < never_below) continue;
                out_node.push_back({src.lo + v, src.hi + v, src.w * hx});
            }
            pending += first_sure;
            out.work += first_sure;
        }
        std::vector<bucket>().swap(node);
    };

    // The split: groups 0..h-1 forward, h..G-1 backward.
    const std::size_t h = G / 2;

    // ---- forward over groups 0..h-1 ----
    std::vector<std::vector<bucket>> cur(1), next;
    cur[0].push_back({0.0, 0.0, 1.0});
    for (std::size_t k = 0; k < h; ++k) {
        next.assign(static_cast<std::size_t>(hi[k + 1] - lo[k + 1] + 1), {});
        pending = 0;
        const std::int64_t M = N - placed[k];
        for (std::int64_t s = lo[k]; s <= hi[k]; ++s) {
            auto& node = cur[static_cast<std::size_t>(s - lo[k])];
            if (node.empty()) continue;
            const auto sup = tallyrates::detail::hypergeometric_pmf(M, S - s, t.n[k], pmf);
            carry(node, 0.0, terms[k], sup, s, lo[k + 1], rmin[k + 1], rmax[k + 1], next,
                  [&](std::size_t) -> double& { return p_sure; });
            if (over_cap() || (pending > max_buckets && !merge_level(next))) return out;
        }
        if (!merge_level(next)) return out;
        cur.swap(next);
    }

    // ---- backward over groups G-1..h: marginal law of their successes t ----
    // Weights are P(x_{G-1}, ..., x_g), the same hypergeometric chain taken
    // from the other end. Pruning as forward, against bounds that end in the
    // forward buckets left at the middle (fmin/fmax per node): a backward
    // bucket extreme with every one of them is kept only as mass (`sure`), one
    // extreme with none of them is dropped. Forward prefixes already counted
    // are no longer among those buckets, so nothing is counted twice.
    const std::size_t R = G - h;  // backward levels
    std::vector<std::int64_t> blo(R + 1), bhi(R + 1), bused(R + 1, 0);
    for (std::size_t r = 0; r <= R; ++r) {
        if (r > 0) bused[r] = bused[r - 1] + t.n[G - r];
        blo[r] = std::max<std::int64_t>(0, S - (N - bused[r]));
        bhi[r] = std::min<std::int64_t>(S, bused[r]);
    }
    constexpr double inf = std::numeric_limits<double>::infinity();
    std::vector<std::vector<double>> bmin(R + 1), bmax(R + 1);
    bmin[R].assign(static_cast<std::size_t>(bhi[R] - blo[R] + 1), inf);
    bmax[R].assign(bmin[R].size(), -inf);
    for (std::int64_t tt = blo[R]; tt <= bhi[R]; ++tt) {
        const std::int64_t s_mid = S - tt;
        if (s_mid < lo[h] || s_mid > hi[h]) continue;
        for (const bucket& f : cur[static_cast<std::size_t>(s_mid - lo[h])]) {
            bmin[R][static_cast<std::size_t>(tt - blo[R])] = std::min(bmin[R][static_cast<std::size_t>(tt - blo[R])], f.lo);
            bmax[R][static_cast<std::size_t>(tt - blo[R])] = std::max(bmax[R][static_cast<std::size_t>(tt - blo[R])], f.hi);
        }
    }
    for (std::size_t r = R; r-- > 0;) {
        const std::size_t g = G - 1 - r;
        bounds_level(terms[g], t.n[g], blo[r], bhi[r], blo[r + 1], bhi[r + 1], bmin[r + 1], bmax[r + 1], bmin[r],
                     bmax[r]);
        out.work += static_cast<std::uint64_t>(bhi[r] - blo[r] + 1) * static_cast<std::uint64_t>(t.n[g] + 1);
    }
    std::vector<std::vector<bucket>> back(1), back_next;
    std::vector<double> sure(1, 0.0), sure_next;  // mass extreme whatever the forward half holds
    back[0].push_back({0.0, 0.0, 1.0});
    for (std::size_t r = 0; r < R; ++r) {
        const std::size_t g = G - 1 - r;
        back_next.assign(static_cast<std::size_t>(bhi[r + 1] - blo[r + 1] + 1), {});
        pending = 0;
        sure_next.assign(back_next.size(), 0.0);
        for (std::int64_t tt = blo[r]; tt <= bhi[r]; ++tt) {
            auto& node = back[static_cast<std::size_t>(tt - blo[r])];
            const double node_sure = sure[static_cast<std::size_t>(tt - blo[r])];
            if (node.empty() && node_sure == 0.0) continue;
            const auto sup = tallyrates::detail::hypergeometric_pmf(N - bused[r], S - tt, t.n[g], pmf);
            carry(node, node_sure, terms[g], sup, tt, blo[r + 1], bmin[r + 1], bmax[r + 1], back_next,
                  [&](std::size_t j) -> double& { return sure_next[j]; });
            if (over_cap() || (pending > max_buckets && !merge_level(back_next))) return out;
        }
        if (!merge_level(back_next)) return out;
        back.swap(back_next);
        sure.swap(sure_next);
    }
    const std::int64_t used = bused[R], t_lo = blo[R], t_hi = bhi[R];

    // ---- join: P(table) = P(first half) P(second half) / P(second half total) ----
    const auto q_sup = tallyrates::detail::hypergeometric_pmf(N, S, used, pmf);
    for (std::int64_t s = lo[h]; s <= hi[h]; ++s) {
        const auto& fwd = cur[static_cast<std::size_t>(s - lo[h])];
        const std::int64_t tt = S - s;
        if (fwd.empty() || tt < t_lo || tt > t_hi || tt < q_sup.first || tt > q_sup.last) continue;
        const auto& bwd = back[static_cast<std::size_t>(tt - t_lo)];
        const double always = sure[static_cast<std::size_t>(tt - t_lo)];
        const double q = pmf[static_cast<std::size_t>(tt - q_sup.first)];
        if ((bwd.empty() && always == 0.0) || q == 0.0) continue;
        suffix.assign(bwd.size() + 1, 0.0);
        for (std::size_t b = bwd.size(); b-- > 0;) suffix[b] = suffix[b + 1] + bwd[b].w;
        auto mass_from = [&](double c) {  // weight of backward buckets with lo >= c
            const auto i = std::lower_bound(bwd.begin(), bwd.end(), c,
                                            [](const bucket& b, double v) { return b.lo < v; }) -
                           bwd.begin();
            return suffix[static_cast<std::size_t>(i)];
        };
        for (const bucket& f : fwd) {
            const double yes = mass_from(thr - f.lo);                 // lo + lo' >= thr
            const double maybe = mass_from(thr - f.hi - width);       // hi + hi' may reach thr
            const double mid = mass_from(thr - 0.5 * (f.lo + f.hi));  // representative values
            p_sure += f.w * (yes + always) / q;
            p_open += f.w * (maybe - yes) / q;
            p_mid += f.w * (mid - yes) / q;
        }
        out.work += fwd.size() * 3 * static_cast<std::uint64_t>(std::bit_width(bwd.size()));
        if (over_cap()) return out;
    }
    out.p_low = std::min(1.0, p_sure);
    out.p_high = std::min(1.0, p_sure + p_open);
    out.p = std::min(1.0, p_sure + p_mid);
    out.complete = true;
    return out;
}

}  // namespace tallyrates::omnibus
