// The cell converter against the way Calc passes values (addin-recipe.md,
// "How Calc passes arguments"): blank cells as empty strings, numbers and
// booleans, text, omitted arguments as VOID, one-cell ranges as 1 x 1.
#include <gtest/gtest.h>

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
