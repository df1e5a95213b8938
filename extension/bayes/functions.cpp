// bayes/functions.cpp - the worksheet methods of the Bayesian family
// (RATES.POST.*). Each converts its arguments, calls the engine and returns,
// inside `guarded`.
#include "../addin.hpp"
#include "../guard.hpp"
#include "keywords.hpp"
#include "prior.hpp"
#include "tallyrates/bayes/across.hpp"
#include "tallyrates/bayes/alike.hpp"
#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::uno {

namespace {

bayes::beta_law law_of(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& prior_a, const Any& prior_b) {
    const auto c = convert::counts_of(document, successes, attempts);
    return bayes::posterior(c.at_position(i, "i"), prior_of(prior_a, prior_b));
}

interval credible_of(const caller& document, const cells& successes, const cells& attempts, double i,
                     const Any& level, const Any& kind, const Any& prior_a, const Any& prior_b) {
    const auto law = law_of(document, successes, attempts, i, prior_a, prior_b);
    const auto how = arguments::keyword_or(convert::word(kind, "kind"), bayes::default_kind, keywords::credible_kind,
                                           "kind");
    return bayes::credible(law, convert::number(level, "level").value_or(arguments::default_level), how);
}

// The posteriors of the groups at positions i and j, which must differ.
std::pair<bayes::beta_law, bayes::beta_law> two_laws(const caller& document, const cells& successes,
                                                     const cells& attempts, double i, double j, const Any& prior_a,
                                                     const Any& prior_b) {
    const auto c = convert::counts_of(document, successes, attempts);
    const auto p = prior_of(prior_a, prior_b);
    const group& a = c.at_position(i, "i");
    const group& b = c.at_position(j, "j");
    pairwise::distinct(a, b);
    return {bayes::posterior(a, p), bayes::posterior(b, p)};
}

bayes::goal goal_of(const Any& goal) {
    return keywords::goal_or_default(convert::word(goal, "goal"));
}

}  // namespace

double rates::postMean(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& prior_a, const Any& prior_b) {
    return guarded([&] { return finite(bayes::mean(law_of(document, successes, attempts, i, prior_a, prior_b))); });
}

double rates::postLow(const caller& document, const cells& successes, const cells& attempts, double i,
                      const Any& level, const Any& kind, const Any& prior_a, const Any& prior_b) {
    return guarded(
        [&] { return finite(credible_of(document, successes, attempts, i, level, kind, prior_a, prior_b).low); });
}

double rates::postHigh(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& level, const Any& kind, const Any& prior_a, const Any& prior_b) {
    return guarded(
        [&] { return finite(credible_of(document, successes, attempts, i, level, kind, prior_a, prior_b).high); });
}

double rates::postAbove(const caller& document, const cells& successes, const cells& attempts, double i, double rate,
                        const Any& goal, const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        return finite(bayes::above(law_of(document, successes, attempts, i, prior_a, prior_b), rate, goal_of(goal)));
    });
}

double rates::postNext(const caller& document, const cells& successes, const cells& attempts, double i, double m,
                       const Any& k, const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto further = arguments::whole(m, 0, 1e15, "m");
        const auto needed = arguments::whole_or(convert::number(k, "k"), further, 0, 1e15, "k");
        return finite(bayes::next_at_least(law_of(document, successes, attempts, i, prior_a, prior_b), further, needed));
    });
}

double rates::postAhead(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                        const Any& goal, const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto better = goal_of(goal);
        const auto [x, y] = two_laws(document, successes, attempts, i, j, prior_a, prior_b);
        return finite(bayes::ahead(x, y, better));
    });
}

namespace {

interval difference_of(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                       const Any& level, const Any& prior_a, const Any& prior_b) {
    const auto [x, y] = two_laws(document, successes, attempts, i, j, prior_a, prior_b);
    return bayes::difference(x, y, convert::number(level, "level").value_or(arguments::default_level));
}

}  // namespace

double rates::postDiffLow(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                          const Any& level, const Any& prior_a, const Any& prior_b) {
    return guarded(
        [&] { return finite(difference_of(document, successes, attempts, i, j, level, prior_a, prior_b).low); });
}

double rates::postDiffHigh(const caller& document, const cells& successes, const cells& attempts, double i, double j,
                           const Any& level, const Any& prior_a, const Any& prior_b) {
    return guarded(
        [&] { return finite(difference_of(document, successes, attempts, i, j, level, prior_a, prior_b).high); });
}

array rates::postOrder(const caller& document, const cells& successes, const cells& attempts, const Any& goal,
                       const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto better = goal_of(goal);
        const auto laws = bayes::posteriors(convert::counts_of(document, successes, attempts), prior_of(prior_a, prior_b));
        const auto cells = bayes::order(laws, better);
        std::vector<std::vector<Any>> rows;
        for (std::size_t r = 0; r < cells.size(); ++r) {
            rows.emplace_back();
            for (std::size_t col = 0; col < cells.size(); ++col)
                rows.back().push_back(r == col ? Any(OUString()) : Any(finite(cells[r][col])));
        }
        return convert::rows_to_array(rows);
    });
}

namespace {

// Every group's law and the index of the one at position i among them.
std::pair<std::vector<bayes::beta_law>, std::size_t> laws_and_index(const caller& document, const cells& successes,
                                                                    const cells& attempts, double i,
                                                                    const Any& prior_a, const Any& prior_b) {
    const auto c = convert::counts_of(document, successes, attempts);
    return {bayes::posteriors(c, prior_of(prior_a, prior_b)), c.index_of(c.at_position(i, "i"))};
}

}  // namespace

double rates::postBest(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& goal, const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto [laws, k] = laws_and_index(document, successes, attempts, i, prior_a, prior_b);
        return finite(bayes::best(laws, k, goal_of(goal), &across_cache_));
    });
}

double rates::postLoss(const caller& document, const cells& successes, const cells& attempts, double i,
                       const Any& goal, const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto [laws, k] = laws_and_index(document, successes, attempts, i, prior_a, prior_b);
        return finite(bayes::loss(laws, k, goal_of(goal), &across_cache_));
    });
}

double rates::postSame(const caller& document, const cells& successes, const cells& attempts, const Any& prior_same,
                       const Any& prior_a, const Any& prior_b) {
    return guarded([&] {
        const auto c = convert::counts_of(document, successes, attempts);
        const double odds = convert::number(prior_same, "prior_same").value_or(bayes::default_prior_same);
        return finite(bayes::same(c.groups(), prior_of(prior_a, prior_b), odds));
    });
}

array rates::postCurve(const caller& document, const cells& successes, const cells& attempts, const Any& points,
                       const Any& prior_a, const Any& prior_b, const Any& labels, const Any& span) {
    return guarded([&] {
        const auto names = convert::optional_texts(labels, "labels");
        const auto c = convert::counts_of(document, successes, attempts, names);
        const auto n = arguments::whole_or(convert::number(points, "points"), bayes::default_curve_points,
                                             static_cast<double>(bayes::min_curve_points),
                                             static_cast<double>(bayes::max_curve_points), "points");
        // The header names each column: a chart takes its legend from it.
        std::vector<std::vector<Any>> rows{convert::texts_to_row(bayes::curves_header(c))};
        const auto over = arguments::keyword_or(convert::word(span, "span"), bayes::default_curve_span,
                                                keywords::curve_span, "span");
        for (const auto& values : bayes::curves(c, n, prior_of(prior_a, prior_b), over)) {
            rows.emplace_back();
            for (const auto& v : values) rows.back().push_back(v ? Any(finite(*v)) : Any(OUString()));
        }
        return convert::rows_to_array(rows);
    });
}

array rates::postTable(const caller& document, const cells& successes, const cells& attempts, const Any& level,
                       const Any& goal, const Any& prior_a, const Any& prior_b, const Any& labels) {
    return guarded([&] {
        const auto names = convert::optional_texts(labels, "labels");
        const auto c = convert::counts_of(document, successes, attempts, names);
        const double lv = convert::number(level, "level").value_or(arguments::default_level);
        std::vector<std::vector<Any>> rows{convert::texts_to_row(bayes::summary_header(lv))};
        for (const auto& r : bayes::summary(c, lv, goal_of(goal), prior_of(prior_a, prior_b), &across_cache_)) {
            const std::string label = c.label_of(r.position);
            rows.push_back({label.empty() ? Any(static_cast<double>(r.position)) : Any(ou(label)), Any(finite(r.mean)),
                            Any(finite(r.bounds.low)), Any(finite(r.bounds.high)), Any(finite(r.best)),
                            Any(finite(r.loss))});
        }
        return convert::rows_to_array(rows);
    });
}

}  // namespace tallyrates::uno
