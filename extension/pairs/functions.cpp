// pairs/functions.cpp - the worksheet methods of the pairs family:
// comparisons of two groups, the table of every pair, and intervals for one
// group. Each converts its arguments, calls the engine and returns, inside
// `guarded`.
#include "../addin.hpp"
#include "../guard.hpp"
#include "keywords.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/pairs/margin.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::uno {

namespace {

double level_of(const Any& level) {
    return arguments::level(convert::number(level, "level").value_or(arguments::default_level), "level");
}

pairwise::interval_options interval_options(const Any& level, const Any& method, const Any& adjust,
                                            const Any& family, const Any& sides) {
    pairwise::interval_options o;
    o.level = convert::number(level, "level").value_or(arguments::default_level);
    o.side = keywords::sides_or_default(convert::word(sides, "sides"));
    o.how = arguments::keyword_or(convert::word(method, "method"), o.how, keywords::difference_method, "method");
    o.adjust = arguments::keyword_or(convert::word(adjust, "adjust"), o.adjust, keywords::simultaneous, "adjust");
    o.comparisons = arguments::keyword_or(convert::word(family, "family"), o.comparisons, keywords::family, "family");
    return o;
}

// Header, one row per pair, then blank rows up to one per pair of rows of
// the range (at most 2,000 rows), so that a selection made for the range
// shows blanks rather than #N/A below the table.
array pairs_array(const counts& c, const std::vector<pairwise::pair_row>& rows, const pairwise::table_options& o,
                  std::string_view adjust_word) {
    constexpr auto width = static_cast<sal_Int32>(pairwise::pairs_columns);
    const std::size_t r = c.range_size();
    const std::size_t height = std::max(rows.size() + 1, std::min<std::size_t>(r * (r - 1) / 2 + 1, 2000));
    array out(static_cast<sal_Int32>(height));
    auto name = [&](std::size_t pos) {
        const std::string label = c.label_of(pos);
        return label.empty() ? Any(static_cast<double>(pos)) : Any(ou(label));
    };
    css::uno::Sequence<Any> header(width);
    const auto titles = pairwise::pairs_header(o, rows.size(), adjust_word);
    for (sal_Int32 col = 0; col < width; ++col) header.getArray()[col] <<= ou(titles[static_cast<std::size_t>(col)]);
    out.getArray()[0] = header;
    for (std::size_t k = 0; k < height - 1; ++k) {
        css::uno::Sequence<Any> line(width);
        if (k < rows.size()) {
            const auto& p = rows[k];
            const Any cells[pairwise::pairs_columns] = {
                name(p.i),          name(p.j),    Any(finite(p.difference)),    Any(finite(p.bounds.low)),
                Any(finite(p.bounds.high)), Any(finite(p.p)), Any(finite(p.p_adjusted)),
                Any(ou(pairwise::verdict(c, p, o.better)))};
            line = css::uno::Sequence<Any>(cells, width);
        } else {
            for (sal_Int32 col = 0; col < width; ++col) line.getArray()[col] <<= OUString();
        }
        out.getArray()[static_cast<sal_Int32>(k + 1)] = line;
    }
    return out;
}

// A problem with the input, in the first cell of the table.
array problem_array(const std::string& problem) {
    array out(1);
    const Any cell(ou(problem_text(problem)));
    out.getArray()[0] = css::uno::Sequence<Any>(&cell, 1);
    return out;
}

}  // namespace

double rates::diff(const caller& document, const cells& successes, const cells& attempts, double i, double j) {
    return guarded([&] {
        const auto c = convert::counts_of(document, successes, attempts);
        const auto [a, b] = pairwise::pair_at(c, i, j);
        return finite(pairwise::difference(a, b));
    });
}

namespace {

interval difference_bounds(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                           const Any& level, const Any& method, const Any& adjust, const Any& family,
                           const Any& sides) {
    const auto o = interval_options(level, method, adjust, family, sides);
    const auto c = convert::counts_of(document, successes, attempts);
    const auto [a, b] = pairwise::pair_at(c, i, j);
    return pairwise::difference_interval(c, a, b, o);
}

}  // namespace

double rates::diffLow(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                      const Any& level, const Any& method, const Any& adjust, const Any& family,
                      const Any& sides) {
    return guarded([&] {
        return finite(difference_bounds(document, successes, attempts, i, j, level, method, adjust, family, sides).low);
    });
}

double rates::diffHigh(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                       const Any& level, const Any& method, const Any& adjust, const Any& family,
                       const Any& sides) {
    return guarded([&] {
        return finite(difference_bounds(document, successes, attempts, i, j, level, method, adjust, family, sides).high);
    });
}

double rates::pairP(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                    const Any& adjust, const Any& method, const Any& family) {
    return guarded([&] {
        pairwise::test_options o;
        o.adjust = arguments::keyword_or(convert::word(adjust, "adjust"), o.adjust, keywords::p_adjust, "adjust");
        o.how = arguments::keyword_or(convert::word(method, "method"), o.how, keywords::pair_test, "method");
        o.comparisons = arguments::keyword_or(convert::word(family, "family"), o.comparisons, keywords::family, "family");
        const auto c = convert::counts_of(document, successes, attempts);
        const auto [a, b] = pairwise::pair_at(c, i, j);
        return finite(pairwise::same_rate_p(c, a, b, o, &pairs_cache_));
    });
}

array rates::pairs(const caller& document, const cells& successes, const cells& attempts, const Any& level,
                   const Any& method, const Any& adjust, const Any& goal, const Any& labels) {
    return guarded([&] {
        try {
            pairwise::table_options o;
            o.level = level_of(level);
            o.how = arguments::keyword_or(convert::word(method, "method"), o.how, keywords::difference_method, "method");
            const auto both = arguments::keyword_or(convert::word(adjust, "adjust"), std::pair{o.intervals, o.p},
                                                    keywords::pairs_adjust, "adjust");
            std::tie(o.intervals, o.p) = both;
            o.better = keywords::goal_or_default(convert::word(goal, "goal"));
            const auto names = convert::optional_texts(labels, "labels");
            const auto c = convert::counts_of(document, successes, attempts, names);
            return pairs_array(c, pairwise::pairs_table(c, o, &pairs_cache_), o,
                               arguments::text_of(both, keywords::pairs_adjust));
        } catch (const invalid_input& e) {
            return problem_array(e.what());
        }
    });
}

double rates::marginP(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                      double margin, const Any& claim, const Any& goal) {
    return guarded([&] {
        const auto what = arguments::keyword_or(convert::word(claim, "claim"), pairwise::default_claim, keywords::claim,
                                                "claim");
        const auto better = keywords::goal_or_default(convert::word(goal, "goal"));
        const auto c = convert::counts_of(document, successes, attempts);
        const auto [a, b] = pairwise::pair_at(c, i, j);
        return finite(pairwise::margin_p(a, b, margin, what, better));
    });
}

namespace {

interval one_bounds(const caller& document, const cells& successes, const cells& attempts, double i, const Any& level,
                    const Any& method, const Any& sides) {
    const double lv = convert::number(level, "level").value_or(arguments::default_level);
    const auto how = keywords::one_rate_method_or_wilson(convert::word(method, "method"));
    const auto side = keywords::sides_or_default(convert::word(sides, "sides"));
    const auto c = convert::counts_of(document, successes, attempts);
    return one_rate::bounds(c.with_attempts_at(i, "i"), lv, how, side);
}

}  // namespace

double rates::oneLow(const caller& document, const cells& successes, const cells& attempts, double i,
                     const Any& level, const Any& method, const Any& sides) {
    return guarded([&] { return finite(one_bounds(document, successes, attempts, i, level, method, sides).low); });
}

double rates::oneHigh(const caller& document, const cells& successes, const cells& attempts, double i,
                      const Any& level, const Any& method, const Any& sides) {
    return guarded([&] { return finite(one_bounds(document, successes, attempts, i, level, method, sides).high); });
}

}  // namespace tallyrates::uno
