#include <catch2/catch.hpp>

#include "core/tuning/note_names.hpp"

using namespace terzo;

TEST_CASE("notes map to MIDI keys with A4 at 69 and middle C at 60", "[note_names]") {
    // MIDI 1.0 convention, docs/references.md conventions line: A4 = MIDI 69, C4 = MIDI 60.
    const SourcePos pos{"--pitch", 0, 0};
    CHECK(midi_key(parse_note("A4", pos)) == 69);
    CHECK(midi_key(parse_note("C4", pos)) == 60);
    CHECK(midi_key(parse_note("C-1", pos)) == 0);
    CHECK(midi_key(parse_note("G9", pos)) == 127);
    CHECK(parse_note("Cb4", pos) == NoteName{11, 3});
    CHECK(parse_note("B#3", pos) == NoteName{0, 4});
    CHECK(parse_note("F##2", pos) == NoteName{7, 2});
    CHECK(parse_note("e\u266D", pos) == NoteName{3, 4});
    CHECK(note_of_key(-1) == NoteName{11, -2});
    CHECK(note_text(note_of_key(70)) == "Bb4");
    CHECK(note_text(note_of_key(70), Spelling::sharps) == "A#4");
    CHECK(pitch_class_name(8, Spelling::flats) == "Ab");
}

TEST_CASE("reference pitches are parsed and give equal-tempered frequencies", "[note_names]") {
    const SourcePos pos{"--pitch", 0, 0};
    PitchReference baroque = parse_pitch_reference("A4=415", pos);
    CHECK(baroque.note == NoteName{9, 4});
    CHECK(baroque.hz == 415.0);
    // docs/references.md section 8: twelve-TET C4 for A4 = 440 is 261.6256, for 415 is 246.7605.
    CHECK(equal_tempered_hz({0, 4}, PitchReference{}) == Approx(261.6256).margin(1e-4));
    CHECK(equal_tempered_hz({0, 4}, baroque) == Approx(246.7605).margin(1e-4));
    // C4 = 256 puts A4 at 430.5390 (docs/references.md section 8, common practice).
    PitchReference scientific = parse_pitch_reference("C4 = 256", pos);
    CHECK(equal_tempered_hz({9, 4}, scientific) == Approx(430.5390).margin(1e-4));
    SECTION("bad input") {
        CHECK_THROWS_WITH(parse_pitch_reference("A4", pos),
                          "--pitch: error: expected NOTE=HZ such as A4=415, found \"A4\"");
        CHECK_THROWS_WITH(parse_pitch_reference("H4=440", pos),
                          "--pitch: error: expected a note letter A to G in \"H4\"");
        CHECK_THROWS_WITH(parse_pitch_reference("A4=-3", pos),
                          Catch::Contains("is outside the accepted range"));
        CHECK_THROWS_WITH(parse_pitch_reference("A4=abc", pos),
                          "--pitch: error: expected a frequency in Hz after '=' in \"A4=abc\"");
        CHECK_THROWS_WITH(parse_pitch_reference("A12=440", pos), Catch::Contains("outside -1..9"));
        CHECK_THROWS_WITH(parse_note("A4x", pos),
                          "--pitch: error: expected an octave number after the note name in \"A4x\"");
        CHECK_THROWS_WITH(parse_pitch_class("C4", pos), Catch::Contains("without octave"));
        CHECK_THROWS_WITH(parse_spelling("greek", pos), Catch::Contains("use sharps, flats or mixed"));
    }
}

TEST_CASE("spelled notes have a place on the line of fifths", "[note_names]") {
    // Each fifth up adds 1, each sharp 7: F C G D A E B = -1..5 (common practice, no source).
    const SourcePos pos{"recipe", 1, 5};
    CHECK(parse_fifths_position("C", pos) == 0);
    CHECK(parse_fifths_position("F", pos) == -1);
    CHECK(parse_fifths_position("B", pos) == 5);
    CHECK(parse_fifths_position("Eb", pos) == -3);
    CHECK(parse_fifths_position("G#", pos) == 8);
    CHECK(parse_fifths_position("Gb", pos) == -6);
    CHECK(parse_fifths_position("B#", pos) == 12);
    CHECK(parse_fifths_position("Fbb", pos) == -15);
    CHECK(fifths_position_name(0) == "C");
    CHECK(fifths_position_name(-3) == "Eb");
    CHECK(fifths_position_name(8) == "G#");
    CHECK(fifths_position_name(12) == "B#");
    CHECK(fifths_position_name(-15) == "Fbb");
    for (int p = -30; p <= 30; ++p) CHECK(parse_fifths_position(fifths_position_name(p), pos) == p);
    REQUIRE_THROWS_WITH(parse_fifths_position("Eb4", pos),
                        "recipe:1:5: error: expected a note name without octave such as C, F# or Bb, found \"Eb4\"");
}
