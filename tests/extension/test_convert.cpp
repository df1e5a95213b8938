// The cell converter against the way Calc passes values (addin-recipe.md,
// "How Calc passes arguments"): blank cells as empty strings, numbers and
// booleans, text, omitted arguments as VOID, one-cell ranges as 1 x 1.
#include <gtest/gtest.h>

#include <cmath>

#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <rtl/ustring.hxx>

#include <boost/math/policies/error_handling.hpp>
#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/sheet/NoConvergenceException.hpp>
#include <com/sun/star/uno/RuntimeException.hpp>

#include "convert.hpp"
#include "guard.hpp"
#include "omnibus/keywords.hpp"
#include "tallyrates/core/errors.hpp"

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
    EXPECT_FALSE(convert::number(Any(), "level"));
    EXPECT_EQ(convert::number(Any(0.9), "level"), 0.9);
    EXPECT_EQ(convert::number(as_any(column({Any(0.8)})), "level"), 0.8);  // a one-cell range
    EXPECT_FALSE(convert::number(as_any(column({text("")})), "level"));    // an empty one
    EXPECT_THROW(convert::number(text("high"), "level"), invalid_input);
    EXPECT_THROW(convert::number(as_any(column({Any(1.0), Any(2.0)})), "level"), invalid_input);

    // The engine's rule applied to what the converter read.
    auto draws = [](const Any& a) { return arguments::whole_or(convert::number(a, "draws"), 5, 1, 100, "draws"); };
    EXPECT_EQ(draws(Any()), 5);
    EXPECT_EQ(draws(Any(40.0)), 40);
    EXPECT_THROW(draws(Any(2.5)), invalid_input);
    EXPECT_THROW(draws(Any(0.0)), invalid_input);
    EXPECT_THROW(draws(Any(1e15)), budget_exceeded);

    auto method = [](const Any& a) {
        return arguments::keyword_or(convert::word(a, "method"), omnibus::method::automatic, keywords::omnibus_method,
                                     "method");
    };
    EXPECT_EQ(method(Any()), omnibus::method::automatic);
    EXPECT_EQ(method(text("EXACT")), omnibus::method::exact);
    EXPECT_EQ(method(as_any(column({text("lr")}))), omnibus::method::lr);
    EXPECT_THROW(method(Any(1.0)), invalid_input);
    EXPECT_TRUE(convert::optional_range(Any(), "scores").empty());
    EXPECT_EQ(convert::optional_range(as_any(column({Any(1.0), Any(4.0)})), "scores").size(), 2u);
}

// The error mapping (guard.hpp): what each kind of failure becomes in a cell.
TEST(Guard, EngineAndBoostErrorsBecomeCalcErrors) {
    auto fails_with = [](auto thrower) {
        return uno::guarded([&]() -> double {
            thrower();
            return 0;
        });
    };
    EXPECT_THROW(fails_with([] { throw invalid_input("bad"); }), css::lang::IllegalArgumentException);
    EXPECT_THROW(fails_with([] { throw budget_exceeded("cap"); }), css::sheet::NoConvergenceException);
    // Boost.Math's evaluation_error derives from std::runtime_error, yet it is
    // a numerical failure (Err:523), not an internal error (#VALUE!).
    EXPECT_THROW(fails_with([] { throw boost::math::evaluation_error("series did not converge"); }),
                 css::sheet::NoConvergenceException);
    EXPECT_THROW(fails_with([] { throw std::domain_error("x is nan"); }), css::sheet::NoConvergenceException);
    EXPECT_THROW(fails_with([] { throw std::overflow_error("too big"); }), css::sheet::NoConvergenceException);
    EXPECT_THROW(fails_with([] { throw std::bad_alloc(); }), css::sheet::NoConvergenceException);
    EXPECT_THROW(fails_with([] { throw std::logic_error("bug"); }), css::uno::RuntimeException);
    EXPECT_THROW(uno::finite(NAN), no_convergence);
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
            arguments::whole_or(convert::number(whole, "draws"), 5, 1, 1e7, "draws");
        } catch (const invalid_input&) {
        } catch (const budget_exceeded&) {
        }
        try {
            arguments::keyword_or(convert::word(whole, "method"), omnibus::method::automatic, keywords::omnibus_method,
                                  "method");
        } catch (const invalid_input&) {
        }
        try {
            convert::optional_range(whole, "scores");
        } catch (const invalid_input&) {
        }
    }
    SUCCEED();
}
