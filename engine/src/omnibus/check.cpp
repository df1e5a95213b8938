// check.cpp - the RATES.CHECK sentence: the first problem with its position, or
// "ok" with the group count, total attempts, smallest expected count (which
// group, successes or failures) and the route the automatic omnibus test takes
// (functions.md, "Checks").
#include "tallyrates/omnibus/check.hpp"

#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates {

std::string smallest_expected_place(const counts& c, const omnibus::expected_summary& e) {
    return std::string(e.smallest_is_failures ? "failures" : "successes") + " at " + c.name_of(e.smallest_position);
}

namespace {

// The rules the pairs and one-rate functions apply to i and j (counts.hpp, pairwise.hpp).
void check_positions(const counts& c, const positions_asked& asked) {
    const group* a = asked.i ? &c.with_attempts_at(*asked.i, "i") : nullptr;
    const group* b = asked.j ? &c.with_attempts_at(*asked.j, "j") : nullptr;
    if (a && b) pairwise::distinct(*a, *b);
}

}  // namespace

std::string check_text(const cell_line& successes, const cell_line& attempts,
                       std::span<const std::string> labels, const omnibus::options* asked,
                       omnibus::result_cache* cache, const positions_asked& positions) {
    counts c;
    try {
        c = counts::from_entries(successes, attempts, labels);
        check_positions(c, positions);
    } catch (const invalid_input& e) {
        return problem_text(e.what());
    }
    const auto groups = c.with_attempts();
    std::string text = "ok: " + count_of(c.groups().size(), "group", "groups") + ", " +
                       format_number(static_cast<double>(c.total_attempts())) + " attempts in all";
    if (groups.size() < c.groups().size())
        text += ", " + std::to_string(c.groups().size() - groups.size()) + " with no attempts yet, left out of tests";
    if (groups.size() < 2) return text + "; at least two groups with attempts are needed to compare rates.";
    const auto t = omnibus::table_of(c);
    const auto e = omnibus::expected_counts(t);
    text += "; the smallest expected count is " + format_short(e.smallest) + ", " + smallest_expected_place(c, e);
    text += "; " + omnibus::auto_route_advice(c, cache) + ".";
    if (asked && asked->how != omnibus::method::automatic) {
        try {
            text += " The method asked for: " + omnibus::same_rates(c, *asked, cache).why;
        } catch (const invalid_input& e) {  // say it, do not fail
            text += std::string(" The method asked for: ") + e.what();
        } catch (const budget_exceeded& e) {
            text += std::string(" The method asked for: ") + e.what();
        }
    }
    return text;
}

}  // namespace tallyrates
