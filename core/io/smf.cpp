#include "core/io/smf.hpp"

#include "core/error.hpp"

namespace terzo {

namespace {

using Bytes = std::vector<std::uint8_t>;

// Variable-length quantity: 7 bits a byte, most significant first, bit 7 set on all but the last.
void append_vlq(Bytes& out, std::uint32_t v) {
    TERZO_ASSERT(v <= 0x0FFFFFFF);
    std::uint8_t buf[4];
    int n = 0;
    buf[n++] = v & 0x7F;
    while (v >>= 7)
        buf[n++] = static_cast<std::uint8_t>((v & 0x7F) | 0x80);
    while (n)
        out.push_back(buf[--n]);
}

void append_u32(Bytes& out, std::uint32_t v) {
    for (int shift = 24; shift >= 0; shift -= 8)
        out.push_back(static_cast<std::uint8_t>(v >> shift));
}

void append_u16(Bytes& out, std::uint16_t v) {
    out.push_back(static_cast<std::uint8_t>(v >> 8));
    out.push_back(static_cast<std::uint8_t>(v));
}

} // namespace

std::vector<std::uint8_t> sysex_midi_file(const std::vector<std::vector<std::uint8_t>>& messages) {
    Bytes track;
    // Tempo 500000 microseconds a quarter note (120 a minute), stated although it is the default.
    for (std::uint8_t b : {0x00, 0xFF, 0x51, 0x03, 0x07, 0xA1, 0x20})
        track.push_back(b);
    for (std::size_t i = 0; i < messages.size(); ++i) {
        const Bytes& m = messages[i];
        TERZO_ASSERT(m.size() >= 2 && m.front() == 0xF0 && m.back() == 0xF7);
        append_vlq(track, i == 0 ? 0 : smf_ticks_between_messages);
        track.push_back(0xF0);
        append_vlq(track, static_cast<std::uint32_t>(m.size() - 1));
        track.insert(track.end(), m.begin() + 1, m.end());
    }
    for (std::uint8_t b : {0x00, 0xFF, 0x2F, 0x00})
        track.push_back(b);

    Bytes file = {'M', 'T', 'h', 'd'};
    append_u32(file, 6);
    append_u16(file, 0); // format 0
    append_u16(file, 1); // one track
    append_u16(file, smf_ticks_per_quarter);
    for (char c : {'M', 'T', 'r', 'k'})
        file.push_back(static_cast<std::uint8_t>(c));
    append_u32(file, static_cast<std::uint32_t>(track.size()));
    file.insert(file.end(), track.begin(), track.end());
    return file;
}

} // namespace terzo
