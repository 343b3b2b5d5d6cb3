// A Standard MIDI File (format 0, one track) that holds System Exclusive messages, such as
// MIDI Tuning Standard messages, for players and sequencers that take .mid files rather
// than raw .syx bytes.
#pragma once

#include <cstdint>
#include <vector>

namespace terzo {

/// Ticks per quarter note in the header, and ticks left between two messages (at the
/// file's tempo of 120 quarter notes a minute, 24 ticks are 125 ms, a pause that gives a
/// receiver time to store one message before the next; common practice, no source).
inline constexpr int smf_ticks_per_quarter = 96;
inline constexpr int smf_ticks_between_messages = 24;

/// The file's bytes: header MThd (format 0, 1 track), then MTrk with a tempo event, each
/// message as a SysEx event (F0, length as a variable-length quantity, the bytes after F0
/// up to and including F7) and the end-of-track event. Each message must start with F0 and
/// end with F7.
std::vector<std::uint8_t> sysex_midi_file(const std::vector<std::vector<std::uint8_t>>& messages);

} // namespace terzo
