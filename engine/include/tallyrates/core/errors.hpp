// errors.hpp - every exception type the engine throws.
//
// The engine reports three kinds of failure; extension/ maps each to one Calc
// error code (architecture: invalid_input -> Err:502, budget_exceeded,
// unreachable_target and no_convergence -> Err:523). Messages are whole sentences a user can act on,
// because RATES.CHECK and RATES.SAME.REPORT show them verbatim.
#pragma once

#include <cstddef>
#include <stdexcept>
#include <string>

namespace tallyrates {

// Bad input: a cell, an argument or a combination of them. `position` is the
// 1-based position in the count range the problem is about, or 0 when the
// problem is not about one row (an argument, a range shape).
class invalid_input : public std::invalid_argument {
public:
    explicit invalid_input(const std::string& message, std::size_t position = 0)
        : std::invalid_argument(message), position_(position) {}
    std::size_t position() const noexcept { return position_; }

private:
    std::size_t position_;
};

// The requested work does not fit the hard cap on time or memory.
class budget_exceeded : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

// The exact omnibus route asked for by name did not fit its cap; where a
// coarse enumeration fitted, the exact p-value is known to lie in
// [p_low, p_high].
class exact_refused : public budget_exceeded {
public:
    exact_refused(const std::string& message, bool has_bounds, double p_low, double p_high)
        : budget_exceeded(message), has_bounds(has_bounds), p_low(p_low), p_high(p_high) {}
    bool has_bounds;
    double p_low, p_high;
};

// A planning target no number of attempts meets (a rate of 100 % to
// demonstrate, a half-width of 0, a power of 1, no difference to detect), or
// one that needs more attempts than the planning cap.
class unreachable_target : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

// An iterative method did not reach its accuracy target.
class no_convergence : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

}  // namespace tallyrates
