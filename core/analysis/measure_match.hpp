// Measured frequencies against tunings: which note each measured tone is and how far from its
// target at a pitch standard, the beat rates of a tuner's intervals as the instrument plays
// them beside the target's, and which tunings of a set the measured notes fit best, each at
// its own best pitch standard. Works on frequencies in Hz; finding them in sound is
// core/sound/measure's job.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "core/analysis/sheet.hpp"

namespace terzo {

/// One measured tone named against a tuning.
struct NoteCheck {
    NoteName note;            ///< the tuning's note nearest to the tone
    double hz = 0;            ///< measured
    double target_hz = 0;     ///< the note in the tuning at the pitch standard
    double deviation_cents = 0; ///< measured above (+) or below (-) the target
    double deviation_hz = 0;
};

/// The note of the map nearest (in cents) to a tone of hz (> 0) and its deviation.
NoteCheck check_note(const NoteMap& map, double hz);

/// A tuner's interval between two measured notes: its beat as played and as it should be.
struct IntervalCheck {
    const CheckedInterval* kind = nullptr;
    NoteName low, high;
    Beat measured; ///< from the two measured frequencies (never exact)
    Beat target;   ///< from the tuning at the pitch standard
};

/// The checked interval between two measured notes (in either order), if they are one apart:
/// what a tuner hears after setting `b` against `a`.
std::optional<IntervalCheck> check_interval(const NoteMap& map, const NoteCheck& a, const NoteCheck& b);

/// Every pair of measured notes a checked interval apart (checked_intervals(): fifths,
/// fourths, thirds, sixths), ordered by kind, then by low note. A note measured more than once
/// counts with its last measurement.
std::vector<IntervalCheck> check_intervals(const NoteMap& map, const std::vector<NoteCheck>& notes);

/// A measured interval this close to its pure ratio (in cents) is called pure: closer than a
/// measurement of two separate notes can tell.
constexpr double measured_pure_tolerance = 0.1;

/// The beat of two measured tones against the pure ratio of `kind`: wide or narrow by the
/// sign of the size's difference from it, pure within measured_pure_tolerance (the beat rate
/// is still the computed one).
Beat measured_beat(double f_low, double f_high, const CheckedInterval& kind);

/// How closely measured tones fit one 12-note tuning at its best pitch standard.
struct TuningFit {
    std::string name;
    PitchReference reference; ///< the standard that fits best (the guess's note)
    double rms_cents = 0;     ///< RMS deviation of the tones from their nearest notes
};

/// Pitch standards searched around a guess (cents below and above it): from A4 = 381 to 479 Hz
/// around A4 = 440, which covers the standards tuners use (392, 415, 430, 440, 465 ...).
struct StandardRange {
    double below_cents = 250, above_cents = 150;
};

/// The reference frequency (of the guess's note, within the range around the guess's
/// frequency) at which the tones deviate least (RMS) from the nearest notes of the tuning,
/// with degree 0 on `tonic`. Tones must be > 0 and at least one. Equal fits are decided for
/// the standard nearest the guess (an equal temperament fits as well a semitone away).
/// Throws InputError at `name` unless the scale has 12 degrees.
TuningFit fit_tuning(const Scale& scale, const std::string& name, int tonic,
                     const PitchReference& guess, const std::vector<double>& hz,
                     const StandardRange& range = {});

/// fit_tuning for each candidate (all must have 12 degrees), best (lowest RMS) first, ties
/// by name.
std::vector<TuningFit> closest_tunings(const std::vector<std::pair<std::string, Scale>>& candidates,
                                       int tonic, const PitchReference& guess,
                                       const std::vector<double>& hz,
                                       const StandardRange& range = {});

} // namespace terzo
