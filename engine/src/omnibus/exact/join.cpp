// join.cpp (exact route) - the meeting of the two passes. The front pass has
// taken F.k groups, the back pass all but one of the rest; the group between
// them is summed over, never stored:
// P(table) = P(front part) P(x | front part) P(back part) / P(back total),
// walking the sorted front and back lists with moving pointers over the band
// of front buckets where the outcome is open (the split-and-join of Horowitz
// & Sahni 1974, JACM 21:277). Method in network.cpp.
#include <algorithm>
#include <bit>
#include <cmath>
#include <numeric>

#include "detail/threads.hpp"
#include "omnibus/exact/network.hpp"

namespace tallyrates::omnibus::exact_network {

namespace {

// The join's work is cut finer than a level's, so that threads taking chunks
// as they free up end together.
constexpr std::size_t join_chunks = 32;

// Suffix sums of every node's weights in one level: node i's from
// suffix[start[i] + i].
std::vector<double> suffix_sums(const level& l) {
    std::vector<double> suffix(l.total() + l.nodes());
    for (std::size_t i = 0; i < l.nodes(); ++i) {
        const std::size_t n = l.size(i), base = l.start[i] + i;
        suffix[base + n] = 0.0;
        for (std::size_t k = n; k-- > 0;) suffix[base + k] = suffix[base + k + 1] + l.first(i)[k].w;
    }
    return suffix;
}

}  // namespace

// The join at front node i (s successes), with the middle group taking x
// successes with probability hx and the back part the rest, t: sums over
// the front buckets f of P(f) hx P(back part) / q(t) for back buckets
// whose lo is at least threshold - v - f.lo (surely extreme),
// threshold - v - f.hi - width (possibly extreme) and threshold - v - mid(f)
// (extreme at representative values), walking both sorted lists; v is the
// middle group's term.
join_sums network::join_node(const pass& F, const pass& B, const std::vector<double>& back_suffix, std::size_t i,
                             const std::vector<middle>& at, std::vector<double>& front_suffix) const {
    const bucket* fl = F.cur.first(i);
    const std::size_t nf = F.cur.size(i);
    front_suffix.assign(nf + 1, 0.0);
    for (std::size_t a = nf; a-- > 0;) front_suffix[a] = front_suffix[a + 1] + fl[a].w;
    join_sums out;
    for (const middle& m : at) {
        const bucket* bl = B.cur.first(m.back_node);
        const std::size_t nb = B.cur.size(m.back_node);
        const double* suffix = back_suffix.data() + B.cur.start[m.back_node] + m.back_node;
        const double c = threshold_ - m.v, scale = m.hx / m.q;
        out.sure += B.cur.sure[m.back_node] * front_suffix[0] * scale;
        if (nb == 0) continue;
        const std::size_t a0 = m.first_open, a1 = m.first_sure;
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
        out.sure += s_yes * scale;
        out.open += s_open * scale;
        out.at_mid += s_mid * scale;
    }
    return out;
}

// The pairs (back node, middle term) that front node i meets, and the
// work of walking them.
std::vector<middle> network::meetings(const pass& F, const pass& B, std::size_t i,
                                      const detail::hypergeometric_support& q_sup, const std::vector<double>& q,
                                      std::vector<double>& pmf, double& cost) const {
    const std::size_t f = F.k, b = B.k, g = F.plan.groups[f];
    const std::int64_t s = F.plan.lo[f] + static_cast<std::int64_t>(i);
    std::vector<middle> out;
    cost += static_cast<double>(F.cur.size(i));  // its suffix sums
    const auto sup = detail::hypergeometric_pmf(t_.attempts - F.plan.used[f], t_.successes - s, t_.n[g], pmf);
    out.reserve(pmf.size());
    for (std::int64_t x = sup.first; x <= sup.last; ++x) {
        const double hx = pmf[static_cast<std::size_t>(x - sup.first)];
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
        const double v = terms_[g][x], c = threshold_ - v;
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

bool network::join(const pass& F, const pass& B) {
    std::vector<double> q, pmf;
    const auto q_sup = detail::hypergeometric_pmf(t_.attempts, t_.successes, B.plan.used[B.k], q);
    const std::vector<double> back_suffix = suffix_sums(B.cur);
    std::vector<std::size_t> fronts;
    std::vector<std::vector<middle>> at;
    std::vector<double> cost;
    for (std::size_t i = 0; i < F.cur.nodes(); ++i) {
        if (F.cur.size(i) == 0) continue;
        double c = 0.0;
        auto m = meetings(F, B, i, q_sup, q, pmf, c);
        if (m.empty()) continue;
        fronts.push_back(i);
        at.push_back(std::move(m));
        cost.push_back(c);
    }
    const double total = std::accumulate(cost.begin(), cost.end(), 0.0);
    out_.work += static_cast<std::uint64_t>(total) + B.cur.total();
    if (over_cap()) return false;
    std::vector<join_sums> sums(fronts.size());
    const auto cuts = cut(cost, total > split_above ? join_chunks : 1);
    detail::on_threads(threads_, cuts.size() - 1, [&](std::size_t c) {
        std::vector<double> front_suffix;  // one buffer per chunk
        for (std::size_t k = cuts[c]; k < cuts[c + 1]; ++k)
            sums[k] = join_node(F, B, back_suffix, fronts[k], at[k], front_suffix);
    });
    double p_open = 0.0, p_mid = 0.0;
    for (const auto& s : sums) {
        sure_mass_ += s.sure;
        p_open += s.open;
        p_mid += s.at_mid;
    }
    out_.p_low = std::min(1.0, sure_mass_);
    out_.p_high = std::min(1.0, sure_mass_ + p_open);
    out_.p = std::min(1.0, sure_mass_ + p_mid);
    return true;
}

}  // namespace tallyrates::omnibus::exact_network
