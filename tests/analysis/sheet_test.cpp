#include <catch2/catch.hpp>

#include <cmath>

#include "core/analysis/sheet.hpp"
#include "test_tunings.hpp"

using namespace terzo;

namespace {
NoteName note(const char* text) {
    return parse_note(text, {"test", 0, 0});
}
PitchReference ref(const char* text) {
    return parse_pitch_reference(text, {"test", 0, 0});
}

const SheetInterval& find(const Sheet& s, const char* kind, const char* low) {
    for (const auto& i : s.intervals)
        if (i.kind->name == kind && i.low == note(low)) return i;
    FAIL("no " << kind << " from " << low);
    return s.intervals.front();
}
const SheetNote& find_note(const Sheet& s, const char* n) {
    for (const auto& sn : s.notes)
        if (sn.note == note(n)) return sn;
    FAIL("no note " << n);
    return s.notes.front();
}
} // namespace

TEST_CASE("a 12-TET sheet at A4 = 440 has the handbook frequencies and beat rates", "[sheet]") {
    Sheet s = make_sheet(test::equal_12(), SheetOptions{}, "12-TET");
    REQUIRE(s.notes.size() == 13); // F3..F4
    // 12-TET frequencies: docs/references.md section 4, agreeing with the CRC Handbook of Chemistry
    // and Physics, "Musical scales" [S].
    CHECK(find_note(s, "F3").hz == Approx(174.6141).margin(5e-5));
    CHECK(find_note(s, "C4").hz == Approx(261.6256).margin(5e-5));
    CHECK(find_note(s, "E4").hz == Approx(329.6276).margin(5e-5));
    CHECK(find_note(s, "A3").hz == Approx(220.0).margin(1e-9));
    for (const auto& n : s.notes)
        CHECK(std::fabs(n.offset) < 1e-9);
    // Beat rates: docs/references.md section 4 (computed; Capleton 2007 via Teki et al. 2012 [S]).
    CHECK(find(s, "fifth", "F3").beat.hz == Approx(0.5912).margin(5e-5));
    CHECK(find(s, "major third", "F3").beat.hz == Approx(6.9294).margin(5e-5));
    CHECK(find(s, "major third", "A3").beat.hz == Approx(8.7305).margin(5e-5));
    CHECK(find(s, "major third", "C4").beat.hz == Approx(10.3824).margin(5e-5));
    CHECK(find(s, "major sixth", "G3").beat.hz == Approx(8.8941).margin(5e-5));
    CHECK(find(s, "fourth", "C4").beat.hz == Approx(1.1824).margin(5e-5));
    CHECK(find(s, "major third", "C4").beat.tempering == Tempering::wide);
    CHECK(find(s, "fifth", "F3").beat.tempering == Tempering::narrow);
}

TEST_CASE("a sheet lists every checked interval that fits in the range", "[sheet]") {
    Sheet s = make_sheet(test::equal_12(), SheetOptions{}, "12-TET");
    // F3..F4 is 12 semitones: 13-7 fifths, 13-5 fourths, 13-4 and 13-3 thirds, 13-9 sixths.
    CHECK(s.intervals.size() == 6u + 8 + 9 + 10 + 4);
    CHECK(s.intervals.front().kind->name == "fifth");
    CHECK(s.intervals.back().kind->name == "major sixth");
    CHECK(s.intervals.back().high == note("F4"));
}

TEST_CASE("Werckmeister III at A4 = 440 has the published frequencies and constructed beats",
          "[sheet]") {
    SheetOptions o;
    o.low = note("C3");
    o.high = note("G4");
    Sheet s = make_sheet(test::werckmeister_3(), o, "w3");
    // R. Rhodes, Mechanical Music Digest 2001-02-23, as recomputed in docs/references.md 2.3 [S].
    CHECK(find_note(s, "C3").hz == Approx(131.7021).margin(5e-5));
    CHECK(find_note(s, "G3").hz == Approx(196.8850).margin(5e-5));
    CHECK(find_note(s, "E3").hz == Approx(165.0000).margin(5e-5));
    CHECK(find_note(s, "Bb3").hz == Approx(234.1371).margin(5e-5));
    CHECK(find_note(s, "F3").hz == Approx(175.6028).margin(5e-5));
    // Offsets from 12-TET with A fixed (docs/references.md 2.3, computed): C +11.7, F +9.8, F# 0.0.
    CHECK(find_note(s, "C4").offset == Approx(11.730).margin(5e-4));
    CHECK(find_note(s, "F3").offset == Approx(9.775).margin(5e-4));
    CHECK(std::fabs(find_note(s, "F#3").offset) < 5e-4);
    // Constructed beat rates [C], docs/references.md section 4.
    CHECK(find(s, "fifth", "F3").beat.tempering == Tempering::pure);
    CHECK(find(s, "fifth", "F3").beat.hz == 0.0);
    CHECK(find(s, "fifth", "C4").beat.hz == Approx(2.6725).margin(5e-5));
    CHECK(find(s, "fifth", "A3").beat.tempering == Tempering::pure);
    CHECK(find(s, "major third", "F3").beat.hz == Approx(1.9859).margin(5e-5));
    CHECK(find(s, "major third", "C4").beat.hz == Approx(2.9788).margin(5e-5));
    CHECK(find(s, "major third", "G3").beat.hz == Approx(5.5748).margin(5e-5));
    CHECK(find(s, "major third", "A3").beat.hz == Approx(9.9833).margin(5e-5));
    CHECK(find(s, "fourth", "A3").beat.hz == Approx(2.9863).margin(5e-5));
}

TEST_CASE("quarter-comma meantone beats follow the meantone formula", "[sheet]") {
    SheetOptions o;
    o.low = note("F3");
    o.high = note("G4");
    Sheet s = make_sheet(test::quarter_comma(), o, "qc");
    // Constructed values [C], docs/references.md section 4.
    CHECK(find(s, "fifth", "F3").beat.hz == Approx(1.6372).margin(5e-5));
    CHECK(find(s, "fifth", "C4").beat.hz == Approx(2.4482).margin(5e-5));
    CHECK(find(s, "fifth", "A3").beat.hz == Approx(2.0465).margin(5e-5));
    CHECK(find(s, "fourth", "A3").beat.hz == Approx(2.7372).margin(5e-5));
    for (const char* low : {"F3", "G3", "A3", "C4"}) {
        INFO(low);
        CHECK(find(s, "major third", low).beat.tempering == Tempering::pure);
        CHECK(find(s, "major third", low).beat.exact);
    }
    // The formula: with the fifth 5^(1/4) and A = C * 5^(3/4) / 2, C4 = 880 / 5^(3/4) and a
    // fifth on C4 beats at C4 * (3 - 2 * 5^(1/4)) (narrow); a fourth on A3 at
    // A3 * (4 - 3 * 2 / 5^(1/4)) (wide), from the definition in docs/references.md section 4.
    double c4 = 880.0 / std::pow(5.0, 0.75);
    CHECK(find(s, "fifth", "C4").beat.hz ==
          Approx(c4 * (3 - 2 * std::pow(5.0, 0.25))).epsilon(1e-12));
    CHECK(find(s, "fourth", "A3").beat.hz ==
          Approx(220.0 * (3 * 2 / std::pow(5.0, 0.25) - 4)).epsilon(1e-12));
    CHECK(find(s, "fifth", "C4").beat.tempering == Tempering::narrow);
    CHECK(find(s, "fourth", "A3").beat.tempering == Tempering::wide);
}

TEST_CASE("the reference may name any note, and frequencies follow it", "[sheet]") {
    SheetOptions o;
    o.reference = ref("A4=415");
    Sheet s = make_sheet(test::equal_12(), o, "12-TET");
    // docs/references.md section 8: 12-TET C4 for A4 = 415 is 246.7605 Hz [CP, computed].
    CHECK(find_note(s, "C4").hz == Approx(246.7605).margin(5e-5));
    o.reference = ref("C4=256");
    Sheet c = make_sheet(test::werckmeister_3(), o, "w3");
    CHECK(find_note(c, "C4").hz == Approx(256.0).margin(1e-9));
    CHECK(find_note(c, "G3").hz == Approx(256.0 * std::exp2((696.090 - 1200) / 1200)).margin(1e-3));
    CHECK(std::fabs(find_note(c, "C4").offset) < 1e-9);
}

TEST_CASE("the tonic names degree 0", "[sheet]") {
    SheetOptions o;
    o.tonic = 7; // degree 0 on G: a Werckmeister III laid on G has G-D, D-A, A-E, E-B narrow
    Sheet s = make_sheet(test::werckmeister_3(), o, "w3");
    CHECK(find_note(s, "G3").degree == 0);
    CHECK(find_note(s, "C4").degree == 5);
    CHECK(find(s, "fifth", "A3").beat.cents == Approx(-23.460010 / 4).margin(1e-6));
    CHECK(find(s, "fifth", "F3").beat.tempering == Tempering::pure);
}

TEST_CASE("the tuning order alternates fifths and fourths, then octaves", "[sheet]") {
    Sheet s = make_sheet(test::equal_12(), SheetOptions{}, "12-TET");
    // Common practice, no source: from A (the fork) into the temperament octave F3..E4.
    const char* expected[] = {"A4",  "A3",  "E4", "B3", "F#3", "C#4", "G#3",
                              "Eb4", "Bb3", "F3", "C4", "G3",  "D4",  "F4"};
    REQUIRE(s.order.size() == 14);
    for (std::size_t i = 0; i < 14; ++i)
        CHECK(note_text(s.order[i].to) == expected[i]);
    CHECK(s.order[0].kind == TuningStep::Kind::reference);
    CHECK_FALSE(s.order[0].from);
    CHECK(s.order[1].kind == TuningStep::Kind::octave_down);
    CHECK(s.order[2].kind == TuningStep::Kind::fifth_up);
    CHECK(s.order[2].beat.hz == Approx(0.7449).margin(5e-5)); // A3-E4, docs/references.md section 4
    CHECK(s.order[3].kind == TuningStep::Kind::fourth_down);
    CHECK(s.order[3].beat.hz == Approx(1.1161).margin(5e-5)); // B3-E4
    CHECK(s.order[3].beat.tempering == Tempering::wide);
    CHECK(s.order[13].kind == TuningStep::Kind::octave_up);
    CHECK(*s.order[13].from == note("F3"));
    CHECK(step_name(s.order[3].kind) == "fourth down");
}

TEST_CASE("the user can start the order elsewhere and walk the circle the other way", "[sheet]") {
    SheetOptions o;
    o.start = note("C4");
    o.rising = false;
    Sheet s = make_sheet(test::equal_12(), o, "12-TET");
    REQUIRE(s.order.size() == 13);
    CHECK(s.order[0].kind == TuningStep::Kind::reference);
    CHECK(s.order[0].to == note("C4"));
    CHECK(s.order[0].to_hz == Approx(261.6256).margin(5e-5));
    CHECK(s.order[1].to == note("F3"));
    CHECK(s.order[1].kind == TuningStep::Kind::fifth_down);
    CHECK(s.order[2].to == note("A#3"));
    CHECK(s.order[2].kind == TuningStep::Kind::fourth_up);
}

TEST_CASE("the circle of fifths shows each fifth's tempering", "[sheet]") {
    Sheet q = make_sheet(test::quarter_comma(), SheetOptions{}, "qc");
    REQUIRE(q.circle.size() == 12);
    CHECK(q.circle[8].from == 8); // G#-Eb
    // docs/references.md 2.2: the quarter-comma wolf is 737.637287 c, other fifths 696.578428 c.
    CHECK(q.circle[8].beat.cents == Approx(737.637287 - 701.955001).margin(1e-5));
    CHECK(q.circle[0].beat.cents == Approx(696.578428 - 701.955001).margin(1e-5));
}

TEST_CASE("bad sheet requests are refused with a clear message", "[sheet]") {
    SheetOptions o;
    SECTION("a tuning that is not 12 notes") {
        Scale five("five",
                   {Pitch::from_ratio(Ratio(9, 8)), Pitch::from_ratio(Ratio(5, 4)),
                    Pitch::from_ratio(Ratio(3, 2)), Pitch::from_ratio(Ratio(5, 3))},
                   Pitch::from_ratio(Ratio(2)));
        REQUIRE_THROWS_WITH(make_sheet(five, o, "five.scl"),
                            "five.scl: error: this needs a 12-note tuning to name its notes C, C#, "
                            "D …; it has 5 degrees");
    }
    SECTION("a range under an octave") {
        o.low = note("C4");
        o.high = note("B4");
        REQUIRE_THROWS_WITH(make_sheet(test::equal_12(), o, "t"),
                            "--range: error: the range C4..B4 must span at least an octave (12 "
                            "semitones) so that every note is set");
    }
    SECTION("a range off the keyboard") {
        o.low = note("C8");
        o.high = note("B9");
        REQUIRE_THROWS_WITH(make_sheet(test::equal_12(), o, "t"),
                            "--range: error: the range C8..B9 leaves the MIDI keyboard C-1..G9");
    }
    SECTION("a start note outside the temperament octave") {
        o.start = note("F4");
        REQUIRE_THROWS_WITH(
            make_sheet(test::equal_12(), o, "t"),
            "--start: error: start note F4 is outside the temperament octave F3..E4");
    }
}

TEST_CASE("notes in other periods stack the tuning's own period", "[sheet]") {
    // A 12-TET whose octave is stretched to 1201 c: each period up adds 1 c against 12-TET at
    // the same reference (constructed example).
    std::vector<Pitch> d;
    for (int i = 1; i < 12; ++i)
        d.push_back(Pitch::from_cents(100.0 * i));
    Scale stretched("stretched", d, Pitch::from_cents(1201.0));
    NoteMap map(stretched, 0, PitchReference{}, "s");
    CHECK(map.offset_from_equal(note("A4")) == Approx(0.0).margin(1e-9));
    CHECK(map.offset_from_equal(note("A5")) == Approx(1.0).margin(1e-9));
    CHECK(map.offset_from_equal(note("A2")) == Approx(-2.0).margin(1e-9));
    CHECK(map.offset_from_equal(note("C-1")) == Approx(-5.0).margin(1e-9));
    CHECK(map.degree_of(note("B-1")) == 11);
    // Exact tunings stay exact across periods: C-1 to C9 is exactly 2^10 in 12-TET.
    NoteMap et(test::equal_12(), 0, PitchReference{}, "et");
    CHECK(et.interval(note("C-1"), note("C9")) == Pitch::from_ratio(Ratio(1024)));
    CHECK(et.hz(note("C-1")) == Approx(8.175799).margin(1e-6)); // MIDI key 0 at A4 = 440 [CP]
}
