#include <catch2/catch.hpp>

#include "core/io/mts.hpp"
#include "core/io/smf.hpp"

using namespace terzo;

namespace {

// An independent reader of the chunks of a Standard MIDI File (MMA "Standard MIDI Files
// 1.0": MThd length 6 with format, track count and division; MTrk with delta-time,
// event pairs; F0 events carry a variable-length length; FF 2F 00 ends a track) [from
// memory]. Returns the SysEx messages with F0 put back in front, and their delta times.
struct Read {
    int format = -1, tracks = -1, division = -1;
    std::vector<Bytes> sysex;
    std::vector<long> deltas;
    bool ended = false;
};

Read read_smf(const Bytes& f) {
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
            Bytes m = {0xF0};
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

} // namespace

TEST_CASE("a MIDI file holds the SysEx messages byte for byte", "[smf]") {
    std::array<MtsFrequency, 128> keys;
    for (int k = 0; k < 128; ++k)
        keys[static_cast<std::size_t>(k)] = {static_cast<std::uint8_t>(k), 0, 0};
    const Bytes dump = bulk_tuning_dump(keys, mts_name("12-TET A440", {"--name", 0, 0}), {0, 0, 0});
    const Bytes note =
        single_note_tuning_changes({{64, {0x3F, 0x6E, 0x3E}}}, {0x7F, 0, 0}, false, true)[0];
    const Bytes file = sysex_midi_file({dump, note});
    Read r = read_smf(file);
    CHECK(r.format == 0);
    CHECK(r.tracks == 1);
    CHECK(r.division == smf_ticks_per_quarter);
    REQUIRE(r.sysex.size() == 2);
    CHECK(r.sysex[0] == dump);
    CHECK(r.sysex[1] == note);
    CHECK(r.deltas == std::vector<long>{0, smf_ticks_between_messages});
    CHECK(r.ended);
    // The 407 bytes after F0 need a two-byte length: 407 = 3 * 128 + 23 -> 83 17.
    const Bytes head(file.begin() + 22 + 7, file.begin() + 22 + 7 + 4);
    CHECK(hex_text(head) == "00 F0 83 17");
}
