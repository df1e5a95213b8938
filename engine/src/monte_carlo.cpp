// monte_carlo.cpp - Monte Carlo p-value with both margins fixed.
//
// A random table with the observed margins is drawn group by group: group k's
// successes given the s already placed are hypergeometric (the 2 x G case of
// Patefield 1981, Applied Statistics 30:91, algorithm AS 159), sampled by
// inversion of a cumulative table (only + - * /, see hypergeometric.hpp).
// p = (1 + extreme) / (B + 1) (Davison & Hinkley 1997, section 4.2; Phipson
// & Smyth 2010, Stat Appl Genet Mol Biol 9:39), which never reports 0.
//
// Reproducibility: draws are cut into fixed blocks of 65,536; block b uses the
// xoshiro256** stream of the seed jumped b times (2^128 steps each), so the
// draws of a block are the same whichever thread runs it, and the count of
// extreme tables is a sum of integers: bit-identical for any thread count.
// Cumulative tables are built lazily per (group, successes placed), trimmed
// where probabilities fall below 1e-20 of the mode: far below the 2^-53
// resolution of the uniforms, so trimming changes no draw that matters.
//
// Work unit: about 8 ns; a variate drawn counts 8, a table entry built 4.
#include <algorithm>
#include <boost/math/distributions/binomial.hpp>
#include <cmath>
#include <thread>

#include "detail/hypergeometric.hpp"
#include "detail/random.hpp"
#include "detail/terms.hpp"
#include "tallyrates/errors.hpp"
#include "tallyrates/omnibus.hpp"
#include "tallyrates/text.hpp"

namespace tallyrates::omnibus {

namespace {

constexpr std::int64_t block_size = 65536;
constexpr double trim = 1e-20;
constexpr std::size_t table_memory_cap = 2'000'000;  // doubles cached per thread (16 MB)
// Measured costs (README benchmarks): about 66 ns per variate drawn from a
// cached table, 33 ns per table entry built; one unit is about 8 ns.
constexpr std::uint64_t variate_work = 8;
constexpr std::uint64_t table_entry_work = 4;
constexpr std::uint64_t table_work = 24;  // fixed cost of starting a table

struct cdf_ref {
    std::int64_t first = 0;
    std::uint32_t offset = 0, size = 0;
};

// Lazily built cumulative tables of one worker thread. Tables are indexed by
// (group, successes already placed) inside a window of +-40 standard
// deviations of the placed successes around their mean (narrower when there
// are very many groups): draws outside it get an uncached table.
class sampler {
public:
    sampler(const table& t, const std::vector<detail::term_row>& terms) : t_(t), terms_(terms) {
        const std::size_t G = t.groups();
        lo_.resize(G);
        index_.resize(G);
        const double N = static_cast<double>(t.attempts), S = static_cast<double>(t.successes);
        // Index memory stays bounded (about 16 MB) however many groups there are.
        const double half_cap = std::max(64.0, 1e6 / static_cast<double>(G));
        std::int64_t placed = 0;
        for (std::size_t k = 0; k + 1 < G; ++k) {
            const double P = static_cast<double>(placed);
            const double mean = P * S / N;
            const double sd = N > 1 ? std::sqrt(P * (N - P) * S * (N - S) / (N * N * (N - 1))) : 0.0;
            const auto feasible = detail::feasible_successes(t.attempts, t.successes, placed);
            const double half = std::min(40 * sd + 2, half_cap);
            lo_[k] = std::max(feasible.first, static_cast<std::int64_t>(std::floor(mean - half)));
            const std::int64_t top = std::min(feasible.last, static_cast<std::int64_t>(std::ceil(mean + half)));
            index_[k].assign(static_cast<std::size_t>(std::max<std::int64_t>(0, top - lo_[k] + 1)), -1);
            placed += t.n[k];
        }
    }

    // Statistic of one random table.
    double draw(detail::xoshiro256ss& rng) {
        const std::size_t G = t_.groups();
        std::int64_t s = 0, placed = 0;
        double total = 0.0;
        for (std::size_t k = 0; k + 1 < G; ++k) {
            std::int64_t first = 0;
            std::uint32_t size = 0;
            const double* c = table_for(k, s, placed, first, size);
            const double u = rng.uniform();
            // Smallest i with c[i] > u; c[size - 1] == 1 > u always.
            const auto i = static_cast<std::int64_t>(std::upper_bound(c, c + size, u) - c);
            const std::int64_t x = first + i;
            total += terms_[k][x];
            s += x;
            placed += t_.n[k];
            work += variate_work;
        }
        total += terms_[G - 1][t_.successes - s];
        return total;
    }

    std::uint64_t work = 0;

private:
    // Cumulative probabilities of group k's successes given s placed.
    void build(std::size_t k, std::int64_t s, std::int64_t placed, std::vector<double>& out, std::int64_t& first) {
        const auto sup = detail::hypergeometric_pmf(t_.attempts - placed, t_.successes - s, t_.n[k],
                                                                out, trim);
        work += table_work + table_entry_work * out.size();
        for (std::size_t i = 1; i < out.size(); ++i) out[i] += out[i - 1];
        const double total = out.back();
        for (double& v : out) v /= total;
        out.back() = 1.0;
        first = sup.first;
    }

    const double* table_for(std::size_t k, std::int64_t s, std::int64_t placed, std::int64_t& first,
                            std::uint32_t& size) {
        const std::int64_t at = s - lo_[k];
        if (at < 0 || at >= static_cast<std::int64_t>(index_[k].size())) {
            build(k, s, placed, scratch_, first);  // outside the window: not cached
            size = static_cast<std::uint32_t>(scratch_.size());
            return scratch_.data();
        }
        auto& slot = index_[k][static_cast<std::size_t>(at)];
        if (slot < 0) {
            build(k, s, placed, pmf_, first);
            if (pool_.size() + pmf_.size() > table_memory_cap) {
                // Memory cap reached: forget every cached table and start again
                // (tables are rebuilt on demand; memory stays bounded).
                for (auto& level : index_) std::fill(level.begin(), level.end(), -1);
                pool_.clear();
                refs_.clear();
            }
            refs_.push_back({first, static_cast<std::uint32_t>(pool_.size()), static_cast<std::uint32_t>(pmf_.size())});
            pool_.insert(pool_.end(), pmf_.begin(), pmf_.end());
            slot = static_cast<std::int64_t>(refs_.size()) - 1;
        }
        const cdf_ref& ref = refs_[static_cast<std::size_t>(slot)];
        first = ref.first;
        size = ref.size;
        return pool_.data() + ref.offset;
    }

    const table& t_;
    const std::vector<detail::term_row>& terms_;
    std::vector<std::int64_t> lo_;
    std::vector<std::vector<std::int64_t>> index_;
    std::vector<cdf_ref> refs_;
    std::vector<double> pool_, pmf_, scratch_;
};

// Counts of the blocks one worker thread ran.
struct tally {
    std::int64_t extreme = 0, done = 0;
    std::uint64_t work = 0;
};

// The blocks id, id + threads, ... of the draws: block b uses the stream of
// the seed jumped b times. Stops once its work passes the cap (checked after
// every draw, a compare, so a runaway request stops within one draw of it).
tally run_blocks(const table& t, const std::vector<detail::term_row>& terms, double thr, std::int64_t draws,
                 std::uint64_t seed, unsigned id, unsigned threads, std::uint64_t work_cap) {
    tally out;
    sampler smp(t, terms);
    detail::xoshiro256ss rng(seed);
    std::int64_t at = 0;  // jumps applied to rng
    const std::int64_t blocks = (draws + block_size - 1) / block_size;
    for (std::int64_t b = id; b < blocks; b += threads) {
        for (; at < b; ++at) rng.jump();
        detail::xoshiro256ss stream = rng;
        const std::int64_t end = std::min(draws, (b + 1) * block_size);
        for (std::int64_t d = b * block_size; d < end; ++d) {
            out.extreme += smp.draw(stream) >= thr;
            ++out.done;
            if (smp.work > work_cap) {
                out.work = smp.work;
                return out;
            }
        }
    }
    out.work = smp.work;
    return out;
}

// Every block, on `threads` threads; the sum of integer counts is the same
// for any thread count.
tally run_all(const table& t, ordering o, std::int64_t draws, std::uint64_t seed, unsigned threads,
              std::uint64_t work_cap) {
    const auto terms = detail::term_tables(t, o);
    const double thr = detail::extreme_threshold(detail::observed_total(t, o), o);
    const std::int64_t blocks = (draws + block_size - 1) / block_size;
    threads = std::max(1u, std::min<unsigned>(threads, static_cast<unsigned>(std::min<std::int64_t>(blocks, 64))));
    std::vector<tally> part(threads);
    auto worker = [&](unsigned id) { part[id] = run_blocks(t, terms, thr, draws, seed, id, threads, work_cap); };
    if (threads == 1) {
        worker(0);
    } else {
        std::vector<std::thread> pool;
        for (unsigned id = 0; id < threads; ++id) pool.emplace_back(worker, id);
        for (auto& th : pool) th.join();
    }
    tally sum;
    for (const auto& p : part) {
        sum.extreme += p.extreme;
        sum.work += p.work;
        sum.done += p.done;
    }
    return sum;
}

}  // namespace

monte_carlo_outcome monte_carlo_p(const table& t, ordering o, std::int64_t draws, std::uint64_t seed,
                                  unsigned threads, std::uint64_t work_cap, bool fit_to_work) {
    monte_carlo_outcome out;
    out.draws = draws;
    const double planned = static_cast<double>(draws) * static_cast<double>(t.groups()) * variate_work;
    if (!fit_to_work && planned > static_cast<double>(work_cap))
        throw budget_exceeded("Monte Carlo with " + format_number(static_cast<double>(draws)) + " draws over " +
                              std::to_string(t.groups()) + " groups needs " + format_number(planned) +
                              " steps, more than the cap of " + format_number(static_cast<double>(work_cap)) + ".");
    if (t.all_alike()) {
        // Only one table has these margins: every draw equals the observed one.
        out.extreme = draws;
    } else {
        // Fitting draws to the work cap stops at a point fixed by the inputs
        // only if blocks run in order: one thread.
        const tally sum = run_all(t, o, draws, seed, fit_to_work ? 1 : threads, work_cap);
        out.extreme = sum.extreme;
        out.work = sum.work;
        if (fit_to_work) {
            out.draws = draws = sum.done;
            if (draws < 1000)
                throw budget_exceeded("Monte Carlo fits only " + format_number(static_cast<double>(draws)) +
                                      " draws into the time budget for counts this large.");
        } else if (sum.done < draws) {
            throw budget_exceeded("Monte Carlo needed more than " + format_number(static_cast<double>(work_cap)) +
                                  " steps.");
        }
    }
    const double B = static_cast<double>(draws), e = static_cast<double>(out.extreme);
    out.p = (1.0 + e) / (B + 1.0);
    const double phat = e / B;
    out.standard_error = std::sqrt(phat * (1.0 - phat) / B);
    using boost::math::binomial_distribution;
    out.low = binomial_distribution<>::find_lower_bound_on_p(B, e, 0.025);
    out.high = binomial_distribution<>::find_upper_bound_on_p(B, e, 0.025);
    return out;
}

}  // namespace tallyrates::omnibus
