// reference.hpp - reads the reference tables of tests/reference/: the values
// computed by its generators with scipy, statsmodels, mpmath and an
// independent rational-arithmetic enumerator. Each row names its source.
#pragma once

#include <cstdint>
#include <fstream>
#include <sstream>
#include <stdexcept>
#include <string>
#include <vector>

namespace tallyrates::testing {

struct reference_row {
    std::string name, quantity, source;
    std::vector<std::int64_t> successes, attempts;
    double value = 0;
};

inline std::vector<std::int64_t> split_ints(const std::string& s) {
    std::vector<std::int64_t> out;
    std::istringstream in(s);
    for (std::int64_t v; in >> v;) out.push_back(v);
    return out;
}

// Minimal CSV reader: fields may be quoted, quotes do not nest.
inline std::vector<std::string> csv_fields(const std::string& line) {
    std::vector<std::string> f(1);
    bool quoted = false;
    for (char c : line) {
        if (c == '"') quoted = !quoted;
        else if (c == ',' && !quoted) f.emplace_back();
        else f.back() += c;
    }
    return f;
}

// The parts of a quantity that carries its inputs: "post_above|1|1|0.99".
inline std::vector<std::string> fields(const std::string& quantity) {
    std::vector<std::string> out;
    std::stringstream in(quantity);
    for (std::string s; std::getline(in, s, '|');) out.push_back(s);
    return out;
}

// Every row of a reference CSV of tests/reference/ after its header, as fields.
inline std::vector<std::vector<std::string>> csv_rows(const std::string& file) {
    std::ifstream in(std::string(TALLYRATES_REFERENCE_DIR) + "/" + file);
    if (!in) throw std::runtime_error("cannot open " + file);
    std::vector<std::vector<std::string>> rows;
    std::string line;
    std::getline(in, line);  // header
    while (std::getline(in, line)) rows.push_back(csv_fields(line));
    return rows;
}

// The rows of one family's table (omnibus.csv, pairs.csv, bayes.csv,
// planning.csv) whose quantity starts with the prefix.
inline std::vector<reference_row> reference_rows(const std::string& file, const std::string& quantity_prefix) {
    std::vector<reference_row> rows;
    for (const auto& f : csv_rows(file)) {
        if (f.size() != 6 || f[3].rfind(quantity_prefix, 0) != 0) continue;
        rows.push_back({f[0], f[3], f[5], split_ints(f[1]), split_ints(f[2]), std::stod(f[4])});
    }
    return rows;
}

// The families' tables, in this order.
inline constexpr const char* family_tables[] = {"omnibus.csv", "pairs.csv", "bayes.csv", "planning.csv"};

}  // namespace tallyrates::testing
