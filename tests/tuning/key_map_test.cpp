#include <catch2/catch.hpp>

#include <cmath>
#include <sstream>

#include "core/tuning/scl.hpp"
#include "core/tuning/key_map.hpp"
#include "tests/support/scales.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;

namespace {


// Werckmeister III as in docs/references.md 2.1: C-G, G-D, D-A and B-F# a quarter of the
// Pythagorean comma P = 3^12/2^19 narrow, the other fifths pure. q = (2^19/3^12)^(1/4).
Scale werckmeister_3() {
    const PrimeVector q =
        PrimeVector::prime_power(2, Ratio(19, 4)) * PrimeVector::prime_power(3, Ratio(-3));
    auto r = [](std::int64_t n, std::int64_t d) { return PrimeVector::from_ratio(Ratio(n, d)); };
    auto p = [](const PrimeVector& v) { return Pitch::from_vector(v); };
    std::vector<Pitch> d = {p(r(256, 243)),
                            p(r(9, 8) * q.pow(Ratio(2))),
                            p(r(32, 27)),
                            p(r(81, 64) * q.pow(Ratio(3))),
                            p(r(4, 3)),
                            p(r(1024, 729)),
                            p(r(3, 2) * q),
                            p(r(128, 81)),
                            p(r(27, 16) * q.pow(Ratio(3))),
                            p(r(16, 9)),
                            p(r(243, 128) * q.pow(Ratio(3)))};
    return Scale("Werckmeister III", d, Pitch::from_ratio(Ratio(2)));
}

const char* const demo_scl = "! demo\nseven notes\n 7\n 9/8\n 5/4\n 4/3\n 3/2\n 5/3\n 7/4\n 2/1\n";

} // namespace

TEST_CASE("12-TET at A4 = 440 Hz gives the standard key frequencies", "[key_map]") {
    KeyMap map(test::equal_division(12), 60, KeyReference{69, 440.0});
    // docs/references.md 8: 12-TET C4 at A4 = 440 is 261.6256 Hz [CP, computed].
    CHECK_THAT(map.at(60).hz, WithinAbs(261.6256, 5e-5));
    CHECK_THAT(map.root_hz(), WithinAbs(261.6256, 5e-5));
    CHECK(map.at(69).hz == 440.0);
    // docs/references.md 6.3 computed column: key 0 = 8.175799 Hz, key 120 = 8372.018090 Hz,
    // key 127 = 12543.853951 Hz (MMA MIDI Tuning spec example table, corrected).
    CHECK_THAT(map.at(0).hz, WithinAbs(8.175799, 5e-7));
    CHECK_THAT(map.at(120).hz, WithinAbs(8372.018090, 5e-6));
    CHECK_THAT(map.at(127).hz, WithinAbs(12543.853951, 5e-6));
    for (int key = 0; key <= 127; ++key) {
        CHECK_THAT(map.at(key).midi_note, WithinAbs(key, 1e-9));
        CHECK_THAT(map.at(key).cents_from_equal, WithinAbs(0, 1e-9));
    }
}

TEST_CASE("Werckmeister III at A4 = 440 Hz matches the published frequencies", "[key_map]") {
    KeyMap map(werckmeister_3(), 48, KeyReference{69, 440.0});
    // docs/references.md 2.3: octave 3 at A4 = 440 as printed by R. Rhodes, Mechanical Music
    // Digest 2001-02-23 [S] (agreeing with the computation to every printed digit).
    const double hz[12] = {131.7021, 138.7479, 147.1644, 156.0914, 165.0000, 175.6028,
                           184.9972, 196.8850, 208.1219, 220.0,    234.1371, 247.5000};
    for (int pc = 0; pc < 12; ++pc)
        CHECK_THAT(map.at(48 + pc).hz, WithinAbs(hz[pc], 5e-5));
    // docs/references.md 2.3, offsets from 12-TET with A fixed [computed]: C +11.7, C# +2.0,
    // D +3.9, Eb +5.9, E +2.0, F +9.8, F# 0.0, G +7.8, G# +3.9, A 0, Bb +7.8, B +3.9.
    const double offsets[12] = {11.7, 2.0, 3.9, 5.9, 2.0, 9.8, 0.0, 7.8, 3.9, 0.0, 7.8, 3.9};
    for (int pc = 0; pc < 12; ++pc)
        CHECK_THAT(map.at(60 + pc).cents_from_equal, WithinAbs(offsets[pc], 0.05));
    // A-E is a pure fifth (docs/references.md 2.1), so E4 is exactly 3/4 of 440 Hz.
    CHECK(map.at(64).from_root.is_exact());
    CHECK_THAT(map.at(64).hz, WithinAbs(330.0, 1e-9));
}

TEST_CASE("consecutive keys walk consecutive degrees of a scale of any size", "[key_map]") {
    KeyMap map(test::scl_text(demo_scl), 60, KeyReference{60, 264.0});
    SECTION("upwards the degrees repeat every seven keys, one period higher each time") {
        const char* ratios[] = {"1/1", "9/8", "5/4", "4/3", "3/2",
                                "5/3", "7/4", "2/1", "9/4", "5/2"};
        for (int i = 0; i < 10; ++i) {
            const MappedKey k = map.at(60 + i);
            CHECK(k.degree == i % 7);
            CHECK(k.period_count == i / 7);
            CHECK(k.from_root.str() == ratios[i]);
        }
        // 264 Hz * 7/4 = 462 Hz; 264 Hz * 2 * 5/4 = 660 Hz.
        // Rational tunings get their frequencies from exact ratios, rounded once.
        CHECK(map.at(66).hz == 462.0);
        CHECK(map.at(69).hz == 660.0);
    }
    SECTION("downwards the top degree of the period below comes next") {
        CHECK(map.at(59).degree == 6);
        CHECK(map.at(59).period_count == -1);
        CHECK(map.at(59).from_root.str() == "7/8");
        CHECK(map.at(53).from_root.str() == "1/2");
        CHECK(map.at(0).degree == 3); // 60 = 8 * 7 + 4 keys below: degree 7 - 4 = 3
        CHECK(map.at(0).period_count == -9);
        CHECK(map.at(0).from_root.str() == "1/384"); // 4/3 / 2^9
        CHECK_THAT(map.at(0).hz, WithinAbs(264.0 / 384.0, 1e-12));
    }
}

TEST_CASE("a named reference pitch is mapped through its key", "[key_map]") {
    // A4=415 means key 69 sounds at 415 Hz; with the root on key 60 that is degree 9 of 12.
    const PitchReference ref = parse_pitch_reference("A4=415", {"--pitch", 0, 0});
    const KeyReference key_ref = key_reference(ref);
    CHECK(key_ref.key == 69);
    CHECK(key_ref.hz == 415.0);
    KeyMap map(test::equal_division(12), 60, key_ref);
    CHECK_THAT(map.at(69).hz, WithinAbs(415.0, 1e-9));
    // docs/references.md 8: 12-TET C4 when A4 = 415 is 246.7605 Hz [CP, computed].
    CHECK_THAT(map.root_hz(), WithinAbs(246.7605, 5e-5));
    // 415 Hz is -101.271 cents from 440 (docs/references.md 8, computed); the cents from 12-TET
    // are taken at the same reference, so they stay zero.
    CHECK_THAT(map.at(69).midi_note, WithinAbs(69 - 1.01271, 5e-6));
    CHECK_THAT(map.at(40).cents_from_equal, WithinAbs(0, 1e-9));

    SECTION("in a 19-note scale the reference key is degree 9 as well") {
        std::vector<Pitch> d;
        for (int k = 1; k <= 18; ++k)
            d.push_back(Pitch::from_vector(PrimeVector::prime_power(2, Ratio(k, 19))));
        KeyMap m19(Scale("19", d, Pitch::from_ratio(Ratio(2))), 60, KeyReference{69, 440.0});
        CHECK_THAT(m19.at(69).hz, WithinAbs(440.0, 1e-9));
        CHECK_THAT(m19.root_hz(), WithinAbs(440.0 * std::exp2(-9.0 / 19.0), 1e-9));
        CHECK(m19.at(79).from_root.str() == "2/1");
        CHECK(m19.at(62).from_root.str() == "2^(2/19)");
    }
}

TEST_CASE("without a reference, 12-note tunings sit at A4 = 440 and other sizes keep the root key's 12-TET pitch", "[key_map]") {
    // 12-TET at A4 = 440 Hz: C4 (key 60) is 261.6256 Hz and D4 (key 62) 293.6648 Hz
    // (docs/references.md 4, agreeing with the CRC Handbook's table of equal-tempered frequencies).
    const KeyReference twelve = default_key_reference(12, 60);
    CHECK(twelve.key == 69);
    CHECK(twelve.hz == 440.0);
    const KeyReference nineteen = default_key_reference(19, 60);
    CHECK(nineteen.key == 60);
    CHECK_THAT(nineteen.hz, WithinAbs(261.6256, 5e-5));
    CHECK_THAT(default_key_reference(31, 62).hz, WithinAbs(293.6648, 5e-5));
    // A 31-note equal division laid from key 60 at the default: degree 0 stays at middle C's
    // 12-TET pitch, and key 91 (one period up) doubles it.
    std::vector<Pitch> d;
    for (int k = 1; k <= 30; ++k) d.push_back(Pitch::from_vector(PrimeVector::prime_power(2, Ratio(k, 31))));
    KeyMap m31(Scale("31", d, Pitch::from_ratio(Ratio(2))), 60, default_key_reference(31, 60));
    CHECK_THAT(m31.root_hz(), WithinAbs(261.6256, 5e-5));
    CHECK_THAT(m31.at(91).hz, WithinAbs(2 * 261.6256, 1e-4));
}

TEST_CASE("keys keep their keyboard names only in 12-note tunings", "[key_map]") {
    KeyMap twelve(test::equal_division(12), 62, KeyReference{69, 440.0});
    CHECK(key_note_name(twelve, 60) == "C4");
    CHECK(key_note_name(twelve, 70) == "Bb4");
    CHECK(key_note_name(twelve, 0) == "C-1");
    KeyMap seven(test::scl_text(demo_scl), 60, KeyReference{60, 264.0});
    CHECK(key_note_name(seven, 60).empty());
}
