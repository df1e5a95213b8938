// apart/functions.cpp - the worksheet methods of the apart family: each
// group's decision limits around the whole, and the table of every group.
// Each converts its arguments, calls the engine and returns, inside
// `guarded`.
#include "../addin.hpp"
#include "../guard.hpp"
#include "keywords.hpp"
#include "tallyrates/apart/limits.hpp"
#include "tallyrates/apart/prior_fit.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::uno {

namespace {

apart::options options_of(const Any& level, const Any& family, const Any& target, const Any& method,
                          const Any& spread) {
    apart::options o;
    o.level = convert::number(level, "level").value_or(arguments::default_level);
    o.together = arguments::keyword_or(convert::word(family, "family"), o.together, keywords::apart_family, "family");
    o.target = convert::number(target, "target");
    o.how = arguments::keyword_or(convert::word(method, "method"), o.how, keywords::apart_method, "method");
    o.variation = arguments::keyword_or(convert::word(spread, "spread"), o.variation, keywords::apart_spread, "spread");
    return o;
}

interval limits_of(const caller& document, const cells& successes, const cells& attempts, double i,
                   const apart::options& o) {
    const auto c = convert::counts_of(document, successes, attempts);
    const group& g = c.with_attempts_at(i, "i");
    const auto res = apart::limits(c, o);
    for (const auto& row : res.rows)
        if (row.position == g.position) return row.limits;
    return {};
}

}  // namespace

double rates::apartLow(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& level, const Any& family, const Any& target, const Any& method, const Any& spread) {
    return guarded([&] {
        return finite(limits_of(document, successes, attempts, i, options_of(level, family, target, method, spread)).low);
    });
}

double rates::apartHigh(const caller& document, const cells& successes, const cells& attempts, double i,
                        const Any& level, const Any& family, const Any& target, const Any& method, const Any& spread) {
    return guarded([&] {
        return finite(
            limits_of(document, successes, attempts, i, options_of(level, family, target, method, spread)).high);
    });
}

array rates::apart(const caller& document, const cells& successes, const cells& attempts, const Any& level,
                   const Any& family, const Any& target, const Any& method, const Any& spread, const Any& labels) {
    return guarded([&] {
        std::vector<std::vector<Any>> rows;
        try {
            const auto o = options_of(level, family, target, method, spread);
            const auto names = convert::optional_texts(labels, "labels");
            const auto c = convert::counts_of(document, successes, attempts, names);
            const auto table = apart::table(c, o);
            for (const auto& line : table) {
                rows.emplace_back();
                for (const auto& cell : line) {
                    if (std::holds_alternative<double>(cell)) rows.back().push_back(Any(finite(std::get<double>(cell))));
                    else rows.back().push_back(Any(ou(std::get<std::string>(cell))));
                }
            }
            // Blank rows up to the height the wizard text asks for (the range
            // plus 3), so that such a selection shows blanks, not #N/A.
            while (rows.size() < c.range_size() + 3)
                rows.emplace_back(apart::table_columns, Any(OUString()));
        } catch (const invalid_input& e) {
            rows = {{Any(ou(problem_text(e.what())))}};
        }
        return convert::rows_to_array(rows);
    });
}

array rates::apartCurve(const caller& document, const cells& successes, const cells& attempts, const Any& level,
                        const Any& target, const Any& sizes) {
    return guarded([&] {
        const double lv = convert::number(level, "level").value_or(arguments::default_level);
        const auto goal_rate = convert::number(target, "target");
        const auto count = arguments::whole_or(convert::number(sizes, "sizes"), apart::default_curve_points,
                                               static_cast<double>(apart::min_curve_points),
                                               static_cast<double>(apart::max_curve_points), "sizes");
        const auto c = convert::counts_of(document, successes, attempts);
        const auto lines = apart::funnel(c, lv, goal_rate, count);
        std::vector<std::vector<Any>> rows{convert::texts_to_row(apart::funnel_header(lv, goal_rate))};
        for (const auto& line : lines) rows.push_back({Any(line[0]), Any(finite(line[1])), Any(finite(line[2]))});
        return convert::rows_to_array(rows);
    });
}

double rates::priorFit(const caller& document, const cells& successes, const cells& attempts, const Any& part) {
    return guarded([&] {
        const auto which = arguments::keyword(convert::word(part, "part").value_or(""), keywords::prior_part_word, "part");
        const auto fit = apart::fit_prior(convert::counts_of(document, successes, attempts));
        return finite(which == keywords::prior_part::a ? fit.prior.a : fit.prior.b);
    });
}

}  // namespace tallyrates::uno
