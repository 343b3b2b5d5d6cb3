// Twelve-note letter names in scientific pitch notation (C4 is middle C, A4 is MIDI key 69)
// and reference-pitch assignments such as "A4=415". Used wherever a 12-note tuning's degrees
// are named: tuner's sheets, comparisons, MIDI key maps.
#pragma once

#include <string>
#include <string_view>

#include "core/error.hpp"

namespace terzo {

/// How the five black keys are spelled.
enum class Spelling {
    sharps, ///< C C# D D# E F F# G G# A A# B
    flats,  ///< C Db D Eb E F Gb G Ab A Bb B
    mixed,  ///< C C# D Eb E F F# G G# A Bb B (the usual spelling of temperament tables)
};

/// A pitch class (0 = C … 11 = B) in an octave of scientific pitch notation.
struct NoteName {
    int pitch_class = 0;
    int octave = 4;
    friend bool operator==(const NoteName& a, const NoteName& b) {
        return a.pitch_class == b.pitch_class && a.octave == b.octave;
    }
};

/// MIDI key number of a note (C4 = 60, A4 = 69); may lie outside 0..127.
int midi_key(const NoteName& n);
/// The note of a MIDI key number (any integer).
NoteName note_of_key(int key);
/// Name of a pitch class 0..11 in the given spelling ("C#", "Eb").
std::string pitch_class_name(int pitch_class, Spelling spelling = Spelling::mixed);
/// "C#4", "Bb3".
std::string note_text(const NoteName& n, Spelling spelling = Spelling::mixed);

/// Parses a letter A-G with any number of '#' or 'b' (also U+266F and U+266D) and an
/// optional octave ("C", "F#", "Bb3", "C-1"); without an octave, default_octave is used.
NoteName parse_note(std::string_view text, const SourcePos& pos, int default_octave = 4);
/// Parses a pitch class alone ("C#", "Eb"); an octave digit is an error.
int parse_pitch_class(std::string_view text, const SourcePos& pos);
/// Position of a spelled pitch class on the line of fifths, C = 0, G = 1, F = -1, F# = 6,
/// Eb = -3 (each sharp adds 7, each flat subtracts 7); an octave digit is an error.
int parse_fifths_position(std::string_view text, const SourcePos& pos);
/// The spelled name of a line-of-fifths position: 0 -> "C", 8 -> "G#", -3 -> "Eb", 13 -> "B#".
std::string fifths_position_name(int position);
/// Parses a spelling name: "sharps", "flats" or "mixed".
Spelling parse_spelling(std::string_view text, const SourcePos& pos);

/// A reference pitch: this note sounds at this frequency.
struct PitchReference {
    NoteName note{9, 4}; ///< A4
    double hz = 440.0;
};

/// Parses "A4=415", "C4=256", "a4 = 430.5"; the frequency must be positive and finite and
/// at most 20000 Hz, the note's octave within -1..9.
PitchReference parse_pitch_reference(std::string_view text, const SourcePos& pos);

/// Frequency of note n in twelve-tone equal temperament tuned to the reference.
double equal_tempered_hz(const NoteName& n, const PitchReference& ref);

} // namespace terzo
