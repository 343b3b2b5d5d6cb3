// Beat rates: two tones near a simple ratio p/q beat at the rate their coinciding partials
// differ, |q*f_high - p*f_low| (the q-th partial of the upper tone against the p-th of the
// lower). A tuner hears this rate and whether the interval is wide or narrow of pure.
#pragma once

#include <string>
#include <vector>

#include "core/arith/pitch.hpp"

namespace terzo {

/// Where an interval lies against its pure ratio.
enum class Tempering { pure, wide, narrow };

/// "pure", "wide" or "narrow".
std::string tempering_name(Tempering t);

/// An interval a tuner checks: its name, the pure ratio p/q (p > q, lowest terms) and its
/// size in 12-tone semitones.
struct CheckedInterval {
    std::string name; ///< "fifth", "major third" …
    int p = 3, q = 2;
    int semitones = 7;
    Ratio pure() const { return Ratio(p, q); }
};

/// The intervals on a tuner's sheet: fifth 3/2, fourth 4/3, major third 5/4, minor third
/// 6/5, major sixth 5/3, in that order.
const std::vector<CheckedInterval>& checked_intervals();
/// The octave 2/1 (12 semitones), used by tuning orders.
const CheckedInterval& octave_interval();

/// One interval's beating.
struct Beat {
    double hz = 0;    ///< beats per second, |q*f_high - p*f_low|, never negative
    double cents = 0; ///< size of the interval minus the pure ratio, in cents
    Tempering tempering = Tempering::pure;
    bool exact = false; ///< true when purity was decided exactly (both pitches exact)
};

/// |q*f_high - p*f_low| for tones f_low, f_high in Hz (any order of size is allowed).
double beat_rate(double f_low, double f_high, int p, int q);

/// A cents-only interval this close to its pure ratio (in cents) counts as pure, with
/// Beat::exact false: the rounding of a value typed to four decimals, as in a .scl file.
constexpr double cents_only_pure_tolerance = 0.00005;

/// The beat of an interval (the upper note over the lower, as a Pitch) whose lower note
/// sounds at f_low Hz, against the pure ratio p/q. Pure means exactly equal when the
/// interval is exact; a cents-only interval is pure within cents_only_pure_tolerance.
Beat beat(const Pitch& interval, double f_low, const CheckedInterval& against);

} // namespace terzo
