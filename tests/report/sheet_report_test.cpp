#include <catch2/catch.hpp>

#include <sstream>

#include "../analysis/test_tunings.hpp"
#include "core/report/sheet_report.hpp"
#include "xml_check.hpp"

using namespace terzo;

namespace {
NoteName note(const char* text) {
    return parse_note(text, {"test", 0, 0});
}
Sheet w3_sheet() {
    return make_sheet(test::werckmeister_3(), SheetOptions{}, "w3");
}
std::vector<std::string> keys_of(const nlohmann::ordered_json& j) {
    std::vector<std::string> k;
    for (auto it = j.begin(); it != j.end(); ++it)
        k.push_back(it.key());
    return k;
}
using Keys = std::vector<std::string>;
} // namespace

TEST_CASE("the sheet's JSON has the documented keys", "[sheet_report]") {
    auto j = sheet_json(w3_sheet());
    CHECK(keys_of(j) == Keys{"description", "reference", "tonic", "range", "notes", "intervals",
                             "order", "circle_of_fifths", "advice"});
    CHECK(j["reference"]["note"] == "A4");
    CHECK(j["reference"]["hz"] == 440.0);
    CHECK(j["range"]["low"] == "F3");
    CHECK(keys_of(j["notes"][0]) ==
          Keys{"note", "midi_key", "degree", "hz", "offset_cents", "position"});
    CHECK(j["notes"][0]["midi_key"] == 53);
    CHECK(keys_of(j["intervals"][0]) == Keys{"interval", "pure", "low", "high", "low_hz", "high_hz",
                                             "cents", "deviation_cents", "beats_per_second",
                                             "tempering", "exact"});
    CHECK(j["intervals"][0]["pure"] == "3/2");
    CHECK(j["intervals"][0]["tempering"] == "pure"); // F3-C4 in Werckmeister III
    CHECK(keys_of(j["order"][0]) == Keys{"step", "kind", "to", "hz", "from", "deviation_cents",
                                         "beats_per_second", "tempering", "exact"});
    CHECK(j["order"][0]["from"].is_null());
    CHECK(j["order"][1]["kind"] == "octave down");
    CHECK(j["circle_of_fifths"].size() == 12);
    CHECK(keys_of(j["circle_of_fifths"][0]) ==
          Keys{"from", "to", "deviation_cents", "beats_per_second", "tempering", "exact"});
    CHECK(j["circle_of_fifths"][0]["deviation_cents"].get<double>() ==
          Approx(-23.460010 / 4).margin(1e-6));
    CHECK(j["advice"] == tuning_advice);
}

TEST_CASE("the notes table puts each note's rising intervals beside it", "[sheet_report]") {
    Table t = sheet_notes_table(make_sheet(test::equal_12(), SheetOptions{}, "12"));
    CHECK(t.header ==
          Keys{"note", "degree", "Hz", "vs 12-TET", "5th up", "4th up", "M3 up", "m3 up", "M6 up"});
    REQUIRE(t.rows.size() == 13);
    // F3: 174.614 Hz, 12-TET rates from docs/references.md section 4 (F3-C4 0.5912, F3-Bb3 0.7892,
    // F3-A3 6.9294, F3-Ab3 9.4230, F3-D4 7.9237).
    CHECK(t.rows[0] == Keys{"F3", "5", "174.614", "0.00", "0.59 narrow", "0.79 wide", "6.93 wide",
                            "9.42 narrow", "7.92 wide"});
    CHECK(t.rows[12][4].empty());
    CHECK(beat_cell(Beat{0, 0, Tempering::pure, true}) == "pure");
}

TEST_CASE("the order and interval tables read as a tuner's steps", "[sheet_report]") {
    Sheet s = w3_sheet();
    Table o = sheet_order_table(s);
    CHECK(o.rows[0] == Keys{"1", "A4", "reference", "-", "440.000", "", ""});
    CHECK(o.rows[1] == Keys{"2", "A3", "A4", "octave down", "220.000", "0.00", "pure"});
    SheetOptions from_c;
    from_c.start = note("C4");
    CHECK(sheet_order_table(make_sheet(test::equal_12(), from_c, "12")).rows[0] ==
          Keys{"1", "C4", "its Hz", "-", "261.626", "", ""});
    SheetOptions wide;
    wide.high = note("G4");
    Sheet g = make_sheet(test::werckmeister_3(), wide, "w3");
    Table i = sheet_intervals_table(g);
    CHECK(i.rows.size() == g.intervals.size());
    // C4-G4 in Werckmeister III: 2.6725 beats/s (docs/references.md section 4 [C]).
    bool found = false;
    for (const auto& r : i.rows)
        if (r[0] == "fifth" && r[1] == "C4") {
            found = true;
            CHECK(r[6] == "2.673"); // 2.6725 to four decimals
            CHECK(r[7] == "narrow");
        }
    CHECK(found);
    Table c = sheet_circle_table(s);
    CHECK(c.rows[0] == Keys{"C-G", "-5.865", "2.673", "narrow"});
}

TEST_CASE("the printable sheet parses as XML and carries the advice", "[sheet_report]") {
    std::string doc = sheet_svg(w3_sheet(), paper_a4());
    CHECK(test::parse_with_python(doc).rfind("{http://www.w3.org/2000/svg}svg ", 0) == 0);
    CHECK(doc.find("width=\"210mm\" height=\"297mm\"") != std::string::npos);
    CHECK(doc.find("instrument maker") != std::string::npos);
    CHECK(test::occurrences(doc, "<path ") == 12); // one arc per fifth
    CHECK(doc.find("C-G: -5.865 c, narrow") != std::string::npos);
    std::string letter = sheet_svg(w3_sheet(), paper_letter());
    CHECK(letter.find("width=\"215.9mm\" height=\"279.4mm\"") != std::string::npos);
}

TEST_CASE("a range too large for one page is refused", "[sheet_report]") {
    SheetOptions o;
    o.low = note("C2");
    o.high = note("C5");
    Sheet s = make_sheet(test::equal_12(), o, "12");
    REQUIRE_THROWS_WITH(sheet_svg(s, paper_a4()),
                        "--svg: error: the range C2..C5 (37 notes) does not fit on one A4 page, "
                        "which holds 27 notes; give a smaller --range");
    REQUIRE_THROWS_WITH(sheet_svg(s, paper_letter()),
                        "--svg: error: the range C2..C5 (37 notes) does not fit on one Letter "
                        "page, which holds 25 notes; give a smaller --range");
    o.low = note("F3");
    o.high = note("F5"); // two octaves fit on either
    CHECK_NOTHROW(sheet_svg(make_sheet(test::equal_12(), o, "12"), paper_letter()));
}

TEST_CASE("a long description is cut to the page width", "[sheet_report]") {
    Scale t = test::equal_12();
    Scale long_name(std::string(300, 'x'), {t.degrees().begin() + 1, t.degrees().end()},
                    t.period());
    std::string doc = sheet_svg(make_sheet(long_name, SheetOptions{}, "long"), paper_a4());
    // 186 mm at 3.4 mm and 0.55 em per character: 99 characters, the last three "...".
    CHECK(doc.find(">" + std::string(96, 'x') + "...</text>") != std::string::npos);
    CHECK(test::parse_with_python(doc).rfind("{http://www.w3.org/2000/svg}svg ", 0) == 0);
}
