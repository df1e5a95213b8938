// catalog.cpp - the families' entries joined, and look-ups (see catalog.hpp).
#include "catalog.hpp"

#include <algorithm>
#include <cctype>
#include <vector>

#include "tallyrates/core/text.hpp"

namespace tallyrates::catalog {

namespace {

bool same_text_ignoring_case(std::string_view a, std::string_view b) {
    return a.size() == b.size() && std::equal(a.begin(), a.end(), b.begin(), [](char x, char y) {
               return std::tolower(static_cast<unsigned char>(x)) == std::tolower(static_cast<unsigned char>(y));
           });
}

}  // namespace

std::span<const function> functions() {
    static const std::vector<function> all = [] {
        std::vector<function> v;
        for (const auto family :
             {omnibus_functions(), pairs_functions(), bayes_functions(), planning_functions(), apart_functions()})
            v.insert(v.end(), family.begin(), family.end());
        return v;
    }();
    return all;
}

const function* by_programmatic(std::string_view name) {
    for (const auto& f : functions())
        if (f.programmatic == name) return &f;
    return nullptr;
}

const function* by_display(std::string_view name) {
    for (const auto& f : functions())
        if (same_text_ignoring_case(f.display, name)) return &f;
    return nullptr;
}

std::string default_shown(const argument& a) {
    return a.has_number() ? format_number(a.default_number) : std::string(a.default_text);
}

std::string argument_text(const argument& a) {
    std::string text(a.description);
    if (a.optional()) text += " Optional; default " + default_shown(a) + ".";
    return text;
}

}  // namespace tallyrates::catalog
