#include <catch2/catch.hpp>

#include "../analysis/test_tunings.hpp"
#include "core/report/compare_report.hpp"
#include "xml_check.hpp"

using namespace terzo;

namespace {
using Keys = std::vector<std::string>;
Keys keys_of(const nlohmann::ordered_json& j) {
    Keys k;
    for (auto it = j.begin(); it != j.end(); ++it)
        k.push_back(it.key());
    return k;
}
ComparedTuning compared(const Scale& s, const char* name, bool fit = false) {
    CompareOptions o;
    o.fit = fit;
    ComparedTuning t;
    t.name = name;
    t.description = s.description();
    t.size = s.size();
    if (s.size() == 12) t.keys = compare_keys(s, o, name);
    t.classes = interval_classes(s, 5, name);
    return t;
}
std::vector<ComparedTuning> two() {
    return {compared(test::equal_12(), "et.scl"), compared(test::quarter_comma(), "qc.scl")};
}
Scale five_note() {
    return Scale("pentatonic",
                 {Pitch::from_ratio(Ratio(9, 8)), Pitch::from_ratio(Ratio(5, 4)),
                  Pitch::from_ratio(Ratio(3, 2)), Pitch::from_ratio(Ratio(5, 3))},
                 Pitch::from_ratio(Ratio(2)));
}
} // namespace

TEST_CASE("the comparison's JSON has the documented keys", "[compare_report]") {
    auto list = two();
    list.push_back(compared(five_note(), "five.scl"));
    CompareOptions o;
    o.fit = false;
    auto j = compare_json(list, o, 5, Spelling::mixed);
    CHECK(keys_of(j) == Keys{"reference", "tonic", "octave", "odd_limit", "fit_order", "weights",
                             "wolf_thresholds", "tunings"});
    CHECK(j["fit_order"].is_null());
    CHECK(j["weights"].is_null());
    CHECK(j["wolf_thresholds"]["fifth_cents"].get<double>() == Approx(11.730005));
    REQUIRE(j["tunings"].size() == 3);
    const auto& t = j["tunings"][1];
    CHECK(keys_of(t) == Keys{"name", "description", "size", "keys", "summary", "circle_of_fifths",
                             "interval_classes"});
    CHECK(keys_of(t["keys"][0]) ==
          Keys{"key", "notes", "fifth", "major_third", "minor_third", "fit_cents"});
    CHECK(t["keys"][0]["notes"] == nlohmann::ordered_json{"C4", "E4", "G4"});
    CHECK(keys_of(t["keys"][0]["fifth"]) ==
          Keys{"deviation_cents", "beats_per_second", "tempering", "exact"});
    CHECK(t["keys"][0]["major_third"]["tempering"] == "pure");
    CHECK(keys_of(t["summary"]) == Keys{"weighted", "mean_fifth_cents", "worst_fifth_cents",
                                        "mean_major_third_cents", "worst_major_third_cents",
                                        "mean_minor_third_cents", "worst_minor_third_cents",
                                        "pure_fifths", "pure_major_thirds", "pure_minor_thirds",
                                        "wolves", "mean_fit_cents"});
    CHECK(t["summary"]["pure_major_thirds"] == 8); // quarter-comma, docs/references.md 2.2
    CHECK(keys_of(t["summary"]["wolves"][0]) == Keys{"interval", "notes", "deviation_cents"});
    CHECK(keys_of(t["interval_classes"][0]) == Keys{"steps", "sizes"});
    CHECK(keys_of(t["interval_classes"][0]["sizes"][0]) ==
          Keys{"cents", "ratio", "exact", "value", "count", "nearest", "deviation_cents"});
    CHECK(j["tunings"][2]["keys"].is_null());
    CHECK(j["tunings"][2]["interval_classes"].size() == 4);
}

TEST_CASE("the summary and wolves tables name the quarter-comma wolf", "[compare_report]") {
    auto list = two();
    Table s = summary_table(list);
    REQUIRE(s.rows.size() == 2);
    // 12-TET: docs/references.md section 1, fifths -1.955, major thirds +13.686, minor -15.641.
    CHECK(s.rows[0] == Keys{"et.scl", "1.955", "1.955", "13.686", "13.686", "15.641", "15.641", "0",
                            "0", "0", ""});
    CHECK(s.rows[1][8] == "8");
    Table w = wolves_table(list, Spelling::mixed);
    bool wolf_fifth = false;
    for (const auto& r : w.rows)
        if (r[1] == "fifth") {
            wolf_fifth = true;
            CHECK(r[2] == "G#-Eb");
            CHECK(r[3] == "+35.682"); // 737.637287 - 701.955001, docs/references.md 2.2
        }
    CHECK(wolf_fifth);
    CHECK(w.rows.size() == 8); // 1 fifth, 4 diminished fourths, 3 augmented seconds
}

TEST_CASE("key and class tables carry the per-key numbers", "[compare_report]") {
    auto list = two();
    Table k = key_table(*list[0].keys, Spelling::mixed);
    CHECK(k.header.size() == 8); // no fit column when fits were not computed
    // C4-G4 0.8858 and C4-E4 10.3824 beats/s at A4 = 440, docs/references.md section 4.
    CHECK(k.rows[0] ==
          Keys{"C major", "C4 E4 G4", "-1.955", "0.89", "+13.686", "10.38", "-15.641", "17.79"});
    Table longt = keys_long_table(list, Spelling::mixed);
    CHECK(longt.rows.size() == 48);
    CHECK(longt.rows[24][0] == "qc.scl");
    Table c = classes_table(list);
    CHECK(c.rows[6] == Keys{"et.scl", "7", "700.000", "2^(7/12)", "12", "3/2", "-1.955"});
}

TEST_CASE("a fit column appears when fits are computed", "[compare_report]") {
    Table k = key_table(*compared(test::equal_12(), "et", true).keys, Spelling::mixed);
    REQUIRE(k.header.size() == 9);
    CHECK(k.header[8] == "fit (c)");
    CHECK_FALSE(k.rows[0][8].empty());
}

TEST_CASE("the comparison plots parse as XML", "[compare_report]") {
    auto list = two();
    list.push_back(compared(five_note(), "five.scl"));
    std::string doc = compare_svg(list, Spelling::mixed);
    CHECK(test::parse_with_python(doc).rfind("{http://www.w3.org/2000/svg}svg ", 0) == 0);
    // 2 tunings x 12 keys x 2 plots of bars (plus the 2 legend squares and the background),
    // and 2 circles of 12 arcs.
    CHECK(test::occurrences(doc, "<rect ") == 48 + 2 + 1);
    CHECK(test::occurrences(doc, "<path ") == 24);
    CHECK(doc.find("qc.scl, C major: 0.000 c") != std::string::npos);
    REQUIRE_THROWS_WITH(compare_svg({compared(five_note(), "five.scl")}, Spelling::mixed),
                        "--svg: error: the plots need at least one 12-note tuning");
}
