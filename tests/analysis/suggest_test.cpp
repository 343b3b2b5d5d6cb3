#include <catch2/catch.hpp>

#include <cmath>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "core/analysis/candidates.hpp"
#include "core/analysis/chord.hpp"
#include "core/analysis/suggest.hpp"
#include "core/tuning/scl.hpp"
#include "core/tuning/load.hpp"
#include "tests/analysis/test_tunings.hpp"
#include "tests/support/run.hpp"
#include "tests/support/scales.hpp"

using namespace terzo;

namespace {

// The 7-note just scale of the tests (tests/analysis/rank_test.cpp).
const char* seven_scl = "seven just notes\n 7\n 9/8\n 5/4\n 4/3\n 3/2\n 5/3\n 15/8\n 2/1\n";
// A scale of our own in a 3/1 period.
const char* tritave_scl = "six notes in a tritave\n 6\n 4/3\n 5/3\n 2/1\n 7/3\n 8/3\n 3/1\n";

std::vector<Pitch> candidates(const std::string& spec, const Keyboard& kb) {
    return candidate_pitches(parse_candidate_spec(spec, {"--candidates"}), kb.scale().period(),
                             {"--candidates"});
}

// Every candidate scored incrementally and from scratch agrees: the fit to 1e-9 c (the sums
// run in another order), the landing counts and the flags exactly.
void check_against_scratch(const Keyboard& kb, const std::string& spec, const SuggestOptions& o) {
    const Suggestions s = suggest(kb, candidates(spec, kb), o, false);
    REQUIRE(!s.add.empty());
    for (const Addition& a : s.add) {
        INFO("candidate " << a.pitch.str());
        const Addition b = addition_from_scratch(kb, a.pitch, o, s.base_fit);
        CHECK(std::fabs(a.fit - b.fit) <= 1e-9);
        CHECK(std::fabs(a.gain - b.gain) <= 1e-9);
        CHECK(a.exact_landings == b.exact_landings);
        CHECK(a.near_landings == b.near_landings);
        CHECK(a.infrasonic_landings == b.infrasonic_landings);
        CHECK(a.gain_is_infrasonic == b.gain_is_infrasonic);
    }
}

} // namespace

TEST_CASE("a note added to a scale takes its place by size; a degree can be taken out", "[suggest]") {
    const Scale s = test::scl_text(seven_scl);
    std::size_t index = 0;
    const Scale g = grown_scale(s, Pitch::from_ratio(Ratio(7, 4)), &index);
    REQUIRE(g.size() == 8);
    CHECK(index == 6);
    CHECK(g.degree(6) == Pitch::from_ratio(Ratio(7, 4)));
    CHECK(g.degree(7) == Pitch::from_ratio(Ratio(15, 8)));
    CHECK(g.period() == s.period());
    const Scale r = shrunk_scale(s, 3);
    REQUIRE(r.size() == 6);
    CHECK(r.degree(3) == Pitch::from_ratio(Ratio(3, 2)));
}

TEST_CASE("each candidate's incremental score equals its score from scratch", "[suggest]") {
    SuggestOptions o;
    SECTION("the 7-note just scale at span 2, order 5, odd:15, tones below 20 Hz left out") {
        o.tones.order = 5;
        o.fit.pitch_floor_hz = pitch_perception_floor_hz;
        check_against_scratch(Keyboard(test::scl_text(seven_scl), default_ref_hz, 2), "odd:15", o);
    }
    SECTION("the same from 27.5 Hz counting every tone, infrasonic ones included") {
        o.tones.order = 4;
        check_against_scratch(Keyboard(test::scl_text(seven_scl), 27.5, 2), "odd:15", o);
    }
    SECTION("a scale in a 3/1 period") {
        o.tones.order = 4;
        check_against_scratch(Keyboard(test::scl_text(tritave_scl), 200.0, 2), "odd:9,edo:13", o);
    }
    SECTION("a cents-only scale with partials") {
        o.tones.partials = 3;
        check_against_scratch(Keyboard(test::equal_division_cents(12)), "odd:9,edo:24,350.0", o);
    }
    SECTION("an exact tempered scale, where octaves make exact tones") {
        o.tones.order = 4;
        check_against_scratch(Keyboard(test::quarter_comma(), default_ref_hz, 2), "odd:7,edo:31", o);
    }
    SECTION("a chord's resultants") {
        const Keyboard kb(test::scl_text(seven_scl));
        o.chord = parse_chord("0,2,4", kb, {"--chord"});
        check_against_scratch(kb, "odd:15", o);
    }
}

TEST_CASE("adding 3/2 to 1/1 and 5/4 catches two resultants exactly", "[suggest]") {
    // docs/references.md section 5 (just 4:5:6 on 264 Hz): the pairs give the difference tones 66,
    // 66 and 132 Hz. Order 2 over the keyboard 264, 330, 396 (added), 528 Hz: difference
    // tones 66, 132, 264, 66, 198, 132 and summation tones 594, 660, 792, 726, 858, 924 Hz.
    // The notes of 3/2 are 396 * 2^k: 198 (528 - 330) and 792 (264 + 528) land on them
    // exactly, and no other tone is within 5 c of one (arithmetic).
    Keyboard kb(test::ratio_scale({{5, 4}}), 264.0);
    SuggestOptions o;
    o.tones.order = 2;
    const Suggestions s = suggest(kb, {Pitch::from_ratio(Ratio(3, 2))}, o, false);
    REQUIRE(s.add.size() == 1);
    CHECK(s.add[0].exact_landings == 2);
    CHECK(s.add[0].near_landings == 2);
    CHECK(s.add[0].gain > 0.0);
}

TEST_CASE("proposals are sorted best first and removals cover every degree but the unison", "[suggest]") {
    Keyboard kb(test::scl_text(seven_scl));
    SuggestOptions o;
    const Suggestions s = suggest(kb, candidates("odd:15", kb), o, true);
    CHECK(s.add.size() == 48 - 6); // 9/8 5/4 4/3 3/2 5/3 15/8 are in the scale already
    for (std::size_t i = 1; i < s.add.size(); ++i) CHECK(s.add[i - 1].fit <= s.add[i].fit);
    REQUIRE(s.remove.size() == 6);
    for (std::size_t i = 1; i < s.remove.size(); ++i) CHECK(s.remove[i - 1].fit <= s.remove[i].fit);
    for (const Addition& a : s.add) CHECK(a.gain == Approx(s.base_fit - a.fit));
}

TEST_CASE("a pitch floor keeps infrasonic resultants out of a proposal", "[suggest]") {
    // A 16/15 step at 27.5 Hz has a difference tone of 1.83 Hz, far below the 20 Hz limit of
    // pitch perception (fit.hpp).
    Keyboard kb(test::ratio_scale({{16, 15}, {3, 2}}), 27.5, 2);
    SuggestOptions o;
    o.tones.order = 4;
    const Suggestions all = suggest(kb, candidates("odd:15", kb), o, false);
    std::size_t infrasonic = 0;
    for (const Addition& a : all.add) infrasonic += a.infrasonic_landings;
    CHECK(infrasonic > 0);
    o.fit.pitch_floor_hz = pitch_perception_floor_hz;
    const Suggestions audible = suggest(kb, candidates("odd:15", kb), o, false);
    for (const Addition& a : audible.add) {
        CHECK(a.infrasonic_landings == 0);
        CHECK(!a.gain_is_infrasonic);
    }
    CHECK(audible.base_tones < all.base_tones);
}

namespace {

// The degree lines of a tuning as .scl text (period last), through the .scl writer.
std::vector<std::string> degree_lines(const Scale& scale) {
    std::ostringstream out;
    write_scl(out, scale, "t.scl");
    std::istringstream in(out.str());
    std::vector<std::string> lines;
    std::string line;
    int seen = 0;
    while (std::getline(in, line)) {
        if (!line.empty() && line[0] == '!') continue;
        if (seen++ < 2) continue; // description and count
        lines.push_back(line);
    }
    return lines;
}

std::string scl_of(const std::vector<std::string>& lines) {
    std::string text = "test\n " + std::to_string(lines.size()) + "\n";
    for (const auto& l : lines) text += l + "\n";
    return text;
}

double resultants_fit(const test::ScratchFolder& dir, const std::string& tuning, const std::string& options) {
    test::RunResult r = test::run_terzo_in(dir.path, "resultants " + tuning + " " + options + " --json");
    REQUIRE(r.status == 0);
    return nlohmann::json::parse(r.out)["fit"]["rms_cents"].get<double>();
}

// `terzo suggest` with --remove on a tuning, then `terzo resultants` on the scale grown by
// every proposed note and shrunk by every degree, written as .scl files: each proposal's fit
// must be the one resultants reports (to 1e-9 c), with the same options.
void check_every_proposal(const std::string& tuning_arg, const Scale& scale, const std::string& spec,
                          const std::string& options) {
    test::ScratchFolder dir("suggest");
    test::RunResult r = test::run_terzo_in(
        dir.path, "suggest " + tuning_arg + " " + options + " --candidates " + spec + " --remove --top 100000 --json");
    REQUIRE(r.status == 0);
    const auto doc = nlohmann::json::parse(r.out);
    CHECK(std::fabs(doc["fit"].get<double>() - resultants_fit(dir, tuning_arg, options)) <= 1e-9);

    const auto lines = degree_lines(scale);
    REQUIRE(doc["add"].size() > 0);
    for (const auto& a : doc["add"]) {
        std::vector<std::string> grown = lines;
        // The period stays last; the new degree's place among the others does not change the fit.
        const std::string degree = a["ratio"].is_string() ? a["ratio"].get<std::string>()
                                                          : scl_cents_text(a["cents"].get<double>());
        grown.insert(grown.end() - 1, " " + degree);
        std::ofstream(dir.path / "grown.scl") << scl_of(grown);
        INFO("adding " << degree);
        CHECK(std::fabs(a["fit"].get<double>() - resultants_fit(dir, "grown.scl", options)) <= 1e-9);
    }
    REQUIRE(doc["remove"].size() == scale.size() - 1);
    for (const auto& m : doc["remove"]) {
        std::vector<std::string> shrunk = lines;
        shrunk.erase(shrunk.begin() + (m["degree"].get<int>() - 1));
        std::ofstream(dir.path / "shrunk.scl") << scl_of(shrunk);
        INFO("removing degree " << m["degree"]);
        CHECK(std::fabs(m["fit"].get<double>() - resultants_fit(dir, "shrunk.scl", options)) <= 1e-9);
    }
}

} // namespace

TEST_CASE("every proposal's fit is the fit terzo resultants reports for the changed scale", "[suggest][cli]") {
    SECTION("the 7-note just scale at span 2, order 5, every odd-limit-15 candidate") {
        test::ScratchFolder dir("seven");
        std::ofstream(dir.path / "seven.scl") << seven_scl;
        check_every_proposal((dir.path / "seven.scl").string(), test::scl_text(seven_scl), "odd:15",
                             "--span 2 --order 5 --pitch-floor 20");
    }
    SECTION("a scale in a 3/1 period, counting every tone") {
        test::ScratchFolder dir("tritave");
        std::ofstream(dir.path / "tritave.scl") << tritave_scl;
        check_every_proposal((dir.path / "tritave.scl").string(), test::scl_text(tritave_scl), "odd:9,edo:13",
                             "--span 2 --order 4 --ref-hz 110 --pitch-floor 0");
    }
    SECTION("a cents-only scale with partials") {
        const std::string path = test::source_path("tests/analysis/data/tet12_cents.scl");
        check_every_proposal(path, read_scl_file(path), "odd:7,edo:24,350.0",
                             "--partials 2 --pitch-floor 20");
    }
    SECTION("a recipe, with a chord") {
        check_every_proposal("\"meantone 1/4\"", load_tuning("meantone 1/4"), "7/4,11/8,edo:31",
                             "--chord 1/1,5/4,3/2 --order 4 --pitch-floor 20");
    }
}
