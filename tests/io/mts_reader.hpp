// Test support: an independent reader of MIDI Tuning Standard messages, shared by the MTS
// tests and the CLI key-map tests. It shares no code with core/io/mts.hpp.
#pragma once

#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <map>
#include <string>
#include <vector>

namespace terzo::test {

using MessageBytes = std::vector<std::uint8_t>;

// ---------------------------------------------------------------------------------------
// An independent reader of MIDI Tuning Standard messages, written from the layouts in
// docs/references.md 6.1 (MMA "MIDI Tuning Messages", CA-020/CA-021/RP-020 [S]) without using
// anything from core/io/mts.hpp. It checks every fixed byte and the checksum, and turns
// frequency data into Hz with f = 440 * 2^((xx + (yy*128 + zz)/16384 - 69) / 12).
struct Decoded {
    bool realtime = false;
    int device = -1, sub_id = -1, bank = -1, program = -1;
    std::string name;
    int channels = -1;                // scale/octave forms: bit 0 = channel 1
    std::map<int, double> key_hz;     // key -> Hz (no-change keys left out)
    std::vector<double> offset_cents; // scale/octave forms, C..B
    bool checksum_ok = false;
};

inline double reader_hz(int xx, int yy, int zz) {
    return 440.0 * std::pow(2.0, (xx + (yy * 128 + zz) / 16384.0 - 69.0) / 12.0);
}

inline Decoded read_message(const MessageBytes& m) {
    Decoded d;
    std::size_t i = 0;
    auto next = [&]() -> int {
        REQUIRE(i < m.size());
        return m[i++];
    };
    auto data = [&]() -> int {
        int b = next();
        REQUIRE(b < 0x80); // every byte between F0 and F7 is a 7-bit data byte
        return b;
    };
    REQUIRE(next() == 0xF0);
    int rt = data();
    REQUIRE((rt == 0x7E || rt == 0x7F));
    d.realtime = rt == 0x7F;
    d.device = data();
    REQUIRE(data() == 0x08); // MIDI Tuning Standard
    d.sub_id = data();
    auto read_name = [&] {
        for (int k = 0; k < 16; ++k)
            d.name += static_cast<char>(data());
    };
    auto read_checksum = [&] {
        int x = 0;
        for (std::size_t k = 1; k < i; ++k)
            x ^= m[k];
        d.checksum_ok = data() == (x & 0x7F);
    };
    auto read_channels = [&] {
        int ff = data(), gg = data(), hh = data();
        REQUIRE((ff & ~0x03) == 0);
        d.channels = (ff << 14) | (gg << 7) | hh;
    };
    switch (d.sub_id) {
    case 0x01:
    case 0x04:
        if (d.sub_id == 0x04) d.bank = data();
        d.program = data();
        read_name();
        for (int key = 0; key < 128; ++key) {
            int xx = data(), yy = data(), zz = data();
            if (!(xx == 0x7F && yy == 0x7F && zz == 0x7F)) d.key_hz[key] = reader_hz(xx, yy, zz);
        }
        read_checksum();
        break;
    case 0x02:
    case 0x07: {
        if (d.sub_id == 0x07) d.bank = data();
        d.program = data();
        int count = data();
        for (int k = 0; k < count; ++k) {
            int key = data(), xx = data(), yy = data(), zz = data();
            d.key_hz[key] = reader_hz(xx, yy, zz);
        }
        break;
    }
    case 0x05:
    case 0x06:
    case 0x08:
    case 0x09: {
        const bool dump = d.sub_id == 0x05 || d.sub_id == 0x06;
        const bool two = d.sub_id == 0x06 || d.sub_id == 0x09;
        if (dump) {
            d.bank = data();
            d.program = data();
            read_name();
        } else {
            read_channels();
        }
        for (int k = 0; k < 12; ++k) {
            if (two) {
                int v = data() * 128;
                v += data();
                d.offset_cents.push_back((v - 8192) * 100.0 / 8192.0);
            } else {
                d.offset_cents.push_back(data() - 64.0);
            }
        }
        if (dump) read_checksum();
        break;
    }
    default:
        FAIL("unknown sub-ID " << d.sub_id);
    }
    REQUIRE(next() == 0xF7);
    REQUIRE(i == m.size());
    return d;
}

} // namespace terzo::test
