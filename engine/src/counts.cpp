// counts.cpp - validation of tally ranges (rules: functions.md, "Shared conventions").
#include "tallyrates/counts.hpp"

#include <cmath>

#include "tallyrates/arguments.hpp"
#include "tallyrates/errors.hpp"
#include "tallyrates/text.hpp"

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
std::int64_t whole_count(const entry& e, const char* what, std::size_t position,
                         std::span<const std::string> labels) {
    switch (e.what) {
        case entry::kind::text:
            throw invalid_input(where(position, labels) + ": the " + what + " cell holds text, not a count.", position);
        case entry::kind::boolean:
            throw invalid_input(where(position, labels) + ": the " + what +
                                    " cell holds a logical value (TRUE/FALSE), not a count.",
                                position);
        case entry::kind::blank:
        case entry::kind::number:
            break;
    }
    const double v = e.value;
    if (!std::isfinite(v))
        throw invalid_input(where(position, labels) + ": the " + what + " cell is not a finite number.", position);
    if (v < 0)
        throw invalid_input(where(position, labels) + ": " + what + " is negative (" + format_number(v) +
                                "); counts are whole numbers of 0 or more.",
                            position);
    if (v != std::floor(v))
        throw invalid_input(where(position, labels) + ": " + what + " is not a whole number (" + format_number(v) + ").",
                            position);
    if (v > max_count)
        throw invalid_input(where(position, labels) + ": " + what + " (" + format_number(v) + ") is above the largest count accepted (1e15).",
                            position);
    return static_cast<std::int64_t>(v);
}

}  // namespace

counts counts::from_entries(std::span<const entry> successes, std::span<const entry> attempts,
                            std::span<const std::string> labels) {
    if (successes.size() != attempts.size())
        throw invalid_input("The successes range has " + std::to_string(successes.size()) +
                            " cells and the attempts range " + std::to_string(attempts.size()) +
                            "; select two ranges of the same size, one group per row.");
    if (successes.size() > max_positions)
        throw invalid_input("The ranges have " + std::to_string(successes.size()) +
                            " cells; at most " + std::to_string(max_positions) + " are accepted.");
    if (!labels.empty() && labels.size() != successes.size())
        throw invalid_input("The labels range has " + std::to_string(labels.size()) + " cells and the count ranges " +
                            std::to_string(successes.size()) + "; give one label per row.");
    counts c;
    c.range_size_ = successes.size();
    c.labels_.assign(labels.begin(), labels.end());
    for (std::size_t k = 0; k < successes.size(); ++k) {
        const std::size_t position = k + 1;
        const bool s_blank = successes[k].what == entry::kind::blank;
        const bool n_blank = attempts[k].what == entry::kind::blank;
        if (s_blank && n_blank) continue;  // a row still to be filled in: skipped
        if (s_blank || n_blank)
            throw invalid_input(where(position, labels) + ": " + (s_blank ? "successes" : "attempts") +
                                    " is blank but " + (s_blank ? "attempts" : "successes") +
                                    " is filled; fill both cells or clear both.",
                                position);
        const std::int64_t x = whole_count(successes[k], "successes", position, labels);
        const std::int64_t n = whole_count(attempts[k], "attempts", position, labels);
        if (x > n)
            throw invalid_input(where(position, labels) + ": successes (" + std::to_string(x) + ") exceed attempts (" +
                                    std::to_string(n) + ").",
                                position);
        c.groups_.push_back({position, x, n});
        c.total_successes_ += x;
        c.total_attempts_ += n;
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

}  // namespace tallyrates
