#include <catch2/catch.hpp>

#include <sstream>
#include <string>

#include "core/analysis/candidates.hpp"
#include "core/report/suggest_report.hpp"
#include "tests/support/scales.hpp"

using namespace terzo;

namespace {

SuggestReport report_of(const Keyboard& kb, const std::string& spec, const SuggestOptions& o, std::size_t top) {
    SuggestReport r;
    r.keyboard = &kb;
    r.options = o;
    r.results = suggest(kb, candidate_pitches(parse_candidate_spec(spec, {"--candidates"}), kb.scale().period(), {"--candidates"}), o, true);
    r.candidates = spec;
    r.top = top;
    r.removals = true;
    return r;
}

} // namespace

TEST_CASE("the JSON document has the documented keys, lists cut to --top", "[suggest_report]") {
    Keyboard kb(test::ratio_scale({{9, 8}, {5, 4}, {3, 2}}));
    SuggestOptions o;
    const auto doc = suggest_json(report_of(kb, "7/4,edo:12,350.0", o, 2));
    std::vector<std::string> keys;
    for (const auto& item : doc.items()) keys.push_back(item.key());
    CHECK(keys == std::vector<std::string>{"fit", "order", "span", "partials", "ref_hz", "pitch_floor_hz",
                                           "near_cents", "candidates", "add", "remove"});
    CHECK(doc["candidates"] == 13); // 7/4, 11 steps of 12 equal divisions, 350.0 c
    REQUIRE(doc["add"].size() == 2);
    REQUIRE(doc["remove"].size() == 2);
    std::vector<std::string> add_keys;
    for (const auto& item : doc["add"][0].items()) add_keys.push_back(item.key());
    CHECK(add_keys == std::vector<std::string>{"ratio", "exact_value", "cents", "fit", "gain", "exact_landings",
                                               "near_landings", "infrasonic_landings", "gain_is_infrasonic"});
    CHECK(doc["add"][0]["fit"].get<double>() <= doc["add"][1]["fit"].get<double>());
    CHECK(doc["add"][0]["gain"].get<double>() ==
          Approx(doc["fit"].get<double>() - doc["add"][0]["fit"].get<double>()));
}

TEST_CASE("a cents-only candidate has no ratio and no exact value", "[suggest_report]") {
    Keyboard kb(test::ratio_scale({{5, 4}}));
    SuggestOptions o;
    const auto doc = suggest_json(report_of(kb, "350.0", o, 10));
    REQUIRE(doc["add"].size() == 1);
    CHECK(doc["add"][0]["ratio"].is_null());
    CHECK(doc["add"][0]["exact_value"].is_null());
    CHECK(doc["add"][0]["cents"] == 350.0);
    CHECK(candidate_label(Pitch::from_cents(350.0)) == "350.000 c");
    CHECK(candidate_label(Pitch::from_ratio(Ratio(7, 4))) == "7/4");
}

TEST_CASE("the text names a gain that rests on tones below 20 Hz", "[suggest_report]") {
    // 3/2 from 40 Hz: 4/3 adds landings only among tones below 20 Hz (docs/suggest.md).
    Keyboard kb(test::ratio_scale({{3, 2}}), 40.0);
    SuggestOptions o;
    std::ostringstream out;
    write_suggest_text(out, report_of(kb, "4/3,5/4", o, 10));
    const std::string text = out.str();
    const auto row = text.find("\n4/3 ");
    REQUIRE(row != std::string::npos);
    CHECK(text.substr(row + 1, text.find('\n', row + 1) - row - 1).find("* below 20 Hz") != std::string::npos);
    CHECK(out.str().find("tones below") == std::string::npos); // no floor: nothing left out
    o.fit.pitch_floor_hz = pitch_perception_floor_hz;
    std::ostringstream floored;
    write_suggest_text(floored, report_of(kb, "4/3,5/4", o, 10));
    CHECK(floored.str().find("* below") == std::string::npos);
    CHECK(floored.str().find("tones below 20 Hz are left out of the fit") != std::string::npos);
}
