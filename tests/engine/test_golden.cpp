// Golden omnibus results: every route, statistic and trend value of a fixed
// set of tables, written as hexadecimal floats and compared bit for bit with
// tests/golden/omnibus.txt.
//
// This is not a check of correctness (test_omnibus.cpp compares with scipy,
// statsmodels and an independent enumeration); it pins the numbers across
// refactoring and speed work, so that a change of any result is deliberate.
// Rewrite the file only on purpose:
//   TALLYRATES_GOLDEN_WRITE=tests/golden/omnibus.txt build/tests/engine_golden
#include <gtest/gtest.h>

#include <cstdlib>
#include <fstream>
#include <string>
#include <vector>

#include "golden_cases.hpp"

TEST(Golden, OmnibusResultsBitIdentical) {
    const auto now = tallyrates::testing::golden_lines();
    if (const char* out = std::getenv("TALLYRATES_GOLDEN_WRITE")) {
        std::ofstream f(out);
        for (const auto& l : now) f << l << '\n';
        GTEST_SKIP() << "wrote " << out;
    }
    std::ifstream in(TALLYRATES_GOLDEN_FILE);
    std::vector<std::string> before;
    for (std::string line; std::getline(in, line);) before.push_back(line);
    ASSERT_EQ(before.size(), now.size()) << "line count differs from " TALLYRATES_GOLDEN_FILE;
    for (std::size_t k = 0; k < now.size(); ++k) EXPECT_EQ(before[k], now[k]) << "line " << k + 1;
}
