// MIDI Tuning Standard messages, byte for byte from the MMA specification "MIDI Tuning
// Messages / Bank-Dump Extensions / Scale-Octave Extensions" (CA-020/CA-021/RP-020, 1999):
// the 3-byte frequency data, the bulk and key-based tuning dumps, single-note tuning changes,
// and the scale/octave tunings in their 1-byte and 2-byte forms, with their dumps.
#pragma once

#include <array>
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "core/error.hpp"
#include "core/tuning/key_map.hpp"

namespace terzo {

using Bytes = std::vector<std::uint8_t>;

/// Frequency data: the 12-TET semitone at or below the pitch (69 = A4 = 440 Hz), then a
/// 14-bit fraction of a semitone sent as two 7-bit bytes, most significant first.
struct MtsFrequency {
    std::uint8_t semitone = 0, msb = 0, lsb = 0;
    friend bool operator==(const MtsFrequency& a, const MtsFrequency& b) {
        return a.semitone == b.semitone && a.msb == b.msb && a.lsb == b.lsb;
    }
};

/// 7F 7F 7F: reserved by the specification to mean "no change" for that key.
inline constexpr MtsFrequency mts_no_change{0x7F, 0x7F, 0x7F};
/// Steps of the 14-bit fraction in one semitone.
inline constexpr int mts_fraction_steps = 16384;

/// Rounds a fractional MIDI note (69.0 = 440 Hz) to the nearest 1/16384 semitone, carrying
/// into the semitone byte; nullopt when the result is below 00 00 00 or above 7F 7F 7E.
std::optional<MtsFrequency> encode_frequency(double midi_note);
/// The fractional MIDI note that frequency data stands for (not for mts_no_change).
double decode_note(MtsFrequency f);
/// The frequency in Hz that frequency data stands for (not for mts_no_change).
double decode_hz(MtsFrequency f);
/// Fractional MIDI note of a frequency (69 + 12 log2(hz / 440)).
double midi_note_of_hz(double hz);

/// Every key's frequency data, with what could not be sent.
struct KeyEncoding {
    std::array<MtsFrequency, 128> keys{}; ///< mts_no_change where the key is out of range
    std::vector<int> out_of_range;        ///< keys below 8.18 Hz or above 13289.66 Hz
    std::vector<int> silent;              ///< keys the key map leaves silent (sent as 7F 7F 7F)
    double max_error_cents = 0;           ///< largest |sent - exact| over the sent keys
};
/// Encodes keys 0..127 of a key map.
KeyEncoding encode_keys(const KeyMap& map);

/// Scale/octave offsets: cents from 12-TET at A4 = 440 Hz for C, C#, ... B.
using OctaveOffsets = std::array<double, 12>;
/// The offsets of a 12-note tuning that repeats at 2/1 laid on every key, read from keys
/// 60..71. Any other tuning or layout throws InputError at pos saying why the scale/octave forms cannot carry it.
OctaveOffsets octave_offsets(const KeyMap& map, const SourcePos& pos);

/// 1-byte offset: 64 + cents rounded to whole cents, 0..127 (-64 .. +63 c); nullopt outside.
std::optional<std::uint8_t> encode_offset_1byte(double cents);
double decode_offset_1byte(std::uint8_t b);
/// 2-byte offset: v = 8192 + cents * 8192/100 rounded, 0..16383 (-100 .. +99.988 c), sent as
/// (v >> 7, v & 7F); nullopt outside.
std::optional<std::uint16_t> encode_offset_2byte(double cents);
double decode_offset_2byte(std::uint16_t v);

/// Twelve encoded offsets and the largest rounding error, in cents.
template <class T> struct EncodedOffsets {
    std::array<T, 12> values{};
    double max_error_cents = 0;
};
/// Encodes offsets; throws InputError at pos naming the first pitch class out of range.
EncodedOffsets<std::uint8_t> encode_offsets_1byte(const OctaveOffsets& o, const SourcePos& pos);
EncodedOffsets<std::uint16_t> encode_offsets_2byte(const OctaveOffsets& o, const SourcePos& pos);

/// Where a message goes. device 0..127 (7F = all devices); program and bank 0..127 (the
/// specification numbers them 1-128 for people; the bytes are 0-127).
struct MtsAddress {
    int device = 0x7F;
    int program = 0;
    int bank = 0;
};
/// Channels 1..16 as a bit set: bit 0 is channel 1.
using ChannelSet = std::uint16_t;
inline constexpr ChannelSet all_channels = 0xFFFF;

/// Channels written as "1-16", "1,2,10" or "3-5,9"; anything else throws InputError at pos.
ChannelSet parse_channels(const std::string& text, const SourcePos& pos);

/// A tuning's description made fit for the name field: its first 16 characters, anything
/// that is not printable ASCII as '?'; "terzo" for an empty description.
std::string mts_name_from_description(std::string_view description);
/// A 16-byte name field: printable ASCII (20..7E), at most 16 characters, padded with
/// spaces; anything else throws InputError at pos.
std::array<std::uint8_t, 16> mts_name(std::string_view name, const SourcePos& pos);
/// XOR of msg[from, to) AND 7F: the checksum rule of the dumps.
std::uint8_t mts_checksum(const Bytes& msg, std::size_t from, std::size_t to);

/// Bulk tuning dump, sub-ID 01 (non-real-time), 408 bytes. Its checksum is the XOR of every
/// byte between F0 and the checksum, the rule the specification gives for the other dumps;
/// the original wording for this one message is ambiguous and receivers may ignore it.
Bytes bulk_tuning_dump(const std::array<MtsFrequency, 128>& keys,
                       const std::array<std::uint8_t, 16>& name, const MtsAddress& to);
/// Key-based tuning dump with bank, sub-ID 04 (non-real-time), 409 bytes.
Bytes key_based_tuning_dump(const std::array<MtsFrequency, 128>& keys,
                            const std::array<std::uint8_t, 16>& name, const MtsAddress& to);

/// Single-note tuning changes for (key, data) pairs, at most 127 per message (the count is
/// one 7-bit byte): sub-ID 02 (real-time, no bank, 8 + 4n bytes) when bank is false, else
/// sub-ID 07 (with bank, real-time or not, 9 + 4n bytes).
std::vector<Bytes>
single_note_tuning_changes(const std::vector<std::pair<int, MtsFrequency>>& changes,
                           const MtsAddress& to, bool with_bank, bool realtime,
                           std::size_t per_message = 64);

/// Scale/octave tuning 1-byte form, sub-ID 08, 21 bytes; realtime picks 7F or 7E.
Bytes scale_octave_1byte(const std::array<std::uint8_t, 12>& offsets, ChannelSet channels,
                         int device, bool realtime);
/// Scale/octave tuning 2-byte form, sub-ID 09, 33 bytes.
Bytes scale_octave_2byte(const std::array<std::uint16_t, 12>& offsets, ChannelSet channels,
                         int device, bool realtime);
/// Scale/octave tuning dump 1-byte form, sub-ID 05 (non-real-time), 37 bytes.
Bytes scale_octave_dump_1byte(const std::array<std::uint8_t, 12>& offsets,
                              const std::array<std::uint8_t, 16>& name, const MtsAddress& to);
/// Scale/octave tuning dump 2-byte form, sub-ID 06 (non-real-time), 49 bytes.
Bytes scale_octave_dump_2byte(const std::array<std::uint16_t, 12>& offsets,
                              const std::array<std::uint8_t, 16>& name, const MtsAddress& to);

/// "45 00 00": bytes in upper-case hex separated by spaces.
std::string hex_text(const Bytes& bytes);

} // namespace terzo
