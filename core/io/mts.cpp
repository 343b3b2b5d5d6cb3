#include "core/io/mts.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>

#include "core/format.hpp"

namespace terzo {

namespace {

// Universal System Exclusive: F0, 7E (non-real-time) or 7F (real-time), device, 08 = MIDI
// Tuning Standard, sub-ID#2.
Bytes header(bool realtime, int device, std::uint8_t sub_id) {
    TERZO_ASSERT(device >= 0 && device <= 0x7F);
    return {0xF0, static_cast<std::uint8_t>(realtime ? 0x7F : 0x7E),
            static_cast<std::uint8_t>(device), 0x08, sub_id};
}

std::uint8_t data_byte(int v) {
    TERZO_ASSERT(v >= 0 && v <= 0x7F);
    return static_cast<std::uint8_t>(v);
}

void append_frequency(Bytes& msg, const MtsFrequency& f) {
    msg.push_back(data_byte(f.semitone));
    msg.push_back(data_byte(f.msb));
    msg.push_back(data_byte(f.lsb));
}

void append_name(Bytes& msg, const std::array<std::uint8_t, 16>& name) {
    for (auto c : name)
        msg.push_back(data_byte(c));
}

// Closes a dump: the checksum over everything after F0, then F7.
Bytes finish_dump(Bytes msg) {
    msg.push_back(mts_checksum(msg, 1, msg.size()));
    msg.push_back(0xF7);
    return msg;
}

// Channel bitmap ff gg hh: ff holds channels 15-16 in bits 0-1, gg channels 8-14, hh 1-7.
void append_channels(Bytes& msg, ChannelSet channels) {
    msg.push_back(static_cast<std::uint8_t>((channels >> 14) & 0x03));
    msg.push_back(static_cast<std::uint8_t>((channels >> 7) & 0x7F));
    msg.push_back(static_cast<std::uint8_t>(channels & 0x7F));
}

const char* const pitch_class_names[12] = {"C",  "C#", "D",  "Eb", "E",  "F",
                                           "F#", "G",  "G#", "A",  "Bb", "B"};

} // namespace

std::optional<MtsFrequency> encode_frequency(double midi_note) {
    if (!std::isfinite(midi_note)) return std::nullopt;
    const double scaled = std::round(midi_note * mts_fraction_steps);
    // 7F 7F 7F is reserved, so the largest value is 127 semitones + 16382 steps.
    if (scaled < 0 || scaled > 127.0 * mts_fraction_steps + (mts_fraction_steps - 2))
        return std::nullopt;
    const auto v = static_cast<long>(scaled);
    const long semitone = v / mts_fraction_steps, fraction = v % mts_fraction_steps;
    return MtsFrequency{static_cast<std::uint8_t>(semitone),
                        static_cast<std::uint8_t>(fraction >> 7),
                        static_cast<std::uint8_t>(fraction & 0x7F)};
}

double decode_note(MtsFrequency f) {
    TERZO_ASSERT(!(f == mts_no_change));
    return f.semitone + ((f.msb << 7) | f.lsb) / static_cast<double>(mts_fraction_steps);
}

double decode_hz(MtsFrequency f) {
    return 440.0 * std::exp2((decode_note(f) - 69.0) / 12.0);
}

double midi_note_of_hz(double hz) {
    return 69.0 + 12.0 * std::log2(hz / 440.0);
}

KeyEncoding encode_keys(const KeyMap& map) {
    KeyEncoding e;
    for (int key = lowest_key; key <= highest_key; ++key) {
        const double note = map.at(key).midi_note;
        auto f = encode_frequency(note);
        if (!f) {
            e.keys[static_cast<std::size_t>(key)] = mts_no_change;
            e.out_of_range.push_back(key);
            continue;
        }
        e.keys[static_cast<std::size_t>(key)] = *f;
        e.max_error_cents = std::max(e.max_error_cents, 100.0 * std::fabs(decode_note(*f) - note));
    }
    return e;
}

OctaveOffsets octave_offsets(const KeyMap& map, const SourcePos& pos) {
    const Scale& s = map.scale();
    const std::string use = "; use --mts-bulk or --mts-note, which tune every key";
    if (s.size() != 12)
        fail(pos,
             "the scale/octave forms carry 12 notes that repeat every octave; this tuning has " +
                 std::to_string(s.size()) + (s.size() == 1 ? " degree" : " degrees") + use);
    const Pitch& period = s.period();
    // A cents-only period counts as an octave when it is 1200 c as typed (".scl: 1200.0").
    const bool octave = period.is_rational()
                            ? *period.ratio() == Ratio(2)
                            : !period.is_exact() && std::fabs(period.cents() - 1200.0) < 1e-9;
    if (!octave)
        fail(pos, "the scale/octave forms carry 12 notes that repeat every octave; this tuning "
                  "repeats at " +
                      period.str() + ", not 2/1" + use);
    OctaveOffsets o{};
    for (int pc = 0; pc < 12; ++pc)
        o[static_cast<std::size_t>(pc)] = 100.0 * (map.at(60 + pc).midi_note - (60 + pc));
    return o;
}

std::optional<std::uint8_t> encode_offset_1byte(double cents) {
    if (!std::isfinite(cents)) return std::nullopt;
    const double v = std::round(64.0 + cents);
    if (v < 0 || v > 127) return std::nullopt;
    return static_cast<std::uint8_t>(v);
}

double decode_offset_1byte(std::uint8_t b) {
    return static_cast<double>(b) - 64.0;
}

std::optional<std::uint16_t> encode_offset_2byte(double cents) {
    if (!std::isfinite(cents)) return std::nullopt;
    const double v = std::round(8192.0 + cents * 8192.0 / 100.0);
    if (v < 0 || v > 16383) return std::nullopt;
    return static_cast<std::uint16_t>(v);
}

double decode_offset_2byte(std::uint16_t v) {
    return (static_cast<double>(v) - 8192.0) * 100.0 / 8192.0;
}

namespace {

template <class T, class Encode, class Decode>
EncodedOffsets<T> encode_offsets(const OctaveOffsets& o, const SourcePos& pos, Encode encode,
                                 Decode decode, const char* range) {
    EncodedOffsets<T> e;
    for (std::size_t pc = 0; pc < 12; ++pc) {
        auto v = encode(o[pc]);
        if (!v)
            fail(pos,
                 std::string("the offset of ") + pitch_class_names[pc] +
                     " from 12-TET at A4 = 440 Hz is " + signed_fixed(o[pc], 3) +
                     " cents, outside the " + range +
                     " this form can carry; move the reference pitch nearer to A4 = 440 Hz, or use "
                     "--mts-bulk or --mts-note");
        e.values[pc] = *v;
        e.max_error_cents = std::max(e.max_error_cents, std::fabs(decode(*v) - o[pc]));
    }
    return e;
}

} // namespace

EncodedOffsets<std::uint8_t> encode_offsets_1byte(const OctaveOffsets& o, const SourcePos& pos) {
    return encode_offsets<std::uint8_t>(o, pos, encode_offset_1byte, decode_offset_1byte,
                                        "-64 .. +63 cents (rounded to whole cents)");
}

EncodedOffsets<std::uint16_t> encode_offsets_2byte(const OctaveOffsets& o, const SourcePos& pos) {
    return encode_offsets<std::uint16_t>(o, pos, encode_offset_2byte, decode_offset_2byte,
                                         "-100 .. +99.988 cents");
}

ChannelSet parse_channels(const std::string& text, const SourcePos& pos) {
    const std::string expected =
        "expected channel numbers 1..16 such as 1,2,10 or 1-16, found " + terzo::excerpt(text);
    ChannelSet set = 0;
    std::istringstream in(text);
    std::string item;
    auto number = [&](const std::string& s) {
        if (s.empty() || s.size() > 2 || s.find_first_not_of("0123456789") != std::string::npos)
            fail(pos, expected);
        int n = std::stoi(s);
        if (n < 1 || n > 16) fail(pos, "channel " + s + " is outside 1..16");
        return n;
    };
    while (std::getline(in, item, ',')) {
        auto dash = item.find('-');
        int lo = number(item.substr(0, dash)),
            hi = dash == std::string::npos ? lo : number(item.substr(dash + 1));
        if (hi < lo) fail(pos, "channel range " + item + " runs backwards");
        for (int c = lo; c <= hi; ++c)
            set = static_cast<ChannelSet>(set | (1u << (c - 1)));
    }
    if (set == 0) fail(pos, expected);
    return set;
}

std::string mts_name_from_description(std::string_view description) {
    std::string n;
    for (char c : description) {
        if (n.size() == 16) break;
        const auto u = static_cast<unsigned char>(c);
        n += (u >= 0x20 && u <= 0x7E) ? c : '?';
    }
    return n.empty() ? "terzo" : n;
}

std::array<std::uint8_t, 16> mts_name(std::string_view name, const SourcePos& pos) {
    if (name.size() > 16)
        fail(pos, "tuning name " + terzo::excerpt(name) + " has " + std::to_string(name.size()) +
                      " characters; the name field holds at most 16");
    std::array<std::uint8_t, 16> out;
    out.fill(' ');
    for (std::size_t i = 0; i < name.size(); ++i) {
        const auto c = static_cast<unsigned char>(name[i]);
        if (c < 0x20 || c > 0x7E)
            fail(pos, "tuning name " + terzo::excerpt(name) +
                          " has a character that is not printable ASCII at position " +
                          std::to_string(i + 1) + "; the name field holds plain ASCII only");
        out[i] = c;
    }
    return out;
}

std::uint8_t mts_checksum(const Bytes& msg, std::size_t from, std::size_t to) {
    TERZO_ASSERT(from <= to && to <= msg.size());
    std::uint8_t x = 0;
    for (std::size_t i = from; i < to; ++i)
        x ^= msg[i];
    return x & 0x7F;
}

Bytes bulk_tuning_dump(const std::array<MtsFrequency, 128>& keys,
                       const std::array<std::uint8_t, 16>& name, const MtsAddress& to) {
    Bytes msg = header(false, to.device, 0x01);
    msg.push_back(data_byte(to.program));
    append_name(msg, name);
    for (const auto& f : keys)
        append_frequency(msg, f);
    return finish_dump(std::move(msg));
}

Bytes key_based_tuning_dump(const std::array<MtsFrequency, 128>& keys,
                            const std::array<std::uint8_t, 16>& name, const MtsAddress& to) {
    Bytes msg = header(false, to.device, 0x04);
    msg.push_back(data_byte(to.bank));
    msg.push_back(data_byte(to.program));
    append_name(msg, name);
    for (const auto& f : keys)
        append_frequency(msg, f);
    return finish_dump(std::move(msg));
}

std::vector<Bytes>
single_note_tuning_changes(const std::vector<std::pair<int, MtsFrequency>>& changes,
                           const MtsAddress& to, bool with_bank, bool realtime,
                           std::size_t per_message) {
    TERZO_ASSERT(per_message >= 1 && per_message <= 127);
    TERZO_ASSERT(with_bank || realtime); // sub-ID 02 exists only as a real-time message
    std::vector<Bytes> out;
    for (std::size_t start = 0; start < changes.size(); start += per_message) {
        const std::size_t n = std::min(per_message, changes.size() - start);
        Bytes msg = header(realtime, to.device, with_bank ? 0x07 : 0x02);
        if (with_bank) msg.push_back(data_byte(to.bank));
        msg.push_back(data_byte(to.program));
        msg.push_back(data_byte(static_cast<int>(n)));
        for (std::size_t i = start; i < start + n; ++i) {
            msg.push_back(data_byte(changes[i].first));
            append_frequency(msg, changes[i].second);
        }
        msg.push_back(0xF7);
        out.push_back(std::move(msg));
    }
    return out;
}

Bytes scale_octave_1byte(const std::array<std::uint8_t, 12>& offsets, ChannelSet channels,
                         int device, bool realtime) {
    Bytes msg = header(realtime, device, 0x08);
    append_channels(msg, channels);
    for (auto v : offsets)
        msg.push_back(data_byte(v));
    msg.push_back(0xF7);
    return msg;
}

Bytes scale_octave_2byte(const std::array<std::uint16_t, 12>& offsets, ChannelSet channels,
                         int device, bool realtime) {
    Bytes msg = header(realtime, device, 0x09);
    append_channels(msg, channels);
    for (auto v : offsets) {
        msg.push_back(data_byte(v >> 7));
        msg.push_back(data_byte(v & 0x7F));
    }
    msg.push_back(0xF7);
    return msg;
}

Bytes scale_octave_dump_1byte(const std::array<std::uint8_t, 12>& offsets,
                              const std::array<std::uint8_t, 16>& name, const MtsAddress& to) {
    Bytes msg = header(false, to.device, 0x05);
    msg.push_back(data_byte(to.bank));
    msg.push_back(data_byte(to.program));
    append_name(msg, name);
    for (auto v : offsets)
        msg.push_back(data_byte(v));
    return finish_dump(std::move(msg));
}

Bytes scale_octave_dump_2byte(const std::array<std::uint16_t, 12>& offsets,
                              const std::array<std::uint8_t, 16>& name, const MtsAddress& to) {
    Bytes msg = header(false, to.device, 0x06);
    msg.push_back(data_byte(to.bank));
    msg.push_back(data_byte(to.program));
    append_name(msg, name);
    for (auto v : offsets) {
        msg.push_back(data_byte(v >> 7));
        msg.push_back(data_byte(v & 0x7F));
    }
    return finish_dump(std::move(msg));
}

std::string hex_text(const Bytes& bytes) {
    std::string s;
    char buf[4];
    for (std::size_t i = 0; i < bytes.size(); ++i) {
        std::snprintf(buf, sizeof buf, "%02X", bytes[i]);
        if (i) s += ' ';
        s += buf;
    }
    return s;
}

} // namespace terzo
