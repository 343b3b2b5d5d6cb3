// Chords: several notes sounding together. All pairwise combination tones, and the chord's
// common resultant bass: the largest frequency of which every note is an integer multiple
// (exact when the notes' ratios are rational), or a labelled approximation within a tolerance.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "core/analysis/combination.hpp"
#include "core/error.hpp"

namespace terzo {

inline constexpr std::size_t max_chord_notes = 32; ///< --chord
/// Default tolerance (cents) for the approximate bass of an inexact chord.
inline constexpr double default_bass_tolerance_cents = 10.0;
/// Largest multiple tried for the lowest note of an inexact chord.
inline constexpr int max_bass_multiple = 64;

/// Parses a chord: comma-separated items, each a degree number (numbers past the last degree
/// continue into the next periods: 12 in a 12-note scale is degree 0 of period 1) or a ratio
/// "p/q" to the reference. Throws InputError at `pos` (e.g. source "--chord").
std::vector<Note> parse_chord(const std::string& text, const Keyboard& keyboard,
                              const SourcePos& pos);

/// Calls visit(dyad) for every pair of chord notes, lower note first (pairs by the notes'
/// order in pitch), one at a time in a reused DyadTones. Throws InputError before the first
/// visit when the options are out of range or the request would exceed max_tones.
void for_each_chord_dyad(const Keyboard& keyboard, const std::vector<Note>& chord,
                         const ToneOptions& options, const std::function<void(const DyadTones&)>& visit);

/// The tones of every pair of chord notes, lower note first, kept.
std::vector<DyadTones> chord_tones(const Keyboard& keyboard, const std::vector<Note>& chord,
                                   const ToneOptions& options);

struct CommonBass {
    double hz = 0.0;
    double cents = 0.0;                ///< above the reference
    std::optional<Ratio> ratio;        ///< exact ratio to the reference, when rational
    std::optional<PrimeVector> vector; ///< exact tempered value (notes tempered, ratios rational)
    bool approximate = false;          ///< true: best fit within the tolerance, not exact
    bool found = true;                 ///< false: no bass within the tolerance (approximate only)
    std::vector<std::string> multiples; ///< each note / bass, as integers (exact or rounded)
    double max_error_cents = 0.0;      ///< approximate only: worst note's distance from its multiple
    Landing landing;
};

/// The chord's common resultant bass (see the header comment); tolerance in cents for
/// inexact chords.
CommonBass common_bass(const Keyboard& keyboard, const std::vector<Note>& chord,
                       double tolerance_cents = default_bass_tolerance_cents);

} // namespace terzo
