#include "core/tuning/note_names.hpp"

#include <charconv>
#include <cmath>
#include <cstdlib>

namespace terzo {

namespace {

int floor_div(int a, int b) { return a / b - ((a % b != 0) && ((a < 0) != (b < 0))); }

// Letter and accidentals at the front of text: the letter's natural pitch class, the net
// number of semitones the accidentals add, and how many bytes were read.
struct Spelled {
    int natural, accidentals;
    std::size_t used;
    int pitch_class() const { return (((natural + accidentals) % 12) + 12) % 12; }
};

Spelled read_spelled(std::string_view text, const SourcePos& pos) {
    static const int letter_pc[7] = {9, 11, 0, 2, 4, 5, 7}; // A B C D E F G
    if (text.empty()) fail(pos, "expected a note name such as C, F# or Bb, found nothing");
    char l = text[0];
    if (l >= 'a' && l <= 'g') l = static_cast<char>(l - 'a' + 'A');
    if (l < 'A' || l > 'G') fail(pos, "expected a note letter A to G in " + excerpt(text));
    Spelled s{letter_pc[l - 'A'], 0, 1};
    for (;;) {
        if (s.used < text.size() && text[s.used] == '#') {
            ++s.accidentals;
            ++s.used;
        } else if (s.used < text.size() && text[s.used] == 'b') {
            --s.accidentals;
            ++s.used;
        } else if (text.substr(s.used, 3) == "\u266F") {
            ++s.accidentals;
            s.used += 3;
        } else if (text.substr(s.used, 3) == "\u266D") {
            --s.accidentals;
            s.used += 3;
        } else {
            return s;
        }
    }
}

} // namespace

int midi_key(const NoteName& n) { return 12 * (n.octave + 1) + n.pitch_class; }

NoteName note_of_key(int key) {
    int octave = floor_div(key, 12) - 1;
    return {key - 12 * (octave + 1), octave};
}

std::string pitch_class_name(int pc, Spelling spelling) {
    static const char* sharps[12] = {"C", "C#", "D", "D#", "E", "F", "F#", "G", "G#", "A", "A#", "B"};
    static const char* flats[12] = {"C", "Db", "D", "Eb", "E", "F", "Gb", "G", "Ab", "A", "Bb", "B"};
    static const char* mixed[12] = {"C", "C#", "D", "Eb", "E", "F", "F#", "G", "G#", "A", "Bb", "B"};
    TERZO_ASSERT(pc >= 0 && pc < 12);
    switch (spelling) {
    case Spelling::sharps:
        return sharps[pc];
    case Spelling::flats:
        return flats[pc];
    case Spelling::mixed:
        break;
    }
    return mixed[pc];
}

std::string note_text(const NoteName& n, Spelling spelling) {
    return pitch_class_name(n.pitch_class, spelling) + std::to_string(n.octave);
}

NoteName parse_note(std::string_view text, const SourcePos& pos, int default_octave) {
    Spelled spelled = read_spelled(text, pos);
    std::string_view rest = text.substr(spelled.used);
    int octave = default_octave;
    if (!rest.empty()) {
        auto [ptr, ec] = std::from_chars(rest.data(), rest.data() + rest.size(), octave);
        if (ec != std::errc() || ptr != rest.data() + rest.size())
            fail(pos, "expected an octave number after the note name in " + excerpt(text));
    }
    if (octave < -1 || octave > 9)
        fail(pos, "octave " + std::to_string(octave) + " in " + excerpt(text) +
                      " is outside -1..9 (MIDI keys 0 to 127)");
    // The octave number belongs to the letter: Cb4 sounds as B3 and B#3 as C4.
    return note_of_key(12 * (octave + 1) + spelled.natural + spelled.accidentals);
}

int parse_pitch_class(std::string_view text, const SourcePos& pos) {
    Spelled spelled = read_spelled(text, pos);
    if (spelled.used != text.size())
        fail(pos, "expected a note name without octave such as C, F# or Bb, found " + excerpt(text));
    return spelled.pitch_class();
}

int parse_fifths_position(std::string_view text, const SourcePos& pos) {
    Spelled spelled = read_spelled(text, pos);
    if (spelled.used != text.size())
        fail(pos, "expected a note name without octave such as C, F# or Bb, found " + excerpt(text));
    // The natural letters F C G D A E B sit at -1..5; 7*position = pitch class (mod 12).
    static const int natural_position[12] = {0, 0, 2, 0, 4, -1, 0, 1, 0, 3, 0, 5};
    return natural_position[spelled.natural] + 7 * spelled.accidentals;
}

std::string fifths_position_name(int position) {
    static const char* letters[7] = {"F", "C", "G", "D", "A", "E", "B"};
    int shifted = position + 1; // F = 0
    int accidentals = floor_div(shifted, 7);
    std::string name = letters[shifted - 7 * accidentals];
    name.append(static_cast<std::size_t>(std::abs(accidentals)), accidentals > 0 ? '#' : 'b');
    return name;
}

Spelling parse_spelling(std::string_view text, const SourcePos& pos) {
    if (text == "sharps") return Spelling::sharps;
    if (text == "flats") return Spelling::flats;
    if (text == "mixed") return Spelling::mixed;
    fail(pos, "unknown spelling " + excerpt(text) + "; use sharps, flats or mixed");
}

PitchReference parse_pitch_reference(std::string_view text, const SourcePos& pos) {
    auto eq = text.find('=');
    if (eq == std::string_view::npos)
        fail(pos, "expected NOTE=HZ such as A4=415, found " + excerpt(text));
    auto strip = [](std::string_view s) {
        while (!s.empty() && s.front() == ' ') s.remove_prefix(1);
        while (!s.empty() && s.back() == ' ') s.remove_suffix(1);
        return s;
    };
    std::string_view note_part = strip(text.substr(0, eq)), hz_part = strip(text.substr(eq + 1));
    PitchReference ref;
    ref.note = parse_note(note_part, pos);
    double hz = 0;
    auto [ptr, ec] = std::from_chars(hz_part.data(), hz_part.data() + hz_part.size(), hz);
    if (ec != std::errc() || ptr != hz_part.data() + hz_part.size() || hz_part.empty())
        fail(pos, "expected a frequency in Hz after '=' in " + excerpt(text));
    if (!std::isfinite(hz) || hz <= 0 || hz > 20000)
        fail(pos, "frequency " + std::string(hz_part) + " Hz in " + excerpt(text) +
                      " is outside the accepted range (above 0, at most 20000 Hz)");
    ref.hz = hz;
    return ref;
}

double equal_tempered_hz(const NoteName& n, const PitchReference& ref) {
    return ref.hz * std::exp2((midi_key(n) - midi_key(ref.note)) / 12.0);
}

} // namespace terzo
