// pairwise.cpp - observed differences of rates.
#include "tallyrates/pairwise.hpp"

#include "tallyrates/errors.hpp"
#include "tallyrates/text.hpp"

namespace tallyrates::pairwise {

const group& group_with_attempts(const counts& c, double pos, const char* argument) {
    const group& g = c.at_position(pos, argument);
    if (g.attempts == 0)
        throw invalid_input(std::string("The argument ") + argument + " names position " +
                                std::to_string(g.position) + ", which has no attempts yet.",
                            g.position);
    return g;
}

double difference(const counts& c, double i, double j) {
    return group_with_attempts(c, i, "i").rate() - group_with_attempts(c, j, "j").rate();
}

}  // namespace tallyrates::pairwise
