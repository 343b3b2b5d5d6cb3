// Test support: an independent reader of Standard MIDI Files holding SysEx messages, shared
// by the SMF tests and the CLI key-map tests.
#pragma once

#include <catch2/catch.hpp>

#include <cstdint>
#include <string>
#include <vector>

namespace terzo::test {

// An independent reader of the chunks of a Standard MIDI File (MMA "Standard MIDI Files
// 1.0": MThd length 6 with format, track count and division; MTrk with delta-time,
// event pairs; F0 events carry a variable-length length; FF 2F 00 ends a track) [from
// memory]. Returns the SysEx messages with F0 put back in front, and their delta times.
struct Read {
    int format = -1, tracks = -1, division = -1;
    std::vector<std::vector<std::uint8_t>> sysex;
    std::vector<long> deltas;
    bool ended = false;
};

inline Read read_smf(const std::vector<std::uint8_t>& f) {
    Read r;
    std::size_t i = 0;
    auto u8 = [&]() -> unsigned {
        REQUIRE(i < f.size());
        return f[i++];
    };
    auto u16 = [&] {
        unsigned a = u8();
        return (a << 8) | u8();
    };
    auto u32 = [&] {
        unsigned long a = u16();
        return (a << 16) | u16();
    };
    auto vlq = [&] {
        unsigned long v = 0;
        for (int k = 0; k < 4; ++k) {
            unsigned b = u8();
            v = (v << 7) | (b & 0x7F);
            if (!(b & 0x80)) return v;
        }
        FAIL("variable-length quantity longer than 4 bytes");
        return v;
    };
    REQUIRE(std::string(f.begin(), f.begin() + 4) == "MThd");
    i = 4;
    REQUIRE(u32() == 6);
    r.format = static_cast<int>(u16());
    r.tracks = static_cast<int>(u16());
    r.division = static_cast<int>(u16());
    REQUIRE(std::string(f.begin() + 14, f.begin() + 18) == "MTrk");
    i = 18;
    const std::size_t length = u32();
    const std::size_t end = i + length;
    REQUIRE(end == f.size());
    while (i < end) {
        long delta = static_cast<long>(vlq());
        unsigned status = u8();
        if (status == 0xF0) {
            std::vector<std::uint8_t> m = {0xF0};
            unsigned long n = vlq();
            for (unsigned long k = 0; k < n; ++k)
                m.push_back(static_cast<std::uint8_t>(u8()));
            r.sysex.push_back(m);
            r.deltas.push_back(delta);
        } else if (status == 0xFF) {
            unsigned type = u8();
            unsigned long n = vlq();
            i += n;
            if (type == 0x2F) r.ended = true;
        } else {
            FAIL("unexpected status byte " << status);
        }
    }
    return r;
}

} // namespace terzo::test
