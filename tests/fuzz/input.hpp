// input.hpp - a fuzzer's bytes read as what a worksheet call can receive:
// count cells of every kind (numbers whole or not, huge, negative, NaN,
// blank, text, booleans, error values), optional numbers and words that may
// be omitted, misspelt or written in another case, and positions inside and
// outside the range. Shared by the libFuzzer targets of tests/fuzz/.
//
// Every target runs each call inside the extension's own `guarded` (guard.hpp,
// the one place where engine outcomes become what a cell shows) and accepts
// what a cell may show, Err:502 (IllegalArgumentException) and Err:523
// (NoConvergenceException); anything else is a finding: a RuntimeException
// (#VALUE!, an exception the engine did not expect), a crash, a sanitizer
// report, a leak, a timeout or an allocation past libFuzzer's limit.
#pragma once

#include <array>
#include <bit>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstring>
#include <limits>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/sheet/NoConvergenceException.hpp>

#include "guard.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/counts.hpp"

namespace tallyrates::fuzz {

class input {
public:
    input(const std::uint8_t* data, std::size_t size) : data_(data), size_(size) {}

    bool exhausted() const { return at_ >= size_; }
    std::uint8_t byte() { return at_ < size_ ? data_[at_++] : 0; }
    std::uint16_t two_bytes() { return static_cast<std::uint16_t>(byte() | (byte() << 8)); }
    // 0 .. n - 1 (n at most 65,536).
    std::size_t below(std::size_t n) { return n <= 256 ? byte() % n : two_bytes() % n; }
    bool flip() { return (byte() & 1) != 0; }

    // A number as a cell or an argument may hold it: usually a small whole
    // number, often one of the values that break arithmetic, sometimes any
    // bit pattern at all.
    double number() {
        switch (byte() % 5) {
        case 0: return static_cast<double>(byte());
        case 1: return static_cast<double>(two_bytes());
        case 2: return awkward[byte() % awkward.size()];
        case 3: return static_cast<double>(byte()) / 256.0;  // a rate or a level
        default: {
            std::uint64_t bits = 0;
            for (int k = 0; k < 8; ++k) bits |= static_cast<std::uint64_t>(byte()) << (8 * k);
            return std::bit_cast<double>(bits);
        }
        }
    }
    // An optional argument: omitted about a quarter of the time.
    std::optional<double> maybe_number() {
        if (byte() % 4 == 0) return std::nullopt;
        return number();
    }

    // A keyword argument: omitted, one of the listed words (in any case,
    // sometimes with spaces around), or other text.
    template <class E, std::size_t K>
    std::optional<std::string> word(const std::array<arguments::word<E>, K>& words) {
        switch (byte() % 4) {
        case 0: return std::nullopt;
        case 1: return text(12);
        default: {
            std::string w(words[byte() % K].text);
            if (flip())
                for (char& ch : w) ch = static_cast<char>(ch - ('a' <= ch && ch <= 'z' ? 32 : 0));
            if (flip()) w = " " + w + "  ";
            return w;
        }
        }
    }
    // Any bytes, up to `longest`, as typed text (not necessarily UTF-8).
    std::string text(std::size_t longest) {
        std::string s;
        const std::size_t n = below(longest + 1);
        for (std::size_t k = 0; k < n && !exhausted(); ++k) s.push_back(static_cast<char>(byte()));
        return s;
    }

    // One count cell: a number, a blank, text, a boolean or an error value.
    entry cell() {
        switch (byte() % 8) {
        case 0: return entry::blank();
        case 1: return entry::text();
        case 2: return entry::boolean();
        case 3: return entry::error();
        default: return entry::number(number());
        }
    }

    // The two count ranges of a call, up to `most` rows: mostly rows a tally
    // sheet holds (attempts, then successes among them), some rows of any cells.
    std::pair<cell_line, cell_line> tally(std::size_t most) {
        std::vector<entry> s, n;
        const std::size_t rows = below(most + 1);
        for (std::size_t r = 0; r < rows; ++r) {
            if (byte() % 4 != 0) {
                const double a = byte() % 8 == 0 ? static_cast<double>(two_bytes()) : static_cast<double>(byte());
                n.push_back(entry::number(a));
                s.push_back(entry::number(static_cast<double>(below(static_cast<std::size_t>(a) + 1))));
            } else {
                s.push_back(cell());
                n.push_back(cell());
            }
        }
        // Ranges of different lengths are a case the product must refuse.
        if (byte() % 16 == 0) n.push_back(cell());
        return {cell_line(std::move(s)), cell_line(std::move(n))};
    }
    // A validated tally (counts::from_entries throws invalid_input, Err:502).
    counts tally_counts(std::size_t most) {
        const auto [s, n] = tally(most);
        return counts::from_entries(s, n);
    }
    // A position as typed: mostly 1 .. most, sometimes anything.
    double position(std::size_t most) {
        return byte() % 8 == 0 ? number() : static_cast<double>(1 + below(most));
    }

private:
    static constexpr std::array<double, 28> awkward{
        0.0, 1.0, 2.0, -1.0, 0.5, -0.5, 1.5, 0.95, 0.9973, 1e-12, 1 - 1e-12, 1e-300, 1e6, 1e9, 1e12, 1e15,
        1e15 + 1, 9007199254740993.0, 1e300, -1e300, 4.9e-324, -0.0, 0.999999, 1e-9,
        std::numeric_limits<double>::infinity(), -std::numeric_limits<double>::infinity(),
        std::numeric_limits<double>::quiet_NaN(), 2.5e-5};
    const std::uint8_t* data_;
    std::size_t size_;
    std::size_t at_ = 0;
};

// One worksheet call through the extension's guard: what a cell may show
// (Err:502, Err:523) is fine; #VALUE! (RuntimeException) and everything else
// escapes to libFuzzer, which reports it.
template <class F>
void as_a_cell(F&& call) {
    try {
        uno::guarded(std::forward<F>(call));
    } catch (const css::lang::IllegalArgumentException&) {
    } catch (const css::sheet::NoConvergenceException&) {
    }
}

// Wherever a function promises a probability.
inline void probability(double p) {
    if (!(p >= 0.0 && p <= 1.0)) __builtin_trap();
}

}  // namespace tallyrates::fuzz
