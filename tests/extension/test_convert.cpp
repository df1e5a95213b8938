// The cell converter against the way Calc passes values (addin-recipe.md,
// "How Calc passes arguments"): blank cells as empty strings, numbers and
// booleans, text, omitted arguments as VOID, one-cell ranges as 1 x 1.
#include <gtest/gtest.h>

#include <cmath>

#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <rtl/ustring.hxx>

#include "convert.hpp"
#include "tallyrates/errors.hpp"

using css::uno::Any;
using css::uno::Sequence;
using namespace tallyrates;

namespace {
convert::range column(std::initializer_list<Any> cells) {
    convert::range r(static_cast<sal_Int32>(cells.size()));
    sal_Int32 k = 0;
    for (const Any& c : cells) r.getArray()[k++] = Sequence<Any>(&c, 1);
    return r;
}
Any text(const char* s) { return Any(rtl::OUString::createFromAscii(s)); }
Any as_any(const convert::range& r) { return Any(r); }
}  // namespace

TEST(Convert, CellKinds) {
    EXPECT_EQ(convert::cell_entry(Any()).what, entry::kind::blank);
    EXPECT_EQ(convert::cell_entry(text("")).what, entry::kind::blank);  // how Calc sends an empty cell
    EXPECT_EQ(convert::cell_entry(text("12")).what, entry::kind::text);  // text that looks like a number is text
    EXPECT_EQ(convert::cell_entry(Any(true)).what, entry::kind::boolean);
    const entry e = convert::cell_entry(Any(7.0));
    EXPECT_EQ(e.what, entry::kind::number);
    EXPECT_EQ(e.value, 7.0);
}

TEST(Convert, ColumnsAndRowsButNotBlocks) {
    const auto col = convert::range_entries(column({Any(1.0), text(""), Any(3.0)}), "successes");
    ASSERT_EQ(col.size(), 3u);
    EXPECT_EQ(col[1].what, entry::kind::blank);
    const Any cells[3] = {Any(1.0), Any(2.0), text("x")};
    convert::range row(1);
    row.getArray()[0] = Sequence<Any>(cells, 3);
    const auto r = convert::range_entries(row, "successes");
    ASSERT_EQ(r.size(), 3u);
    EXPECT_EQ(r[2].what, entry::kind::text);
    convert::range block(2);
    block.getArray()[0] = Sequence<Any>(cells, 2);
    block.getArray()[1] = Sequence<Any>(cells, 2);
    EXPECT_THROW(convert::range_entries(block, "successes"), invalid_input);
    EXPECT_TRUE(convert::range_entries(convert::range(), "successes").empty());
}

TEST(Convert, OptionalArguments) {
    EXPECT_EQ(convert::optional_number(Any(), 0.95, "level"), 0.95);
    EXPECT_EQ(convert::optional_number(Any(0.9), 0.95, "level"), 0.9);
    EXPECT_EQ(convert::optional_number(as_any(column({Any(0.8)})), 0.95, "level"), 0.8);  // a one-cell range
    EXPECT_EQ(convert::optional_number(as_any(column({text("")})), 0.95, "level"), 0.95);  // an empty one
    EXPECT_THROW(convert::optional_number(text("high"), 0.95, "level"), invalid_input);
    EXPECT_THROW(convert::optional_number(as_any(column({Any(1.0), Any(2.0)})), 0.95, "level"), invalid_input);

    EXPECT_EQ(convert::optional_whole(Any(), 5, 1, 100, "draws"), 5);
    EXPECT_EQ(convert::optional_whole(Any(40.0), 5, 1, 100, "draws"), 40);
    EXPECT_THROW(convert::optional_whole(Any(2.5), 5, 1, 100, "draws"), invalid_input);
    EXPECT_THROW(convert::optional_whole(Any(0.0), 5, 1, 100, "draws"), invalid_input);
    EXPECT_THROW(convert::optional_whole(Any(1e15), 5, 1, 100, "draws"), budget_exceeded);

    EXPECT_EQ(convert::optional_keyword(Any(), omnibus::method::automatic, keywords::omnibus_method, "method"),
              omnibus::method::automatic);
    EXPECT_EQ(convert::optional_keyword(text("EXACT"), omnibus::method::automatic, keywords::omnibus_method, "method"),
              omnibus::method::exact);
    EXPECT_EQ(convert::optional_keyword(as_any(column({text("lr")})), omnibus::method::automatic, keywords::omnibus_method,
                                        "method"),
              omnibus::method::lr);
    EXPECT_THROW(convert::optional_keyword(Any(1.0), omnibus::method::automatic, keywords::omnibus_method, "method"),
                 invalid_input);
    EXPECT_TRUE(convert::optional_range(Any(), "scores").empty());
    EXPECT_EQ(convert::optional_range(as_any(column({Any(1.0), Any(4.0)})), "scores").size(), 2u);
}

// Robustness sweep over values of every kind Calc could hand us, and some it
// should not (ints, nested sequences, ragged rows): the converter answers or
// throws invalid_input / budget_exceeded, never anything else.
TEST(Convert, RandomValuesNeverEscapeAsOtherErrors) {
    std::uint64_t state = 42;
    auto next = [&] {  // SplitMix64 step, enough for a sweep
        std::uint64_t z = (state += 0x9e3779b97f4a7c15ULL);
        z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
        z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
        return z ^ (z >> 31);
    };
    const double specials[] = {0.0, -0.0, 1.0, -1.0, 0.5, 1e15, 1e300, NAN, INFINITY, -INFINITY, 4503599627370497.0};
    auto scalar = [&]() -> Any {
        switch (next() % 7) {
            case 0: return Any();
            case 1: return Any(specials[next() % 11]);
            case 2: return Any(next() % 2 == 0);
            case 3: return text("");
            case 4: return text("auto");
            case 5: return Any(static_cast<sal_Int32>(next() % 100));
            default: return text("montecarlo ");
        }
    };
    for (int trial = 0; trial < 5000; ++trial) {
        const sal_Int32 rows = static_cast<sal_Int32>(next() % 4);
        convert::range r(rows);
        for (sal_Int32 i = 0; i < rows; ++i) {
            const sal_Int32 cols = static_cast<sal_Int32>(1 + next() % 3);  // may be ragged
            Sequence<Any> row(cols);
            for (sal_Int32 j = 0; j < cols; ++j) row.getArray()[j] = scalar();
            r.getArray()[i] = row;
        }
        const Any whole = (next() % 2) ? Any(r) : scalar();
        try {
            convert::range_entries(r, "successes");
        } catch (const invalid_input&) {
        }
        try {
            convert::optional_number(whole, 0.95, "level");
        } catch (const invalid_input&) {
        }
        try {
            convert::optional_whole(whole, 5, 1, 1e7, "draws");
        } catch (const invalid_input&) {
        } catch (const budget_exceeded&) {
        }
        try {
            convert::optional_keyword(whole, omnibus::method::automatic, keywords::omnibus_method, "method");
        } catch (const invalid_input&) {
        }
        try {
            convert::optional_range(whole, "scores");
        } catch (const invalid_input&) {
        }
    }
    SUCCEED();
}
