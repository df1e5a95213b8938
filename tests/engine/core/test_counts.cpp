// Tests of the count-range conventions (functions.md, "Shared conventions").
// The conventions themselves are the reference here: each expectation quotes
// the rule it checks.
#include <gtest/gtest.h>

#include <cmath>

#include "tallyrates/omnibus/check.hpp"
#include "tallyrates/core/counts.hpp"
#include "tallyrates/core/errors.hpp"
#include "support.hpp"

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

void expect_bad_lines(const cell_line& s, const cell_line& n, const std::string& words) {
    TALLYRATES_EXPECT_THROW_SAYING(counts::from_entries(s, n), invalid_input, words);
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

TEST(Counts, AWholeColumnIsReadOnlyToItsLastFilledRow) {
    // A line read partly (convert.hpp: a whole column B:B is read down to its
    // last filled row): the unread rest is blank, positions keep counting to
    // the end of the range, and two lines of equal length may be read to
    // different depths.
    const cell_line s({entry::text(), num(3), num(5)}, 1048576);
    const cell_line n({entry::text(), num(10), num(8), blank()}, 1048576);
    const auto c = counts::from_entries(s, n);
    ASSERT_EQ(c.groups().size(), 2u);
    EXPECT_EQ(c.range_size(), 1048576u);
    EXPECT_EQ(c.groups()[1].position, 3u);
    // A position in the unread blank rest is a blank row, not outside the range.
    try {
        (void)c.at_position(5000, "i");
        FAIL();
    } catch (const invalid_input& e) {
        EXPECT_NE(std::string(e.what()).find("a blank row"), std::string::npos) << e.what();
    }
    // Lengths are what must agree, not how far each was read.
    expect_bad_lines(cell_line({num(1)}, 9), cell_line({num(2)}, 8), "the attempts range 8");
}

TEST(Counts, HeadingsAboveTheCountsAreSkippedTextBelowIsNot) {
    // Column headings in the first row of a whole column ("Passed", "Made")
    // are not counts (functions.md: text in a count cell is refused, except a
    // heading row above the first counts, our convention for whole columns).
    const auto c = counts::from_entries(std::vector{entry::text(), num(3)}, std::vector{entry::text(), num(10)});
    EXPECT_EQ(c.groups().size(), 1u);
    expect_bad({num(3), entry::text()}, {num(10), entry::text()}, 2, "holds text");
    expect_bad({entry::text(), num(3)}, {num(4), num(10)}, 1, "holds text");
}

TEST(Counts, ACellShowingAnErrorIsNamed) {
    // Even beside a blank cell, the error value is the problem reported.
    expect_bad({num(3), entry::error()}, {num(10), blank()}, 2, "the successes cell shows an error value");
    expect_bad({num(3), blank()}, {num(10), entry::error()}, 2, "the attempts cell shows an error value");
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
