// counts.cpp - validation of tally ranges (rules: functions.md, "Shared conventions").
#include "tallyrates/core/counts.hpp"

#include <algorithm>
#include <cmath>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates {

namespace {

std::string label_at(std::size_t position, std::span<const std::string> labels) {
    return position >= 1 && position <= labels.size() ? labels[position - 1] : std::string();
}

// "Position 4 of the range" or "Position 4 of the range, Pilot oven".
std::string where(std::size_t position, std::span<const std::string> labels) {
    const std::string label = label_at(position, labels);
    return "Position " + std::to_string(position) + " of the range" + (label.empty() ? "" : ", " + label);
}

// A count cell that is filled: returns its whole value or throws.
std::int64_t whole_count(const entry& e, const char* what, std::size_t position, std::span<const std::string> labels) {
    switch (e.what) {
        case entry::kind::text:
            throw invalid_input(where(position, labels) + ": the " + what + " cell holds text, not a count.", position);
        case entry::kind::error:
            throw invalid_input(
                where(position, labels) + ": the " + what + " cell shows an error value; correct that cell first.",
                position);
        case entry::kind::boolean:
            throw invalid_input(
                where(position, labels) + ": the " + what + " cell holds a logical value (TRUE/FALSE), not a count.",
                position);
        case entry::kind::blank:
        case entry::kind::number: break;
    }
    const double v = e.value;
    if (!std::isfinite(v))
        throw invalid_input(where(position, labels) + ": the " + what + " cell is not a finite number.", position);
    if (v < 0)
        throw invalid_input(where(position, labels) + ": " + what + " is negative (" + format_number(v) +
                                "); counts are whole numbers of 0 or more.",
                            position);
    if (v != std::floor(v))
        throw invalid_input(
            where(position, labels) + ": " + what + " is not a whole number (" + format_number(v) + ").", position);
    if (v > max_count)
        throw invalid_input(where(position, labels) + ": " + what + " (" + format_number(v) +
                                ") is above the largest count accepted (1e15).",
                            position);
    return static_cast<std::int64_t>(v);
}

}  // namespace

counts counts::from_entries(const cell_line& successes, const cell_line& attempts,
                            std::span<const std::string> labels) {
    if (successes.length != attempts.length)
        throw invalid_input("The successes range has " + std::to_string(successes.length) +
                            " cells and the attempts range " + std::to_string(attempts.length) +
                            "; select two ranges of the same size, one group per row.");
    if (successes.length > max_positions)
        throw invalid_input("The ranges have " + std::to_string(successes.length) + " cells; at most " +
                            std::to_string(max_positions) + " are accepted.");
    if (!labels.empty() && labels.size() != successes.length)
        throw invalid_input("The labels range has " + std::to_string(labels.size()) + " cells and the count ranges " +
                            std::to_string(successes.length) + "; give one label per row.");
    counts c;
    c.range_size_ = successes.length;
    c.labels_.assign(labels.begin(), labels.end());
    // Past the cells read, both lines are blank: nothing more to look at.
    const std::size_t read = std::min(successes.length, std::max(successes.cells.size(), attempts.cells.size()));
    for (std::size_t k = 0; k < read; ++k) {
        const std::size_t position = k + 1;
        const entry s = successes.at(k), n = attempts.at(k);
        const bool s_blank = s.what == entry::kind::blank;
        const bool n_blank = n.what == entry::kind::blank;
        if (s_blank && n_blank) continue;  // a row still to be filled in: skipped
        // Column headings above the first counts (a whole column such as B:B
        // takes in the heading row): text in both cells there is skipped.
        if (c.groups_.empty() && s.what == entry::kind::text && n.what == entry::kind::text) continue;
        if (s_blank || n_blank) {
            // An error value is the problem to name, whatever its neighbour holds.
            if (s.what != entry::kind::error && n.what != entry::kind::error)
                throw invalid_input(where(position, labels) + ": " + (s_blank ? "successes" : "attempts") +
                                        " is blank but " + (s_blank ? "attempts" : "successes") +
                                        " is filled; fill both cells or clear both.",
                                    position);
        }
        const std::int64_t x = whole_count(s, "successes", position, labels);
        const std::int64_t n_count = whole_count(n, "attempts", position, labels);
        if (x > n_count)
            throw invalid_input(where(position, labels) + ": successes (" + std::to_string(x) + ") exceed attempts (" +
                                    std::to_string(n_count) + ").",
                                position);
        c.groups_.push_back({position, x, n_count});
        c.total_successes_ += x;
        c.total_attempts_ += n_count;
        if (static_cast<double>(c.total_attempts_) > max_count)
            throw invalid_input("The attempts add up to more than the largest total accepted (1e15).", position);
    }
    return c;
}

counts counts::from_values(std::span<const std::int64_t> successes, std::span<const std::int64_t> attempts) {
    std::vector<entry> s, n;
    for (auto v : successes) s.push_back(entry::number(static_cast<double>(v)));
    for (auto v : attempts) n.push_back(entry::number(static_cast<double>(v)));
    return from_entries(s, n);
}

std::string counts::name_of(std::size_t position) const {
    const std::string label = label_at(position, labels_);
    return "position " + std::to_string(position) + (label.empty() ? "" : ", " + label);
}

std::string counts::label_of(std::size_t position) const { return label_at(position, labels_); }

std::vector<group> counts::with_attempts() const {
    std::vector<group> out;
    for (const auto& g : groups_)
        if (g.attempts > 0) out.push_back(g);
    return out;
}

const group& counts::at_position(double position, const char* argument) const {
    const std::size_t p = arguments::position(position, range_size_, argument);
    for (const auto& g : groups_)
        if (g.position == p) return g;
    throw invalid_input(std::string("The argument ") + argument + " names position " + std::to_string(p) +
                            ", a blank row of the range.",
                        p);
}

const group& counts::with_attempts_at(double position, const char* argument) const {
    const group& g = at_position(position, argument);
    if (g.attempts == 0)
        throw invalid_input(std::string("The argument ") + argument + " names position " +
                                std::to_string(g.position) + ", which has no attempts yet.",
                            g.position);
    return g;
}

}  // namespace tallyrates
