// catalog_dump.cpp - prints the function reference (extension/FUNCTIONS.md)
// from the catalog, so the reference cannot drift from what Calc shows.
#include <iostream>
#include <string_view>

#include "catalog.hpp"

int main(int argc, char** argv) {
    using namespace tallyrates::catalog;
    if (argc > 1 && std::string_view(argv[1]) == "--tsv") {
        // One line per function: programmatic, display, description, then
        // argument name and wizard text pairs (for the integration tests).
        for (const auto& f : functions()) {
            std::cout << f.programmatic << '\t' << f.display << '\t' << f.description;
            for (const auto& a : f.arguments) std::cout << '\t' << a.name << '\t' << argument_text(a);
            std::cout << '\n';
        }
        return 0;
    }
    std::cout << "# tallyrates function reference\n\n"
                 "Generated from extension/catalog.cpp by `catalog_dump`; a test fails when this file and the "
                 "catalog differ.\nCategory in the function wizard: "
              << category << ". Arguments in [brackets] are optional.\n";
    for (const auto& f : functions()) {
        std::cout << "\n## " << f.display << "(";
        for (std::size_t k = 0; k < f.arguments.size(); ++k) {
            const auto& a = f.arguments[k];
            std::cout << (k ? "; " : "") << (a.optional() ? "[" : "") << a.name << (a.optional() ? "]" : "");
        }
        std::cout << ")" << (f.array ? " (array formula)" : "") << "\n\n" << f.description << "\n\n";
        for (const auto& a : f.arguments) std::cout << "- `" << a.name << "`: " << argument_text(a) << "\n";
        std::cout << "\nStored in files as `" << service_name << "." << f.programmatic << "`.\n";
    }
}
