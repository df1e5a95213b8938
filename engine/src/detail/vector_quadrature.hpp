// vector_quadrature.hpp - many integrals over the same pieces at once:
// adaptive Gauss-Kronrod with Boost.Math's 15-point Kronrod and 7-point
// Gauss nodes and weights (Kronrod 1965; Piessens et al. 1983, QUADPACK, for
// the error estimate |K - G| and global adaptivity).
//
// Why not Boost's own adaptive integrator: it integrates one function, and its
// first decision (bisect or not) is made from one rule over the whole range,
// so a narrow peak that falls between the nodes is never seen (estimate 0,
// answer 0). Here the caller hands over pieces already cut at every feature's
// scale, every component shares the node values (one evaluation serves G
// integrals), and a piece is bisected while any component's error is above
// its share of that component's tolerance.
#pragma once

#include <algorithm>
#include <boost/math/quadrature/gauss.hpp>
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <cmath>
#include <cstddef>
#include <vector>

#include "tallyrates/core/errors.hpp"

namespace tallyrates::detail {

// A piece [low, high] of an integration variable; `map` tells the integrand
// how that variable maps to the quantity of interest (a substitution near a
// singular end, for example). Bisection keeps the map.
struct quadrature_piece {
    double low = 0, high = 0;
    int map = 0;
};

struct vector_integrals {
    std::vector<double> value, error;  // per component
    std::size_t evaluations = 0;       // node evaluations (each fills every component)
};

// Tolerance of component c: error <= max(absolute[c], r * |value[c]|), with
// r = relative, or small_relative for a value below small_below (a small
// probability needs its relative digits, not 1e-10 of them).
struct vector_tolerance {
    double relative = 1e-10;
    std::vector<double> absolute;
    double small_relative = 1e-10, small_below = 0;

    double allowed(std::size_t c, double value) const {
        const double v = std::fabs(value);
        return std::max(absolute[c], (v < small_below ? small_relative : relative) * v);
    }
};

// The caps that bound one call: past either, no_convergence.
inline constexpr std::size_t max_quadrature_pieces = 6000;
inline constexpr int max_quadrature_rounds = 60;

// One piece's Kronrod (15-point) and Gauss (7-point) sums for every
// component, in the layout of Boost's own non-adaptive rule (index 0 is the
// centre, even indices are also Gauss nodes); the error estimate |K - G|,
// never below the rounding of the sum.
template <class F>
void kronrod_piece(F& f, const quadrature_piece& p, std::size_t width, double* value, double* error,
                   std::vector<double>& node, std::vector<double>& gauss_sum, std::size_t& evaluations) {
    using kronrod = boost::math::quadrature::gauss_kronrod<double, 15>;
    const auto& x = kronrod::abscissa();
    const auto& wk = kronrod::weights();
    const auto& wg = boost::math::quadrature::gauss<double, 7>::weights();
    const double centre = (p.low + p.high) / 2, half = (p.high - p.low) / 2;
    std::fill(value, value + width, 0.0);
    std::fill(gauss_sum.begin(), gauss_sum.end(), 0.0);
    for (std::size_t k = 0; k < x.size(); ++k)
        for (const double side : {1.0, -1.0}) {
            if (k == 0 && side < 0) break;  // the centre once
            f(p.map, centre + side * half * x[k], node.data());
            ++evaluations;
            for (std::size_t c = 0; c < width; ++c) {
                value[c] += wk[k] * node[c];
                if (k % 2 == 0) gauss_sum[c] += wg[k / 2] * node[c];
            }
        }
    for (std::size_t c = 0; c < width; ++c) {
        error[c] = std::max(half * std::fabs(value[c] - gauss_sum[c]), 4e-16 * std::fabs(half * value[c]));
        value[c] *= half;
    }
}

// f(map, v, out) writes the `width` integrands at the point v of a piece with
// that map into out[0 .. width). Each round sums the pieces; a component
// still above its tolerance shares that tolerance out evenly over the
// pieces, and every piece over some open component's share is halved.
template <class F>
vector_integrals integrate_pieces(F f, std::vector<quadrature_piece> pieces, std::size_t width,
                                  const vector_tolerance& tolerance) {
    vector_integrals out;
    std::vector<double> node(width), gauss_sum(width), values(pieces.size() * width), errors(pieces.size() * width);
    auto rule = [&](const quadrature_piece& p, double* value, double* error) {
        kronrod_piece(f, p, width, value, error, node, gauss_sum, out.evaluations);
    };
    for (std::size_t p = 0; p < pieces.size(); ++p) rule(pieces[p], &values[p * width], &errors[p * width]);
    for (int round = 0; round < max_quadrature_rounds; ++round) {
        out.value.assign(width, 0.0);
        out.error.assign(width, 0.0);
        for (std::size_t p = 0; p < pieces.size(); ++p)
            for (std::size_t c = 0; c < width; ++c) {
                out.value[c] += values[p * width + c];
                out.error[c] += errors[p * width + c];
            }
        std::vector<double> share(width, -1.0);  // negative: the component is settled
        bool open = false;
        for (std::size_t c = 0; c < width; ++c) {
            const double allowed = tolerance.allowed(c, out.value[c]);
            if (out.error[c] > allowed) {
                share[c] = allowed / static_cast<double>(pieces.size());
                open = true;
            }
        }
        if (!open) return out;
        std::vector<quadrature_piece> next;
        std::vector<double> next_values, next_errors;
        auto keep = [&](const quadrature_piece& piece, const double* value, const double* error) {
            next.push_back(piece);
            next_values.insert(next_values.end(), value, value + width);
            next_errors.insert(next_errors.end(), error, error + width);
        };
        for (std::size_t p = 0; p < pieces.size(); ++p) {
            bool cut = false;
            for (std::size_t c = 0; c < width && !cut; ++c) cut = share[c] >= 0 && errors[p * width + c] > share[c];
            const double mid = (pieces[p].low + pieces[p].high) / 2;
            // A piece that can no longer be halved in double precision stays.
            if (!cut || !(mid > pieces[p].low && mid < pieces[p].high)) {
                keep(pieces[p], &values[p * width], &errors[p * width]);
                continue;
            }
            std::vector<double> half_value(width), half_error(width);
            for (const auto& half : {quadrature_piece{pieces[p].low, mid, pieces[p].map},
                                     quadrature_piece{mid, pieces[p].high, pieces[p].map}}) {
                rule(half, half_value.data(), half_error.data());
                keep(half, half_value.data(), half_error.data());
            }
            if (next.size() > max_quadrature_pieces)
                throw no_convergence("A posterior probability's integral needed more than " +
                                     std::to_string(max_quadrature_pieces) + " pieces to reach its accuracy.");
        }
        pieces = std::move(next);
        values = std::move(next_values);
        errors = std::move(next_errors);
    }
    throw no_convergence("A posterior probability's integral did not reach its accuracy in " +
                         std::to_string(max_quadrature_rounds) + " rounds of refinement.");
}

}  // namespace tallyrates::detail
