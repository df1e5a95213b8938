// The exact route on 2 x 12 tables, equal and unequal group sizes, near and
// far from one shared rate, in all three orderings. Each case runs
// once in its own child process, so the peak memory printed (maximum resident
// set size, from wait4; in brackets) is that run's alone, the program's own ~4 MB
// included. Three lines per table and ordering:
//   raised caps   exact_p with the caps lifted: time, p, work units
//   by name       RATES.SAME.P with the method named ("exact", "exact-lr",
//                 "exact-prob") and the default caps: the value or Err:523
//   auto          (X^2 only) the route "auto" takes and its time
// Figures go into the README; nothing here passes or fails.
//
//     build/tests/bench/bench_exact            every table
//     build/tests/bench/bench_exact NAME       one table
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <string>
#include <vector>

#include "../engine/omnibus/golden_cases.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"

using namespace tallyrates;
using namespace tallyrates::omnibus;

namespace {

struct bench_table {
    std::string name, what;
    std::vector<std::int64_t> x, n;
};

// 12 equal groups of N / 12 with rates low, low + step, ... (the README's
// near and far tables).
bench_table equal(const char* name, std::int64_t N, double low, double step) {
    bench_table b{name, "12 groups of " + std::to_string(N / 12) + ", rates " + std::to_string(low).substr(0, 4) +
                            " to " + std::to_string(low + 11 * step).substr(0, 4),
                  {}, {}};
    for (int g = 0; g < 12; ++g) {
        b.n.push_back(N / 12);
        b.x.push_back(static_cast<std::int64_t>(static_cast<double>(N / 12) * (low + step * g)));
    }
    return b;
}

// Issue 10's unequal tables (tests/engine/golden_cases.hpp).
bench_table unequal(const char* name, std::int64_t N, double low, double high) {
    const auto u = testing::unequal_twelve(name, N, low, high);
    return {name,
            "12 groups of 20..65 scaled to N = " + std::to_string(N) + ", rates " + std::to_string(low).substr(0, 4) +
                " to " + std::to_string(high).substr(0, 4),
            u.x, u.n};
}

std::vector<bench_table> tables() {
    return {equal("near_500", 500, 0.40, 0.02),      equal("near_1000", 1000, 0.40, 0.02),
            equal("far_240", 240, 0.10, 0.8 / 11),   equal("far_500", 500, 0.10, 0.8 / 11),
            unequal("unequal_mid_500", 500, 0.35, 0.65), unequal("unequal_far_240", 240, 0.10, 0.83),
            unequal("unequal_wide_500", 500, 0.25, 0.75)};
}

double ms_since(std::chrono::steady_clock::time_point start) {
    return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count();
}

void raised(const table& t, ordering o) {
    const auto start = std::chrono::steady_clock::now();
    const auto r = exact_p(t, o, 1ull << 40, std::size_t{1} << 28);
    const double ms = ms_since(start);
    std::printf("  raised caps %10.1f ms  p = %.6g  work %.3g%s", ms, r.p, static_cast<double>(r.work),
                r.complete ? "" : ("  stopped: " + r.stopped).c_str());
}

void as_user(const counts& c, method how, const char* label) {
    options opt;
    opt.how = how;
    const auto start = std::chrono::steady_clock::now();
    std::string outcome;
    try {
        const auto r = same_rates(c, opt);
        const char* routes[] = {"chi-square", "lr", "exact", "monte carlo", "all alike"};
        char p[32];
        std::snprintf(p, sizeof p, "%.6g", r.p);
        outcome = std::string("p = ") + p + " by " + routes[static_cast<int>(r.used)];
    } catch (const budget_exceeded& e) {
        outcome = std::string("Err:523: ") + e.what();
    }
    std::printf("  %-11s %10.1f ms  %s", label, ms_since(start), outcome.substr(0, 140).c_str());
}

// Runs `job` in a child process and prints its peak memory.
template <class F>
void in_child(F job) {
    std::fflush(stdout);
    const pid_t child = fork();
    if (child == 0) {
        job();
        std::fflush(stdout);
        _exit(0);
    }
    int status = 0;
    rusage usage{};
    wait4(child, &status, 0, &usage);
    std::printf("  [%.0f MB]\n", static_cast<double>(usage.ru_maxrss) / 1024.0);
}

}  // namespace

int main(int argc, char** argv) {
    for (const auto& b : tables()) {
        if (argc > 1 && b.name != argv[1]) continue;
        const auto c = counts::from_values(b.x, b.n);
        const auto t = table_of(c);
        std::printf("%s: %s\n", b.name.c_str(), b.what.c_str());
        const std::pair<ordering, method> orderings[] = {{ordering::pearson, method::exact},
                                                         {ordering::lr, method::exact_lr},
                                                         {ordering::probability, method::exact_prob}};
        for (const auto& [o, how] : orderings) {
            std::printf(" %s\n", o == ordering::pearson ? "X^2" : o == ordering::lr ? "G^2" : "probability");
            in_child([&] { raised(t, o); });
            in_child([&] { as_user(c, how, "by name"); });
        }
        in_child([&] { as_user(c, method::automatic, "auto"); });
        std::printf("\n");
    }
    return 0;
}
