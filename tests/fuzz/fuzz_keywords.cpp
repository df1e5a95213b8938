// fuzz_keywords.cpp - libFuzzer target for the keyword parser
// (arguments::keyword, the one parser behind every option word): any bytes
// against every family's table of words. A word is either one of the table's
// (whatever its case and surrounding spaces) or refused with Err:502 and a
// sentence naming the allowed words; it never matches two entries.
#include "apart/keywords.hpp"
#include "bayes/keywords.hpp"
#include "input.hpp"
#include "omnibus/keywords.hpp"
#include "pairs/keywords.hpp"
#include "planning/keywords.hpp"

using namespace tallyrates;

namespace {

template <class E, std::size_t K>
void parse(const std::string& text, const std::array<arguments::word<E>, K>& words) {
    fuzz::as_a_cell([&] {
        const E got = arguments::keyword(text, words, "option");
        // What matched is the word the text spells once case and spaces go.
        if (arguments::text_of(got, words) != arguments::normalised(text)) __builtin_trap();
        return 0.0;
    });
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string text(reinterpret_cast<const char*>(data), size);
    parse(text, keywords::goal);
    parse(text, keywords::sides);
    parse(text, keywords::omnibus_method);
    parse(text, keywords::statistic);
    parse(text, keywords::trend_variance);
    parse(text, keywords::difference_method);
    parse(text, keywords::simultaneous);
    parse(text, keywords::family);
    parse(text, keywords::pair_test);
    parse(text, keywords::p_adjust);
    parse(text, keywords::pairs_adjust);
    parse(text, keywords::claim);
    parse(text, keywords::one_rate_method);
    parse(text, keywords::credible_kind);
    parse(text, keywords::curve_span);
    parse(text, keywords::correction);
    parse(text, keywords::apart_family);
    parse(text, keywords::apart_method);
    parse(text, keywords::apart_spread);
    parse(text, keywords::prior_part_word);
    return 0;
}
