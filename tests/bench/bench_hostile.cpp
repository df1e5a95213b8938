// Hostile inputs for the omnibus routes: large but plausible
// tallies that a colleague may type. Each case runs once in its own child
// process, so the peak memory printed (maximum resident set size, from
// wait4) is that call's alone, the program's own ~4 MB included. Figures go
// into the README; nothing here passes or fails.
//
//     build/tests/bench/bench_hostile            every case
//     build/tests/bench/bench_hostile NAME       one case
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cstdio>
#include <cstring>
#include <functional>
#include <string>
#include <vector>

#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"

using namespace tallyrates;

namespace {

struct hostile {
    const char* name;
    const char* what;
    std::vector<std::int64_t> x, n;
    omnibus::options opt;
};

// `count` groups of 2 attempts with 0, 1, 2, 0, ... successes.
hostile pairs(const char* name, const char* what, int count) {
    hostile h{name, what, {}, {}, {}};
    for (int g = 0; g < count; ++g) {
        h.n.push_back(2);
        h.x.push_back(g % 3);
    }
    return h;
}

std::vector<hostile> cases() {
    std::vector<hostile> out;
    {
        hostile h{"small_beside_huge", "auto: 4 of 5 beside eleven groups of 4.5 million at about 90 %", {4}, {5}, {}};
        for (int g = 0; g < 11; ++g) {
            h.n.push_back(4'500'000);
            h.x.push_back(4'050'000 + 1000 * g);
        }
        out.push_back(h);
    }
    out.push_back({"small_beside_two_giants", "auto: 4 of 5 beside two groups of 24 million",
                   {4, 21'600'000, 21'620'000}, {5, 24'000'000, 24'000'000}, {}});
    out.push_back(pairs("million_pairs", "auto: 1,048,576 groups of 2 attempts", 1'048'576));
    {
        hostile h{"mc_15x1000", "montecarlo by name: 10^7 draws over 15 groups of 1000", {}, {}, {}};
        for (int g = 0; g < 15; ++g) {
            h.n.push_back(1000);
            h.x.push_back(600 + 3 * g);
        }
        h.opt.how = omnibus::method::monte_carlo;
        h.opt.draws = 10'000'000;
        out.push_back(h);
    }
    {
        hostile h{"mc_15x80000", "montecarlo by name: 10^7 draws over 15 groups of 80,000", {}, {}, {}};
        for (int g = 0; g < 15; ++g) {
            h.n.push_back(80'000);
            h.x.push_back(48'000 + 50 * g);
        }
        h.opt.how = omnibus::method::monte_carlo;
        h.opt.draws = 10'000'000;
        out.push_back(h);
    }
    {
        hostile h{"exact_2x12_N3000", "exact by name: 2 x 12, N = 3000, rates 0.35 to 0.65", {}, {}, {}};
        for (int g = 0; g < 12; ++g) {
            h.n.push_back(250);
            h.x.push_back(88 + 7 * g);
        }
        h.opt.how = omnibus::method::exact;
        out.push_back(h);
    }
    out.push_back(pairs("exact_10000_pairs", "exact by name: 10,000 groups of 2 attempts", 10'000));
    out.back().opt.how = omnibus::method::exact;
    for (unsigned threads : {1u, 2u, 4u}) {
        hostile h{"mc_3x12000_threads", "montecarlo by name: 131,072 draws over 3 groups of 12,000",
                  {7000, 7100, 7200}, {12'000, 12'000, 12'000}, {}};
        h.opt.how = omnibus::method::monte_carlo;
        h.opt.draws = 131'072;
        h.opt.threads = threads;
        out.push_back(h);
    }
    return out;
}

void run(const hostile& h) {
    const auto c = counts::from_values(h.x, h.n);
    const auto start = std::chrono::steady_clock::now();
    std::string outcome;
    try {
        const auto r = omnibus::same_rates(c, h.opt);
        char p[32];
        std::snprintf(p, sizeof p, "%.6g", r.p);
        outcome = std::string("p = ") + p + ", route " + std::to_string(static_cast<int>(r.used));
    } catch (const budget_exceeded& e) {
        outcome = std::string("Err:523: ") + e.what();
    }
    const double ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count();
    std::printf("%-20s threads %u  %9.1f ms  %s\n", h.name, h.opt.threads, ms, outcome.substr(0, 150).c_str());
    std::fflush(stdout);
}

}  // namespace

int main(int argc, char** argv) {
    std::printf("%s\n", "case                 threads        time  outcome; then peak memory of the call's process");
    // The cases are built in the child only, so the parent's memory (the
    // million-group tally) does not count in another case's peak.
    constexpr std::size_t count = 10;
    for (std::size_t k = 0; k < count; ++k) {
        std::fflush(stdout);
        const pid_t child = fork();
        if (child == 0) {
            const auto all = cases();
            if (argc > 1 && std::strcmp(argv[1], all[k].name) != 0) _exit(3);
            std::printf("# %s\n", all[k].what);
            run(all[k]);
            _exit(0);
        }
        int status = 0;
        rusage usage{};
        wait4(child, &status, 0, &usage);
        if (WIFEXITED(status) && WEXITSTATUS(status) == 3) continue;
        std::printf("%-20s peak memory %.0f MB\n\n", "", static_cast<double>(usage.ru_maxrss) / 1024.0);
    }
    return 0;
}
