// level.cpp (exact route) - one level of a pass: node j of the next level
// receives, from each node s of this one, that node's list shifted by the
// term of x = j - s and scaled by P(x | s); the runs are merged (merge.cpp),
// and the part of a run that is surely extreme is one suffix sum of its
// weights. The destination nodes are cut into chunks by the input they read,
// the same whatever the thread count. Method in network.cpp.
#include <algorithm>
#include <bit>
#include <cmath>
#include <new>
#include <numeric>

#include "detail/threads.hpp"
#include "omnibus/exact/network.hpp"

namespace tallyrates::omnibus::exact_network {

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

// The next group's law at every live node of the pass's level, and the
// suffix sums of each node's weights.
void network::build_laws(const pass& p, source_laws& s) const {
    const std::size_t k = p.k, g = p.plan.groups[k];
    const level& cur = p.cur;
    s.of_node.assign(cur.nodes(), law{});
    s.live.clear();
    s.values.clear();
    s.work = 0;
    s.suffix.resize(cur.total() + cur.nodes());
    std::vector<double> pmf;
    for (std::size_t i = 0; i < cur.nodes(); ++i) {
        const std::size_t n = cur.size(i), base = cur.start[i] + i;
        const bucket* list = cur.first(i);
        s.suffix[base + n] = 0.0;
        for (std::size_t b = n; b-- > 0;) s.suffix[base + b] = s.suffix[base + b + 1] + list[b].w;
        if (n == 0 && cur.sure[i] == 0.0) continue;
        const std::int64_t successes = p.plan.lo[k] + static_cast<std::int64_t>(i);
        const auto sup = detail::hypergeometric_pmf(t_.attempts - p.plan.used[k], t_.successes - successes, t_.n[g],
                                                    pmf);
        s.of_node[i] = {s.values.size(), sup.first, sup.last};
        s.live.push_back(i);
        s.values.insert(s.values.end(), pmf.begin(), pmf.end());
        s.work += pmf.size() + n;
    }
}

// Node d of the pass's next level into `out`; returns the mass that
// becomes surely extreme there. A bucket is extreme for sure when
// lo + v + least >= threshold and never when hi + v + most < threshold,
// where least / most bound what the groups not yet taken add.
double network::build_node(const pass& p, const source_laws& from, std::size_t d, std::vector<bucket>& out,
                           merger& m, std::uint64_t& work) const {
    const std::size_t k = p.k, g = p.plan.groups[k];
    const std::int64_t j = p.plan.lo[k + 1] + static_cast<std::int64_t>(d);
    const std::int64_t s_from = std::max(p.plan.lo[k], j - t_.n[g]), s_to = std::min(p.plan.hi[k], j);
    const double least = p.bound.least[k + 1][d], most = p.bound.most[k + 1][d];
    double sure = 0.0;
    m.runs.clear();
    // Near one shared rate most source nodes are pruned empty: only the
    // live ones (those with a law) are visited.
    const auto i_from = static_cast<std::size_t>(s_from - p.plan.lo[k]);
    const auto i_to = static_cast<std::size_t>(s_to - p.plan.lo[k]);
    for (auto it = std::lower_bound(from.live.begin(), from.live.end(), i_from); it != from.live.end() && *it <= i_to;
         ++it) {
        const std::size_t i = *it;
        const law& l = from.of_node[i];
        const std::int64_t x = j - (p.plan.lo[k] + static_cast<std::int64_t>(i));
        if (x < l.first || x > l.last) continue;
        const double hx = from.values[l.at + static_cast<std::size_t>(x - l.first)];
        if (hx == 0.0) continue;
        const double v = terms_[g][x];
        const bucket* list = p.cur.first(i);
        const std::size_t n = p.cur.size(i);
        const std::size_t sure_from = first_from(list, n, threshold_ - v - least);
        sure += hx * (from.suffix[p.cur.start[i] + i + sure_from] + p.cur.sure[i]);
        // hi <= lo + width up to rounding: no bucket before `a` reaches never_below.
        const double never_below = threshold_ - v - most;
        const std::size_t a = first_from(list, sure_from, never_below - 2 * width_ - 1e-12 * std::fabs(never_below));
        work += 2 * static_cast<std::uint64_t>(std::bit_width(n)) + (sure_from - a);
        if (a < sure_from) m.runs.push_back({list + a, list + sure_from, v, hx, never_below});
    }
    work += m.merge(out, width_);
    return sure;
}

// Builds the chunk's nodes; stops early once it alone passes the work
// left (`budget`) or the buckets memory has room for (`room`).
void network::build_chunk(const pass& p, const source_laws& from, chunk& c, std::uint64_t budget, std::size_t room,
                          merger& m) const {
    try {
        // Reserved, not touched: pages not written cost no memory. The
        // chunk stops once past `room`, so with one node's worth more the
        // buckets never move once written (the level points at them).
        c.out.reserve(static_cast<std::size_t>(std::min(c.bound, static_cast<double>(room) + c.largest)));
        c.count.reserve(c.to - c.from);
        c.sure.reserve(c.to - c.from);
        for (std::size_t d = c.from; d < c.to; ++d) {
            const std::size_t before = c.out.size();
            c.sure.push_back(build_node(p, from, d, c.out, m, c.work));
            c.count.push_back(c.out.size() - before);
            if (c.work > budget) c.stopped = stop::work_cap;
            if (c.out.size() > room) c.stopped = stop::memory_cap;
            if (c.stopped != stop::none) return;
        }
    } catch (const std::bad_alloc&) {
        c.stopped = stop::memory_cap;  // never let an exception leave a worker thread
    }
}

// The chunks of the pass's next level, cut by the buckets each node
// reads, which also bound the buckets it can hold.
std::vector<chunk> network::level_chunks(const pass& p) const {
    const std::size_t k = p.k, g = p.plan.groups[k], W = p.cur.nodes();
    std::vector<double> before(W + 1, 0.0);  // buckets (plus one) of the nodes below i
    for (std::size_t i = 0; i < W; ++i) before[i + 1] = before[i] + static_cast<double>(p.cur.size(i) + 1);
    std::vector<double> cost(p.plan.width(k + 1));
    for (std::size_t d = 0; d < cost.size(); ++d) {
        const std::int64_t j = p.plan.lo[k + 1] + static_cast<std::int64_t>(d);
        const std::int64_t a = std::max(p.plan.lo[k], j - t_.n[g]), b = std::min(p.plan.hi[k], j);
        if (a <= b)
            cost[d] = before[static_cast<std::size_t>(b - p.plan.lo[k] + 1)] -
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
// surely extreme mass goes to sure_mass_); false when a chunk stopped, the
// first in order deciding why.
bool network::assemble(const pass& p, std::vector<chunk>& chunks, level& next) {
    const std::size_t width = p.plan.width(p.k + 1);
    const bool back = p.from == direction::back;
    next.at.reserve(width);
    next.start.reserve(width + 1);
    next.sure.reserve(width);
    next.parts.reserve(chunks.size());
    for (auto& c : chunks) {
        out_.work += c.work;
        if (c.stopped == stop::work_cap) {
            over_cap();  // c.work > budget: the cap is passed, and says so
            return false;
        }
        if (c.stopped == stop::memory_cap) return over_memory();
        const bucket* at = c.out.data();
        for (std::size_t d = 0; d < c.count.size(); ++d) {
            next.at.push_back(at);
            at += c.count[d];
            next.start.push_back(next.start.back() + c.count[d]);
            // The front pass's weights are whole chains: their sure mass is final.
            next.sure.push_back(back ? c.sure[d] : 0.0);
            if (!back) sure_mass_ += c.sure[d];
        }
        next.parts.push_back(std::move(c.out));  // moving keeps the buckets where they are
    }
    return true;
}

// Takes the pass's next group. `other` is the size of the other pass's
// level, held in memory meanwhile.
bool network::step(pass& p, std::size_t other) {
    // A pass's bounds are built when it takes its first group: near one
    // shared rate the front pass often prunes everything before the back
    // pass starts (its bounds are charged in the set-up work all the same).
    if (p.k == 0) p.bound = reach_of(p.plan, t_, terms_, {0.0}, {0.0});
    build_laws(p, sources_);
    const source_laws& from = sources_;
    out_.work += from.work;
    if (over_cap()) return false;
    const std::size_t held = other + p.cur.total() + (from.values.size() + from.suffix.size()) / 3 + reach_held_;
    if (held > max_buckets_) return over_memory();
    auto chunks = level_chunks(p);
    const std::uint64_t budget = work_cap_ - out_.work;
    if (mergers_.size() < chunks.size()) mergers_.resize(chunks.size());
    // Each chunk may fill the room left in proportion to what it reads, so
    // that together they never pass the cap.
    double bound = 0;
    for (const auto& c : chunks) bound += c.bound;
    detail::on_threads(threads_, chunks.size(), [&](std::size_t c) {
        // The merge buffers hold two copies of one node's input.
        const double share = bound > 0 ? chunks[c].bound / bound : 1.0;
        const double room = static_cast<double>(max_buckets_ - held) * share - 2 * chunks[c].largest;
        if (room < 0)
            chunks[c].stopped = stop::memory_cap;
        else
            build_chunk(p, from, chunks[c], budget, static_cast<std::size_t>(room), mergers_[c]);
    });
    level next;
    if (!assemble(p, chunks, next)) return false;
    if (over_cap()) return false;
    if (held + next.total() > max_buckets_) return over_memory();
    p.cur = std::move(next);
    ++p.k;
    return true;
}

}  // namespace tallyrates::omnibus::exact_network
