// fuzz_cells.cpp - libFuzzer target for the cell converter (extension/
// convert.cpp): every kind of value UNO can hand an argument (nothing, a
// number, text in any bytes, a boolean, a whole number, a range of any shape,
// ragged or nested), through every reader of the converter, then as count
// ranges through the tally's rules and RATES.CHECK's sentence. Reading the
// cells of a sheet (XCellRange) needs Calc itself: the hostile-cell matrix of
// tests/office drives that part through LibreOffice.
#include <rtl/ustring.hxx>

#include "convert.hpp"
#include "input.hpp"
#include "tallyrates/omnibus/check.hpp"

using namespace tallyrates;
using css::uno::Any;
using css::uno::Sequence;

namespace {

Any value(fuzz::input& in, int depth);

convert::range block(fuzz::input& in, int depth) {
    const auto rows = static_cast<sal_Int32>(in.below(5));
    convert::range r(rows);
    for (sal_Int32 k = 0; k < rows; ++k) {
        // Calc sends rows of one length; other callers need not.
        Sequence<Any> row(static_cast<sal_Int32>(in.below(5)));
        for (sal_Int32 col = 0; col < row.getLength(); ++col) row.getArray()[col] = value(in, depth + 1);
        r.getArray()[k] = row;
    }
    return r;
}

Any value(fuzz::input& in, int depth) {
    switch (in.byte() % 8) {
    case 0: return Any();
    case 1: return Any(rtl::OUString());
    case 2: {
        const std::string bytes = in.text(16);
        return Any(rtl::OUString(bytes.data(), static_cast<sal_Int32>(bytes.size()), RTL_TEXTENCODING_UTF8));
    }
    case 3: return Any(in.flip());
    case 4: return Any(static_cast<sal_Int32>(in.two_bytes()) - 32768);
    case 5: return depth < 2 ? Any(block(in, depth)) : Any();
    default: return Any(in.number());
    }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    fuzz::input in(data, size);
    fuzz::as_a_cell([&] {
        const Any a = value(in, 0);
        convert::cell_entry(a);
        fuzz::as_a_cell([&] { return convert::number(a, "level").value_or(0.0); });
        fuzz::as_a_cell([&] { return convert::word(a, "method").value_or("").size(); });
        fuzz::as_a_cell([&] { return convert::switch_value(a, "correction").number.value_or(0.0); });
        fuzz::as_a_cell([&] { return convert::optional_range(a, "scores").size(); });
        fuzz::as_a_cell([&] { return convert::optional_texts(a, "labels").size(); });
        // Two ranges as the count arguments, then the tally's rules.
        const auto s = convert::range_entries(block(in, 0), "successes");
        const auto n = convert::range_entries(block(in, 0), "attempts");
        std::vector<std::string> labels;
        if (in.flip()) labels = convert::optional_texts(Any(block(in, 0)), "labels");
        if (check_text(s, n, labels).empty()) __builtin_trap();
        const auto c = counts::from_entries(s, n, labels);
        std::vector<std::optional<double>> along(c.range_size());
        convert::along_the_counts(along, in.flip());
        return 0.0;
    });
    return 0;
}
