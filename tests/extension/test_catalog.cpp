// The catalog against the other places that must agree with it: the IDL
// (method names and argument counts), the engine's defaults and keyword
// tables. Facts checked here are the project's own conventions
// (functions.md); no outside numbers are involved.
#include <gtest/gtest.h>

#include <array>
#include <fstream>
#include <map>
#include <regex>
#include <set>
#include <sstream>

#include "apart/keywords.hpp"
#include "bayes/keywords.hpp"
#include "catalog.hpp"
#include "omnibus/keywords.hpp"
#include "pairs/keywords.hpp"
#include "planning/keywords.hpp"
#include "tallyrates/bayes/across.hpp"
#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/bayes/alike.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/planning/planning.hpp"

using namespace tallyrates;

TEST(Catalog, EveryFunctionAndArgumentIsDescribed) {
    std::set<std::string_view> programmatic, display;
    for (const auto& f : catalog::functions()) {
        EXPECT_TRUE(f.display.starts_with("RATES.")) << f.display;
        EXPECT_GT(f.description.size(), 20u) << f.display;
        EXPECT_TRUE(programmatic.insert(f.programmatic).second) << "duplicate " << f.programmatic;
        EXPECT_TRUE(display.insert(f.display).second) << "duplicate " << f.display;
        for (const auto& a : f.arguments) {
            EXPECT_FALSE(a.name.empty());
            EXPECT_GT(a.description.size(), 10u) << f.display << " " << a.name;
        }
        EXPECT_EQ(catalog::by_display(f.display), &f);
        EXPECT_EQ(catalog::by_programmatic(f.programmatic), &f);
    }
    // Display names are matched without regard to case (Calc shows them upper case).
    EXPECT_NE(catalog::by_display("rates.same.p"), nullptr);
}

TEST(Catalog, MatchesTheIdl) {
    std::ifstream in(TALLYRATES_IDL);
    std::stringstream text;
    text << in.rdbuf();
    const std::string idl = text.str();
    // "type name([in] ..., [in] ...)" for each method.
    const std::regex method(R"((\w+)\s*\(([^)]*)\)\s*raises)");
    std::size_t found = 0;
    for (auto it = std::sregex_iterator(idl.begin(), idl.end(), method); it != std::sregex_iterator(); ++it) {
        const std::string name = (*it)[1];
        const std::string params = (*it)[2];
        const auto* f = catalog::by_programmatic(name);
        ASSERT_NE(f, nullptr) << "IDL method " << name << " has no catalog entry";
        std::size_t count = 0;
        for (std::size_t pos = 0; (pos = params.find("[in]", pos)) != std::string::npos; ++pos) ++count;
        // The first parameter is the calling document, which Calc fills in and
        // the wizard does not show (addin-recipe.md).
        EXPECT_EQ(params.find("[in] com::sun::star::beans::XPropertySet document"), 0u) << name;
        EXPECT_EQ(count - 1, f->arguments.size()) << name;
        // One rule for count ranges in every family: Calc's range object
        // (DEVELOPERS.md, "How range arguments reach us").
        for (const char* range : {"successes", "attempts"}) {
            if (params.find(std::string(" ") + range) == std::string::npos) continue;
            EXPECT_NE(params.find(std::string("com::sun::star::table::XCellRange ") + range), std::string::npos)
                << name << " " << range;
        }
        ++found;
    }
    EXPECT_EQ(found, catalog::functions().size());
}

namespace {

template <class E, std::size_t K>
std::string quoted(E value, const std::array<arguments::word<E>, K>& words) {
    return "\"" + std::string(arguments::text_of(value, words)) + "\"";
}

}  // namespace

// Every optional argument of every function shows the engine's own default:
// numbers are read from the engine's constants (checked here to be the ones
// the functions use), keywords are the text of the engine's default choice,
// and the rest are notes (a missing range, "m: every one"). An optional
// argument this table does not know fails the test, so a new default cannot
// slip past it.
TEST(Catalog, EveryDefaultIsTheEngines) {
    const std::map<std::string, double> numbers{
        {"level", arguments::default_level},
        {"power", planning::default_power},
        {"alpha", planning::default_alpha},
        {"failures", static_cast<double>(planning::default_failures)},
        {"ratio", planning::default_ratio},
        {"points", static_cast<double>(bayes::default_curve_points)},
        {"prior_same", bayes::default_prior_same},
        {"prior_a", bayes::prior{}.a},
        {"prior_b", bayes::prior{}.b},
        {"draws", static_cast<double>(omnibus::options{}.draws)},
        {"seed", static_cast<double>(omnibus::options{}.seed)},
        {"sizes", static_cast<double>(apart::default_curve_points)}};
    const pairwise::interval_options interval;
    const pairwise::test_options test;
    const pairwise::table_options table;
    const std::string automatic = quoted(omnibus::options{}.how, keywords::omnibus_method);
    std::map<std::pair<std::string, std::string>, std::string> words{
        {{"check", "method"}, automatic},
        {{"sameP", "method"}, automatic},
        {{"sameReport", "method"}, automatic},
        {{"sameStat", "statistic"}, quoted(omnibus::default_statistic, keywords::statistic)},
        {{"trendP", "variance"}, quoted(trend::default_variance, keywords::trend_variance)},
        {{"trendZ", "variance"}, quoted(trend::default_variance, keywords::trend_variance)},
        {{"diffLow", "method"}, quoted(interval.how, keywords::difference_method)},
        {{"diffHigh", "method"}, quoted(interval.how, keywords::difference_method)},
        {{"diffLow", "adjust"}, quoted(interval.adjust, keywords::simultaneous)},
        {{"diffHigh", "adjust"}, quoted(interval.adjust, keywords::simultaneous)},
        {{"diffLow", "family"}, quoted(interval.comparisons, keywords::family)},
        {{"diffHigh", "family"}, quoted(interval.comparisons, keywords::family)},
        {{"pairP", "adjust"}, quoted(test.adjust, keywords::p_adjust)},
        {{"pairP", "method"}, quoted(test.how, keywords::pair_test)},
        {{"pairP", "family"}, quoted(test.comparisons, keywords::family)},
        {{"pairs", "method"}, quoted(table.how, keywords::difference_method)},
        {{"pairs", "adjust"},
         "\"" + std::string(arguments::text_of(std::pair{table.intervals, table.p}, keywords::pairs_adjust)) + "\""},
        {{"oneLow", "method"}, quoted(one_rate::default_method, keywords::one_rate_method)},
        {{"oneHigh", "method"}, quoted(one_rate::default_method, keywords::one_rate_method)},
        {{"planWidth", "method"}, quoted(one_rate::default_method, keywords::one_rate_method)},
        {{"postLow", "kind"}, quoted(bayes::default_kind, keywords::credible_kind)},
        {{"postHigh", "kind"}, quoted(bayes::default_kind, keywords::credible_kind)},
        {{"postAbove", "goal"}, quoted(bayes::default_goal, keywords::goal)},
        {{"postBest", "goal"}, quoted(bayes::default_goal, keywords::goal)},
        {{"postLoss", "goal"}, quoted(bayes::default_goal, keywords::goal)},
        {{"postTable", "goal"}, quoted(bayes::default_goal, keywords::goal)},
        {{"postAhead", "goal"}, quoted(default_goal, keywords::goal)},
        {{"postOrder", "goal"}, quoted(default_goal, keywords::goal)},
        {{"postCurve", "span"}, quoted(bayes::default_curve_span, keywords::curve_span)},
        {{"planAhead", "goal"}, quoted(default_goal, keywords::goal)},
        {{"pairs", "goal"}, quoted(table.better, keywords::goal)},
        {{"marginP", "goal"}, quoted(default_goal, keywords::goal)},
        {{"marginP", "claim"}, quoted(pairwise::default_claim, keywords::claim)},
        {{"diffLow", "sides"}, quoted(interval.side, keywords::sides)},
        {{"diffHigh", "sides"}, quoted(interval.side, keywords::sides)},
        {{"oneLow", "sides"}, quoted(default_sides, keywords::sides)},
        {{"oneHigh", "sides"}, quoted(default_sides, keywords::sides)}};
    const apart::options apart_defaults;
    for (const char* f : {"apartLow", "apartHigh", "apart"}) {
        words[{f, "family"}] = quoted(apart_defaults.together, keywords::apart_family);
        words[{f, "method"}] = quoted(apart_defaults.how, keywords::apart_method);
        words[{f, "spread"}] = quoted(apart_defaults.variation, keywords::apart_spread);
    }
    const std::set<std::string> notes{"labels", "i", "j", "k", "scores", "correction", "target"};
    std::size_t numbers_seen = 0, words_seen = 0;
    for (const auto& f : catalog::functions())
        for (const auto& a : f.arguments) {
            if (!a.optional()) continue;
            const std::string name(a.name), where = std::string(f.programmatic) + " " + name;
            if (a.has_number()) {
                ASSERT_TRUE(numbers.contains(name)) << where << ": a number the engine does not name";
                EXPECT_EQ(a.default_number, numbers.at(name)) << where;
                ++numbers_seen;
            } else if (const auto w = words.find({std::string(f.programmatic), name}); w != words.end()) {
                EXPECT_TRUE(a.default_text.starts_with(w->second)) << where << ": " << a.default_text;
                ++words_seen;
            } else {
                EXPECT_TRUE(notes.contains(name)) << where << ": a default the engine does not name";
            }
        }
    EXPECT_EQ(words_seen, words.size());
    EXPECT_GE(numbers_seen, 40u);
    // The correction's default is shown as the switch a user types (FALSE)
    // with the word beside it.
    const auto* power = catalog::by_programmatic("planPower");
    ASSERT_NE(power, nullptr);
    EXPECT_NE(power->arguments[4].default_text.find(quoted(planning::default_correction, keywords::correction)),
              std::string::npos);
}

// Caps and ranges a wizard text quotes are the engine's.
TEST(Catalog, QuotedCapsAreTheEngines) {
    auto text_of = [](const char* function, std::size_t argument) {
        const auto* f = catalog::by_programmatic(function);
        return f ? std::string(argument < f->arguments.size() ? f->arguments[argument].description : f->description)
                 : std::string();
    };
    const std::string prior = text_of("postMean", 4);
    EXPECT_NE(prior.find("From " + format_number(bayes::min_prior) + " to " + format_number(bayes::max_prior)),
              std::string::npos)
        << prior;
    EXPECT_NE(text_of("postCurve", 2).find("(" + std::to_string(bayes::min_curve_points) + " to " +
                                           std::to_string(bayes::max_curve_points)),
              std::string::npos);
    EXPECT_NE(text_of("sameP", 3).find(format_grouped(omnibus::limits{}.max_draws)), std::string::npos);
    EXPECT_NE(text_of("planPower", 5).find("From " + format_number(planning::min_ratio) + " to " +
                                           format_number(planning::max_ratio)),
              std::string::npos);
    EXPECT_NE(text_of("postBest", 99).find("Up to " + std::to_string(bayes::max_groups_best) + " groups"),
              std::string::npos);
    EXPECT_NE(text_of("postLoss", 99).find("Up to " + std::to_string(bayes::max_groups_best) + " groups"),
              std::string::npos);
    EXPECT_NE(text_of("postTable", 99).find("Up to " + std::to_string(bayes::max_groups_table) + " groups"),
              std::string::npos);
    EXPECT_NE(text_of("postOrder", 99).find("Up to " + std::to_string(bayes::max_groups_order) + " groups"),
              std::string::npos);
}

// A wizard text names only arguments its function has, and no markup.
TEST(Catalog, TextsNameOnlyTheirOwnArguments) {
    for (const auto& f : catalog::functions()) {
        std::set<std::string> names;
        for (const auto& a : f.arguments) {
            names.insert(std::string(a.name));
            EXPECT_EQ(a.description.find('`'), std::string::npos) << f.display << " " << a.name;
        }
        const std::string text(f.description);
        EXPECT_EQ(text.find('`'), std::string::npos) << f.display;
        const auto why = text.find("Err:502");
        if (why == std::string::npos) continue;
        const std::string sentence = text.substr(why);
        for (const char* name : {"i", "j"}) {
            const bool named = sentence.find(std::string(" ") + name + " ") != std::string::npos ||
                               sentence.find(std::string(" ") + name + ",") != std::string::npos;
            if (named) {
                EXPECT_TRUE(names.contains(name)) << f.display << " names " << name << ": " << sentence;
            }
        }
        if (sentence.find("word") != std::string::npos) {
            bool takes_words = false;
            for (const auto& a : f.arguments) takes_words |= a.description.find('"') != std::string::npos;
            EXPECT_TRUE(takes_words) << f.display << " speaks of words: " << sentence;
        }
    }
}

TEST(Catalog, EveryKeywordIsListedInTheDescriptions) {
    const auto* same = catalog::by_programmatic("sameP");
    for (const auto& w : keywords::omnibus_method)
        EXPECT_NE(same->arguments[2].description.find("\"" + std::string(w.text) + "\""), std::string::npos) << w.text;
    const auto* power = catalog::by_programmatic("planPower");
    ASSERT_NE(power, nullptr);
    for (const auto& w : keywords::correction)
        EXPECT_NE(power->arguments[4].description.find("\"" + std::string(w.text) + "\""), std::string::npos)
            << w.text;
    const auto* width = catalog::by_programmatic("planWidth");
    ASSERT_NE(width, nullptr);
    for (const auto& w : keywords::one_rate_method)
        EXPECT_NE(width->arguments[3].description.find("\"" + std::string(w.text) + "\""), std::string::npos)
            << w.text;
}

TEST(Keywords, CaseInsensitiveAndListsTheAllowedWords) {
    EXPECT_EQ(arguments::keyword("Exact-LR", keywords::omnibus_method, "method"), omnibus::method::exact_lr);
    EXPECT_EQ(arguments::keyword(" montecarlo ", keywords::omnibus_method, "method"), omnibus::method::monte_carlo);
    try {
        arguments::keyword("fisher", keywords::omnibus_method, "method");
        FAIL();
    } catch (const invalid_input& e) {
        EXPECT_STREQ(e.what(),
                     "The argument method must be one of \"auto\", \"pearson\", \"lr\", \"exact\", \"exact-lr\", "
                     "\"exact-prob\", \"montecarlo\", \"tarone\"; got \"fisher\".");
    }
}
