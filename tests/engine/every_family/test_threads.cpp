// Concurrent calls into every family's cached entry points, as the component
// makes them when several documents recalculate at once: four threads ask
// about the same and about different tallies through shared caches (the
// omnibus result memo, the pairwise p memo, the Bayesian pass memo), while
// the exact route runs its own two threads and the Monte Carlo route its
// own. Every answer must equal the one computed alone, bit for bit: the
// routes are deterministic (fixed seeds, fixed splits of work) and a cache
// never hands back another question's answer. A property of the design
// (architecture.md, Recalculation), no outside numbers; under the sanitize
// preset AddressSanitizer watches the caches' memory while they are shared.
#include <gtest/gtest.h>

#include <thread>
#include <vector>

#include "tallyrates/bayes/across.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/pairs/pairwise.hpp"

using namespace tallyrates;

namespace {

// Four invented tallies of 3 to 6 groups.
std::vector<counts> tallies() {
    return {counts::from_values(std::vector<std::int64_t>{12, 18, 9}, std::vector<std::int64_t>{30, 31, 29}),
            counts::from_values(std::vector<std::int64_t>{286, 271, 233, 14}, std::vector<std::int64_t>{300, 290, 260, 14}),
            counts::from_values(std::vector<std::int64_t>{3, 7, 5, 9, 4}, std::vector<std::int64_t>{20, 21, 19, 22, 20}),
            counts::from_values(std::vector<std::int64_t>{40, 44, 39, 47, 41, 45},
                                std::vector<std::int64_t>{50, 50, 50, 50, 50, 50})};
}

struct answers {
    double exact_p = 0, monte_carlo_p = 0, pair_p = 0, best = 0, loss = 0;
    bool operator==(const answers&) const = default;
};

answers ask(const counts& c, omnibus::result_cache* omnibus_cache, pairwise::p_cache* pair_cache,
            bayes::across_cache* bayes_cache) {
    answers a;
    omnibus::options exact;
    exact.how = omnibus::method::exact;
    a.exact_p = omnibus::same_rates(c, exact, omnibus_cache).p;
    omnibus::options mc;
    mc.how = omnibus::method::monte_carlo;
    mc.draws = 20000;
    a.monte_carlo_p = omnibus::same_rates(c, mc, omnibus_cache).p;
    a.pair_p = pairwise::all_pairs_p(c, pairwise::test_method::exact, pair_cache).at(0);
    const auto laws = bayes::posteriors(c, bayes::prior{0.5, 0.5});
    a.best = bayes::best(laws, 0, goal::high, bayes_cache);
    a.loss = bayes::loss(laws, 1, goal::high, bayes_cache);
    return a;
}

}  // namespace

TEST(Threads, SharedCachesGiveEveryThreadTheAnswerOfASingleCall) {
    const auto cs = tallies();
    std::vector<answers> alone;
    for (const auto& c : cs) alone.push_back(ask(c, nullptr, nullptr, nullptr));
    // Small caches, so that entries are evicted while other threads read them.
    omnibus::result_cache omnibus_cache(2);
    pairwise::p_cache pair_cache(2);
    bayes::across_cache bayes_cache(2);
    std::vector<std::vector<answers>> seen(4);
    std::vector<std::thread> threads;
    for (std::size_t t = 0; t < 4; ++t)
        threads.emplace_back([&, t] {
            // Thread t starts at tally t and walks through all of them twice:
            // the same tally in two threads at once, and different ones.
            for (std::size_t k = 0; k < 2 * cs.size(); ++k)
                seen[t].push_back(ask(cs[(t + k) % cs.size()], &omnibus_cache, &pair_cache, &bayes_cache));
        });
    for (auto& th : threads) th.join();
    for (std::size_t t = 0; t < 4; ++t)
        for (std::size_t k = 0; k < seen[t].size(); ++k)
            EXPECT_EQ(seen[t][k], alone[(t + k) % cs.size()]) << "thread " << t << ", call " << k;
}
