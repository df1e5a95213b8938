// Tests of the count-range conventions (functions.md, "Shared conventions").
// The conventions themselves are the reference here: each expectation quotes
// the rule it checks.
#include <gtest/gtest.h>

#include <cmath>

#include "tallyrates/check.hpp"
#include "tallyrates/counts.hpp"
#include "tallyrates/errors.hpp"

using namespace tallyrates;

namespace {
entry num(double v) { return entry::number(v); }
entry blank() { return entry::blank(); }

// Expects invalid_input at `position` with a message containing `words`.
void expect_bad(std::vector<entry> s, std::vector<entry> n, std::size_t position, const std::string& words) {
    try {
        counts::from_entries(s, n);
        FAIL() << "no error; expected: " << words;
    } catch (const invalid_input& e) {
        EXPECT_EQ(e.position(), position) << e.what();
        EXPECT_NE(std::string(e.what()).find(words), std::string::npos) << e.what();
    }
}
}  // namespace

TEST(Counts, BlankRowsAreSkippedButKeepTheirPositions) {
    // "A row where both cells are blank is skipped"; "position 3 is always the third row".
    const auto c = counts::from_entries(std::vector{num(3), blank(), num(5), blank()},
                                        std::vector{num(10), blank(), num(8), blank()});
    ASSERT_EQ(c.groups().size(), 2u);
    EXPECT_EQ(c.groups()[1].position, 3u);
    EXPECT_EQ(c.range_size(), 4u);
    EXPECT_EQ(c.total_successes(), 8);
    EXPECT_EQ(c.total_attempts(), 18);
    EXPECT_EQ(c.at_position(3, "i").successes, 5);
}

TEST(Counts, PositionsOutsideOrBlankAreErrors) {
    const auto c = counts::from_entries(std::vector{num(3), blank()}, std::vector{num(10), blank()});
    EXPECT_THROW(c.at_position(2, "i"), invalid_input);  // blank row
    EXPECT_THROW(c.at_position(3, "i"), invalid_input);  // outside
    EXPECT_THROW(c.at_position(0, "i"), invalid_input);
    EXPECT_THROW(c.at_position(1.5, "i"), invalid_input);
    EXPECT_THROW(c.at_position(NAN, "i"), invalid_input);
}

TEST(Counts, EachBadCellNamesItsPositionAndReason) {
    expect_bad({num(1), num(2)}, {num(5), blank()}, 2, "attempts is blank but successes is filled");
    expect_bad({blank(), num(2)}, {num(5), num(4)}, 1, "successes is blank but attempts is filled");
    expect_bad({num(1), entry::text()}, {num(5), num(4)}, 2, "holds text");
    expect_bad({num(1), num(2)}, {entry::boolean(), num(4)}, 1, "logical value");
    expect_bad({num(-1)}, {num(5)}, 1, "negative");
    expect_bad({num(1.5)}, {num(5)}, 1, "not a whole number");
    expect_bad({num(7)}, {num(5)}, 1, "successes (7) exceed attempts (5)");
    expect_bad({num(NAN)}, {num(5)}, 1, "not a finite number");
    expect_bad({num(1)}, {num(INFINITY)}, 1, "not a finite number");
    expect_bad({num(1)}, {num(1e300)}, 1, "largest count");
    expect_bad({num(1)}, {num(2), num(3)}, 0, "same size");
}

TEST(Counts, AttemptsZeroIsAllowedInARow) {
    // "Attempts = 0 in a non-blank row is allowed (a group with no data yet)".
    const auto c = counts::from_entries(std::vector{num(0), num(2)}, std::vector{num(0), num(4)});
    EXPECT_EQ(c.groups().size(), 2u);
    EXPECT_EQ(c.with_attempts().size(), 1u);
}

TEST(Check, SaysOkWithTheFigures) {
    const std::vector s{num(45), num(171), num(12)}, n{num(50), num(190), num(12)};
    const auto text = check_text(s, n);
    EXPECT_EQ(text.rfind("ok: 3 groups, 252 attempts in all", 0), 0u) << text;
    // Expected failures of the third group: 12 x 24 / 252 = 1.142857 (arithmetic).
    EXPECT_NE(text.find("the smallest expected count is 1.14, failures at position 3;"), std::string::npos) << text;
    EXPECT_NE(text.find("below 5"), std::string::npos) << text;
    EXPECT_NE(text.find("uses the exact conditional test"), std::string::npos) << text;
}

TEST(Check, NamesTheFirstProblem) {
    const std::vector s{num(4), num(9), num(3)}, n{num(10), num(8), num(2)};
    EXPECT_EQ(check_text(s, n), "problem: Position 2 of the range: successes (9) exceed attempts (8).");
}

TEST(Check, LabelsNameTheGroup) {
    const std::vector s{num(45), num(171), num(12)}, n{num(50), num(190), num(12)};
    const std::vector<std::string> labels{"Oven A", "Oven B", "Pilot oven"};
    EXPECT_NE(check_text(s, n, labels).find("failures at position 3, Pilot oven;"), std::string::npos);
    const std::vector bad{num(45), num(171), num(13)};
    EXPECT_EQ(check_text(bad, n, labels),
              "problem: Position 3 of the range, Pilot oven: successes (13) exceed attempts (12).");
    const std::vector<std::string> short_labels{"Oven A"};
    EXPECT_EQ(check_text(s, n, short_labels).rfind("problem: The labels range has 1 cells", 0), 0u);
}

TEST(Check, LargeExpectedCountsNeedNoCaution) {
    const std::vector s{num(400), num(420)}, n{num(1000), num(1000)};
    const auto text = check_text(s, n);
    EXPECT_NE(text.find("every expected count is at least 5, so method \"auto\" uses the chi-square"), std::string::npos) << text;
}
