// golden_cases.hpp - the tables and routes whose results tests/golden/
// omnibus.txt pins (see test_golden.cpp). Hexadecimal floats, so equal text
// means equal bits.
#pragma once

#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <string>
#include <vector>

#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/omnibus/trend.hpp"

namespace tallyrates::testing {

struct golden_table {
    const char* name;
    std::vector<std::int64_t> x, n;
};

inline std::vector<golden_table> golden_tables() {
    std::vector<golden_table> t = {
        {"e_g2_unequal", {1, 9}, {3, 30}},
        {"e_g3_small", {1, 4, 6}, {6, 7, 8}},
        {"e_g4_mixed", {0, 2, 5, 3}, {4, 5, 6, 3}},
        {"e_g4_ties", {1, 1, 2, 2}, {4, 4, 4, 4}},
        {"e_g5_sparse", {0, 1, 0, 3, 1}, {3, 4, 2, 5, 6}},
        {"e_g6_pilot", {2, 3, 1, 4, 0, 5}, {5, 5, 4, 6, 3, 6}},
        {"e_tea", {3, 1}, {4, 4}},
        {"g12_shift", {50, 52, 47, 55, 60, 41, 49, 51, 58, 62, 45, 53}, {80, 80, 78, 81, 85, 79, 80, 77, 82, 84, 80, 79}},
        {"g2_even", {18, 27}, {40, 40}},
        {"g2_million_unequal", {999000, 4}, {1000000, 12}},
        {"g2_unequal", {3, 350}, {12, 400}},
        {"g3_all_success", {20, 17, 9}, {20, 25, 16}},
        {"g3_zero_group", {0, 14, 22}, {15, 30, 31}},
        {"g4_tiny_p", {5, 40, 75, 98}, {100, 100, 100, 100}},
        {"g6_mixed", {12, 30, 7, 44, 19, 3}, {25, 41, 20, 60, 33, 9}},
        {"issue_example", {45, 171, 12}, {50, 190, 12}},
        {"armitage1955", {19, 29, 24}, {516, 589, 293}},
        {"t_rising", {2, 5, 9, 14}, {30, 30, 30, 30}},
        {"g8_coarse", {2, 3, 1, 4, 0, 5, 6, 2}, {5, 5, 4, 6, 3, 6, 9, 7}},
        {"g7_ten", {4, 7, 2, 9, 5, 1, 8}, {10, 10, 10, 10, 10, 10, 10}},
    };
    // 2 x 12 tables of the README's speed section (equal sizes N / 12).
    for (const auto& [name, N, low, step] : {std::tuple{"near150", 150, 0.40, 0.02},
                                             std::tuple{"far150", 150, 0.10, 0.8 / 11},
                                             std::tuple{"near240", 240, 0.40, 0.02}}) {
        golden_table g{name, {}, {}};
        for (int k = 0; k < 12; ++k) {
            g.n.push_back(N / 12);
            g.x.push_back(static_cast<std::int64_t>(static_cast<double>(N / 12) * (low + step * k)));
        }
        t.push_back(g);
    }
    return t;
}

// 12 groups of 20, 25, 30, 35, 38, 40, 42, 45, 48, 52, 60 and 65 attempts
// (N = 500), or those sizes scaled to N, with rates spread evenly from low
// to high: the unequal tables of bench_exact.
inline golden_table unequal_twelve(const char* name, std::int64_t N, double low, double high) {
    const std::vector<std::int64_t> sizes = {20, 25, 30, 35, 38, 40, 42, 45, 48, 52, 60, 65};
    golden_table t{name, {}, {}};
    for (std::size_t g = 0; g < sizes.size(); ++g) {
        const auto n = static_cast<std::int64_t>(std::lround(static_cast<double>(sizes[g] * N) / 500.0));
        t.n.push_back(n);
        t.x.push_back(std::lround(static_cast<double>(n) * (low + (high - low) * static_cast<double>(g) / 11.0)));
    }
    return t;
}

// A golden file is rewritten only on purpose: with TALLYRATES_GOLDEN_WRITE
// set, `lines` go to that file and the caller skips its comparison.
inline bool write_if_asked(const std::vector<std::string>& lines) {
    const char* out = std::getenv("TALLYRATES_GOLDEN_WRITE");
    if (out == nullptr) return false;
    std::ofstream f(out);
    for (const auto& l : lines) f << l << '\n';
    return true;
}

inline std::vector<std::string> read_lines(const char* path) {
    std::ifstream in(path);
    std::vector<std::string> lines;
    for (std::string line; std::getline(in, line);) lines.push_back(line);
    return lines;
}

inline std::string hex(double v) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%a", v);
    return buf;
}

inline std::string golden_line(const golden_table& g, const char* what, omnibus::method how) {
    omnibus::options o;
    o.how = how;
    o.draws = 20000;
    std::string line = std::string(g.name) + " " + what + " ";
    try {
        const auto r = omnibus::same_rates(counts::from_values(g.x, g.n), o);
        line += "p=" + hex(r.p) + " stat=" + hex(r.statistic) + " route=" + std::to_string(static_cast<int>(r.used));
        if (r.has_exact) line += " low=" + hex(r.exact.p_low) + " high=" + hex(r.exact.p_high);
        if (r.has_monte_carlo) line += " draws=" + std::to_string(r.mc.draws) + " extreme=" + std::to_string(r.mc.extreme);
    } catch (const budget_exceeded&) {
        line += "refused";
    }
    return line;
}

inline std::vector<std::string> golden_lines() {
    using omnibus::method;
    std::vector<std::string> out;
    for (const auto& g : golden_tables()) {
        for (const auto& [what, how] : {std::pair{"auto", method::automatic}, std::pair{"pearson", method::pearson},
                                        std::pair{"lr", method::lr}, std::pair{"exact", method::exact},
                                        std::pair{"exact-lr", method::exact_lr},
                                        std::pair{"exact-prob", method::exact_prob},
                                        std::pair{"montecarlo", method::monte_carlo}})
            out.push_back(golden_line(g, what, how));
        const auto c = counts::from_values(g.x, g.n);
        for (const auto v : {trend::variance::binomial, trend::variance::conditional}) {
            const auto r = trend::test(c, {}, v);
            out.push_back(std::string(g.name) + " trend" + std::to_string(static_cast<int>(v)) + " z=" + hex(r.z) +
                          " p=" + hex(r.p));
        }
    }
    return out;
}

}  // namespace tallyrates::testing
