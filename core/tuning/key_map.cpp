#include "core/tuning/key_map.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <limits>

#include "core/error.hpp"
#include "core/tuning/degree_order.hpp"

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

// Pitch class 0..11 of a key (0 = C).
int pitch_class(int key) {
    return static_cast<int>(key - 12 * floor_div(key, 12));
}

} // namespace

KeyReference key_reference(const PitchReference& ref) {
    return {midi_key(ref.note), ref.hz};
}

KeyReference default_key_reference(std::size_t scale_size, int root_key) {
    if (scale_size == 12) return {69, 440.0};
    return {root_key, 440.0 * std::exp2((root_key - 69) / 12.0)};
}

bool is_black_key(int key) {
    const int pc = pitch_class(key);
    return pc == 1 || pc == 3 || pc == 6 || pc == 8 || pc == 10;
}

KeyPattern every_key_pattern(std::size_t scale_size, int keys_per_period) {
    const int n = static_cast<int>(scale_size);
    const int keys = keys_per_period > 0 ? keys_per_period : n;
    KeyPattern p{std::vector<int>(static_cast<std::size_t>(keys), silent_key), n};
    for (int k = 0; k < keys && k < n; ++k) p.keys[static_cast<std::size_t>(k)] = k;
    return p;
}

KeyPattern white_keys_pattern(int root_key, const SourcePos& pos) {
    if (is_black_key(root_key))
        fail(pos, "the white-keys layout needs a white root key; key " + std::to_string(root_key) +
                      " (" + note_text(note_of_key(root_key)) + ") is black");
    KeyPattern p{std::vector<int>(12, silent_key), 7};
    int degree = 0;
    for (int k = 0; k < 12; ++k)
        if (!is_black_key(root_key + k)) p.keys[static_cast<std::size_t>(k)] = degree++;
    return p;
}

KeyPattern twelve_by_pitch_pattern(const Scale& scale, const SourcePos& pos) {
    const int n = static_cast<int>(scale.size());
    if (n < 5 || n > 12)
        fail(pos, "the twelve-by-pitch layout takes tunings of 5 to 12 degrees; this one has " +
                      std::to_string(n) +
                      " (use every-key, white-keys or a pattern of your own)");
    // Where each degree would like to sit: its pitch in twelfths of the period.
    const double step = scale.period().cents() / 12.0;
    std::vector<double> want(static_cast<std::size_t>(n));
    for (int d = 0; d < n; ++d) want[static_cast<std::size_t>(d)] = scale.degree(static_cast<std::size_t>(d)).cents() / step;
    // Keys rising with the degrees, degree 0 on key 0, least total |key - want|: a small
    // dynamic programme over (degree, key). cost[d][k]: best total for degrees 0..d with
    // degree d on key k. Ties go to the lower key because only a strictly better total
    // replaces an earlier (lower) choice.
    const double inf = std::numeric_limits<double>::infinity();
    std::vector<std::vector<double>> cost(static_cast<std::size_t>(n), std::vector<double>(12, inf));
    std::vector<std::vector<int>> from(static_cast<std::size_t>(n), std::vector<int>(12, -1));
    cost[0][0] = 0;
    for (int d = 1; d < n; ++d)
        for (int k = d; k < 12 - (n - 1 - d); ++k) {
            const double here = std::fabs(k - want[static_cast<std::size_t>(d)]);
            for (int j = d - 1; j < k; ++j) {
                const double c = cost[static_cast<std::size_t>(d - 1)][static_cast<std::size_t>(j)] + here;
                if (c < cost[static_cast<std::size_t>(d)][static_cast<std::size_t>(k)]) {
                    cost[static_cast<std::size_t>(d)][static_cast<std::size_t>(k)] = c;
                    from[static_cast<std::size_t>(d)][static_cast<std::size_t>(k)] = j;
                }
            }
        }
    int best = n - 1;
    for (int k = n - 1; k < 12; ++k)
        if (cost[static_cast<std::size_t>(n - 1)][static_cast<std::size_t>(k)] <
            cost[static_cast<std::size_t>(n - 1)][static_cast<std::size_t>(best)])
            best = k;
    KeyPattern p{std::vector<int>(12, silent_key), n};
    for (int d = n - 1, k = best; d >= 0; k = from[static_cast<std::size_t>(d)][static_cast<std::size_t>(k)], --d)
        p.keys[static_cast<std::size_t>(k)] = d;
    return p;
}

void check_pattern(const KeyPattern& p, const SourcePos& pos) {
    if (p.keys.empty() || p.keys.size() > static_cast<std::size_t>(max_pattern_keys))
        fail(pos, "a pattern has 1 to " + std::to_string(max_pattern_keys) + " keys; this one has " +
                      std::to_string(p.keys.size()));
    if (p.keys[0] != 0)
        fail(pos, "the pattern's first key is the root key and must play degree 0, found " +
                      (p.keys[0] == silent_key ? std::string("x") : std::to_string(p.keys[0])));
    for (std::size_t i = 0; i < p.keys.size(); ++i)
        if (p.keys[i] != silent_key && (p.keys[i] < 0 || p.keys[i] > max_pattern_degree))
            fail(pos, "key " + std::to_string(i) + " of the pattern plays degree " +
                          std::to_string(p.keys[i]) + "; degree numbers run from 0 to " +
                          std::to_string(max_pattern_degree));
    if (p.degrees_per_repeat < 1 || p.degrees_per_repeat > max_pattern_degree)
        fail(pos, "degrees per repeat must be 1 to " + std::to_string(max_pattern_degree) +
                      ", found " + std::to_string(p.degrees_per_repeat));
}

std::vector<int> parse_pattern_keys(std::string_view text, const SourcePos& pos) {
    std::vector<int> keys;
    std::size_t i = 0;
    auto separator = [](char c) { return c == ' ' || c == ',' || c == '\t'; };
    while (true) {
        while (i < text.size() && separator(text[i])) ++i;
        if (i == text.size()) break;
        std::size_t end = i;
        while (end < text.size() && !separator(text[end])) ++end;
        const std::string_view item = text.substr(i, end - i);
        SourcePos at = pos;
        if (at.column > 0) at.column += static_cast<int>(i);
        if (item == "x" || item == "X") {
            keys.push_back(silent_key);
        } else {
            if (item.size() > 4 || item.find_first_not_of("0123456789") != std::string_view::npos)
                fail(at, excerpt(item) + " is neither a degree number nor x (silent); write a "
                                         "pattern such as \"0 x 1 x 2 3 x 4 x 5 x 6\"");
            keys.push_back(std::stoi(std::string(item)));
        }
        if (keys.size() > static_cast<std::size_t>(max_pattern_keys))
            fail(pos, "a pattern has at most " + std::to_string(max_pattern_keys) + " keys");
        i = end;
    }
    if (keys.empty()) fail(pos, "the pattern is empty; write degree numbers and x, such as \"0 x 1\"");
    return keys;
}

std::string pattern_keys_text(const std::vector<int>& keys) {
    std::string out;
    for (int k : keys) {
        if (!out.empty()) out += ' ';
        out += k == silent_key ? "x" : std::to_string(k);
    }
    return out;
}

std::string key_layout_name(KeyLayout layout) {
    switch (layout) {
    case KeyLayout::every_key: return "every-key";
    case KeyLayout::white_keys: return "white-keys";
    case KeyLayout::twelve_by_pitch: return "twelve-by-pitch";
    case KeyLayout::pattern: return "pattern";
    }
    return "";
}

KeyLayout parse_key_layout(std::string_view text, const SourcePos& pos) {
    for (KeyLayout l : {KeyLayout::every_key, KeyLayout::white_keys, KeyLayout::twelve_by_pitch,
                        KeyLayout::pattern})
        if (text == key_layout_name(l)) return l;
    fail(pos, excerpt(text) + " is not a layout; use every-key, white-keys, twelve-by-pitch or pattern");
}

KeyMap::KeyMap(Scale scale, int root_key, KeyReference ref, KeyPattern pattern,
               std::vector<std::size_t> file_degree)
    : scale_(std::move(scale)), root_key_(root_key), ref_(ref), pattern_(std::move(pattern)),
      file_degree_(std::move(file_degree)) {
    TERZO_ASSERT(root_key >= lowest_key && root_key <= highest_key);
    // Reference notes come from scientific pitch names (octaves -1..9: keys 0..131).
    TERZO_ASSERT(ref.key >= -12 && ref.key <= 140);
    TERZO_ASSERT(std::isfinite(ref.hz) && ref.hz > 0);
    TERZO_ASSERT(scale_.size() > 0);
    if (pattern_.keys.empty()) pattern_ = every_key_pattern(scale_.size());
    if (pattern_.degrees_per_repeat == 0) pattern_.degrees_per_repeat = static_cast<int>(scale_.size());
    TERZO_ASSERT(pattern_.keys[0] == 0 && pattern_.degrees_per_repeat >= 1);
    TERZO_ASSERT(file_degree_.empty() || file_degree_.size() == scale_.size());
    const auto ref_step = step_of(ref_.key);
    TERZO_ASSERT(ref_step.has_value());
    root_hz_ = ref_.hz * std::exp2(-step_cents(*ref_step) / 1200.0);
}

void KeyMap::check_frequencies(const std::string& source) const {
    for (int key = lowest_key; key <= highest_key; ++key) {
        const MappedKey k = at(key);
        if (!k.sounds || std::isnormal(k.hz)) continue;
        const double hz = k.hz;
        char text[256];
        std::snprintf(text, sizeof text, "%g Hz, outside the numbers terzo computes with; the period (%.3f c)", hz,
                      scale_.period().cents());
        fail({source, 0, 0}, "key " + std::to_string(key) + " would sound at " + text + " is too large for 128 keys");
    }
}

std::optional<int> KeyMap::step_of(int key) const {
    const long long length = static_cast<long long>(pattern_.keys.size());
    const long long repeat = floor_div(key - root_key_, length);
    const int entry = pattern_.keys[static_cast<std::size_t>(key - root_key_ - repeat * length)];
    if (entry == silent_key) return std::nullopt;
    return static_cast<int>(entry + repeat * pattern_.degrees_per_repeat);
}

double KeyMap::step_cents(long long step) const {
    const long long n = static_cast<long long>(scale_.size());
    const long long count = floor_div(step, n);
    return scale_.degree(static_cast<std::size_t>(step - count * n)).cents() +
           static_cast<double>(count) * scale_.period().cents();
}

Pitch KeyMap::step_pitch(long long step) const {
    const long long n = static_cast<long long>(scale_.size());
    const long long count = floor_div(step, n);
    return scale_.degree(static_cast<std::size_t>(step - count * n)) * power(scale_.period(), count);
}

MappedKey KeyMap::at(int key) const {
    MappedKey m;
    m.key = key;
    const auto step = step_of(key);
    if (!step) {
        m.sounds = false;
        m.hz = m.midi_note = m.cents_from_equal = std::numeric_limits<double>::quiet_NaN();
        return m;
    }
    const long long n = static_cast<long long>(scale_.size());
    const long long count = floor_div(*step, n);
    m.step = *step;
    m.degree = static_cast<int>(*step - count * n);
    m.file_degree = file_degree_.empty() ? m.degree : static_cast<int>(file_degree_[static_cast<std::size_t>(m.degree)]);
    m.period_count = static_cast<int>(count);
    m.from_root = step_pitch(*step);
    // Everything below is measured from the reference key, so a tuning whose reference key
    // is at 440 Hz gets its MIDI note numbers without passing through a frequency.
    const int ref_step = *step_of(ref_.key);
    const double cents_from_ref = step_cents(*step) - step_cents(ref_step);
    m.hz = ref_.hz * std::exp2(cents_from_ref / 1200.0);
    // For a rational tuning the frequency is the reference times an exact ratio: rounded
    // once, so 264 Hz * 5/2 prints as 660, not 660.0000000000001.
    if (m.from_root.is_rational()) {
        const Pitch ref_from_root = step_pitch(ref_step);
        if (ref_from_root.is_rational())
            m.hz = static_cast<double>(
                static_cast<long double>(ref_.hz) *
                (*m.from_root.ratio() / *ref_from_root.ratio()).to_long_double());
    }
    m.midi_note = 69.0 + 12.0 * std::log2(ref_.hz / 440.0) + cents_from_ref / 100.0;
    m.cents_from_equal = cents_from_ref - 100.0 * (key - ref_.key);
    return m;
}

KeyMap make_key_map(const Scale& scale, const KeyMapSpec& spec, const SourcePos& pos) {
    if (spec.root_key < lowest_key || spec.root_key > highest_key)
        fail(pos, "root key " + std::to_string(spec.root_key) + " is outside 0..127");
    SortedScale sorted = spec.keep_file_order
                             ? SortedScale{scale, {}}
                             : sort_by_pitch(scale);
    KeyPattern pattern;
    switch (spec.layout) {
    case KeyLayout::every_key:
        if (spec.keys_per_period < 0 || spec.keys_per_period > max_pattern_keys)
            fail(pos, "keys per period must be 1 to " + std::to_string(max_pattern_keys) +
                          ", found " + std::to_string(spec.keys_per_period));
        pattern = every_key_pattern(sorted.scale.size(), spec.keys_per_period);
        break;
    case KeyLayout::white_keys: pattern = white_keys_pattern(spec.root_key, pos); break;
    case KeyLayout::twelve_by_pitch: pattern = twelve_by_pitch_pattern(sorted.scale, pos); break;
    case KeyLayout::pattern:
        pattern = spec.pattern;
        if (pattern.degrees_per_repeat == 0)
            pattern.degrees_per_repeat = static_cast<int>(sorted.scale.size());
        break;
    }
    // The every-key layout's own pattern is valid by construction and as long as the scale
    // (up to 4096 degrees); the pattern limits are for patterns a user writes.
    if (spec.layout != KeyLayout::every_key) check_pattern(pattern, pos);
    const KeyReference ref =
        spec.reference ? *spec.reference : default_key_reference(sorted.scale.size(), spec.root_key);
    if (!(std::isfinite(ref.hz) && ref.hz > 0 && ref.hz <= 20000))
        fail(pos, "the reference frequency must be above 0 and at most 20000 Hz");
    if (ref.key < -12 || ref.key > 140)
        fail(pos, "the reference key " + std::to_string(ref.key) + " is outside -12..140");
    KeyMap probe(sorted.scale, spec.root_key, KeyReference{spec.root_key, 1.0}, pattern);
    if (!probe.step_of(ref.key))
        fail(pos, "the reference key " + std::to_string(ref.key) + " (" +
                      note_text(note_of_key(ref.key)) +
                      ") is silent in this key map; give the frequency of a key that plays");
    // A pattern may name degrees far above its repeat; keep every key within a thousand
    // periods of the root so exact powers of the period stay small enough to compute.
    const long long n = static_cast<long long>(sorted.scale.size());
    for (int key = lowest_key; key <= highest_key; ++key)
        if (auto step = probe.step_of(key); step && std::llabs(floor_div(*step, n)) > 1000)
            fail(pos, "key " + std::to_string(key) + " would play degree " +
                          std::to_string(*step) + ", more than 1000 periods from the root key");
    return KeyMap(std::move(sorted.scale), spec.root_key, ref, std::move(pattern),
                  std::move(sorted.file_degree));
}

std::optional<int> first_falling_key(const KeyMap& map) {
    std::optional<double> before;
    for (int key = lowest_key; key <= highest_key; ++key) {
        const auto step = map.step_of(key);
        if (!step) continue;
        const double c = map.at(key).midi_note;
        if (before && !(c > *before)) return key;
        before = c;
    }
    return std::nullopt;
}

std::string key_note_name(const KeyMap& map, int key) {
    if (map.scale().size() != 12 || !(map.pattern() == every_key_pattern(12))) return "";
    return note_text(note_of_key(key));
}

} // namespace terzo
