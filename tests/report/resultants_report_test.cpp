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

TEST_CASE("the streamed JSON is the same text as the whole document", "[report]") {
    Keyboard kb(test::just12());
    ResultantsReport r;
    r.keyboard = &kb;
    r.chord = parse_chord("0,4,7", kb, {"--chord"});
    r.dyads = chord_tones(kb, *r.chord, r.options);
    r.bass = common_bass(kb, *r.chord);
    r.fit = fit(r.dyads);
    std::ostringstream streamed;
    write_resultants_json(streamed, r);
    CHECK(streamed.str() == resultants_json(r).dump(2) + "\n");
    r.dyads.clear();
    std::ostringstream empty;
    write_resultants_json(empty, r);
    CHECK(empty.str() == resultants_json(r).dump(2) + "\n");
}

TEST_CASE("labels and exact values print the way the README shows them", "[report]") {
    CHECK(note_label(4, -2) == "degree 4, period -2");
    Tone t;
    CHECK(exact_text(t) == "-");
    t.ratio = Ratio(1, 4);
    CHECK(exact_text(t) == "1/4");
}
