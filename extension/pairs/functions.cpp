// pairs/functions.cpp - the worksheet methods of the pairs family:
// comparisons of two groups. Each converts its arguments, calls the engine
// and returns, inside `guarded`.
#include "../addin.hpp"
#include "../guard.hpp"
#include "tallyrates/pairwise.hpp"

namespace tallyrates::uno {

double rates::diff(const caller& document, const cells& successes, const cells& attempts, double i, double j) {
    return guarded(
        [&] { return finite(pairwise::difference(convert::counts_of(document, successes, attempts), i, j)); });
}

}  // namespace tallyrates::uno
