// Growing (or thinning) a scale by its resultants: for each candidate pitch, the fit of
// `terzo resultants` (fit.hpp) for the scale with that pitch added as a degree, and how many
// resultants then land on it; for each degree, the fit without it. Adding is incremental:
// the tones of the existing dyads do not change, only their landings (a new note can only
// take a landing), and only the new note's dyads are computed.
#pragma once

#include <cstddef>
#include <optional>
#include <vector>

#include "core/analysis/fit.hpp"
#include "core/analysis/keyboard.hpp"

namespace terzo {

struct SuggestOptions {
    ToneOptions tones;   ///< order and partials, as for `terzo resultants`
    FitOptions fit;      ///< which tones count (suggest's default floor: pitch_perception_floor_hz)
    /// A resultant within this many cents of the new note counts as a near landing.
    double near_cents = 5.0;
    /// Set: the fit of this chord's resultants instead of every dyad of the keyboard (the
    /// chord's notes keep their pitches; adding a note only moves landings).
    std::optional<std::vector<Note>> chord;
};

/// One candidate added to the scale.
struct Addition {
    Pitch pitch;              ///< inside the period
    double fit = 0.0;         ///< rms_cents of the grown scale, as `terzo resultants` reports it
    double gain = 0.0;        ///< base fit minus fit (positive: better)
    std::size_t exact_landings = 0;  ///< counted tones proven equal to a note of the new degree
    std::size_t near_landings = 0;   ///< counted tones landing on it within near_cents (exact included)
    /// Counted tones below pitch_perception_floor_hz that land on the new note within
    /// near_cents (only when the floor lets such tones count).
    std::size_t infrasonic_landings = 0;
    /// The gain comes from tones below pitch_perception_floor_hz: positive overall, but none
    /// (or a loss) over the tones at or above it.
    bool gain_is_infrasonic = false;
};

/// One degree taken out of the scale.
struct Removal {
    int degree = 0;    ///< 1 .. size - 1 of the original scale
    double fit = 0.0;  ///< rms_cents of the scale without it
    double gain = 0.0; ///< base fit minus fit
};

struct Suggestions {
    double base_fit = 0.0;       ///< the scale's own fit (rms_cents)
    std::size_t base_tones = 0;  ///< the tones that count in it
    std::vector<Addition> add;   ///< best first (lowest fit; equal fits by pitch)
    std::vector<Removal> remove; ///< best first (lowest fit; equal fits by degree)
};

/// The scale with `pitch` added as a degree, placed by size among the degrees inside the
/// period (so a sorted scale stays sorted); its index is returned in `index` when given.
Scale grown_scale(const Scale& scale, const Pitch& pitch, std::size_t* index = nullptr);
/// The scale without degree `degree` (1 <= degree < size).
Scale shrunk_scale(const Scale& scale, std::size_t degree);

/// Scores every candidate (pitches inside the period and not in the scale, see
/// new_candidates) incrementally, and with `removals` every degree but 0 from scratch.
/// Throws InputError like keyboard_tones when the grown keyboard would exceed max_tones.
Suggestions suggest(const Keyboard& keyboard, const std::vector<Pitch>& candidates,
                    const SuggestOptions& options, bool removals);

/// One candidate scored from scratch (the grown scale's keyboard, all its tones, its fit;
/// `base_fit` is the scale's own): the reference the incremental path is tested and
/// benchmarked against.
Addition addition_from_scratch(const Keyboard& keyboard, const Pitch& candidate,
                               const SuggestOptions& options, double base_fit);

} // namespace terzo
