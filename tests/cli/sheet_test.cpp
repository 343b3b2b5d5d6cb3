#include <catch2/catch.hpp>

#include <filesystem>
#include <nlohmann/json.hpp>

#include "tests/support/run.hpp"

using terzo::test::run_terzo;

TEST_CASE("terzo sheet prints frequencies, beats and an order for a recipe", "[sheet]") {
    auto r = run_terzo("sheet 'equal 12' --pitch A4=440");
    REQUIRE(r.status == 0);
    CHECK(r.err.empty());
    // F3 174.614 Hz; F3-C4 0.5912, F3-Bb3 0.7892, F3-A3 6.9294 beats/s (docs/references.md section 4).
    CHECK(r.out.find("F3         5  174.614       0.00  0.59 narrow  0.79 wide   6.93 wide") !=
          std::string::npos);
    CHECK(r.out.find("   1  A4    reference  -            440.000") != std::string::npos);
    CHECK(r.out.find("instrument maker") != std::string::npos);
}

TEST_CASE("terzo sheet --json and --csv give the chosen part", "[sheet]") {
    auto j = run_terzo("sheet 'meantone 1/4 from Eb' --pitch A4=415 --json");
    REQUIRE(j.status == 0);
    auto doc = nlohmann::json::parse(j.out);
    CHECK(doc["reference"]["hz"] == 415.0);
    CHECK(doc["notes"].size() == 13);
    auto c = run_terzo("sheet 'equal 12' --csv --part order");
    REQUIRE(c.status == 0);
    CHECK(c.out.rfind("step,tune,from,by,Hz,beats/s,tempering\r\n1,A4,reference,-,440.000,,\r\n",
                      0) == 0);
}

TEST_CASE("terzo sheet --svg writes a file once and refuses to overwrite it", "[sheet]") {
    auto dir = terzo::test::temp_folder("sheet-svg");
    std::string file = (dir / "sheet.svg").string();
    auto r = run_terzo("sheet 'equal 12' --svg " + file + " --paper letter");
    REQUIRE(r.status == 0);
    std::string first = terzo::test::slurp(file);
    CHECK(first.find("height=\"279.4mm\"") != std::string::npos);
    auto again = run_terzo("sheet 'meantone 1/4 from Eb' --svg " + file);
    CHECK(again.status == 1);
    CHECK(again.out.empty());
    CHECK(again.err ==
          file + ": error: already exists and was not changed; give --force to replace it\n");
    CHECK(terzo::test::slurp(file) == first);
    auto forced = run_terzo("sheet 'meantone 1/4 from Eb' --svg " + file + " --force");
    CHECK(forced.status == 0);
    CHECK(terzo::test::slurp(file) != first);
    std::filesystem::remove_all(dir);
}

TEST_CASE("terzo sheet reports bad options and writes nothing", "[sheet]") {
    auto dir = terzo::test::temp_folder("sheet-bad");
    std::string file = (dir / "no.svg").string();
    auto r = run_terzo("sheet 'equal 12' --range F3..E4 --svg " + file);
    CHECK(r.status == 1);
    CHECK(r.out.empty());
    CHECK(r.err == "--range: error: the range F3..E4 must span at least an octave (12 semitones) "
                   "so that every note is set\n");
    CHECK_FALSE(std::filesystem::exists(file));
    CHECK(run_terzo("sheet 'equal 12' --range F3-F4").err ==
          "--range: error: expected LOW..HIGH such as F3..F4, found \"F3-F4\"\n");
    CHECK(run_terzo("sheet 'equal 12' --pitch A4=0").err ==
          "--pitch: error: frequency 0 Hz in \"A4=0\" is outside the accepted range (above 0, at "
          "most 20000 Hz)\n");
    CHECK(run_terzo("sheet 'equal 12' --part keys").err ==
          "--part: error: unknown part \"keys\"; use notes, intervals, order or fifths\n");
    CHECK(run_terzo("sheet 'equal 12' --paper a5").err ==
          "--paper: error: unknown paper size \"a5\"; use a4 or letter\n");
    CHECK(run_terzo("sheet 'equal 19'").err == "equal 19: error: this needs a 12-note tuning to "
                                               "name its notes C, C#, D …; it has 19 degrees\n");
    std::filesystem::remove_all(dir);
}
