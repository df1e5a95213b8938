// difference.cpp - central credible bounds for the difference of two
// groups' rates: the d where P(rate_x - rate_y <= d) = (1 -+ level) / 2, that
// probability being the integral of f_y(t) F_x(t + d) dt, found by Newton's
// method on a combined CDF-and-density pass or a bracketing root search
// (TOMS 748); sources in tallyrates/bayes/comparison.hpp.
#include "tallyrates/bayes/comparison.hpp"

#include <algorithm>
#include <boost/math/distributions/normal.hpp>
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <boost/math/quadrature/tanh_sinh.hpp>
#include <boost/math/special_functions/beta.hpp>
#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <complex>
#include <limits>
#include <vector>

#include "bayes/law_math.hpp"
#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::bayes {

using namespace detail;

namespace {

// The credible bounds of a difference integrate a CDF unscaled and need it
// to 1e-11 absolute, so they keep the tighter relative tolerance.
constexpr double cdf_tolerance = 1e-11;
// The summed error estimate beyond which a CDF is a failure (Err:523): 1e-10
// moves a bound by 1e-10 over the density of the difference (at least 1 for
// any two laws of a tally), and at least: a density and a CDF of a law of n attempts come out of Boost with a
// relative rounding noise of about n eps, which the adaptive rule's estimate
// adds up over its up to 512 pieces (four times that here: the estimate of a
// law peaked at an end came out 1.3 times the plain sum). With that floor
// (noise_floor), 10^4 of 10^4 beside 8,000 of 10^4 is answered; it was
// refused at an estimate of 9e-11. A CDF error of e moves a bound by e over
// the density of the difference: at 10^6 attempts (floor about 5e-7,
// density about 10^3) by 5e-10.
constexpr double max_cdf_error = 1e-10;
constexpr double noise_pieces = 2048;
// Steps of the two root searches before they are a failure (Err:523).
constexpr int max_newton_steps = 60;
constexpr std::uintmax_t max_bracket_steps = 100;
constexpr const char* not_converged = "A credible bound's root search did not converge.";
// Depth 8 (256 pieces a side): a smooth integrand converges in a few; past
// that the estimate only chases rounding noise.
constexpr unsigned quad_depth = 8;

// P(X - Y <= d) is an integral over one law's window of its density times
// the other law's CDF: over Y, f_Y(t) F_X(t + d); over X, f_X(s)
// P(Y >= s - d). It runs over the narrower law, across whose window the wider
// law's CDF varies slowly: over the wider one, the narrow law's CDF is a step
// a few of its widths wide somewhere inside, which an adaptive rule cut only
// at the wide law's scale did not resolve (100 % of 10^4 against 80 % of 10^4
// was refused). Its derivative in d, the density of the difference, is the
// same integral with the other law's density.
struct split {
    const beta_law& over;   // integrated over
    const beta_law& other;  // its CDF (or density) in the integrand
    bool over_x;            // over is X: the integrand is f_X(s) P(Y >= s - d)
};

split split_of(const beta_law& x, const beta_law& y) {
    if (sd(x) < sd(y)) return {x, y, true};
    return {y, x, false};
}

// The point of the other law the integrand reads at v of the law integrated over.
double other_point(const split& sp, double v, double d) { return sp.over_x ? v - d : v + d; }

// The other law's part of the CDF integrand at its point u: F_X(u) over Y,
// P(Y >= u) over X; 0 or 1 beyond [0, 1].
double other_cdf(const split& sp, double u) {
    if (u <= 0) return sp.over_x ? 1.0 : 0.0;
    if (u >= 1) return sp.over_x ? 0.0 : 1.0;
    return sp.over_x ? boost::math::ibetac(sp.other.a, sp.other.b, u) : boost::math::ibeta(sp.other.a, sp.other.b, u);
}

// The law's window `w` cut at its mean (where its mass is) and where the
// other law's point crosses 0 or 1 (the integrand has a corner there), in
// order.
std::vector<double> pieces_of(const split& sp, double d, std::pair<double, double> w) {
    std::vector<double> cuts{w.first, w.second, mean(sp.over)};
    const double corners[2] = {sp.over_x ? d : -d, sp.over_x ? 1 + d : 1 - d};
    for (double c : corners)
        if (c > w.first && c < w.second) cuts.push_back(c);
    std::sort(cuts.begin(), cuts.end());
    // A corner's neighbouring pieces are halved, so that no piece has a
    // rough point at both ends (difference_cdf treats one end).
    std::vector<double> halves;
    for (std::size_t k = 0; k < cuts.size(); ++k)
        if (cuts[k] == corners[0] || cuts[k] == corners[1]) {
            if (k > 0) halves.push_back((cuts[k - 1] + cuts[k]) / 2);
            if (k + 1 < cuts.size()) halves.push_back((cuts[k] + cuts[k + 1]) / 2);
        }
    cuts.insert(cuts.end(), halves.begin(), halves.end());
    std::sort(cuts.begin(), cuts.end());
    return cuts;
}

double noise_floor(const beta_law& x, const beta_law& y) {
    return noise_pieces * std::numeric_limits<double>::epsilon() * std::max(x.a + x.b, y.a + y.b);
}

// The sum over the pieces of rule(a, b, &error estimate); no_convergence
// when the summed estimate passes `allowed`.
template <class T, class Rule>
T over_pieces(const std::vector<double>& cuts, double allowed, Rule rule) {
    T total = 0.0;
    double error = 0.0;
    for (std::size_t k = 0; k + 1 < cuts.size(); ++k) {
        if (!(cuts[k + 1] > cuts[k])) continue;
        double piece_error = 0.0;
        total += rule(cuts[k], cuts[k + 1], &piece_error);
        error += piece_error;
    }
    if (error > allowed)
        throw no_convergence("A credible bound's integral did not reach its accuracy (error estimate " +
                             format_short(error) + ").");
    return total;
}

// A law whose density has an unbounded derivative at an end (a parameter
// below 2: (1 - t)^0.5 next to 1 for b = 1.5, common with Jeffreys' prior)
// makes Gauss-Kronrod's estimate stall near 1e-6 at depth 8 (measured:
// 14.5 / 1.5 against 1.5 / 1.5 was refused): such end pieces are
// substituted (difference_cdf), and the quantile takes the bracketing
// search, whose CDFs can.
bool rough_ends(const beta_law& law) { return law.a < 2 || law.b < 2; }
constexpr double min_substituted = 0.25;

// P(X - Y <= d).
double difference_cdf(const beta_law& x, const beta_law& y, double d) {
    if (d <= -1) return 0.0;
    if (d >= 1) return 1.0;
    const split sp = split_of(x, y);
    auto f = [&](double v) {
        const double c = other_cdf(sp, other_point(sp, v, d));
        return c > 0 ? std::exp(log_density(sp.over, v)) * c : 0.0;
    };
    // The other law's ends (u = 0 and u = 1) as points of the integrated law.
    const double corners[2] = {sp.over_x ? d : -d, sp.over_x ? 1 + d : 1 - d};
    const auto w = window(sp.over);
    const double allowed = std::max(max_cdf_error, noise_floor(x, y));
    const double total = over_pieces<double>(pieces_of(sp, d, w), allowed, [&](double a, double b, double* error) {
        // End pieces where a law turns like t^p with p below 2: the
        // integrated law's own end (its density), or a corner where the other
        // law's point reaches 0 or 1 (its CDF; p its first parameter at 0, its
        // second at 1). An infinite density (p from 0.25 to 1, Jeffreys' 0.5
        // among them) is taken out by t = a + (b - a) v^(1/p), under which the
        // integrand is bounded and smooth. Otherwise tanh-sinh, whose nodes
        // crowd at the ends, on the piece measured from its rough end
        // (tau in [0, b - a]): measured from a it rounded its nodes onto a
        // itself away from 0, which Boost asserts against. Gauss-Kronrod
        // elsewhere.
        using gk = boost::math::quadrature::gauss_kronrod<double, 61>;
        auto from_end = [&](double p, bool low_end) {
            const double width = b - a;
            if (p < 1 && p >= min_substituted) {
                auto g = [&](double v) {
                    if (!(v > 0)) return 0.0;
                    const double t = low_end ? a + width * std::pow(v, 1 / p) : b - width * std::pow(v, 1 / p);
                    return f(t) * width / p * std::pow(v, 1 / p - 1);
                };
                return gk::integrate(g, 0.0, 1.0, quad_depth, cdf_tolerance, error);
            }
            auto g = [&](double tau) { return f(low_end ? a + tau : b - tau); };
            return boost::math::quadrature::tanh_sinh<double>(12).integrate(g, 0.0, width, 1e-12, error);
        };
        if (a == w.first && sp.over.a < 2) return from_end(sp.over.a, true);
        if (b == w.second && sp.over.b < 2) return from_end(sp.over.b, false);
        for (const auto& [corner, p] : {std::pair{corners[0], sp.other.a}, std::pair{corners[1], sp.other.b}}) {
            if (!(p < 2)) continue;
            if (a == corner) return from_end(p, true);
            if (b == corner) return from_end(p, false);
        }
        return gk::integrate(f, a, b, quad_depth, cdf_tolerance, error);
    });
    return std::clamp(total, 0.0, 1.0);
}

// P(X - Y <= d) and, scaled by `scale`, its density, in one adaptive
// Gauss-Kronrod pass over the narrower law's window `w` with a complex
// integrand (real part the CDF's integrand, imaginary part the density's
// times scale). For laws without an infinite end.
std::pair<double, double> difference_cdf_density(const split& sp, double d, std::pair<double, double> w,
                                                 double scale) {
    auto f = [&](double v) {
        const double u = other_point(sp, v, d);
        const double c = other_cdf(sp, u);
        if (u <= 0 || u >= 1) return std::complex<double>(c > 0 ? std::exp(log_density(sp.over, v)) * c : 0.0, 0.0);
        const double fo = std::exp(log_density(sp.over, v));
        return std::complex<double>(fo * c, fo * boost::math::ibeta_derivative(sp.other.a, sp.other.b, u) * scale);
    };
    const double allowed = std::max(max_cdf_error, noise_floor(sp.over, sp.other));
    const auto total = over_pieces<std::complex<double>>(pieces_of(sp, d, w), allowed, [&](double a, double b,
                                                                                         double* error) {
        return boost::math::quadrature::gauss_kronrod<double, 61>::integrate(f, a, b, quad_depth, cdf_tolerance,
                                                                            error);
    });
    return {std::clamp(total.real(), 0.0, 1.0), total.imag() / scale};
}

// The quantile by Newton's method from the normal approximation, each step
// one pass giving the CDF and the density together; a step that would leave
// the bracket known so far is replaced by bisection. Two or three passes
// where the bracketing search took seven to eleven integrals (measured).
double difference_quantile_newton(const beta_law& x, const beta_law& y, double q) {
    const double spread = std::hypot(sd(x), sd(y));
    // A CDF needs no tails beyond its own accuracy: the integrated law's
    // quantiles at 1e-16 (what is cut is below 2e-16, absolute), a window
    // about 3 times narrower than the 1e-100 one of the probabilities that
    // may be tiny.
    const split sp = split_of(x, y);
    const std::pair<double, double> w{tail_point(sp.over, 1e-16, false), tail_point(sp.over, 1e-16, true)};
    double lo = -1.0, hi = 1.0;
    double d = std::clamp(mean(x) - mean(y) + spread * boost::math::quantile(boost::math::normal(), q), -1.0, 1.0);
    for (int step = 0; step < max_newton_steps; ++step) {
        const auto [cdf, density] = difference_cdf_density(sp, d, w, spread);
        const double g = cdf - q;
        (g < 0 ? lo : hi) = d;
        double next = d - g / density;
        if (!(density > 0) || !(next > lo && next < hi)) next = (lo + hi) / 2;
        // Converged: what remains after a Newton step of size e is about
        // e^2 f''/(2 f'), below 1e-11 for e < 3e-7 at these spreads.
        if (std::fabs(next - d) < 3e-7 * std::min(1.0, spread / 0.01) || hi - lo < 1e-12) return next;
        d = next;
    }
    throw no_convergence(not_converged);
}

double difference_quantile(const beta_law& x, const beta_law& y, double q) {
    if (!rough_ends(x) && !rough_ends(y)) return difference_quantile_newton(x, y, q);
    auto f = [&](double d) { return d <= -1 ? -q : d >= 1 ? 1 - q : difference_cdf(x, y, d) - q; };
    // Start at the normal approximation's quantile and step away from it,
    // doubling the step, until the root is bracketed: two or three integrals
    // where a wide symmetric bracket took four to eight (measured).
    const double spread = std::hypot(sd(x), sd(y));
    const double guess = std::clamp(mean(x) - mean(y) + spread * boost::math::quantile(boost::math::normal(), q),
                                    -1.0, 1.0);
    double a = guess, fa = f(a), b = a, fb = fa;
    const double direction = fa < 0 ? 1.0 : -1.0;
    for (double step = 0.25 * spread; (fb < 0) == (fa < 0); step *= 2) {
        a = b;
        fa = fb;
        b = std::clamp(a + direction * step, -1.0, 1.0);
        fb = f(b);
        if (b == -1.0 || b == 1.0) break;
    }
    if (a > b) {
        std::swap(a, b);
        std::swap(fa, fb);
    }
    std::uintmax_t iterations = max_bracket_steps;
    // An absolute tolerance: a bound near 0 needs no relative digits.
    const auto r = boost::math::tools::toms748_solve(
        f, a, b, fa, fb, [](double u, double v) { return std::fabs(u - v) < 1e-12; }, iterations);
    if (iterations >= max_bracket_steps) throw no_convergence(not_converged);
    return (r.first + r.second) / 2;
}

}  // namespace

interval difference(const beta_law& x, const beta_law& y, double level) {
    level = arguments::level(level, "level");
    // Laws with their mass nearer 1 are mirrored: X - Y = (1 - Y) - (1 - X),
    // and next to 0 a double resolves a law of 10^6 attempts within 1e-6 of
    // the end to every digit, where next to 1 it has only its last ten.
    if (mean(x) + mean(y) > 1) {
        const beta_law mx = mirrored(y), my = mirrored(x);
        return {difference_quantile(mx, my, (1 - level) / 2), difference_quantile(mx, my, (1 + level) / 2)};
    }
    return {difference_quantile(x, y, (1 - level) / 2), difference_quantile(x, y, (1 + level) / 2)};
}

}  // namespace tallyrates::bayes
