// network.hpp (exact route, internal) - the enumeration of the exact
// conditional p-value: two passes of levels over the groups and their join.
// Method and sources in network.cpp; a level is built in level.cpp, the join
// in join.cpp.
#pragma once

#include <array>
#include <cstddef>
#include <cstdint>
#include <vector>

#include "detail/hypergeometric.hpp"
#include "detail/terms.hpp"
#include "omnibus/exact/levels.hpp"
#include "omnibus/exact/merge.hpp"
#include "tallyrates/omnibus/exact.hpp"

namespace tallyrates::omnibus::exact_network {

// Inputs whose levels are cut in two (about 0.2 ms of work): below it a
// second thread costs more to start than it saves.
inline constexpr double split_above = 100'000;
// Chunk boundaries over [0, D) (D + 1 of them or fewer) cutting `cost` (one
// entry per item) into `parts` nearly equal shares (level.cpp).
std::vector<std::size_t> cut(const std::vector<double>& cost, std::size_t parts);

// Why a chunk of a level stopped early.
enum class stop { none, work_cap, memory_cap };

// A chunk of the destination nodes of a level, built on its own: the
// buckets, their count and the surely extreme mass per node, its work.
struct chunk {
    std::size_t from = 0, to = 0;
    std::vector<bucket> out;
    std::vector<std::size_t> count;
    std::vector<double> sure;
    double bound = 0;    // at most this many buckets (those its nodes read)
    double largest = 0;  // the most one of its nodes reads
    std::uint64_t work = 0;
    stop stopped = stop::none;
};

// The conditional law of the next group at one source node: its values are
// values[at + x - first] for x in [first, last] (empty: first > last).
struct law {
    std::size_t at = 0;
    std::int64_t first = 1, last = 0;
};

// What a level is built from: the next group's law at every source node,
// the source nodes that have one (in order), and the suffix sums of the
// source lists' weights (node i's from suffix[start[i] + i]).
struct source_laws {
    std::vector<law> of_node;
    std::vector<std::size_t> live;
    std::vector<double> values, suffix;
    std::uint64_t work = 0;
};

// A (back node, middle term) pair that one front node meets in the join:
// the middle group's term, its probability, P(back total), and the band
// [first_open, first_sure) of front buckets that needs a walk.
struct middle {
    std::size_t back_node;
    double v, hx, q;
    std::size_t first_open, first_sure;
};

// Mass of the join at one front node: surely extreme, undecided, and
// extreme at representative values.
struct join_sums {
    double sure = 0, open = 0, at_mid = 0;
};

class network {
public:
    network(const table& t, ordering o, std::uint64_t work_cap, std::size_t max_buckets, double merge_width,
            unsigned threads, exact_outcome& out)
        : t_(t), o_(o), work_cap_(work_cap), max_buckets_(max_buckets), merge_width_(merge_width),
          threads_(threads), out_(out) {}

    // The whole enumeration; false (with out_.stopped) when a cap stops it.
    bool run();

private:
    // network.cpp
    bool prepare();
    bool over_cap();
    bool over_memory();
    double level_cost(const pass& p) const;
    pass& takes_next(pass& front, pass& back, double front_spent) const;
    // level.cpp
    void build_laws(const pass& p, source_laws& s) const;
    double build_node(const pass& p, const source_laws& from, std::size_t d, std::vector<bucket>& out, merger& m,
                      std::uint64_t& work) const;
    void build_chunk(const pass& p, const source_laws& from, chunk& c, std::uint64_t budget, std::size_t room,
                     merger& m) const;
    std::vector<chunk> level_chunks(const pass& p) const;
    bool assemble(const pass& p, std::vector<chunk>& chunks, level& next);
    bool step(pass& p, std::size_t other);
    // join.cpp
    join_sums join_node(const pass& F, const pass& B, const std::vector<double>& back_suffix, std::size_t i,
                        const std::vector<middle>& at, std::vector<double>& front_suffix) const;
    std::vector<middle> meetings(const pass& F, const pass& B, std::size_t i,
                                 const detail::hypergeometric_support& q_sup, const std::vector<double>& q,
                                 std::vector<double>& pmf, double& cost) const;
    bool join(const pass& F, const pass& B);

    const table& t_;
    const ordering o_;
    const std::uint64_t work_cap_;
    const std::size_t max_buckets_;
    const double merge_width_;  // relative to the observed statistic
    const unsigned threads_;
    exact_outcome& out_;
    // Fixed by prepare(): the term tables, the threshold of "as extreme",
    // and the merge width in the statistic's units.
    std::vector<detail::term_row> terms_;
    double threshold_ = 0, width_ = 0;
    double sure_mass_ = 0.0;      // mass proven extreme so far
    std::vector<double> ahead_;   // values of the front pass's groups from level k to G - 1 (see run)
    double back_bounds_ = 0;      // what building the back pass's bounds costs
    std::size_t reach_held_ = 0;  // the passes' bounds, in buckets' worth of memory
    std::vector<merger> mergers_;  // one per chunk of a level, buffers kept across levels
    // What the level being built is read from (step() fills it and hands it
    // on); one object kept across levels so that its buffers keep their
    // capacity: allocating and zeroing them afresh made G^2 on the unequal
    // N = 500 table of bench_exact 16 % slower.
    source_laws sources_;
};

}  // namespace tallyrates::omnibus::exact_network
