// Golden omnibus results: every route, statistic and trend value of a fixed
// set of tables, written as hexadecimal floats and compared bit for bit with
// tests/golden/omnibus.txt.
//
// Exact-route lines (route=2) are compared at 1e-12 relative in p, low and
// high since the k-way merge network changed the summation order; everything
// else bit for bit.
//
// This is not a check of correctness (test_omnibus.cpp compares with scipy,
// statsmodels and an independent enumeration); it pins the numbers across
// refactoring and speed work, so that a change of any result is deliberate.
// Rewrite the file only on purpose:
//   TALLYRATES_GOLDEN_WRITE=tests/golden/omnibus.txt build/tests/engine_golden
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "golden_cases.hpp"

namespace {

// Fields of a golden line: name, route word, then key=value pairs.
std::vector<std::string> words(const std::string& line) {
    std::istringstream in(line);
    std::vector<std::string> out;
    for (std::string w; in >> w;) out.push_back(w);
    return out;
}

// Lines of the exact route (route=2) may differ in the last bits of p, low
// and high: the k-way merge network sums in another order than
// the network that wrote the file. Those three agree to 1e-12 relative (the
// tolerance of the rational-arithmetic checks); every other field is equal.
bool exact_route_close(const std::string& a, const std::string& b) {
    const auto wa = words(a), wb = words(b);
    if (wa.size() != wb.size() || std::find(wa.begin(), wa.end(), "route=2") == wa.end()) return false;
    for (std::size_t i = 0; i < wa.size(); ++i) {
        if (wa[i] == wb[i]) continue;
        const auto eq = wa[i].find('=');
        const std::string key = wa[i].substr(0, eq + 1);
        if ((key != "p=" && key != "low=" && key != "high=") || wb[i].substr(0, eq + 1) != key) return false;
        const double x = std::strtod(wa[i].c_str() + eq + 1, nullptr), y = std::strtod(wb[i].c_str() + eq + 1, nullptr);
        if (std::fabs(x - y) > 1e-12 * std::fabs(x)) return false;
    }
    return true;
}

}  // namespace

TEST(Golden, OmnibusResultsBitIdentical) {
    const auto now = tallyrates::testing::golden_lines();
    if (tallyrates::testing::write_if_asked(now)) GTEST_SKIP() << "wrote the golden file";
    const auto before = tallyrates::testing::read_lines(TALLYRATES_GOLDEN_FILE);
    ASSERT_EQ(before.size(), now.size()) << "line count differs from " TALLYRATES_GOLDEN_FILE;
    for (std::size_t k = 0; k < now.size(); ++k) {
        if (before[k] == now[k]) continue;
        EXPECT_TRUE(exact_route_close(before[k], now[k])) << "line " << k + 1 << "\n  before " << before[k]
                                                           << "\n  now    " << now[k];
    }
}
