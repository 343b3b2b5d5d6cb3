#include <catch2/catch.hpp>

#include <cmath>
#include <map>
#include <sstream>

#include "core/io/mts.hpp"
#include "core/tuning/scl.hpp"
#include "tests/io/mts_reader.hpp"
#include "tests/support/scales.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;
using terzo::test::Decoded;
using terzo::test::read_message;
using terzo::test::reader_hz;

namespace {

// ---------------------------------------------------------------------------------------
// Tunings built from their definitions (docs/references.md 2.1).


// A chain of fifths Eb..G# (n = -3..8) of the given fifth, folded into one octave.
Scale chain_of_fifths(const PrimeVector& fifth) {
    std::vector<Pitch> by_class(12);
    for (int n = -3; n <= 8; ++n) {
        PrimeVector v = fifth.pow(Ratio(n));
        int octaves = static_cast<int>(std::floor(v.cents() / 1200.0 + 1e-12));
        v = v * PrimeVector::prime_power(2, Ratio(-octaves));
        by_class[static_cast<std::size_t>(((7 * n) % 12 + 12) % 12)] = Pitch::from_vector(v);
    }
    return Scale("chain", std::vector<Pitch>(by_class.begin() + 1, by_class.end()),
                 Pitch::from_ratio(Ratio(2)));
}

Scale quarter_comma() {
    return chain_of_fifths(PrimeVector::prime_power(5, Ratio(1, 4)));
}
Scale pythagorean() {
    return chain_of_fifths(PrimeVector::from_ratio(Ratio(3, 2)));
}

// 12-TET C4 at A4 = 440: the reference for offsets "with C fixed" (docs/references.md 2.4).
KeyReference c_fixed() {
    return {60, 440.0 * std::exp2(-9.0 / 12.0)};
}

const SourcePos opt{"--mts-octave1", 0, 0};

} // namespace

TEST_CASE("the specification's frequency-data examples decode to their computed values", "[mts]") {
    // docs/references.md 6.3: the example table of the MMA MIDI Tuning spec (CA-020/CA-021/RP-020)
    // [S]; the "Computed" column, since several printed values are wrong (also posted as
    // corrections on the MMA forum, 2018 [S]).
    struct Row {
        MtsFrequency f;
        double hz;
    };
    const Row rows[] = {
        {{0x00, 0x00, 0x00}, 8.175799},     {{0x00, 0x00, 0x01}, 8.175828},
        {{0x01, 0x00, 0x00}, 8.661957},     {{0x0C, 0x00, 0x00}, 16.351598},
        {{0x3C, 0x00, 0x00}, 261.625565},   {{0x3D, 0x00, 0x00}, 277.182631},
        {{0x44, 0x7F, 0x7F}, 439.998449},   {{0x45, 0x00, 0x00}, 440.000000},
        {{0x45, 0x00, 0x01}, 440.001551},   {{0x78, 0x00, 0x00}, 8372.018090},
        {{0x78, 0x00, 0x01}, 8372.047605},  {{0x7F, 0x00, 0x00}, 12543.853951},
        {{0x7F, 0x00, 0x01}, 12543.898175}, {{0x7F, 0x7F, 0x7E}, 13289.656616},
    };
    for (const Row& r : rows) {
        INFO(hex_text({r.f.semitone, r.f.msb, r.f.lsb}));
        CHECK_THAT(decode_hz(r.f), WithinAbs(r.hz, 6e-7));
        // And back: the printed frequency encodes to the same three bytes.
        auto e = encode_frequency(midi_note_of_hz(r.hz));
        REQUIRE(e);
        CHECK(*e == r.f);
    }
}

TEST_CASE("frequencies round to the nearest 1/16384 semitone, carrying into the semitone",
          "[mts]") {
    // docs/references.md 6.4 constructed encodings [C], "Rounded" column.
    struct Row {
        double hz;
        MtsFrequency f;
    };
    const Row rows[] = {
        {440.0 * std::exp2(-9.0 / 12.0) * 1.25,
         {0x3F, 0x6E, 0x3E}}, // 5/4 above 12-TET C4 (truncation: 3D)
        {660, {0x4C, 0x02, 0x40}},
        {415, {0x43, 0x7E, 0x30}},
        {432, {0x44, 0x57, 0x2B}},
        {435, {0x44, 0x66, 0x56}},
        {442, {0x45, 0x0A, 0x06}},
        {466, {0x45, 0x7F, 0x1C}},
        {1000, {0x53, 0x1B, 0x23}},
        {100, {0x2B, 0x2C, 0x66}},
    };
    for (const Row& r : rows) {
        INFO(r.hz);
        auto e = encode_frequency(midi_note_of_hz(r.hz));
        REQUIRE(e);
        CHECK(*e == r.f);
        // Half a step is 100/16384/2 = 0.0030518 cents.
        CHECK(std::fabs(1200.0 * std::log2(decode_hz(*e) / r.hz)) <= 100.0 / 16384 / 2 + 1e-9);
    }
    SECTION("a fraction that rounds up to a whole semitone carries") {
        auto e = encode_frequency(69.0 - 0.2 / 16384);
        REQUIRE(e);
        CHECK(*e == MtsFrequency{0x45, 0x00, 0x00});
        e = encode_frequency(68.0 + 16383.6 / 16384);
        REQUIRE(e);
        CHECK(*e == MtsFrequency{0x45, 0x00, 0x00});
    }
    SECTION("the range ends at 00 00 00 and 7F 7F 7E; 7F 7F 7F is reserved") {
        CHECK(encode_frequency(-0.4 / 16384) == MtsFrequency{0, 0, 0});
        CHECK_FALSE(encode_frequency(-0.6 / 16384));
        CHECK(encode_frequency(127.0 + 16382.0 / 16384) == MtsFrequency{0x7F, 0x7F, 0x7E});
        CHECK_FALSE(encode_frequency(127.0 + 16382.6 / 16384));
        CHECK_FALSE(encode_frequency(std::nan("")));
    }
}

TEST_CASE("12-TET at A4 = 440 Hz encodes every key as (n, 0, 0)", "[mts]") {
    // MMA MIDI Tuning spec: the first byte is the 12-TET semitone, A4 = 69 = 440 Hz [S].
    SECTION("exact degrees 2^(k/12)") {
        KeyEncoding e = encode_keys(KeyMap(test::equal_division(12), 60, {69, 440.0}));
        for (int k = 0; k < 128; ++k)
            CHECK(e.keys[static_cast<std::size_t>(k)] ==
                  MtsFrequency{static_cast<std::uint8_t>(k), 0, 0});
        CHECK(e.out_of_range.empty());
        CHECK(e.max_error_cents < 1e-9);
    }
    SECTION("cents typed in a .scl file, root on D") {
        KeyEncoding e =
            encode_keys(KeyMap(test::scl_text("!\n12\n12\n100.\n200.\n300.\n400.\n500.\n600.\n700.\n800.\n"
                                   "900.\n1000.\n1100.\n2/1\n"),
                               62, {69, 440.0}));
        for (int k = 0; k < 128; ++k)
            CHECK(e.keys[static_cast<std::size_t>(k)] ==
                  MtsFrequency{static_cast<std::uint8_t>(k), 0, 0});
    }
}

TEST_CASE("a bulk dump is read back to every key's frequency within the resolution", "[mts]") {
    // Quarter-comma meantone at A4 = 440 and a 7-note just scale spread over 18 periods.
    const KeyMap meantone(quarter_comma(), 60, {69, 440.0});
    const auto name = mts_name("quarter comma", {"--name", 0, 0});
    KeyEncoding e = encode_keys(meantone);
    Bytes msg = bulk_tuning_dump(e.keys, name, {0x7F, 5, 0});
    REQUIRE(msg.size() == 408); // docs/references.md 6.1: sub-ID 01 is 408 bytes
    Decoded d = read_message(msg);
    CHECK(d.sub_id == 0x01);
    CHECK_FALSE(d.realtime);
    CHECK(d.device == 0x7F);
    CHECK(d.program == 5);
    CHECK(d.name == "quarter comma   ");
    CHECK(d.checksum_ok);
    REQUIRE(d.key_hz.size() == 128);
    double worst = 0;
    for (int k = 0; k < 128; ++k) {
        double err = std::fabs(1200.0 * std::log2(d.key_hz[k] / meantone.at(k).hz));
        worst = std::max(worst, err);
    }
    CHECK(worst <= 100.0 / 16384 / 2 + 1e-9);
    CHECK_THAT(e.max_error_cents, WithinAbs(worst, 1e-6));
    CHECK(e.max_error_cents > 0.001); // meantone is not on the grid: the report is not zero

    SECTION("keys outside 8.18 .. 13289.66 Hz are reported and left unchanged, not clamped") {
        const KeyMap wide(test::scl_text("!\nseven\n7\n9/8\n5/4\n4/3\n3/2\n5/3\n7/4\n2/1\n"), 60, {60, 264.0});
        KeyEncoding w = encode_keys(wide);
        // Key 60 - 7*5 = 25 is 264/32 = 8.25 Hz, key 24 (7/4 / 64 * 264 = 7.22 Hz) is below;
        // 264 * 32 = 8448 Hz at key 95, 264 * 7/4 * 32 = 14784 Hz at key 101 is above.
        std::vector<int> expected;
        for (int k = 0; k < 128; ++k) {
            double hz = wide.at(k).hz;
            if (hz < 8.175799 - 1e-6 || hz > 13289.656616 + 1e-6) expected.push_back(k);
        }
        CHECK(w.out_of_range == expected);
        CHECK(w.out_of_range.front() == 0);
        CHECK(std::find(w.out_of_range.begin(), w.out_of_range.end(), 24) != w.out_of_range.end());
        CHECK(std::find(w.out_of_range.begin(), w.out_of_range.end(), 25) == w.out_of_range.end());
        CHECK(std::find(w.out_of_range.begin(), w.out_of_range.end(), 101) != w.out_of_range.end());
        Decoded wd = read_message(bulk_tuning_dump(w.keys, name, {0, 0, 0}));
        CHECK(wd.key_hz.size() == 128 - expected.size()); // 7F 7F 7F = no change
        for (int k : expected)
            CHECK(wd.key_hz.count(k) == 0);
    }
}

TEST_CASE("the bulk dump checksum follows the XOR rule of the specification", "[mts]") {
    // docs/references.md 6.6 worked example [C] of the CA-020 rule [S]: 12-TET, device 00,
    // program 00, name "12-TET A440": 6D when every byte between F0 and the checksum is
    // XORed (65 if the 08 byte is left out, as the original wording reads; receivers may
    // ignore this checksum).
    std::array<MtsFrequency, 128> keys;
    for (int k = 0; k < 128; ++k)
        keys[static_cast<std::size_t>(k)] = {static_cast<std::uint8_t>(k), 0, 0};
    const auto name = mts_name("12-TET A440", {"--name", 0, 0});
    Bytes dump = bulk_tuning_dump(keys, name, {0, 0, 0});
    CHECK(dump[406] == 0x6D);
    CHECK((mts_checksum(dump, 1, 406) ^ 0x08) == 0x65);
    Bytes bank_dump = key_based_tuning_dump(keys, name, {0, 0, 0});
    REQUIRE(bank_dump.size() == 409); // docs/references.md 6.1
    CHECK(bank_dump[407] == 0x68);    // docs/references.md 6.6
    Decoded d = read_message(bank_dump);
    CHECK(d.sub_id == 0x04);
    CHECK(d.checksum_ok);
    CHECK(d.bank == 0);
}

TEST_CASE("single-note tuning changes have the specification's layout and length", "[mts]") {
    const MtsFrequency e4{0x3F, 0x6E, 0x3E};
    SECTION("docs/references.md 6.4 example: key 64 to 5/4 above 12-TET C4, all devices") {
        auto msgs = single_note_tuning_changes({{64, e4}}, {0x7F, 0, 0}, false, true);
        REQUIRE(msgs.size() == 1);
        CHECK(hex_text(msgs[0]) == "F0 7F 7F 08 02 00 01 40 3F 6E 3E F7");
    }
    SECTION("sub-ID 07 carries a bank and may be non-real-time") {
        auto msgs = single_note_tuning_changes({{64, e4}, {65, e4}}, {0x10, 3, 2}, true, false);
        REQUIRE(msgs.size() == 1);
        CHECK(msgs[0].size() == 9 + 4 * 2);
        CHECK(hex_text(msgs[0]) == "F0 7E 10 08 07 02 03 02 40 3F 6E 3E 41 3F 6E 3E F7");
        Decoded d = read_message(msgs[0]);
        CHECK_FALSE(d.realtime);
        CHECK(d.bank == 2);
        CHECK(d.program == 3);
    }
    SECTION("128 keys go in messages of at most 64 changes, each 8 + 4n bytes long") {
        // With A4 = 440 Pythagorean C-1 lies 5.865 cents below key 0's 8.1758 Hz and
        // cannot be sent; with C fixed every key is in range.
        CHECK(encode_keys(KeyMap(pythagorean(), 60, {69, 440.0})).out_of_range ==
              std::vector<int>{0});
        const KeyMap map(pythagorean(), 60, c_fixed());
        KeyEncoding e = encode_keys(map);
        REQUIRE(e.out_of_range.empty());
        std::vector<std::pair<int, MtsFrequency>> changes;
        for (int k = 0; k < 128; ++k)
            changes.push_back({k, e.keys[static_cast<std::size_t>(k)]});
        auto msgs = single_note_tuning_changes(changes, {0x7F, 0, 0}, false, true);
        REQUIRE(msgs.size() == 2);
        std::map<int, double> hz;
        for (const Bytes& m : msgs) {
            CHECK(m.size() == 8 + 4 * 64);
            Decoded d = read_message(m);
            CHECK(d.realtime);
            CHECK(d.sub_id == 0x02);
            hz.insert(d.key_hz.begin(), d.key_hz.end());
        }
        REQUIRE(hz.size() == 128);
        for (int k = 0; k < 128; ++k)
            CHECK(std::fabs(1200.0 * std::log2(hz[k] / map.at(k).hz)) <= 100.0 / 16384 / 2 + 1e-9);
        CHECK(single_note_tuning_changes(changes, {0x7F, 0, 0}, false, true, 127).size() == 2);
        CHECK(single_note_tuning_changes(changes, {0x7F, 0, 0}, false, true, 127)[0].size() ==
              8 + 4 * 127);
    }
}

TEST_CASE("scale/octave offsets of a 12-note tuning are its cents from 12-TET", "[mts]") {
    // docs/references.md 2.4, offsets from 12-TET with C fixed [computed].
    const double quarter[12] = {0,       -23.951, -6.843,  +10.265, -13.686, +3.422,
                                -20.529, -3.422,  -27.373, -10.265, +6.843,  -17.108};
    const double pyth[12] = {0,       +13.685, +3.910,  -5.865, +7.820, -1.955,
                             +11.730, +1.955,  +15.640, +5.865, -3.910, +9.775};
    OctaveOffsets q = octave_offsets(KeyMap(quarter_comma(), 60, c_fixed()), opt);
    OctaveOffsets p = octave_offsets(KeyMap(pythagorean(), 60, c_fixed()), opt);
    for (std::size_t pc = 0; pc < 12; ++pc) {
        CHECK_THAT(q[pc], WithinAbs(quarter[pc], 0.0005));
        CHECK_THAT(p[pc], WithinAbs(pyth[pc], 0.0005));
    }
    SECTION("the root key does not matter for a tuning that repeats at the octave") {
        // The same meantone laid with its degree 0 on key 67 is meantone on G.
        OctaveOffsets g =
            octave_offsets(KeyMap(quarter_comma(), 67, {67, 440.0 * std::exp2(-2.0 / 12.0)}), opt);
        CHECK_THAT(g[7], WithinAbs(0, 1e-9));
        CHECK_THAT(g[11], WithinAbs(quarter[4], 0.0005)); // B over G is E over C
    }
    SECTION("other tunings are refused with a reason") {
        const KeyMap seven(test::scl_text("!\nseven\n7\n9/8\n5/4\n4/3\n3/2\n5/3\n7/4\n2/1\n"), 60,
                           {60, 264.0});
        REQUIRE_THROWS_WITH(
            octave_offsets(seven, opt),
            "--mts-octave1: error: the scale/octave forms carry 12 notes that repeat every octave; "
            "this tuning has 7 degrees; use --mts-bulk or --mts-note, which tune every key");
        std::vector<Pitch> d;
        for (int k = 1; k <= 11; ++k)
            d.push_back(Pitch::from_vector(PrimeVector::prime_power(3, Ratio(k, 12))));
        const KeyMap tritave(Scale("3/1", d, Pitch::from_ratio(Ratio(3))), 60, {69, 440.0});
        REQUIRE_THROWS_WITH(
            octave_offsets(tritave, opt),
            "--mts-octave1: error: the scale/octave forms carry 12 notes that repeat every octave; "
            "this tuning repeats at 3/1, not 2/1; use --mts-bulk or --mts-note, which tune every "
            "key");
    }
}

TEST_CASE("scale/octave messages match the constructed encodings", "[mts]") {
    const KeyMap map(quarter_comma(), 60, c_fixed());
    const OctaveOffsets o = octave_offsets(map, opt);
    SECTION("1-byte form, non-real-time, all channels (docs/references.md 6.5 [C])") {
        auto enc = encode_offsets_1byte(o, opt);
        Bytes msg = scale_octave_1byte(enc.values, all_channels, 0x7F, false);
        REQUIRE(msg.size() == 21); // docs/references.md 6.1
        CHECK(hex_text(msg) == "F0 7E 7F 08 08 03 7F 7F 40 28 39 4A 32 43 2B 3D 25 36 47 2F F7");
        CHECK(enc.max_error_cents <= 0.5);
        CHECK(enc.max_error_cents > 0.3); // C# -23.951 goes to -24
        Decoded d = read_message(msg);
        CHECK(d.channels == 0xFFFF);
        for (std::size_t pc = 0; pc < 12; ++pc)
            CHECK(std::fabs(d.offset_cents[pc] - o[pc]) <= 0.5);
    }
    SECTION("2-byte form, real-time, all channels (docs/references.md 6.5 [C])") {
        auto enc = encode_offsets_2byte(o, opt);
        Bytes msg = scale_octave_2byte(enc.values, all_channels, 0x7F, true);
        REQUIRE(msg.size() == 33);
        CHECK(hex_text(msg) ==
              "F0 7F 7F 08 09 03 7F 7F 40 00 30 56 3B 4F 46 49 37 1F 42 18 32 6E 3D 68 2E 3E "
              "39 37 44 31 35 07 F7");
        CHECK(enc.max_error_cents <= 100.0 / 8192 / 2 + 1e-12);
        Decoded d = read_message(msg);
        for (std::size_t pc = 0; pc < 12; ++pc)
            CHECK(std::fabs(d.offset_cents[pc] - o[pc]) <= 100.0 / 8192 / 2 + 1e-9);
    }
    SECTION("dumps 05 and 06 with name and checksum (docs/references.md 6.6 [C])") {
        const auto name = mts_name("Meantone 1/4 SC", {"--name", 0, 0});
        Bytes d1 = scale_octave_dump_1byte(encode_offsets_1byte(o, opt).values, name, {0, 0, 0});
        REQUIRE(d1.size() == 37);
        CHECK(hex_text(d1) ==
              "F0 7E 00 08 05 00 00 4D 65 61 6E 74 6F 6E 65 20 31 2F 34 20 53 43 20 40 28 39 4A "
              "32 43 2B 3D 25 36 47 2F 59 F7");
        Bytes d2 = scale_octave_dump_2byte(encode_offsets_2byte(o, opt).values, name, {0, 0, 0});
        REQUIRE(d2.size() == 49);
        CHECK(d2[47] == 0x22);
        CHECK(read_message(d2).checksum_ok);
    }
    SECTION("other tunings of docs/references.md 6.5 [C]") {
        auto one = [](const Scale& s) {
            return encode_offsets_1byte(octave_offsets(KeyMap(s, 60, c_fixed()), opt), opt).values;
        };
        auto two = [](const Scale& s) {
            auto v =
                encode_offsets_2byte(octave_offsets(KeyMap(s, 60, c_fixed()), opt), opt).values;
            Bytes b;
            for (auto x : v) {
                b.push_back(static_cast<std::uint8_t>(x >> 7));
                b.push_back(static_cast<std::uint8_t>(x & 0x7F));
            }
            return hex_text(b);
        };
        auto hex12 = [](const std::array<std::uint8_t, 12>& v) {
            return hex_text(Bytes(v.begin(), v.end()));
        };
        CHECK(hex12(one(pythagorean())) == "40 4E 44 3A 48 3E 4C 42 50 46 3C 4A");
        CHECK(two(pythagorean()) ==
              "40 00 48 61 42 40 3C 20 45 01 3E 60 47 41 41 20 4A 01 43 60 3D 40 46 21");
    }
}

TEST_CASE("scale/octave offset bytes decode to their cents", "[mts]") {
    // docs/references.md 6.5: 1-byte 00 = -64, 40 = 0, 7F = +63; 2-byte 00 00 = -100,
    // 40 00 = 0, 7F 7F = +99.987793; samples +1 -> 40 52, -1 -> 3F 2E, +13.686 -> 48 61,
    // -13.686 -> 37 1F, +50 -> 60 00, -50 -> 20 00.
    CHECK(decode_offset_1byte(0x00) == -64);
    CHECK(decode_offset_1byte(0x40) == 0);
    CHECK(decode_offset_1byte(0x7F) == 63);
    CHECK(decode_offset_2byte(0) == -100);
    CHECK(decode_offset_2byte(0x40 << 7) == 0);
    CHECK_THAT(decode_offset_2byte(16383), WithinAbs(99.987793, 5e-7));
    const std::pair<double, std::uint16_t> samples[] = {
        {1, 0x40 << 7 | 0x52},       {-1, 0x3F << 7 | 0x2E}, {13.686, 0x48 << 7 | 0x61},
        {-13.686, 0x37 << 7 | 0x1F}, {50, 0x60 << 7},        {-50, 0x20 << 7}};
    for (auto [cents, v] : samples)
        CHECK(encode_offset_2byte(cents) == v);
    CHECK_THAT(decode_offset_2byte(0x40 << 7 | 0x52), WithinAbs(1.000977, 5e-7));
    CHECK(encode_offset_1byte(-64.4) == 0);
    CHECK_FALSE(encode_offset_1byte(-64.6));
    CHECK(encode_offset_1byte(63.4) == 127);
    CHECK_FALSE(encode_offset_1byte(63.6));
    CHECK_FALSE(encode_offset_2byte(-100.01));
    CHECK_FALSE(encode_offset_2byte(100.0));

    SECTION("an offset outside the form's range is refused naming the note") {
        // 12-TET at A4 = 415 is -101.271 cents from A4 = 440 (docs/references.md 8, computed).
        OctaveOffsets low = octave_offsets(KeyMap(test::equal_division(12), 60, {69, 415.0}), opt);
        REQUIRE_THROWS_WITH(
            encode_offsets_2byte(low, {"--mts-octave2", 0, 0}),
            "--mts-octave2: error: the offset of C from 12-TET at A4 = 440 Hz is -101.271 cents, "
            "outside the -100 .. +99.988 cents this form can carry; move the reference pitch "
            "nearer "
            "to A4 = 440 Hz, or use --mts-bulk or --mts-note");
        OctaveOffsets third(low);
        third.fill(0);
        third[3] = 70;
        REQUIRE_THROWS_WITH(
            encode_offsets_1byte(third, opt),
            "--mts-octave1: error: the offset of Eb from 12-TET at A4 = 440 Hz is +70.000 cents, "
            "outside the -64 .. +63 cents (rounded to whole cents) this form can carry; move the "
            "reference pitch nearer to A4 = 440 Hz, or use --mts-bulk or --mts-note");
    }
}

TEST_CASE("the channel bitmap puts channels 15-16, 8-14 and 1-7 in three bytes", "[mts]") {
    // docs/references.md 6.1 (MMA spec [S]): ff bits 0-1 = channels 15-16, gg = 8-14, hh = 1-7.
    std::array<std::uint8_t, 12> zero;
    zero.fill(0x40);
    auto mask = [&](ChannelSet c) {
        Bytes m = scale_octave_1byte(zero, c, 0, true);
        return hex_text(Bytes(m.begin() + 5, m.begin() + 8));
    };
    CHECK(mask(all_channels) == "03 7F 7F");
    CHECK(mask(1u << 0) == "00 00 01");  // channel 1
    CHECK(mask(1u << 7) == "00 01 00");  // channel 8
    CHECK(mask(1u << 15) == "02 00 00"); // channel 16
}

TEST_CASE("the name field is 16 printable ASCII characters padded with spaces", "[mts]") {
    const SourcePos pos{"--name", 0, 0};
    auto n = mts_name("abc", pos);
    CHECK(std::string(n.begin(), n.end()) == "abc             ");
    REQUIRE_THROWS_WITH(
        mts_name("a name far too long", pos),
        "--name: error: tuning name \"a name far too long\" has 19 characters; the name field "
        "holds at most 16");
    REQUIRE_THROWS_WITH(
        mts_name("caf\xC3\xA9", pos),
        "--name: error: tuning name \"caf\xC3\xA9\" has a character that is not printable ASCII at "
        "position 4; the name field holds plain ASCII only");
}

TEST_CASE("channel lists name channels 1-16 singly or as ranges", "[mts]") {
    const SourcePos pos{"--channels", 0, 0};
    CHECK(parse_channels("1-16", pos) == all_channels);
    CHECK(parse_channels("1,2,10", pos) == ((1u << 0) | (1u << 1) | (1u << 9)));
    CHECK(parse_channels("3-5,9", pos) == ((1u << 2) | (1u << 3) | (1u << 4) | (1u << 8)));
    CHECK(parse_channels("16", pos) == (1u << 15));
    REQUIRE_THROWS_WITH(parse_channels("0,3", pos), "--channels: error: channel 0 is outside 1..16");
    REQUIRE_THROWS_WITH(parse_channels("17", pos), "--channels: error: channel 17 is outside 1..16");
    REQUIRE_THROWS_WITH(parse_channels("9-2", pos), "--channels: error: channel range 9-2 runs backwards");
    for (const char* bad : {"x", "", ",", "1-", "1--3", "100"})
        REQUIRE_THROWS_WITH(parse_channels(bad, pos),
                            std::string("--channels: error: expected channel numbers 1..16 such as "
                                        "1,2,10 or 1-16, found \"") + bad + "\"");
}

TEST_CASE("a description becomes a name field of printable ASCII", "[mts]") {
    CHECK(mts_name_from_description("Quarter-comma meantone") == "Quarter-comma me");
    CHECK(mts_name_from_description("caf\xC3\xA9") == "caf??");
    CHECK(mts_name_from_description("") == "terzo");
}
