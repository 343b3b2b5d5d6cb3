// KeyMap: a tuning laid over the MIDI keys 0..127. One key (the root key, 60 unless chosen)
// plays degree 0; consecutive keys walk consecutive degrees whatever the scale's size, and
// each pass through the degrees moves up one period. A reference pitch fixes the frequency.
#pragma once

#include <cstddef>
#include <string>

#include "core/arith/pitch.hpp"
#include "core/tuning/note_names.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// The lowest and highest MIDI key numbers.
inline constexpr int lowest_key = 0;
inline constexpr int highest_key = 127;

/// Where the tuning sits in absolute pitch: this key sounds at this frequency.
struct KeyReference {
    int key = 69;      ///< any key 0..127
    double hz = 440.0; ///< above 0 and finite
};

/// A reference pitch "A4=440" as a key reference: the named note's key number sounds at hz.
KeyReference key_reference(const PitchReference& ref);

/// The reference used when none is given. A 12-note tuning is laid at A4 = 440 Hz (key 69),
/// as the trade expects. A tuning of any other size walks a different degree on key 69 (in a
/// 31-note tuning it is degree 9), so pinning 440 Hz there would move degree 0 far from where
/// a player looks for it; instead the root key keeps its 12-TET frequency at A4 = 440 Hz
/// (261.626 Hz for key 60, middle C).
KeyReference default_key_reference(std::size_t scale_size, int root_key);

/// One key of the map.
struct MappedKey {
    int key = 0;
    int degree = 0;       ///< index into the scale, 0 <= degree < size
    int period_count = 0; ///< periods above (negative: below) the root key's period
    Pitch from_root;      ///< interval from the root key: degree * period^period_count
    double hz = 0;        ///< frequency
    /// Fractional MIDI note number of hz in 12-TET at A4 = 440 Hz (69 = 440 Hz, 60 = middle C),
    /// the scale used by the MIDI Tuning Standard. Computed from cents, not from hz, so an
    /// equal-tempered tuning at 440 gives whole numbers to within double rounding.
    double midi_note = 0;
    /// Cents from 12-TET tuned to the same reference (the reference key is 0 cents).
    double cents_from_equal = 0;
};

class KeyMap {
  public:
    /// Lays scale over the keys: root_key (0..127) plays degree 0 and ref fixes the pitch.
    /// root_key and ref.key are checked with TERZO_ASSERT; the CLI checks them first.
    KeyMap(Scale scale, int root_key, KeyReference ref);
    /// InputError at source when a key 0..127 would sound at a frequency that is not a finite,
    /// normal number of Hz (a period of millions of cents overflows a double within 128 keys).
    void check_frequencies(const std::string& source) const;

    const Scale& scale() const { return scale_; }
    int root_key() const { return root_key_; }
    const KeyReference& reference() const { return ref_; }
    /// Frequency of the root key (degree 0).
    double root_hz() const { return root_hz_; }

    /// Key key of any integer value (keys outside 0..127 are allowed for computing).
    MappedKey at(int key) const;

  private:
    // Interval of key from the root key: its degree times a whole number of periods.
    Pitch at_pitch(int key) const;
    // Cents of key above the root key: degree cents plus whole periods.
    double cents_from_root(int key) const;

    Scale scale_;
    int root_key_;
    KeyReference ref_;
    double root_hz_;
};

/// The name of a key on the keyboard ("C4", "Bb3") when the scale has 12 degrees, where each
/// key keeps its keyboard name; empty for other sizes, whose notes have no letter names.
std::string key_note_name(const KeyMap& map, int key);

} // namespace terzo
