// The reports of a measurement: JSON keys exactly as documented (docs/measure.md), tables and
// the terminal text, from a result built by hand.
#include <catch2/catch.hpp>

#include <sstream>

#include "core/report/measure_report.hpp"
#include "tests/analysis/test_tunings.hpp"

using namespace terzo;

namespace {

MeasureResult two_notes() {
    MeasureResult r;
    r.recording = "two.wav";
    r.seconds = 3.5;
    r.sample_rate = 48000;
    r.channels = 2;
    for (double hz : {174.614, 261.626}) {
        MeasuredNote n;
        n.span = {0.5 + double(r.notes.size()), 1.25 + double(r.notes.size())};
        n.pitch.hz = hz;
        n.pitch.inharmonicity = 1.5e-4;
        n.pitch.confidence = 0.97;
        n.pitch.partials.resize(12);
        r.notes.push_back(n);
    }
    return r;
}

} // namespace

TEST_CASE("without a tuning the JSON has the notes and the closest tunings", "[measure_report]") {
    MeasureResult r = two_notes();
    r.closest = {{"werckmeister-iii.scl", {NoteName{9, 4}, 415.0212}, 0.1234},
                 {"vallotti.scl", {NoteName{9, 4}, 415.5}, 2.5}};
    r.library = "scales";
    const auto j = measure_json(r);
    REQUIRE(j.size() == 2);
    CHECK(j.begin().key() == "notes");
    std::vector<std::string> keys;
    for (auto it = j["notes"][0].begin(); it != j["notes"][0].end(); ++it) keys.push_back(it.key());
    CHECK(keys == std::vector<std::string>{"start_s", "end_s", "hz", "inharmonicity", "confidence"});
    CHECK(j["notes"][1]["hz"] == 261.626);
    CHECK(j["closest"][0] == nlohmann::ordered_json::parse(
                                 R"({"tuning": "werckmeister-iii.scl", "reference": "A4=415.02", "rms_cents": 0.1234})"));
    const std::string text = measure_text(r, 1);
    CHECK(text.find("Recording two.wav: 3.50 s, 48000 Hz, 2 channels; 2 notes found") != std::string::npos);
    CHECK(text.find("werckmeister-iii.scl  A4=415.02") != std::string::npos);
    CHECK(text.find("vallotti.scl") == std::string::npos); // only the best one asked for
    CHECK(text.find("Measurements are advice.") != std::string::npos);
}

TEST_CASE("against a tuning the JSON adds note, target and deviation and the intervals",
          "[measure_report]") {
    MeasureResult r = two_notes();
    NoteMap map(test::equal_12(), 0, PitchReference{}, "test");
    MeasureResult::Against g;
    g.tuning = "equal 12";
    g.description = "12-TET";
    for (const auto& n : r.notes) g.notes.push_back(check_note(map, n.pitch.hz));
    g.intervals = check_intervals(map, g.notes);
    r.against = g;
    const auto j = measure_json(r);
    std::vector<std::string> keys;
    for (auto it = j["notes"][0].begin(); it != j["notes"][0].end(); ++it) keys.push_back(it.key());
    CHECK(keys == std::vector<std::string>{"start_s", "end_s", "hz", "inharmonicity", "confidence", "note",
                                           "target_hz", "deviation_cents"});
    CHECK(j["notes"][0]["note"] == "F3");
    CHECK(j["notes"][1]["note"] == "C4");
    CHECK_FALSE(j.contains("closest"));
    // F3-C4 is a fifth: one interval, played and targeted.
    REQUIRE(j["intervals"].size() == 1);
    CHECK(j["intervals"][0]["interval"] == "fifth");
    CHECK(j["intervals"][0]["target"]["tempering"] == "narrow");

    std::ostringstream csv;
    write_csv(csv, measure_notes_table(r));
    CHECK(csv.str().rfind("#,start s,end s,Hz,B,confidence,partials,note,target Hz,cents,Hz off\r\n"
                          "1,0.500,1.250,174.614,1.500e-4,0.97,12,F3,174.614,",
                          0) == 0);
}
