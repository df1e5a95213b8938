// Tests of the internals shared by several families (engine/src/detail/):
// the hypergeometric law against 50-digit mpmath (tests/reference/detail.py),
// the generator against a transcription of the published algorithm, the term
// sums against the chi-square statistic of scipy (tests/reference/omnibus.csv),
// the vector quadrature against closed forms, and the thread helper.
#include <gtest/gtest.h>

#include <atomic>
#include <cmath>
#include <numbers>
#include <string>
#include <vector>

#include "detail/hypergeometric.hpp"
#include "detail/random.hpp"
#include "detail/terms.hpp"
#include "detail/threads.hpp"
#include "detail/vector_quadrature.hpp"
#include "reference.hpp"
#include "support.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/table.hpp"

using namespace tallyrates;
namespace support = tallyrates::testing;

// P(X = x) from the ratio recurrence against the exact binomial ratio
// (mpmath, 50 digits): the recurrence's error grows like steps * eps, so
// 1e-12 relative holds up to draws of 600 (hypergeometric.hpp).
TEST(Hypergeometric, MatchesTheExactBinomialRatio) {
    std::size_t checked = 0;
    for (const auto& row : support::csv_rows("detail.csv")) {
        if (row[0] != "hypergeometric") continue;
        const auto in = support::split_ints(row[1]);  // population, marked, draws, x
        std::vector<double> pmf;
        const auto sup = detail::hypergeometric_pmf(in[0], in[1], in[2], pmf);
        ASSERT_GE(in[3], sup.first);
        ASSERT_LE(in[3], sup.last);
        support::expect_relative(pmf[static_cast<std::size_t>(in[3] - sup.first)], std::stod(row[2]), 1e-12,
                                 row[1] + " (" + row[3] + ")");
        ++checked;
    }
    EXPECT_EQ(checked, 24u);
}

// The generator's outputs, and its jump, against a transcription of the
// published algorithm (Blackman & Vigna 2018) made from the paper.
TEST(Generator, MatchesThePublishedAlgorithm) {
    std::size_t checked = 0;
    for (const auto& row : support::csv_rows("detail.csv")) {
        if (row[0].rfind("xoshiro", 0) != 0) continue;
        const auto in = support::split_ints(row[1]);  // seed, index
        detail::xoshiro256ss g(static_cast<std::uint64_t>(in[0]));
        if (row[0] == "xoshiro_after_jump") {
            for (int k = 0; k < 3; ++k) g.next();
            g.jump();
        }
        std::uint64_t got = 0;
        for (std::int64_t k = 0; k <= in[1]; ++k) got = g.next();
        EXPECT_EQ(std::to_string(got), row[2]) << row[0] << " " << row[1];
        ++checked;
    }
    EXPECT_EQ(checked, 15u);
}

// The additive terms sum to the Pearson X^2 of scipy's chi2_contingency
// (without continuity correction) for every reference table.
TEST(Terms, SumToTheChiSquareStatistic) {
    const auto rows = support::reference_rows("omnibus.csv", "pearson_stat");
    ASSERT_FALSE(rows.empty());
    for (const auto& r : rows) {
        const auto t = omnibus::table_of(support::tally(r.successes, r.attempts));
        support::expect_relative(detail::observed_total(t, omnibus::ordering::pearson), r.value, 1e-12,
                                 r.name + " (" + r.source + ")");
    }
}

// Many integrals over shared pieces: polynomials exactly (closed forms
// 1 / (k + 1)), and a peak 1e-4 wide found because the pieces are cut at
// its scale (its integral is 1e-4 sqrt(2 pi), the normal density's constant).
TEST(VectorQuadrature, ClosedFormsOverSharedPieces) {
    const double centre = 0.3, width = 1e-4;
    auto f = [&](int, double x, double* out) {
        for (int k = 0; k < 5; ++k) out[k] = std::pow(x, k);
        const double z = (x - centre) / width;
        out[5] = std::exp(-z * z / 2);
    };
    std::vector<detail::quadrature_piece> pieces{{0, centre - 10 * width}, {centre - 10 * width, centre},
                                                 {centre, centre + 10 * width}, {centre + 10 * width, 1}};
    detail::vector_tolerance tol;
    tol.relative = 1e-12;
    tol.absolute.assign(6, 1e-300);
    const auto r = detail::integrate_pieces(f, pieces, 6, tol);
    for (int k = 0; k < 5; ++k) support::expect_relative(r.value[k], 1.0 / (k + 1), 1e-13, "x^" + std::to_string(k));
    support::expect_relative(r.value[5], width * std::sqrt(2 * std::numbers::pi), 1e-11, "peak");
    // An accuracy no piece can reach ends in a refusal, never a silent answer.
    auto jump = [](int, double x, double* out) { out[0] = x < 1 / std::numbers::pi ? 0.0 : 1.0; };
    detail::vector_tolerance impossible;
    impossible.relative = 1e-300;
    impossible.absolute.assign(1, 1e-300);
    EXPECT_THROW(detail::integrate_pieces(jump, std::vector<detail::quadrature_piece>{{0, 1}}, 1, impossible),
                 no_convergence);
}

// Every job runs exactly once, whatever the thread count (0 counts as 1).
TEST(Threads, EveryJobRunsOnce) {
    for (unsigned threads : {0u, 1u, 2u, 5u})
        for (std::size_t n : {std::size_t{0}, std::size_t{1}, std::size_t{7}, std::size_t{1000}}) {
            std::vector<std::atomic<int>> runs(n);
            detail::on_threads(threads, n, [&](std::size_t job) { ++runs[job]; });
            for (std::size_t k = 0; k < n; ++k) EXPECT_EQ(runs[k].load(), 1) << threads << " threads, job " << k;
        }
}
