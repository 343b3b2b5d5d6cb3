// Measured frequencies against tunings: note names, targets, deviations, the beat rates of the
// tuner's intervals, and the closest tuning with its pitch standard. References: the 12-TET
// beat rates of Capleton, "Theory and Practice of Piano Tuning" (2007) as reproduced in Teki et
// al., J. Neurosci. 32(35) 2012, Table 1, and the Werckmeister III frequencies at A4 = 440 Hz
// of R. Rhodes, Mechanical Music Digest 2001-02-23 (both in docs/references.md, sections 4 and 2).
#include <catch2/catch.hpp>

#include <cmath>
#include <random>

#include "core/analysis/measure_match.hpp"
#include "core/tuning/scl.hpp"
#include "tests/analysis/test_tunings.hpp"

using namespace terzo;

namespace {

double shifted(double hz, double cents) {
    return hz * std::pow(2.0, cents / 1200.0);
}

const PitchReference a440{NoteName{9, 4}, 440.0};

std::vector<std::pair<std::string, Scale>> library() {
    std::vector<std::pair<std::string, Scale>> out;
    for (const char* f : {"equal-12.scl", "meantone-quarter-comma.scl", "meantone-sixth-comma.scl",
                          "werckmeister-iii.scl", "vallotti.scl", "young-2.scl", "kirnberger-iii.scl",
                          "pythagorean.scl", "just-chromatic-5-limit.scl", "meantone-fifth-comma.scl"})
        out.emplace_back(f, read_scl_file(std::string(TERZO_SOURCE_DIR) + "/scales/" + f));
    return out;
}

} // namespace

TEST_CASE("a measured tone is named by the nearest note of the tuning with its deviation",
          "[measure_match]") {
    // Werckmeister III at A4 = 440: E3 = 165.0000 Hz, B3 = 247.5000 Hz (Rhodes 2001).
    NoteMap map(test::werckmeister_3(), 0, a440, "test");
    NoteCheck c = check_note(map, shifted(165.0, 4.0));
    CHECK(c.note == NoteName{4, 3});
    CHECK(c.target_hz == Approx(165.0).epsilon(1e-9));
    CHECK(c.deviation_cents == Approx(4.0).epsilon(1e-9));
    CHECK(c.deviation_hz == Approx(shifted(165.0, 4.0) - 165.0).epsilon(1e-9));
    c = check_note(map, shifted(247.5, -30.0));
    CHECK(c.note == NoteName{11, 3});
    CHECK(c.deviation_cents == Approx(-30.0).epsilon(1e-9));
    // 60 cents under B3 is nearer to Bb3 (234.1371 Hz in Rhodes' table, 96 cents under B3).
    c = check_note(map, shifted(247.5, -60.0));
    CHECK(c.note == NoteName{10, 3});
    CHECK(c.target_hz == Approx(234.1371).epsilon(1e-6));
}

TEST_CASE("the intervals between measured notes beat as played beside the tuning's targets",
          "[measure_match]") {
    // Notes of 12-TET at A4 = 440 measured exactly where they should be: the played beats are
    // the handbook's (Capleton: F3-C4 fifth 0.6, C4-G4 0.9; computed 0.5912 and 0.8858).
    NoteMap map(test::equal_12(), 0, a440, "test");
    std::vector<NoteCheck> notes;
    for (int key : {53, 60, 67}) notes.push_back(check_note(map, map.hz(note_of_key(key))));
    auto checks = check_intervals(map, notes);
    // Of F3, C4 and G4 only F3-C4 and C4-G4 are checked intervals (both fifths).
    REQUIRE(checks.size() == 2);
    CHECK(checks[0].kind->name == "fifth");
    CHECK(checks[0].low == NoteName{5, 3});
    CHECK(checks[0].measured.hz == Approx(0.5912).margin(5e-5));
    CHECK(checks[0].measured.tempering == Tempering::narrow);
    // Within a tenth of a cent of pure a measured interval is called pure.
    CHECK(measured_beat(200.0, 300.0 * std::pow(2.0, 0.09 / 1200), checked_intervals()[0]).tempering ==
          Tempering::pure);
    CHECK(measured_beat(200.0, 300.0 * std::pow(2.0, 0.11 / 1200), checked_intervals()[0]).tempering ==
          Tempering::wide);
    CHECK(checks[1].measured.hz == Approx(0.8858).margin(5e-5));
    CHECK(checks[1].target.hz == Approx(0.8858).margin(5e-5));

    SECTION("a mistuned note shows in the played beat, not in the target") {
        // Werckmeister III at A4 = 440: F3-C4 is pure and C4-G4 beats 2.6725 (docs/references.md 4).
        NoteMap w(test::werckmeister_3(), 0, a440, "test");
        std::vector<NoteCheck> played = {check_note(w, w.hz(NoteName{5, 3})),
                                         check_note(w, shifted(w.hz(NoteName{0, 4}), 2.0)),
                                         check_note(w, w.hz(NoteName{7, 4}))};
        auto c = check_intervals(w, played);
        REQUIRE(c.size() == 2);
        CHECK(c[0].target.tempering == Tempering::pure);
        // C4 two cents sharp: F3-C4 turns wide by 2 cents, C4-G4 narrower by 2.
        CHECK(c[0].measured.tempering == Tempering::wide);
        CHECK(c[0].measured.cents == Approx(2.0).epsilon(1e-9));
        CHECK(c[1].measured.cents == Approx(c[1].target.cents - 2.0).epsilon(1e-9));
        CHECK(c[1].target.hz == Approx(2.6725).margin(5e-5));
    }
}

TEST_CASE("the best pitch standard of a tuning is found from its notes", "[measure_match]") {
    // Werckmeister III at A4 = 415: the exact notes of F3..A4 fit with RMS 0 at 415 Hz.
    const Scale w = test::werckmeister_3();
    for (double a4 : {415.0, 440.0, 392.0, 465.0}) {
        NoteMap map(w, 0, PitchReference{NoteName{9, 4}, a4}, "test");
        std::vector<double> hz;
        for (int key = 53; key <= 69; ++key) hz.push_back(map.hz(note_of_key(key)));
        TuningFit f = fit_tuning(w, "w", 0, a440, hz);
        INFO("A4 = " << a4);
        CHECK(f.reference.note == NoteName{9, 4});
        CHECK(f.reference.hz == Approx(a4).epsilon(1e-9));
        CHECK(f.rms_cents < 1e-9);
    }
    // A constant offset of every note is a different pitch standard, not a deviation.
    NoteMap map(w, 0, a440, "test");
    std::vector<double> hz;
    for (int key = 60; key <= 71; ++key) hz.push_back(shifted(map.hz(note_of_key(key)), 7.0));
    TuningFit f = fit_tuning(w, "w", 0, a440, hz);
    CHECK(f.reference.hz == Approx(shifted(440.0, 7.0)).epsilon(1e-9));

    SECTION("a tuning that is not 12 notes is refused") {
        Scale five("five", {Pitch::from_cents(240), Pitch::from_cents(480), Pitch::from_cents(720),
                            Pitch::from_cents(960)},
                   Pitch::from_ratio(Ratio(2)));
        CHECK_THROWS_WITH(fit_tuning(five, "five.scl", 0, a440, {440.0}),
                          "five.scl: error: this needs a 12-note tuning to name its notes C, C#, D …; it has 5 degrees");
    }
}

TEST_CASE("the closest library tuning is the one the notes were tuned in", "[measure_match]") {
    // Three temperaments at two pitch standards, every note off by up to 0.3 cents (what the
    // measurement allows): the tuning they came from is ranked first, at its standard.
    const auto lib = library();
    std::mt19937 rng(7);
    std::uniform_real_distribution<double> err(-0.3, 0.3);
    for (const char* file : {"equal-12.scl", "meantone-quarter-comma.scl", "werckmeister-iii.scl",
                             "vallotti.scl", "kirnberger-iii.scl"})
        for (double a4 : {415.0, 440.0}) {
            const Scale& s = std::find_if(lib.begin(), lib.end(), [&](auto& e) { return e.first == file; })->second;
            NoteMap map(s, 0, PitchReference{NoteName{9, 4}, a4}, file);
            std::vector<double> hz;
            for (int key = 53; key <= 69; ++key) hz.push_back(shifted(map.hz(note_of_key(key)), err(rng)));
            auto ranked = closest_tunings(lib, 0, a440, hz);
            INFO(file << " at A4 = " << a4);
            REQUIRE(ranked.size() == lib.size());
            CHECK(ranked[0].rms_cents < 0.3);
            CHECK(ranked[1].rms_cents > ranked[0].rms_cents);
            if (std::string(file) == "equal-12.scl") {
                // Equal temperament fits equally a whole number of semitones away: the
                // standard nearest the guess (A4 = 440) is reported, so 415 (101.3 cents
                // under 440) shows as 439.2 with the notes named a semitone higher.
                CHECK(ranked[0].name == file);
                const double d = 1200 * std::log2(ranked[0].reference.hz / a4);
                CHECK(std::abs(d - 100 * std::round(d / 100)) < 0.3);
                CHECK(std::abs(1200 * std::log2(ranked[0].reference.hz / 440.0)) < 50.0);
            } else {
                CHECK(ranked[0].name == file);
                CHECK(ranked[0].reference.hz == Approx(a4).epsilon(2e-4));
            }
        }
}

TEST_CASE("the interval just tuned is found in either order with its target beat",
          "[measure_match]") {
    // Werckmeister III at A4 = 440: the major third F3-A3 beats 1.9859 per second
    // (docs/references.md section 4, computed; Rhodes' frequencies F3 175.6028, A3 220).
    NoteMap map(test::werckmeister_3(), 0, a440, "test");
    const NoteCheck f3 = check_note(map, 175.6028), a3 = check_note(map, 220.0);
    for (auto [first, second] : {std::pair{f3, a3}, std::pair{a3, f3}}) {
        auto c = check_interval(map, first, second);
        REQUIRE(c);
        CHECK(c->kind->name == "major third");
        CHECK(c->low == NoteName{5, 3});
        CHECK(c->target.hz == Approx(1.9859).margin(5e-5));
        CHECK(c->measured.hz == Approx(1.9859).margin(2e-3));
    }
    // A whole tone is not a checked interval.
    CHECK_FALSE(check_interval(map, f3, check_note(map, 196.8850)));
}
