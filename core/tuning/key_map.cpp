#include "core/tuning/key_map.hpp"

#include <cmath>
#include <cstdio>

#include "core/error.hpp"

namespace terzo {

namespace {

long long floor_div(long long a, long long b) {
    return a / b - ((a % b != 0) && ((a < 0) != (b < 0)));
}

// p^e for an integer e, exact when p is exact.
Pitch power(const Pitch& p, long long e) {
    if (auto r = p.ratio()) return Pitch::from_ratio(r->pow(e));
    if (p.is_exact()) {
        if (auto v = p.vector()) return Pitch::from_vector(v->pow(Ratio(e)));
    }
    return Pitch::from_cents(p.cents() * static_cast<double>(e));
}

} // namespace

KeyReference key_reference(const PitchReference& ref) {
    return {midi_key(ref.note), ref.hz};
}

KeyReference default_key_reference(std::size_t scale_size, int root_key) {
    if (scale_size == 12) return {69, 440.0};
    return {root_key, 440.0 * std::exp2((root_key - 69) / 12.0)};
}

KeyMap::KeyMap(Scale scale, int root_key, KeyReference ref)
    : scale_(std::move(scale)), root_key_(root_key), ref_(ref) {
    TERZO_ASSERT(root_key >= lowest_key && root_key <= highest_key);
    // Reference notes come from scientific pitch names (octaves -1..9: keys 0..131).
    TERZO_ASSERT(ref.key >= -12 && ref.key <= 140);
    TERZO_ASSERT(std::isfinite(ref.hz) && ref.hz > 0);
    TERZO_ASSERT(scale_.size() > 0);
    root_hz_ = ref_.hz * std::exp2(-cents_from_root(ref_.key) / 1200.0);
}

void KeyMap::check_frequencies(const std::string& source) const {
    for (int key = lowest_key; key <= highest_key; ++key) {
        const double hz = at(key).hz;
        if (std::isnormal(hz)) continue;
        char text[256];
        std::snprintf(text, sizeof text, "%g Hz, outside the numbers terzo computes with; the period (%.3f c)", hz,
                      scale_.period().cents());
        fail({source, 0, 0}, "key " + std::to_string(key) + " would sound at " + text + " is too large for 128 keys");
    }
}

double KeyMap::cents_from_root(int key) const {
    const long long n = static_cast<long long>(scale_.size());
    const long long steps = key - root_key_;
    const long long count = floor_div(steps, n);
    const auto degree = static_cast<std::size_t>(steps - count * n);
    return scale_.degree(degree).cents() + static_cast<double>(count) * scale_.period().cents();
}

Pitch KeyMap::at_pitch(int key) const {
    const long long n = static_cast<long long>(scale_.size());
    const long long steps = key - root_key_;
    const long long count = floor_div(steps, n);
    return scale_.degree(static_cast<std::size_t>(steps - count * n)) *
           power(scale_.period(), count);
}

MappedKey KeyMap::at(int key) const {
    const long long n = static_cast<long long>(scale_.size());
    const long long steps = key - root_key_;
    const long long count = floor_div(steps, n);
    MappedKey m;
    m.key = key;
    m.degree = static_cast<int>(steps - count * n);
    m.period_count = static_cast<int>(count);
    m.from_root = at_pitch(key);
    // Everything below is measured from the reference key, so a tuning whose reference key
    // is at 440 Hz gets its MIDI note numbers without passing through a frequency.
    const double cents_from_ref = cents_from_root(key) - cents_from_root(ref_.key);
    m.hz = ref_.hz * std::exp2(cents_from_ref / 1200.0);
    // For a rational tuning the frequency is the reference times an exact ratio: rounded
    // once, so 264 Hz * 5/2 prints as 660, not 660.0000000000001.
    if (m.from_root.is_rational()) {
        const Pitch ref_from_root = at_pitch(ref_.key);
        if (ref_from_root.is_rational())
            m.hz = static_cast<double>(
                static_cast<long double>(ref_.hz) *
                (*m.from_root.ratio() / *ref_from_root.ratio()).to_long_double());
    }
    m.midi_note = 69.0 + 12.0 * std::log2(ref_.hz / 440.0) + cents_from_ref / 100.0;
    m.cents_from_equal = cents_from_ref - 100.0 * (key - ref_.key);
    return m;
}

std::string key_note_name(const KeyMap& map, int key) {
    if (map.scale().size() != 12) return "";
    return note_text(note_of_key(key));
}

} // namespace terzo
