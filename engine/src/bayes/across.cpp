// across.cpp - BEST, LOSS and TABLE: every group's chance of being the best
// and expected loss from one pass over the rate axis (rate_axis.hpp), through
// the bounded cache; sources in tallyrates/bayes/across.hpp.
#include "tallyrates/bayes/across.hpp"

#include "bayes/law_math.hpp"
#include "bayes/rate_axis.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::bayes {

using namespace detail;

namespace {

// The pass, through the cache when there is one.
across_groups pass(std::span<const beta_law> laws, goal g, across_cache* cache) {
    across_key key{{}, g};
    if (cache) {
        for (const auto& l : laws) key.first.insert(key.first.end(), {l.a, l.b});
        if (auto hit = cache->find(key)) return *hit;
    }
    auto result = detail::compare_all(laws, g, detail::for_probability, detail::answers::every);
    if (cache) cache->put(key, result);
    return result;
}

}  // namespace

across_groups across(std::span<const beta_law> laws, goal g, across_cache* cache) { return pass(laws, g, cache); }

double best(std::span<const beta_law> laws, std::size_t i, goal g, across_cache* cache) {
    check_groups(laws.size(), max_groups_best, "The probability of being the best");
    return pass(laws, g, cache).best.at(i);
}

double loss(std::span<const beta_law> laws, std::size_t i, goal g, across_cache* cache) {
    check_groups(laws.size(), max_groups_best, "The expected loss");
    return pass(laws, g, cache).loss.at(i);
}

std::vector<std::string> summary_header(double level) {
    const std::string pct = format_short(level * 100) + " %";
    return {"group", "expected rate", "credible low (" + pct + ")", "credible high (" + pct + ")", "P(best)",
            "expected loss"};
}

std::vector<summary_row> summary(const counts& c, double level, goal g, prior p, across_cache* cache) {
    const auto laws = posteriors(c, p);
    check_groups(laws.size(), max_groups_table, "The posterior table");
    const auto answers = across(laws, g, cache);  // every row's P(best) and loss: the cells' own pass
    std::vector<summary_row> rows;
    for (std::size_t k = 0; k < laws.size(); ++k)
        rows.push_back({c.groups()[k].position, mean(laws[k]), credible(laws[k], level, kind::central),
                        answers.best[k], answers.loss[k]});
    return rows;
}

}  // namespace tallyrates::bayes
