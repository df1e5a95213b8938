// counts.hpp - validated tallies of successes and attempts, one group per row.
//
// The rules of functions.md ("Shared conventions") live here and only here:
// blank-row skipping, positions counted over the whole range, whole
// non-negative counts, successes <= attempts, booleans and text refused. The
// UNO layer only turns each cell into an `entry`; every judgement about what
// the user typed is made by `counts::from_entries`.
#pragma once

#include <cstddef>
#include <cstdint>
#include <span>
#include <string>
#include <utility>
#include <vector>

namespace tallyrates {

// What one worksheet cell held, as far as the rules care.
struct entry {
    enum class kind { blank, number, text, boolean, error };
    kind what = kind::blank;
    double value = 0.0;  // meaningful for kind::number only

    static entry blank() { return {}; }
    static entry number(double v) { return {kind::number, v}; }
    static entry text() { return {kind::text, 0.0}; }
    static entry boolean() { return {kind::boolean, 0.0}; }
    static entry error() { return {kind::error, 0.0}; }  // a cell showing an error value
};

// One range argument as read from the sheet: its first cells, in order, and
// the length of the whole range. Cells past `cells.size()` (up to `length`)
// are blank: a whole column is read only down to its last filled row.
struct cell_line {
    std::vector<entry> cells;
    std::size_t length = 0;

    cell_line() = default;
    // A range read in full (tests, arrays): implicit on purpose.
    cell_line(std::vector<entry> all) : cells(std::move(all)), length(cells.size()) {}  // NOLINT
    cell_line(std::vector<entry> first, std::size_t whole) : cells(std::move(first)), length(whole) {}
    entry at(std::size_t k) const { return k < cells.size() ? cells[k] : entry::blank(); }
};

// One group with data: its 1-based position in the range and its tallies.
struct group {
    std::size_t position = 0;
    std::int64_t successes = 0;
    std::int64_t attempts = 0;
    double rate() const { return static_cast<double>(successes) / static_cast<double>(attempts); }
};

// Largest count accepted. Above 2^53 doubles stop holding every integer; far
// below that every method here has run out of meaning or budget anyway.
inline constexpr double max_count = 1e15;
// Largest number of positions in a range (a whole column is 1,048,576 rows).
inline constexpr std::size_t max_positions = 1u << 21;

class counts {
public:
    // Validates two ranges of equal size. Throws invalid_input naming the first
    // bad position (and its label, when labels are given: one per position,
    // empty for none) and why.
    static counts from_entries(const cell_line& successes, const cell_line& attempts,
                               std::span<const std::string> labels = {});
    // Convenience for tests and internal use: no blank rows, positions 1..G.
    static counts from_values(std::span<const std::int64_t> successes, std::span<const std::int64_t> attempts);

    // Non-blank rows, in range order (attempts may be 0).
    const std::vector<group>& groups() const { return groups_; }
    // Non-blank rows with attempts > 0: what the frequentist tests use.
    std::vector<group> with_attempts() const;
    std::size_t range_size() const { return range_size_; }
    std::int64_t total_successes() const { return total_successes_; }
    std::int64_t total_attempts() const { return total_attempts_; }

    // The group at a 1-based position; invalid_input for a blank row or a
    // position outside the range. `argument` names the argument in messages.
    // A position is checked here once: the engine's functions of one or two
    // groups take the group handed back, never the cell's value.
    const group& at_position(double position, const char* argument) const;
    // The same for a group that must have attempts (a frequentist statement
    // about a group without data is refused).
    const group& with_attempts_at(double position, const char* argument) const;
    // Index among groups() of a group this tally handed out.
    std::size_t index_of(const group& g) const { return static_cast<std::size_t>(&g - groups_.data()); }

    // How messages name a group: "position 4" or "position 4, Pilot oven".
    std::string name_of(std::size_t position) const;
    // The group's label, empty when none was given.
    std::string label_of(std::size_t position) const;

    bool operator==(const counts&) const = default;

private:
    std::vector<group> groups_;
    std::vector<std::string> labels_;  // empty, or one per position
    std::size_t range_size_ = 0;
    std::int64_t total_successes_ = 0;
    std::int64_t total_attempts_ = 0;
};

}  // namespace tallyrates
