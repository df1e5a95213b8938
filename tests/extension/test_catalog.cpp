// The catalog against the other places that must agree with it: the IDL
// (method names and argument counts), the engine's defaults and keyword
// tables. Facts checked here are the project's own conventions
// (functions.md); no outside numbers are involved.
#include <gtest/gtest.h>

#include <fstream>
#include <regex>
#include <set>
#include <sstream>

#include "catalog.hpp"
#include "omnibus/keywords.hpp"
#include "pairs/keywords.hpp"
#include "planning/keywords.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"

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

TEST(Catalog, DefaultsAreTheEngineDefaults) {
    const omnibus::options o;
    const auto* same = catalog::by_programmatic("sameP");
    ASSERT_NE(same, nullptr);
    EXPECT_TRUE(same->arguments[2].default_text.starts_with(
        "\"" + std::string(arguments::text_of(o.how, keywords::omnibus_method)) + "\""));
    EXPECT_EQ(same->arguments[3].default_text, std::to_string(o.draws));
    EXPECT_EQ(same->arguments[4].default_text, std::to_string(o.seed));
    const auto* trend = catalog::by_programmatic("trendP");
    EXPECT_EQ(trend->arguments[3].default_text,
              "\"" + std::string(arguments::text_of(trend::variance::binomial, keywords::trend_variance)) + "\"");
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
                     "\"exact-prob\", \"montecarlo\"; got \"fisher\".");
    }
}
