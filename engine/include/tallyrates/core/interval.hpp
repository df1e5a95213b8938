// interval.hpp - a pair of bounds on a rate or a difference of rates, as
// every family hands them back (confidence, credible and decision bounds).
#pragma once

namespace tallyrates {

struct interval {
    double low = 0.0;
    double high = 1.0;
};

}  // namespace tallyrates
