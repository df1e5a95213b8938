// guard.cpp - see guard.hpp.
#include "guard.hpp"

#include <boost/math/policies/error_handling.hpp>
#include <cmath>
#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/sheet/NoConvergenceException.hpp>
#include <com/sun/star/uno/RuntimeException.hpp>
#include <new>
#include <stdexcept>

#include "tallyrates/core/errors.hpp"

namespace tallyrates::uno {

namespace {
[[noreturn]] void err523(const std::string& message) { throw css::sheet::NoConvergenceException(ou(message), {}); }
std::string numerical(const std::exception& e) {
    return std::string("A numerical routine could not reach a reliable result for these counts (") + e.what() + ").";
}
}  // namespace

void rethrow_for_calc() {
    try {
        throw;
    } catch (const invalid_input& e) {
        throw css::lang::IllegalArgumentException(ou(e.what()), {}, 0);
    } catch (const budget_exceeded& e) {
        err523(e.what());
    } catch (const no_convergence& e) {
        err523(e.what());
    } catch (const unreachable_target& e) {
        err523(e.what());
    } catch (const boost::math::evaluation_error& e) {  // derives from std::runtime_error
        err523(numerical(e));
    } catch (const boost::math::rounding_error& e) {  // likewise
        err523(numerical(e));
    } catch (const std::domain_error& e) {  // Boost.Math domain and pole errors
        err523(numerical(e));
    } catch (const std::overflow_error& e) {
        err523(numerical(e));
    } catch (const std::underflow_error& e) {
        err523(numerical(e));
    } catch (const std::bad_alloc&) {
        err523("Not enough memory for this calculation.");
    } catch (const css::uno::Exception&) {
        throw;  // already a UNO exception (from the UNO runtime itself)
    } catch (const std::exception& e) {
        throw css::uno::RuntimeException(ou(std::string("tallyrates internal error: ") + e.what()));
    } catch (...) {
        throw css::uno::RuntimeException("tallyrates internal error");
    }
}

double finite(double v) {
    if (!std::isfinite(v)) throw no_convergence("The result is not a finite number.");
    return v;
}

}  // namespace tallyrates::uno
