// threads.hpp (detail) - the one way the engine shares work between threads:
// jobs 0 .. n - 1, each run exactly once, the calling thread working too.
// Jobs write only their own results, so which thread runs which job changes
// nothing: the exact route and the Monte Carlo route give the same answer
// bit for bit on one thread or several.
#pragma once

#include <algorithm>
#include <atomic>
#include <cstddef>
#include <thread>
#include <vector>

namespace tallyrates::detail {

// Runs job(0) ... job(n - 1) on up to `threads` threads, each taking the next
// job not yet taken.
template <class Job>
void on_threads(unsigned threads, std::size_t n, Job job) {
    const auto use = static_cast<unsigned>(std::min<std::size_t>(std::max(1u, threads), n));
    if (use <= 1) {
        for (std::size_t c = 0; c < n; ++c) job(c);
        return;
    }
    std::atomic<std::size_t> next{0};
    auto worker = [&] {
        for (std::size_t c = next++; c < n; c = next++) job(c);
    };
    std::vector<std::thread> helpers;
    for (unsigned id = 1; id < use; ++id) helpers.emplace_back(worker);
    worker();
    for (auto& h : helpers) h.join();
}

}  // namespace tallyrates::detail
