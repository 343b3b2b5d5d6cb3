// Keyboard: a scale laid over absolute pitch. Degree 0 of the lowest period sounds at the
// reference frequency; the keyboard spans whole periods and closes with degree 0 of the
// period above, so a 12-note scale with span 1 has 13 notes. Notes off the keyboard (any
// period, also negative) are available too, for landings.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "core/arith/pitch.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// The default reference: C4 when A4 = 440 Hz in 12-tone equal temperament (440 * 2^(-9/12)).
inline constexpr double default_ref_hz = 261.6255653;
/// Limits on a keyboard (checked by the Keyboard constructor).
inline constexpr int max_span = 11;             ///< periods
inline constexpr double min_ref_hz = 0.001;     ///< Hz
inline constexpr double max_ref_hz = 100000.0;  ///< Hz
inline constexpr double min_period_cents = 1.0; ///< smallest period a keyboard accepts
inline constexpr double min_note_hz = 1e-6;     ///< every keyboard note lies in this range
inline constexpr double max_note_hz = 1e9;

/// One note: a degree of the scale in a given period, with its frequency.
struct Note {
    int degree = 0;      ///< index into Scale::degrees()
    int period = 0;      ///< 0 is the keyboard's lowest period; may be negative or above the span
    double hz = 0.0;     ///< frequency in Hz
    double cents = 0.0;  ///< size above the reference in cents
    Pitch pitch;         ///< interval above the reference: degree * period^p, exact when the scale is
    bool on_scale = true; ///< false for a chord note given by a ratio that is not itself a note

    /// The exact ratio to the reference, when the note is rational.
    std::optional<Ratio> ratio() const { return pitch.ratio(); }
};

class Keyboard {
public:
    /// Lays `scale` over `span` periods from `ref_hz`. Throws InputError naming Setting::ref_hz
    /// or Setting::span when ref_hz is outside [min_ref_hz, max_ref_hz] or span outside [1, max_span],
    /// and naming `tuning_name` (the tuning's file) when the period is below min_period_cents
    /// or a note would sound outside [min_note_hz, max_note_hz].
    Keyboard(Scale scale, double ref_hz = default_ref_hz, int span = 1,
             const std::string& tuning_name = "tuning");

    const Scale& scale() const { return scale_; }
    double ref_hz() const { return ref_hz_; }
    int span() const { return span_; }
    /// Size of the period in cents.
    double period_cents() const { return period_cents_; }
    /// The keyboard's notes, period by period, degrees in scale order, then the closing note.
    const std::vector<Note>& notes() const { return notes_; }
    /// The note of `degree` (0 <= degree < scale().size()) in any period.
    Note note(int degree, int period) const;
    /// The exact ratio to the reference of note (degree, period) when the scale is rational there
    /// (period powers are cached, so this is cheap on the hot path).
    std::optional<Ratio> note_ratio(int degree, int period) const;

    /// Degrees sorted by their position inside the period, for nearest-note searches: each
    /// entry is (cents reduced into [0, period), degree, how many periods the reduction moved).
    struct SortedDegree {
        double cents_in_period;
        int degree;
        int shift; ///< degree cents = cents_in_period + shift * period_cents
    };
    const std::vector<SortedDegree>& sorted_degrees() const { return sorted_; }

private:
    Scale scale_;
    double ref_hz_;
    int span_;
    double period_cents_;
    std::vector<Note> notes_;
    std::vector<SortedDegree> sorted_;
    std::vector<std::optional<Ratio>> degree_ratios_; // each degree's ratio, when rational
    int power_offset_ = 0;                    // period_powers_[p + power_offset_] = period^p
    std::vector<Ratio> period_powers_;        // only when the period is rational
};

} // namespace terzo
