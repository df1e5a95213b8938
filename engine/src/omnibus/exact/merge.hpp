// merge.hpp (exact route, internal) - building one node of the next level:
// the k-way merge of its sorted runs, merged within the width as it is
// written. Method in network.cpp and merge.cpp.
#pragma once

#include <cstddef>
#include <cstdint>
#include <vector>

#include "omnibus/exact/levels.hpp"

namespace tallyrates::omnibus::exact_network {

// A run into one destination node: a source list from `at` to `end`, shifted
// by the term v and scaled by P(x | s); buckets with hi < never_below (no
// extreme completion) are skipped.
struct run {
    const bucket* at;
    const bucket* end;
    double v, hx, never_below;
};

// The k-way merge of the runs into one node, as rounds of two-way merges of
// neighbouring runs (a balanced merge tree, Knuth 1998, TAOCP vol. 3,
// 5.4.1). Holds its buffers across nodes and levels.
class merger {
public:
    std::vector<run> runs;
    // Up to this many buckets one insertion sort beats the rounds.
    static constexpr std::size_t small_merge = 48;

    // Writes the node at the end of `out`; returns its work (buckets moved,
    // one per round).
    std::uint64_t merge(std::vector<bucket>& out, double width);

private:
    std::vector<bucket> a_, b_;
    std::vector<std::size_t> ends_, next_;
};

}  // namespace tallyrates::omnibus::exact_network
