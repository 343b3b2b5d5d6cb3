#include <catch2/catch.hpp>

#include "core/tuning/load.hpp"
#include "tests/support/run.hpp"

using namespace terzo;

TEST_CASE("a tuning argument is a file when one exists and a recipe otherwise", "[load]") {
    Scale file = load_tuning(test::source_path("assets/demo.scl"));
    CHECK(file.size() == 8);
    Scale recipe = load_tuning("equal 19");
    CHECK(recipe.size() == 19);
    CHECK(recipe.description() == "19 equal divisions of 2/1");
}

TEST_CASE("a missing file and a bad recipe get different messages", "[load]") {
    REQUIRE_THROWS_WITH(
        load_tuning("nowhere/missing.scl"),
        "nowhere/missing.scl: error: no such file (a TUNING is a .scl file or a recipe such "
        "as \"equal 12\")");
    REQUIRE_THROWS_WITH(
        load_tuning("werckmeister"),
        "recipe:1:1: error: unknown recipe kind \"werckmeister\"; a recipe starts with one of "
        "equal, chain, meantone, fifths, harmonics, subharmonics, diamond, products, list");
    REQUIRE_THROWS_WITH(load_tuning("equal 12 of 0"),
                        "recipe:1:13: error: 0 is not an interval; a ratio must be positive");
    REQUIRE_THROWS_WITH(
        load_tuning(""),
        "TUNING: error: empty tuning argument; give a .scl file or a recipe such as \"equal 12\"");
}

TEST_CASE("terzo inspect builds a recipe like a file", "[load]") {
    auto r = test::run_terzo("inspect 'meantone 1/4'");
    CHECK(r.status == 0);
    CHECK(r.err.empty());
    CHECK(r.out.rfind("1/4-comma meantone, 12 notes from Eb to G#\n12 degrees, period 2/1\n", 0) ==
          0);
    CHECK(r.out.find("     4  5/4              386.314   +76.049\n") != std::string::npos);
    auto bad = test::run_terzo("inspect 'fifths: -P/4'");
    CHECK(bad.status == 1);
    CHECK(bad.out.empty());
    CHECK(bad.err == "recipe:1:13: error: expected 12 fifths after ':', found 1\n");
}
