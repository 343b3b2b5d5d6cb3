// Landing: where a tone falls against a tuning: the nearest note of the scale extended over
// all periods, and the signed deviation in cents (positive when the tone is above the note).
// Floating point finds the nearest note; exact arithmetic alone decides that a tone
// coincides with it. No tolerance ever turns "very close" into "exact".
#pragma once

#include <optional>
#include <vector>

#include "core/analysis/keyboard.hpp"

namespace terzo {

struct Landing {
    int degree = 0;               ///< degree of the nearest note
    int period = 0;               ///< its period (negative below the keyboard)
    double deviation_cents = 0.0; ///< tone minus note, in cents; exactly 0 when `exact`
    /// True only when the tone is proven equal to the note (both exact and comparable).
    /// False means "not proven equal": either proven different, or a cents-only value for
    /// which only a tolerance could say, and terzo never uses one for this.
    bool exact = false;
};

/// The nearest note to a tone `cents` above the reference, by floating point alone (exact is
/// false). When two notes are equally near the lower one wins.
Landing nearest_note(const Keyboard& keyboard, double cents);

/// The landing of an exactly known tone (an interval above the reference): nearest note by
/// floating point, then exact comparison where the deviation is within rounding error.
Landing landing(const Keyboard& keyboard, const Pitch& tone);

/// The landing of a rational tone whose cents were computed in floating point with a known
/// error bound (cents). Used by the combination engine's fast path.
Landing landing(const Keyboard& keyboard, double cents, const Ratio& tone, double error_cents);

/// A keyboard's degrees laid out for many nearest-note searches (the resultant engine's hot
/// path): the two notes around a tone by one binary search, with the same choices as
/// nearest_note (ties to the lower note, the lowest-numbered of degrees at one pitch).
class NoteFinder {
public:
    explicit NoteFinder(const Keyboard& keyboard);
    /// The nearest note (exactly nearest_note's answer) and the other neighbour, both with
    /// exact = false.
    struct Around {
        Landing nearer, other;
    };
    Around around(double cents) const;

private:
    struct Side {
        double cents_in_period;
        int degree;
        int period_shift; ///< landing period = tone's period + period_shift
        int step;         ///< 0, or -1/+1 for a neighbour in the period below/above
    };
    double period_;
    std::vector<double> cuts_;              // sorted cents inside the period
    std::vector<std::size_t> bucket_;       // a guess of the upper bound per slice of the period
    double buckets_per_cent_;
    std::vector<Side> below_, above_;       // indexed by the upper bound of `in` in cuts_
};

} // namespace terzo
