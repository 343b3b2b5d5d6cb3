// KeyMap: a tuning laid over the MIDI keys 0..127. The root key plays degree 0; a pattern of
// keys, counted from the root key, says which degree each key plays or that it is silent, and
// repeats up and down the keyboard, each repeat moving up a fixed number of degrees (by
// default the scale's size: one period). Presets build the usual patterns: every key, white
// keys only, and twelve keys per period with each degree on the key nearest its pitch. A
// reference pitch fixes the frequency. Export, render and the window all read this one model.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "core/arith/pitch.hpp"
#include "core/error.hpp"
#include "core/tuning/note_names.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// The lowest and highest MIDI key numbers.
inline constexpr int lowest_key = 0;
inline constexpr int highest_key = 127;
/// A pattern entry for a key that plays nothing.
inline constexpr int silent_key = -1;
/// Largest pattern (keys in one repeat) and largest degree number a pattern may name.
inline constexpr int max_pattern_keys = 128;
inline constexpr int max_pattern_degree = 4095;

/// Where the tuning sits in absolute pitch: this key sounds at this frequency.
struct KeyReference {
    int key = 69;      ///< any key 0..127
    double hz = 440.0; ///< above 0 and finite
    friend bool operator==(const KeyReference& a, const KeyReference& b) {
        return a.key == b.key && a.hz == b.hz;
    }
};

/// A reference pitch "A4=440" as a key reference: the named note's key number sounds at hz.
KeyReference key_reference(const PitchReference& ref);

/// The reference used when none is given. A 12-note tuning is laid at A4 = 440 Hz (key 69),
/// as the trade expects. A tuning of any other size walks a different degree on key 69 (in a
/// 31-note tuning it is degree 9), so pinning 440 Hz there would move degree 0 far from where
/// a player looks for it; instead the root key keeps its 12-TET frequency at A4 = 440 Hz
/// (261.626 Hz for key 60, middle C).
KeyReference default_key_reference(std::size_t scale_size, int root_key);

/// One repeat of a key map: per key from the root key upward, the degree it plays counted
/// across periods (in a 9-note scale, 9 is degree 0 one period up) or silent_key.
struct KeyPattern {
    std::vector<int> keys;      ///< keys[0] is the root key and plays degree 0
    int degrees_per_repeat = 0; ///< degrees the next repeat moves up (the scale size: a period)
    friend bool operator==(const KeyPattern& a, const KeyPattern& b) {
        return a.keys == b.keys && a.degrees_per_repeat == b.degrees_per_repeat;
    }
};

/// Consecutive keys play consecutive degrees, keys_per_period keys a period (0: the scale
/// size). More keys than degrees leaves the keys above the top degree silent; fewer leaves the
/// top degrees out.
KeyPattern every_key_pattern(std::size_t scale_size, int keys_per_period = 0);
/// White keys play consecutive degrees and black keys are silent: 12 keys a repeat, 7 degrees
/// a repeat, whatever the scale's size. Throws InputError at pos when root_key is black.
KeyPattern white_keys_pattern(int root_key, const SourcePos& pos);
/// Twelve keys a period for a scale of 5 to 12 degrees sorted by pitch: degree 0 on the root
/// key and each other degree on the key nearest its pitch in twelve equal steps of the period
/// (two degrees never share a key and keep their order; the least total distance wins, ties
/// to the lower key); the keys left over are silent. Throws InputError at pos for other sizes.
KeyPattern twelve_by_pitch_pattern(const Scale& scale, const SourcePos& pos);
/// Checks a pattern: 1..max_pattern_keys keys, the first plays degree 0, the others a degree
/// number 0..max_pattern_degree or silent_key, degrees_per_repeat 1..max_pattern_degree;
/// throws InputError at pos.
void check_pattern(const KeyPattern& p, const SourcePos& pos);
/// "0 x 1 x 2 3 x 4 x 5 x 6": degree numbers and x (silent), separated by spaces or commas.
std::vector<int> parse_pattern_keys(std::string_view text, const SourcePos& pos);
/// The same text for a pattern's keys.
std::string pattern_keys_text(const std::vector<int>& keys);

/// The ways of building the pattern.
enum class KeyLayout { every_key, white_keys, twelve_by_pitch, pattern };
/// "every-key", "white-keys", "twelve-by-pitch", "pattern".
std::string key_layout_name(KeyLayout layout);
/// Parses a layout name; throws InputError at pos naming the accepted ones.
KeyLayout parse_key_layout(std::string_view text, const SourcePos& pos);

/// Everything a key-map file holds: it applies to any tuning of a size the layout accepts.
struct KeyMapSpec {
    int root_key = 60;
    std::optional<KeyReference> reference; ///< none: default_key_reference
    KeyLayout layout = KeyLayout::every_key;
    int keys_per_period = 0;      ///< every_key only; 0 is the scale size
    KeyPattern pattern;           ///< pattern only; degrees_per_repeat 0 is the scale size
    bool keep_file_order = false; ///< else the degrees are sorted by pitch before laying them
    friend bool operator==(const KeyMapSpec& a, const KeyMapSpec& b) {
        return a.root_key == b.root_key && a.reference == b.reference && a.layout == b.layout &&
               a.keys_per_period == b.keys_per_period && a.pattern == b.pattern &&
               a.keep_file_order == b.keep_file_order;
    }
};

/// One key of the map.
struct MappedKey {
    int key = 0;
    bool sounds = true;   ///< false for a silent key (then only key is meaningful)
    int step = 0;         ///< degree number from the root key across periods (degree + period * size)
    int degree = 0;       ///< index into the map's scale, 0 <= degree < size
    int file_degree = 0;  ///< the same degree's index as the tuning was written
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
    /// Lays scale over the keys: root_key (0..127) plays degree 0, pattern (empty keys: every
    /// key) says what each key plays, ref fixes the pitch and must be a key that sounds.
    /// file_degree (empty: the identity) names each degree's written index. Checked with
    /// TERZO_ASSERT; make_key_map checks user input first.
    KeyMap(Scale scale, int root_key, KeyReference ref, KeyPattern pattern = {},
           std::vector<std::size_t> file_degree = {});
    /// InputError at source when a key 0..127 would sound at a frequency that is not a finite,
    /// normal number of Hz (a period of millions of cents overflows a double within 128 keys).
    void check_frequencies(const std::string& source) const;

    const Scale& scale() const { return scale_; }
    int root_key() const { return root_key_; }
    const KeyReference& reference() const { return ref_; }
    const KeyPattern& pattern() const { return pattern_; }
    /// Frequency of the root key (degree 0).
    double root_hz() const { return root_hz_; }

    /// Key key of any integer value (keys outside 0..127 are allowed for computing).
    MappedKey at(int key) const;
    /// The step a key plays, or nullopt when it is silent.
    std::optional<int> step_of(int key) const;

  private:
    // Interval of a step from the root key: its degree times a whole number of periods.
    Pitch step_pitch(long long step) const;
    // Cents of a step above the root key.
    double step_cents(long long step) const;

    Scale scale_;
    int root_key_;
    KeyReference ref_;
    KeyPattern pattern_;
    std::vector<std::size_t> file_degree_;
    double root_hz_;
};

/// The first sounding key of 0..127 that sounds lower than or level with the sounding key
/// before it (a pattern that does not rise), or nullopt when the keys rise throughout.
std::optional<int> first_falling_key(const KeyMap& map);

/// The map a spec lays on a tuning: degrees sorted by pitch unless spec.keep_file_order, the
/// layout's pattern, the reference (or the default one). Throws InputError at pos when the
/// layout does not fit the tuning or the reference key is silent.
KeyMap make_key_map(const Scale& scale, const KeyMapSpec& spec, const SourcePos& pos);

/// The name of a key on the keyboard ("C4", "Bb3") when the scale has 12 degrees, where each
/// key keeps its keyboard name; empty for other sizes, whose notes have no letter names.
std::string key_note_name(const KeyMap& map, int key);
/// True for the black keys of a piano keyboard (C#, D#, F#, G#, A#).
bool is_black_key(int key);

} // namespace terzo
