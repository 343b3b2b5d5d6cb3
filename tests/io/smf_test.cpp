#include <catch2/catch.hpp>

#include "core/io/mts.hpp"
#include "core/io/smf.hpp"
#include "tests/io/smf_reader.hpp"

using namespace terzo;
using terzo::test::Read;
using terzo::test::read_smf;

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
