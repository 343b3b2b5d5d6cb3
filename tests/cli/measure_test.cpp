// terzo measure end to end: synthetic recordings (tests/sound/recording.hpp: stiff strings,
// decay, attack noise, background noise 45 dB under the peak) written as WAV files, measured
// by the built program. Truth: the notes of published temperaments in scales/ at A4 = 415 and
// 440 Hz (NoteMap), detuned by known amounts.
#include <catch2/catch.hpp>

#include <cmath>
#include <fstream>
#include <nlohmann/json.hpp>

#include "core/analysis/sheet.hpp"
#include "core/tuning/scl.hpp"
#include "core/io/wav.hpp"
#include "tests/sound/recording.hpp"
#include "tests/support/run.hpp"

using namespace terzo;
using test::run_terzo;

namespace {

// F3..F4 of the tuning at the standard, note i detuned by detune[i] cents, written to `file`.
std::vector<double> write_octave(const std::string& file, const std::string& scl, double a4,
                                 const std::vector<double>& detune, SampleFormat format, double gap = 0.0) {
    const Scale scale = read_scl_file(test::source_path("scales/" + scl));
    NoteMap map(scale, 0, PitchReference{NoteName{9, 4}, a4}, scl);
    std::vector<test::StringNote> notes;
    std::vector<double> hz;
    for (int key = 53; key <= 65; ++key) {
        const double d = detune.empty() ? 0.0 : detune[std::size_t(key - 53) % detune.size()];
        hz.push_back(map.hz(note_of_key(key)) * std::pow(2.0, d / 1200.0));
        notes.push_back({hz.back(), 0.8, gap, 0.0});
    }
    test::StringSound s;
    s.sample_rate = 44100;
    s.inharmonicity = 6e-5;
    auto r = test::string_recording(notes, s);
    write_wav(file, r.samples, WavFormat{44100, format}, Overwrite::allow);
    return hz;
}

} // namespace

TEST_CASE("terzo measure names the temperament and pitch standard of a recording", "[measure]") {
    test::ScratchFolder dir("measure");
    // Werckmeister III at A4 = 415 and quarter-comma meantone at A4 = 440, each note off by
    // up to 0.5 cents (an instrument in good tune).
    const std::vector<double> small = {0.2, -0.4, 0.5, -0.1, 0.3, -0.5};
    struct Case {
        const char* scl;
        double a4;
        SampleFormat format;
    } cases[] = {{"werckmeister-iii.scl", 415.0, SampleFormat::int16},
                 {"meantone-quarter-comma.scl", 440.0, SampleFormat::float32}};
    for (const Case& c : cases) {
        const std::string file = (dir.path / "octave.wav").string();
        const auto hz = write_octave(file, c.scl, c.a4, small, c.format);
        auto r = run_terzo("measure " + file + " --json");
        INFO(c.scl << " " << r.err);
        REQUIRE(r.status == 0);
        auto doc = nlohmann::json::parse(r.out);
        REQUIRE(doc["notes"].size() == hz.size());
        for (std::size_t i = 0; i < hz.size(); ++i) {
            const double got = doc["notes"][i]["hz"];
            CHECK(std::abs(test::cents_between(got, hz[i])) < 0.3);
            CHECK_FALSE(doc["notes"][i].contains("note"));
        }
        CHECK(doc["closest"][0]["tuning"] == c.scl);
        const std::string ref = doc["closest"][0]["reference"];
        CHECK(ref.substr(0, 3) == "A4=");
        CHECK(std::stod(ref.substr(3)) == Approx(c.a4).margin(0.1));
        CHECK(doc["closest"][0]["rms_cents"] < 0.5);
    }
}

TEST_CASE("terzo measure --against gives each note's target, deviation and the beats",
          "[measure]") {
    test::ScratchFolder dir("measure");
    const std::string file = (dir.path / "octave.wav").string();
    // Vallotti at A4 = 415 with the notes 5 cents sharp, 3 flat, in turn.
    const auto hz = write_octave(file, "vallotti.scl", 415.0, {5.0, -3.0}, SampleFormat::int16, 0.2);
    auto r = run_terzo("measure " + file + " --against " + test::source_path("scales/vallotti.scl") +
                       " --pitch A4=415 --json");
    INFO(r.err);
    REQUIRE(r.status == 0);
    auto doc = nlohmann::json::parse(r.out);
    REQUIRE(doc["notes"].size() == 13);
    const char* names[] = {"F3", "F#3", "G3", "G#3", "A3", "Bb3", "B3", "C4", "C#4", "D4", "Eb4", "E4", "F4"};
    for (std::size_t i = 0; i < 13; ++i) {
        INFO("note " << i);
        CHECK(doc["notes"][i]["note"] == names[i]);
        CHECK(double(doc["notes"][i]["deviation_cents"]) == Approx(i % 2 == 0 ? 5.0 : -3.0).margin(0.3));
        const double target = doc["notes"][i]["target_hz"];
        CHECK(test::cents_between(hz[i], target) == Approx(i % 2 == 0 ? 5.0 : -3.0).margin(1e-6));
        for (const char* key : {"start_s", "end_s", "hz", "inharmonicity", "confidence"})
            CHECK(doc["notes"][i].contains(key));
    }
    CHECK_FALSE(doc.contains("closest"));
    // F3-C4: F3 5 cents sharp, C4 (i = 7) 3 cents flat: the fifth is 8 cents narrower than
    // the tuning's, and its played beat is |3 F3 - 2 C4| of the measured notes.
    bool seen = false;
    for (const auto& i : doc["intervals"])
        if (i["interval"] == "fifth" && i["low"] == "F3") {
            seen = true;
            CHECK(double(i["played"]["deviation_cents"]) ==
                  Approx(double(i["target"]["deviation_cents"]) - 8.0).margin(0.5));
        }
    CHECK(seen);

    SECTION("the text report lists notes, intervals and the advice; --csv the notes") {
        auto t = run_terzo("measure " + file + " --against " + test::source_path("scales/vallotti.scl") +
                           " --pitch A4=415");
        REQUIRE(t.status == 0);
        CHECK(t.out.find("13 notes found") != std::string::npos);
        CHECK(t.out.find("Intervals between measured notes") != std::string::npos);
        CHECK(t.out.find("Measurements are advice.") != std::string::npos);
        auto c = run_terzo("measure " + file + " --against " + test::source_path("scales/vallotti.scl") +
                           " --pitch A4=415 --csv");
        REQUIRE(c.status == 0);
        CHECK(c.out.rfind("#,start s,end s,Hz,B,confidence,partials,note,target Hz,cents,Hz off\r\n1,", 0) == 0);
    }
}

TEST_CASE("terzo measure of a recording without notes says so", "[measure]") {
    test::ScratchFolder dir("measure");
    const std::string file = (dir.path / "quiet.wav").string();
    write_wav(file, std::vector<double>(44100, 0.0), WavFormat{44100, SampleFormat::int16});
    auto r = run_terzo("measure " + file);
    REQUIRE(r.status == 0);
    CHECK(r.out.find("0 notes found") != std::string::npos);
    CHECK(r.out.find("No notes found") != std::string::npos);
    auto j = run_terzo("measure " + file + " --json");
    REQUIRE(j.status == 0);
    CHECK(nlohmann::json::parse(j.out) == nlohmann::json::parse(R"({"notes": [], "closest": []})"));
}
