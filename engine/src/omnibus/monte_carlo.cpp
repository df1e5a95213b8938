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
// Work unit: about 8 ns; a variate drawn counts 8, a table entry built 4, a
// term computed 2 (16 for the probability ordering).
//
// Bounds: before anything is built, the run is planned from the
// counts alone: the term tables (at most detail::max_term_values values),
// the variates, and the cumulative tables, built once per (group, successes
// placed) visited while they fit the per-thread cache of 2,000,000 values,
// rebuilt when they do not. A plan above the cap is refused at once, naming
// how many draws would fit; the automatic route asks whether 1,000 draws fit.
// While running, the threads add their work to one shared counter, a safety
// net at 1.5 times the cap for a plan that was too optimistic: the outcome
// of an accepted plan, and every refusal, depend on the counts only, never
// on the thread count. Memory: term tables at most 48 MB, the cache 16 MB
// per thread, the index of cached tables 4 bytes per slot (at most
// 2,000,000 + 3 G slots).
#include <algorithm>
#include <atomic>
#include <boost/math/distributions/binomial.hpp>
#include <cmath>
#include <numbers>

#include "detail/hypergeometric.hpp"
#include "detail/random.hpp"
#include "detail/threads.hpp"
#include "detail/terms.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/monte_carlo.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::omnibus {

namespace {

constexpr std::int64_t block_size = 65536;
constexpr double trim = detail::sampler_trim;
constexpr std::size_t table_memory_cap = 2'000'000;  // doubles cached per thread (16 MB)
// Measured costs (README benchmarks): about 66 ns per variate drawn from a
// cached table, 33 ns per table entry built; one unit is about 8 ns.
constexpr std::uint64_t variate_work = 8;
constexpr std::uint64_t table_entry_work = 4;
constexpr std::uint64_t table_work = 24;  // fixed cost of starting a table
// Slots of the index of cached tables: about 1,000,000 + G, whatever G.
constexpr double index_slots = 1e6;
// The shared counter may run past the planned cap by this factor before the
// run is stopped (a safety net for a plan that underestimated).
constexpr double safety_factor = 1.5;
// Trimmed at 1e-20 of the mode, a hypergeometric law keeps about +-9.6
// standard deviations.
constexpr double table_half_width_sd = 9.6;

// Work of the run on one thread, planned from the counts alone.
struct plan {
    double setup = 0;           // term tables
    double per_draw = 0;        // variates, and tables rebuilt when the cache cannot hold them
    double tables_once = 0;     // tables built the first time their (group, successes) is visited
    double total(double draws) const { return setup + tables_once + per_draw * draws; }
    // The most draws that fit `cap`.
    double draws_within(double cap) const { return per_draw > 0 ? (cap - setup - tables_once) / per_draw : 0; }
};

plan plan_of(const table& t, ordering o, double draws) {
    plan out;
    out.setup = detail::term_values(t) * (o == ordering::probability ? 16.0 : 2.0);
    const double N = static_cast<double>(t.attempts), S = static_cast<double>(t.successes), F = N - S;
    const std::size_t G = t.groups();
    double placed = 0, cached = 0, build_cost = 0, lookups = 0, one_of_each = 0;
    for (std::size_t k = 0; k + 1 < G; ++k) {
        const double n = static_cast<double>(t.n[k]), rest = N - placed;
        const double sd_s = N > 1 ? std::sqrt(placed * (N - placed) * S * F / (N * N * (N - 1))) : 0.0;
        const double sd_x = rest > 1 ? std::sqrt(n * (S / N) * (F / N) * (rest - n) / (rest - 1)) : 0.0;
        // Distinct successes-placed values met in `draws` draws: about
        // M (1 - e^(-draws / M)) for a near-normal law, M = sqrt(2 pi e) sd its
        // effective number of values (the exponential of its entropy).
        const double spread = std::sqrt(2 * std::numbers::pi * std::numbers::e) * sd_s + 1;
        const double states = spread * -std::expm1(-draws / spread);
        const double size = std::min(n + 1, 2 * table_half_width_sd * sd_x + 1);
        cached += states * size;
        build_cost += states * (table_work + table_entry_work * size);
        one_of_each += table_work + table_entry_work * size;
        lookups += 1;
        placed += n;
    }
    out.per_draw = lookups * variate_work;
    if (cached <= table_memory_cap) {
        out.tables_once = build_cost;
    } else {
        // The cache is flushed whole when full and refilled, so it holds half
        // its capacity on average: a share 1 - cap / (2 cached) of the
        // lookups (one per group and draw) builds its table again.
        const double miss = 1 - table_memory_cap / (2 * cached);
        out.tables_once = build_cost * (1 - miss);
        out.per_draw += miss * one_of_each;
    }
    return out;
}

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
        start_.assign(G + 1, 0);
        const double N = static_cast<double>(t.attempts), S = static_cast<double>(t.successes);
        // One flat index of about index_slots + 3 G slots, whatever G.
        const double half_cap = std::max(1.0, index_slots / static_cast<double>(G));
        std::int64_t placed = 0;
        std::size_t slots = 0;
        for (std::size_t k = 0; k + 1 < G; ++k) {
            const double P = static_cast<double>(placed);
            const double mean = P * S / N;
            const double sd = N > 1 ? std::sqrt(P * (N - P) * S * (N - S) / (N * N * (N - 1))) : 0.0;
            const auto feasible = detail::feasible_successes(t.attempts, t.successes, placed);
            const double half = std::min(40 * sd + 2, half_cap);
            lo_[k] = std::max(feasible.first, static_cast<std::int64_t>(std::floor(mean - half)));
            const std::int64_t top = std::min(feasible.last, static_cast<std::int64_t>(std::ceil(mean + half)));
            start_[k] = slots;
            slots += static_cast<std::size_t>(std::max<std::int64_t>(0, top - lo_[k] + 1));
            placed += t.n[k];
        }
        start_[G - 1] = start_[G] = slots;
        index_.assign(slots, -1);
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
        if (at < 0 || at >= static_cast<std::int64_t>(start_[k + 1] - start_[k])) {
            build(k, s, placed, scratch_, first);  // outside the window: not cached
            size = static_cast<std::uint32_t>(scratch_.size());
            return scratch_.data();
        }
        auto& slot = index_[start_[k] + static_cast<std::size_t>(at)];
        if (slot < 0) {
            build(k, s, placed, pmf_, first);
            if (pool_.size() + pmf_.size() > table_memory_cap) {
                // Memory cap reached: forget every cached table and start again
                // (tables are rebuilt on demand; memory stays bounded).
                std::fill(index_.begin(), index_.end(), -1);
                pool_.clear();
                refs_.clear();
            }
            refs_.push_back({first, static_cast<std::uint32_t>(pool_.size()), static_cast<std::uint32_t>(pmf_.size())});
            pool_.insert(pool_.end(), pmf_.begin(), pmf_.end());
            slot = static_cast<std::int32_t>(refs_.size()) - 1;
        }
        const cdf_ref& ref = refs_[static_cast<std::size_t>(slot)];
        first = ref.first;
        size = ref.size;
        return pool_.data() + ref.offset;
    }

    const table& t_;
    const std::vector<detail::term_row>& terms_;
    std::vector<std::int64_t> lo_;
    std::vector<std::size_t> start_;   // group k's slots: index_[start_[k] .. start_[k + 1])
    std::vector<std::int32_t> index_;  // -1, or the cached table's entry in refs_ (at most 2,000,000)
    std::vector<cdf_ref> refs_;
    std::vector<double> pool_, pmf_, scratch_;
};

// Counts of the blocks one worker thread ran.
struct tally {
    std::int64_t extreme = 0, done = 0;
    std::uint64_t work = 0;
};

// Work of every thread of one run: each adds what it did every 256 draws.
struct shared_work {
    std::atomic<std::uint64_t> total{0};
    std::uint64_t cap = 0;
};

// The blocks id, id + threads, ... of the draws: block b uses the stream of
// the seed jumped b times. Stops once the work of all threads passes the
// cap (on one thread, checked after every draw, so that drawing stops at a
// point fixed by the inputs; with more, every 256 draws).
tally run_blocks(const table& t, const std::vector<detail::term_row>& terms, double thr, std::int64_t draws,
                 std::uint64_t seed, unsigned id, unsigned threads, shared_work& work) {
    tally out;
    sampler smp(t, terms);
    detail::xoshiro256ss rng(seed);
    std::int64_t at = 0;  // jumps applied to rng
    std::uint64_t reported = 0;
    const std::int64_t blocks = (draws + block_size - 1) / block_size;
    const std::int64_t every = threads == 1 ? 1 : 256;
    for (std::int64_t b = id; b < blocks; b += threads) {
        for (; at < b; ++at) rng.jump();
        detail::xoshiro256ss stream = rng;
        const std::int64_t end = std::min(draws, (b + 1) * block_size);
        for (std::int64_t d = b * block_size; d < end; ++d) {
            out.extreme += smp.draw(stream) >= thr;
            ++out.done;
            if (out.done % every == 0) {
                const std::uint64_t total = work.total.fetch_add(smp.work - reported) + (smp.work - reported);
                reported = smp.work;
                if (total > work.cap) {
                    out.work = smp.work;
                    return out;
                }
            }
        }
    }
    work.total.fetch_add(smp.work - reported);
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
    shared_work work;
    work.cap = work_cap;
    detail::on_threads(threads, threads, [&](std::size_t id) {
        part[id] = run_blocks(t, terms, thr, draws, seed, static_cast<unsigned>(id), threads, work);
    });
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
    const double cap = static_cast<double>(work_cap);
    if (const double values = detail::term_values(t); values > detail::max_term_values)
        throw budget_exceeded("Monte Carlo would need tables of " + format_number(values) +
                              " values for counts this large, more than memory allows; counts this large suit "
                              "the chi-square route.");
    // Refusals foreseen from the plan, before anything is built: the
    // automatic route needs at least min_draws draws within its cap.
    // (Fitted to the work, the plan is made for the min_draws it must reach.)
    const double planned = static_cast<double>(fit_to_work ? min_draws : draws);
    const plan p = plan_of(t, o, planned);
    if (fit_to_work && p.total(planned) > cap)
        throw budget_exceeded("Monte Carlo cannot make " + format_grouped(min_draws) +
                              " draws within the time budget for counts this large.");
    if (!fit_to_work && p.total(planned) > cap) {
        const double fit = std::floor(p.draws_within(cap));
        throw budget_exceeded("Monte Carlo with " + format_number(static_cast<double>(draws)) + " draws over " +
                              std::to_string(t.groups()) + " groups needs about " +
                              format_number(p.total(static_cast<double>(draws))) + " steps, more than the cap of " +
                              format_number(cap) + " (about 5 s)" +
                              (fit >= static_cast<double>(min_draws) ? "; about " + format_number(fit) + " draws fit" : "") + ".");
    }
    if (t.all_alike()) {
        // Only one table has these margins: every draw equals the observed one.
        out.extreme = draws;
    } else {
        // Fitting draws to the work cap stops at a point fixed by the inputs
        // only if blocks run in order: one thread.
        // Asked by name, the plan fitted: the shared counter is only a safety net.
        const auto limit = fit_to_work ? work_cap : static_cast<std::uint64_t>(safety_factor * cap);
        const tally sum = run_all(t, o, draws, seed, fit_to_work ? 1 : threads, limit);
        out.extreme = sum.extreme;
        out.work = sum.work;
        if (fit_to_work) {
            out.draws = draws = sum.done;
            if (draws < min_draws)
                throw budget_exceeded("Monte Carlo fits only " + format_number(static_cast<double>(draws)) +
                                      " draws into the time budget for counts this large.");
        } else if (sum.done < draws) {
            throw budget_exceeded("Monte Carlo needed more than " + format_number(static_cast<double>(limit)) +
                                  " steps, beyond its plan; ask for fewer draws.");
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
