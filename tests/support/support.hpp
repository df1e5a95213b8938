// support.hpp - what every engine test shares: tallies built from numbers,
// comparisons to a reference value at a relative tolerance, expectations on
// the sentence of a refusal, and (cells.hpp) the engine's functions of one or
// two groups called the way a worksheet cell calls them.
#pragma once

#include <gtest/gtest.h>

#include <cmath>
#include <cstdint>
#include <string>
#include <vector>

#include "cells.hpp"
#include "tallyrates/core/counts.hpp"

namespace tallyrates::testing {

// A tally with no blank rows, positions 1..G.
inline counts tally(const std::vector<std::int64_t>& successes, const std::vector<std::int64_t>& attempts) {
    return counts::from_values(successes, attempts);
}

// |got - want| <= tol |want|; want = 0 asks for |got| <= 1e-300.
inline void expect_relative(double got, double want, double tol, const std::string& what) {
    if (want == 0.0) {
        EXPECT_LE(std::fabs(got), 1e-300) << what;
        return;
    }
    EXPECT_LE(std::fabs(got - want), tol * std::fabs(want)) << what << ": got " << got << " want " << want;
}

}  // namespace tallyrates::testing

// The statement throws `type` and its message contains `words`.
#define TALLYRATES_EXPECT_THROW_SAYING(statement, type, words)                                                    \
    do {                                                                                                       \
        try {                                                                                                  \
            statement;                                                                                         \
            ADD_FAILURE() << #statement " did not throw";                                                      \
        } catch (const type& thrown_) {                                                                        \
            EXPECT_NE(std::string(thrown_.what()).find(words), std::string::npos) << thrown_.what();            \
        }                                                                                                      \
    } while (false)
