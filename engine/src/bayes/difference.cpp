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
// The summed error estimate beyond which a CDF is a failure (Err:523).
constexpr double max_cdf_error = 1e-11;
// Steps of the two root searches before they are a failure (Err:523).
constexpr int max_newton_steps = 60;
constexpr std::uintmax_t max_bracket_steps = 100;
constexpr const char* not_converged = "A credible bound's root search did not converge.";
// Depth 8 (256 pieces a side): a smooth integrand converges in a few; past
// that the estimate only chases rounding noise.
constexpr unsigned quad_depth = 8;

// Y's window `w` cut at Y's mean (where its mass is) and where t + d crosses
// 0 or 1 (the integrand has a corner there), in order.
std::vector<double> pieces_of(const beta_law& y, double d, std::pair<double, double> w) {
    std::vector<double> cuts{w.first, w.second, mean(y)};
    for (double c : {-d, 1 - d})
        if (c > w.first && c < w.second) cuts.push_back(c);
    std::sort(cuts.begin(), cuts.end());
    return cuts;
}

// The sum over the pieces of rule(a, b, &error estimate); no_convergence
// when the summed estimate passes max_cdf_error.
template <class T, class Rule>
T over_pieces(const std::vector<double>& cuts, Rule rule) {
    T total = 0.0;
    double error = 0.0;
    for (std::size_t k = 0; k + 1 < cuts.size(); ++k) {
        if (!(cuts[k + 1] > cuts[k])) continue;
        double piece_error = 0.0;
        total += rule(cuts[k], cuts[k + 1], &piece_error);
        error += piece_error;
    }
    if (error > max_cdf_error)
        throw no_convergence("A credible bound's integral did not reach its accuracy (error estimate " +
                             format_short(error) + ").");
    return total;
}

// P(X - Y <= d).
double difference_cdf(const beta_law& x, const beta_law& y, double d) {
    if (d <= -1) return 0.0;
    if (d >= 1) return 1.0;
    auto f = [&](double t) {
        const double s = t + d;
        const double fx = s <= 0 ? 0.0 : s >= 1 ? 1.0 : boost::math::ibeta(x.a, x.b, s);
        return fx > 0 ? std::exp(log_density(y, t)) * fx : 0.0;
    };
    const double total = over_pieces<double>(pieces_of(y, d, window(y)), [&](double a, double b, double* error) {
        return singular_ends(y)
                   ? boost::math::quadrature::tanh_sinh<double>(12).integrate(f, a, b, 1e-12, error)
                   : boost::math::quadrature::gauss_kronrod<double, 61>::integrate(f, a, b, quad_depth,
                                                                                     cdf_tolerance, error);
    });
    return std::clamp(total, 0.0, 1.0);
}

// P(X - Y <= d) and, scaled by `scale`, its density, in one adaptive
// Gauss-Kronrod pass over Y's window with a complex integrand (real part
// f_Y(t) F_X(t + d), imaginary part f_Y(t) f_X(t + d) scale). For laws
// without an infinite end; `w` is Y's window.
std::pair<double, double> difference_cdf_density(const beta_law& x, const beta_law& y, double d,
                                                 std::pair<double, double> w, double scale) {
    auto f = [&](double t) {
        const double s = t + d;
        if (s <= 0) return std::complex<double>(0.0, 0.0);
        const double fy = std::exp(log_density(y, t));
        if (s >= 1) return std::complex<double>(fy, 0.0);
        return std::complex<double>(fy * boost::math::ibeta(x.a, x.b, s),
                                    fy * boost::math::ibeta_derivative(x.a, x.b, s) * scale);
    };
    const auto total = over_pieces<std::complex<double>>(pieces_of(y, d, w), [&](double a, double b, double* error) {
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
    // A CDF needs no tails beyond its own accuracy: Y's quantiles at 1e-16
    // (what is cut is below 2e-16, absolute), a window about 3 times
    // narrower than the 1e-100 one of the probabilities that may be tiny.
    const std::pair<double, double> w{tail_point(y, 1e-16, false), tail_point(y, 1e-16, true)};
    double lo = -1.0, hi = 1.0;
    double d = std::clamp(mean(x) - mean(y) + spread * boost::math::quantile(boost::math::normal(), q), -1.0, 1.0);
    for (int step = 0; step < max_newton_steps; ++step) {
        const auto [cdf, density] = difference_cdf_density(x, y, d, w, spread);
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
    if (!singular_ends(x) && !singular_ends(y)) return difference_quantile_newton(x, y, q);
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
    return {difference_quantile(x, y, (1 - level) / 2), difference_quantile(x, y, (1 + level) / 2)};
}

}  // namespace tallyrates::bayes
