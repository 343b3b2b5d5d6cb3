// The tuner's sheet: a 12-note tuning laid over the keyboard at a reference pitch (A4 = 415,
// C4 = 256 …), with every note's frequency and offset from 12-tone equal temperament, the
// beat rates of the intervals a tuner checks, and an order for setting the temperament by
// ear (alternating fifths and fourths through one octave, then octaves).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "core/analysis/beats.hpp"
#include "core/tuning/note_names.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// A 12-note tuning on the keyboard: degree d sounds on pitch class tonic + d, degree 0 of
/// octave 4 is the tonic in octave 4 (C4 when the tonic is C), periods stack above and below,
/// and the reference note sounds at the reference frequency.
/// The periods a NoteMap accepts as octaves: a stretched or compressed octave, at most a
/// quarter tone from 2/1, still takes octave numbers; a 3/1 period does not.
inline constexpr double min_octave_cents = 1150, max_octave_cents = 1250;

class NoteMap {
  public:
    /// Throws InputError at {source} unless the scale has exactly 12 degrees and its period
    /// lies within min_octave_cents..max_octave_cents.
    NoteMap(const Scale& scale, int tonic, PitchReference ref, const std::string& source);

    int tonic() const { return tonic_; }
    const PitchReference& reference() const { return ref_; }
    /// The scale degree a note plays.
    int degree_of(const NoteName& n) const;
    /// The note's interval above the tonic in octave 4 (exact when the tuning is).
    Pitch position(const NoteName& n) const;
    /// The interval from low to high (exact when the tuning is).
    Pitch interval(const NoteName& low, const NoteName& high) const;
    /// Frequency in Hz at the reference.
    double hz(const NoteName& n) const;
    /// Cents above (+) or below (-) 12-tone equal temperament at the same reference.
    double offset_from_equal(const NoteName& n) const;

  private:
    std::vector<Pitch> degrees_;
    Pitch period_;
    int tonic_;
    PitchReference ref_;
    double ref_position_cents_;
};

/// One fifth of the circle of fifths: from pitch class `from` to from + 7, how far from 3/2.
struct CircleFifth {
    int from = 0;
    Beat beat; ///< at the lower note in octave 4 (C4-G4 … B4-F#5)
};
/// The twelve fifths in circle order from the tonic (C-G, G-D … F-C for tonic C).
std::vector<CircleFifth> fifth_circle(const NoteMap& map);

/// What a sheet covers. The range must span at least an octave; its lowest 12 notes are the
/// temperament octave that the tuning order sets by fifths and fourths.
struct SheetOptions {
    PitchReference reference;       ///< A4 = 440 Hz unless given
    int tonic = 0;                  ///< pitch class of degree 0 (C)
    NoteName low{5, 3}, high{5, 4}; ///< F3..F4
    std::optional<NoteName> start;  ///< first note of the order; default: the reference's pitch
                                    ///< class in the temperament octave
    bool rising = true;             ///< up a fifth, down a fourth (else down a fifth, up a fourth)
    Spelling spelling = Spelling::mixed;
};

/// One note of the range.
struct SheetNote {
    NoteName note;
    int degree = 0;
    Pitch position; ///< interval above the tonic in octave 4
    double hz = 0;
    double offset = 0; ///< cents from 12-TET at the same reference
};

/// One checked interval between two notes of the range.
struct SheetInterval {
    const CheckedInterval* kind = nullptr;
    NoteName low, high;
    double low_hz = 0, high_hz = 0;
    Pitch size; ///< the interval itself
    Beat beat;
};

/// One step of the tuning order: tune `to` against `from` (already tuned) by the interval,
/// aiming at the beat rate; the first step sets a note from the reference.
struct TuningStep {
    enum class Kind {
        reference,
        fifth_up,
        fifth_down,
        fourth_up,
        fourth_down,
        octave_up,
        octave_down
    };
    Kind kind = Kind::reference;
    std::optional<NoteName> from; ///< empty for the reference step
    NoteName to;
    double to_hz = 0;
    Beat beat; ///< of the interval between from and to (none for the reference)
};
/// "reference", "fifth up", "fourth down" …
std::string step_name(TuningStep::Kind k);

struct Sheet {
    std::string description;
    SheetOptions options;
    std::vector<SheetNote> notes; ///< low..high
    std::vector<SheetInterval>
        intervals; ///< grouped by kind in checked_intervals() order, then by low note
    std::vector<TuningStep> order;
    std::vector<CircleFifth> circle;
};

/// Builds the sheet; throws InputError (at `source` for the tuning, "--range"/"--start" for
/// the options) for a tuning that is not 12 notes, a range under an octave, reversed or off
/// the MIDI keyboard (C-1..G9, keys 0..127), or a start note outside the temperament octave.
Sheet make_sheet(const Scale& scale, const SheetOptions& options, const std::string& source);

} // namespace terzo
