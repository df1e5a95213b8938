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
// Work unit: one variate drawn, or one table entry built.
#include <algorithm>
#include <boost/math/distributions/binomial.hpp>
#include <cmath>
#include <thread>

#include "tallyrates/errors.hpp"
#include "tallyrates/hypergeometric.hpp"
#include "tallyrates/omnibus.hpp"
#include "tallyrates/random.hpp"
#include "terms.hpp"

namespace tallyrates::omnibus {

namespace {

constexpr std::int64_t block_size = 65536;
constexpr double trim = 1e-20;
constexpr std::size_t table_memory_cap = 4'000'000;  // doubles cached per thread (32 MB)

struct cdf_ref {
    std::int64_t first = 0;
    std::uint32_t offset = 0, size = 0;
};

// Lazily built cumulative tables of one worker thread.
class sampler {
public:
    sampler(const table& t, const std::vector<std::vector<double>>& terms) : t_(t), terms_(terms) {
        const std::size_t G = t.groups();
        lo_.resize(G);
        index_.resize(G);
        std::int64_t placed = 0;
        for (std::size_t k = 0; k + 1 < G; ++k) {
            lo_[k] = std::max<std::int64_t>(0, t.successes - (t.attempts - placed));
            const std::int64_t hi = std::min<std::int64_t>(t.successes, placed);
            index_[k].assign(static_cast<std::size_t>(hi - lo_[k] + 1), -1);
            placed += t.n[k];
        }
    }

    // Statistic of one random table.
    double draw(random::xoshiro256ss& rng) {
        const std::size_t G = t_.groups();
        std::int64_t s = 0, placed = 0;
        double total = 0.0;
        for (std::size_t k = 0; k + 1 < G; ++k) {
            const cdf_ref& ref = table_for(k, s, placed);
            const double* c = ref.size ? (scratch_active_ ? scratch_.data() : pool_.data() + ref.offset) : nullptr;
            const double u = rng.uniform();
            // Smallest i with c[i] > u; c[size - 1] == 1 > u always.
            const auto i = static_cast<std::int64_t>(std::upper_bound(c, c + ref.size, u) - c);
            const std::int64_t x = ref.first + i;
            total += terms_[k][static_cast<std::size_t>(x)];
            s += x;
            placed += t_.n[k];
            ++work;
        }
        total += terms_[G - 1][static_cast<std::size_t>(t_.successes - s)];
        return total;
    }

    std::uint64_t work = 0;

private:
    const cdf_ref& table_for(std::size_t k, std::int64_t s, std::int64_t placed) {
        scratch_active_ = false;
        auto& slot = index_[k][static_cast<std::size_t>(s - lo_[k])];
        if (slot >= 0) return refs_[static_cast<std::size_t>(slot)];
        const auto sup = tallyrates::detail::hypergeometric_pmf(t_.attempts - placed, t_.successes - s, t_.n[k], pmf_, trim);
        work += pmf_.size();
        for (std::size_t i = 1; i < pmf_.size(); ++i) pmf_[i] += pmf_[i - 1];
        const double total = pmf_.back();
        for (double& v : pmf_) v /= total;
        pmf_.back() = 1.0;
        cdf_ref ref{sup.first, 0, static_cast<std::uint32_t>(pmf_.size())};
        if (pool_.size() + pmf_.size() > table_memory_cap) {
            // Memory cap reached: use the table once and forget it.
            scratch_.swap(pmf_);
            scratch_active_ = true;
            scratch_ref_ = ref;
            return scratch_ref_;
        }
        ref.offset = static_cast<std::uint32_t>(pool_.size());
        pool_.insert(pool_.end(), pmf_.begin(), pmf_.end());
        slot = static_cast<std::int64_t>(refs_.size());
        refs_.push_back(ref);
        return refs_.back();
    }

    const table& t_;
    const std::vector<std::vector<double>>& terms_;
    std::vector<std::int64_t> lo_;
    std::vector<std::vector<std::int64_t>> index_;
    std::vector<cdf_ref> refs_;
    std::vector<double> pool_, pmf_, scratch_;
    cdf_ref scratch_ref_;
    bool scratch_active_ = false;
};

}  // namespace

monte_carlo_outcome monte_carlo_p(const table& t, ordering o, std::int64_t draws, std::uint64_t seed,
                                  unsigned threads, std::uint64_t work_cap) {
    monte_carlo_outcome out;
    out.draws = draws;
    const double planned = static_cast<double>(draws) * static_cast<double>(t.groups());
    if (planned > static_cast<double>(work_cap))
        throw budget_exceeded("Monte Carlo with " + format_number(static_cast<double>(draws)) + " draws over " +
                              std::to_string(t.groups()) + " groups needs " + format_number(planned) +
                              " steps, more than the cap of " + format_number(static_cast<double>(work_cap)) + ".");
    if (t.successes == 0 || t.successes == t.attempts) {
        // Only one table has these margins: every draw equals the observed one.
        out.extreme = draws;
    } else {
        double n_cells = 0;
        for (auto n : t.n) n_cells += static_cast<double>(n) + 1;
        if (n_cells > 4e7)
            throw budget_exceeded("Monte Carlo over " + format_number(static_cast<double>(t.attempts)) +
                                  " attempts needs statistic tables too large for memory; counts this large suit the "
                                  "chi-square route.");
        const auto terms = detail::term_tables(t, o);
        const double thr = detail::extreme_threshold(detail::observed_total(t, o), o);
        const std::int64_t blocks = (draws + block_size - 1) / block_size;
        threads = std::max(1u, std::min<unsigned>(threads, static_cast<unsigned>(std::min<std::int64_t>(blocks, 64))));
        std::vector<std::int64_t> extreme(threads, 0);
        std::vector<std::uint64_t> work(threads, 0);
        auto worker = [&](unsigned id) {
            sampler smp(t, terms);
            random::xoshiro256ss rng(seed);
            std::int64_t at = 0;  // jumps applied to rng
            for (std::int64_t b = id; b < blocks; b += threads) {
                for (; at < b; ++at) rng.jump();
                random::xoshiro256ss stream = rng;
                const std::int64_t end = std::min(draws, (b + 1) * block_size);
                std::int64_t hits = 0;
                for (std::int64_t d = b * block_size; d < end; ++d) hits += smp.draw(stream) >= thr;
                extreme[id] += hits;
                if (smp.work > work_cap) break;  // a runaway table build; caught below
            }
            work[id] = smp.work;
        };
        if (threads == 1) {
            worker(0);
        } else {
            std::vector<std::thread> pool;
            for (unsigned id = 0; id < threads; ++id) pool.emplace_back(worker, id);
            for (auto& th : pool) th.join();
        }
        for (unsigned id = 0; id < threads; ++id) {
            out.extreme += extreme[id];
            out.work += work[id];
        }
        if (out.work > work_cap)
            throw budget_exceeded("Monte Carlo needed more than " + format_number(static_cast<double>(work_cap)) +
                                  " steps.");
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
