// report.hpp - RATES.SAME.REPORT: the omnibus analysis as label/value rows.
//
// Rows are fixed in number and meaning so that users can refer to a cell of
// the report from elsewhere; a row that does not apply holds empty text.
// The report never fails for bad input: it shows the problem instead, since
// it is where users look to learn why RATES.SAME.P shows Err:502 or Err:523.
#pragma once

#include <span>
#include <string>
#include <variant>
#include <vector>

#include "tallyrates/core/counts.hpp"
#include "tallyrates/omnibus/same_rates.hpp"

namespace tallyrates {

struct report_row {
    std::string label;
    std::variant<std::monostate, double, std::string> value;
};

inline constexpr std::size_t same_report_rows = 11;

// `labels`: one per position, or none; they name the group of the smallest
// expected count and of a problem found in the counts.
std::vector<report_row> same_rates_report(const cell_line& successes, const cell_line& attempts,
                                          std::span<const std::string> labels, const omnibus::options& opt,
                                          omnibus::result_cache* cache = nullptr);
// The report for a problem found before the counts were looked at (an
// argument that could not be read).
std::vector<report_row> problem_report(const std::string& problem);

}  // namespace tallyrates
