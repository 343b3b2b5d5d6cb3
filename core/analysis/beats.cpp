#include "core/analysis/beats.hpp"

#include <cmath>

namespace terzo {

std::string tempering_name(Tempering t) {
    switch (t) {
    case Tempering::pure:
        return "pure";
    case Tempering::wide:
        return "wide";
    case Tempering::narrow:
        break;
    }
    return "narrow";
}

const std::vector<CheckedInterval>& checked_intervals() {
    static const std::vector<CheckedInterval> list = {
        {"fifth", 3, 2, 7},       {"fourth", 4, 3, 5},      {"major third", 5, 4, 4},
        {"minor third", 6, 5, 3}, {"major sixth", 5, 3, 9},
    };
    return list;
}

const CheckedInterval& octave_interval() {
    static const CheckedInterval octave{"octave", 2, 1, 12};
    return octave;
}

double beat_rate(double f_low, double f_high, int p, int q) {
    return std::fabs(q * f_high - p * f_low);
}

Beat beat(const Pitch& interval, double f_low, const CheckedInterval& against) {
    Pitch pure = Pitch::from_ratio(against.pure());
    Beat b;
    b.cents = interval.cents() - pure.cents();
    // f_high = f_low * r, so q*f_high - p*f_low = f_low * (q*r - p) = p*f_low*(r/(p/q) - 1).
    // Written with the deviation it keeps its digits when the interval is nearly pure.
    b.hz = std::fabs(against.p * f_low * std::expm1(b.cents / 1200.0 * std::log(2.0)));
    if (auto equal = exactly_equal(interval, pure)) {
        b.exact = true;
        if (*equal) {
            b.tempering = Tempering::pure;
            b.hz = 0;
            b.cents = 0;
            return b;
        }
    } else if (std::fabs(b.cents) <= cents_only_pure_tolerance) {
        b.hz = 0;
        return b; // pure as far as a cents-only value can tell; `exact` stays false
    }
    // Exact but unequal: the sign of the double deviation is trusted, as it can only be
    // wrong within ~1e-12 cents of pure, where either word describes the same sound.
    b.tempering = b.cents > 0 ? Tempering::wide : Tempering::narrow;
    return b;
}

} // namespace terzo
