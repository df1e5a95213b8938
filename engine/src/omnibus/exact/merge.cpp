// merge.cpp (exact route) - the k-way merge of a node's runs as rounds of
// two-way merges (Knuth 1998, TAOCP vol. 3, 5.4.1): each bucket is moved once
// per round, log2(runs) rounds, with no data-dependent branch in the inner
// loop. A binary heap of run heads took 1.8-2.1 s instead of 1.3-1.5 s on the
// level-heavy X^2 run of bench_exact's wide N = 500 table, and the same time
// elsewhere. Ties keep the order of the runs, so the output depends on the
// inputs only.
#include "omnibus/exact/merge.hpp"

#include <algorithm>
#include <utility>

namespace tallyrates::omnibus::exact_network {

namespace {

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

// [x, mid) and [mid, end), each sorted by lo, into dst; ties take the first.
void merge_two(const bucket* x, const bucket* mid, const bucket* end, bucket* dst) {
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

// Few buckets: one insertion sort (stable, like the rounds).
void insertion_sort(std::vector<bucket>& a) {
    for (std::size_t k = 1; k < a.size(); ++k) {
        const bucket c = a[k];
        std::size_t i = k;
        for (; i > 0 && c.lo < a[i - 1].lo; --i) a[i] = a[i - 1];
        a[i] = c;
    }
}

}  // namespace

std::uint64_t merger::merge(std::vector<bucket>& out, double width) {
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
        insertion_sort(a_);
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

}  // namespace tallyrates::omnibus::exact_network
