#include <catch2/catch.hpp>

#include <sstream>
#include <string>

#include <nlohmann/json.hpp>

#include "core/report/resultants_report.hpp"
#include "../analysis/helpers.hpp"
#include "tests/support/run.hpp"

using namespace terzo;
using test::run;
using Run = test::RunResult;

namespace {

std::string data(const char* name) { return std::string(TERZO_SOURCE_DIR) + "/tests/analysis/data/" + name; }
std::string cli() { return std::string(TERZO_CLI); }

} // namespace

TEST_CASE("terzo resultants agrees with an independent computation in Python fractions", "[report]") {
    // The script rebuilds every tone and landing with fractions.Fraction (Python's standard
    // library) and compares it with terzo's JSON: three scales, one with ratios beyond 64 bits
    // once multiplied out, with partials and with chords.
    const std::string script = std::string(TERZO_SOURCE_DIR) + "/tests/analysis/crosscheck_resultants.py";
    const char* cases[] = {
        "triad.scl",
        "just12.scl --span 2 --order 5",
        "just12.scl --chord 0,4,7,12 --order 4",
        "large.scl --span 2 --order 4 --partials 2",
        "large.scl --chord 0,1,3,5,9/7 --partials 3",
    };
    for (const char* c : cases) {
        INFO(c);
        Run r = run("python3 " + script + " " + cli() + " " + data("") + c);
        INFO(r.out + r.err);
        CHECK(r.status == 0);
        CHECK(r.out.rfind("ok: ", 0) == 0);
    }
}

TEST_CASE("the JSON document has the documented keys", "[report]") {
    Run r = run(cli() + " resultants " + data("triad.scl") + " --json");
    REQUIRE(r.status == 0);
    auto j = nlohmann::json::parse(r.out);
    CHECK(j["ref_hz"] == 261.6255653);
    CHECK(j["order"] == 3);
    const auto& d = j["dyads"][0];
    CHECK(d["low"]["degree"] == 0);
    CHECK(d["low"]["period"] == 0);
    CHECK(d["high"]["degree"] == 1);
    const auto& t = d["tones"][0];
    CHECK(t["a"] == -1);
    CHECK(t["b"] == 1);
    CHECK(t["order"] == 2);
    CHECK(t["ratio"] == "1/4");
    CHECK(t["landing"]["degree"] == 0);
    CHECK(t["landing"]["period"] == -2);
    CHECK(t["landing"]["deviation_cents"] == 0.0);
    CHECK(t["landing"]["exact"] == true);
    CHECK(std::abs(t["hz"].get<double>() - 261.6255653 / 4) < 1e-9);
}

TEST_CASE("the text report of the just triad matches the saved output", "[report]") {
    Run r = run(cli() + " resultants " + data("triad.scl") + " --chord 0,1,2");
    REQUIRE(r.status == 0);
    CHECK(r.out == test::slurp(data("triad_chord.txt")));
}

TEST_CASE("the CSV form has one row per tone", "[report]") {
    Run r = run(cli() + " resultants " + data("triad.scl") + " --csv");
    REQUIRE(r.status == 0);
    std::size_t rows = 0;
    for (char ch : r.out) rows += ch == '\n';
    CHECK(rows == 1 + 35); // header + the 35 tones the fractions check counts for triad.scl
    CHECK(r.out.rfind("low_degree,low_period,low_hz,high_degree", 0) == 0);
}

TEST_CASE("the compact and the indented JSON hold the same document, laid out as a JSON library prints it", "[report]") {
    // nlohmann::json (a general-purpose library) is the reference: it reads both forms to the
    // same value, and its dump(2) of that value is, byte for byte, the indented form.
    Keyboard kb(test::just12());
    ResultantsReport r;
    r.keyboard = &kb;
    r.chord = parse_chord("0,4,7", kb, {"--chord"});
    r.dyads = chord_tones(kb, *r.chord, r.options);
    r.bass = common_bass(kb, *r.chord);
    r.fit = fit(r.dyads);
    auto both = [&] {
        std::ostringstream compact, pretty;
        write_resultants(compact, r, ResultantsFormat::json);
        write_resultants(pretty, r, ResultantsFormat::json_pretty);
        return std::pair{compact.str(), pretty.str()};
    };
    auto [compact, pretty] = both();
    const auto doc = nlohmann::ordered_json::parse(compact);
    CHECK(nlohmann::ordered_json::parse(pretty) == doc);
    CHECK(pretty == doc.dump(2) + "\n");
    CHECK(compact == doc.dump() + "\n");
    CHECK(doc["dyads"].size() == 3);
    CHECK(doc["chord"]["common_bass"]["ratio"] == "1/4");
    r.dyads.clear();
    auto [empty_compact, empty_pretty] = both();
    const auto empty = nlohmann::ordered_json::parse(empty_compact);
    CHECK(empty["dyads"].empty());
    CHECK(empty_pretty == empty.dump(2) + "\n");
}

TEST_CASE("labels and exact values print the way the manual shows them", "[report]") {
    CHECK(note_label(4, -2) == "degree 4, period -2");
    Keyboard kb(test::just12());
    DyadTones d{kb.note(0, 0), kb.note(4, 0), {}}; // 1/1 and 5/4
    const DyadExact exact(d.low, d.high);
    Tone t; // the difference tone 5/4 - 1 = 1/4
    CHECK(exact.text(t) == "-"); // a tone not marked exact has no exact value
    t.exact = ExactKind::ratio;
    CHECK(exact.text(t) == "1/4");
    CHECK(exact_ratio(d, t) == Ratio(1, 4));
}

TEST_CASE("nothing is written before the first dyad, so a refused request leaves no output", "[report]") {
    Keyboard kb(test::just12());
    std::ostringstream out;
    {
        ResultantsWriter w(out, ResultantsFormat::json, kb, ToneOptions{});
        CHECK(out.str().empty());
    }
    CHECK(out.str().empty());
}

TEST_CASE("the CSV rows carry the exact ratio and the landing of each tone", "[report]") {
    // 1/1 and 5/4 from the reference 264 Hz: the difference tone is 66 Hz = 1/4, degree 0
    // two periods down, exactly (docs/references.md section 5.2, as in combination_test.cpp).
    Keyboard kb(test::ratio_scale({{5, 4}, {3, 2}}), 264.0);
    ResultantsReport r;
    r.keyboard = &kb;
    r.options.order = 2;
    r.dyads = {{kb.note(0, 0), kb.note(1, 0), dyad_tones(kb, kb.note(0, 0), kb.note(1, 0), r.options)}};
    std::ostringstream out;
    write_resultants(out, r, ResultantsFormat::csv);
    CHECK(out.str().find("\r\n0,0,264.000000,1,0,330.000000,-1,1,2,difference tone,1,1,66.000000,1/4,0,-2,"
                         "0.000000,true,0.5000\r\n") != std::string::npos);
}
