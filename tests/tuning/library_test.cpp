#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>
#include <set>
#include <sstream>

#include "core/tuning/scl.hpp"
#include "core/tuning/library.hpp"
#include "tests/support/run.hpp"

using namespace terzo;

namespace {

std::vector<LibraryEntry> the_list() {
    std::ifstream in(test::source_path("tools/library.txt"));
    REQUIRE(in);
    return read_library_list(in, "tools/library.txt");
}

std::vector<LibraryEntry> read_text(const std::string& text) {
    std::istringstream in(text);
    return read_library_list(in, "list.txt");
}

} // namespace

TEST_CASE("the tuning library is current", "[library]") {
    // Every file in scales/ is exactly what its entry in tools/library.txt generates today,
    // and scales/ holds no .scl file the list does not name. To fix a failure, run
    // `cmake --build build --target library` and commit the result.
    auto entries = the_list();
    CHECK(entries.size() >= 40);
    std::set<std::string> named;
    for (const auto& e : entries) {
        INFO(e.file << " (tools/library.txt line " << e.line << ")");
        named.insert(e.file);
        auto path = test::source_path("scales/" + e.file);
        REQUIRE(std::filesystem::exists(path));
        CHECK(test::slurp(path) == library_scl_text(e));
    }
    for (const auto& f : std::filesystem::directory_iterator(test::source_path("scales"))) {
        INFO(f.path().string());
        if (f.path().extension() == ".scl") CHECK(named.count(f.path().filename().string()) == 1);
    }
}

TEST_CASE("every library file reads back as the tuning of its recipe", "[library]") {
    for (const auto& e : the_list()) {
        INFO(e.file);
        Scale s = read_scl_file(test::source_path("scales/" + e.file));
        CHECK(s.description() == e.title);
        CHECK(s.size() >= 5);
    }
    // Spot checks against docs/references.md 2.3 (Werckmeister III, standard P/4 reading; Barbour
    // 1951 [M]; R. Rhodes 2001 [S]) through the written file, i.e. after .scl rounding.
    Scale w = read_scl_file(test::source_path("scales/werckmeister-iii.scl"));
    CHECK(w.degree(4).cents() == Approx(390.225).margin(0.0006));
    CHECK(w.degree(11).cents() == Approx(1092.180).margin(0.0006));
    Scale k = read_scl_file(test::source_path("scales/kirnberger-iii.scl"));
    CHECK(*k.degree(4).ratio() == Ratio(5, 4));
    CHECK(*k.degree(6).ratio() == Ratio(45, 32));
}

TEST_CASE("a library file names its source, its recipe and its degrees", "[library]") {
    LibraryEntry e;
    e.file = "x.scl";
    e.title = "Pure fifths";
    e.recipe = "chain 3/2 up 8 down 3";
    e.sources = {"first line", "second line"};
    e.letter_names = true;
    std::string text = library_scl_text(e);
    CHECK(text.rfind("! x.scl\n! Source: first line\n!         second line\n! Recipe: chain 3/2 up "
                     "8 down 3\n"
                     "! Degrees 0-11: C C# D Eb E F F# G G# A Bb B\n! Tags: ",
                     0) == 0);
    CHECK(text.find("!\nPure fifths\n 12\n!\n 2187/2048\n") != std::string::npos);
    e.spelling = Spelling::flats;
    CHECK(library_scl_text(e).find("! Degrees 0-11: C Db D Eb E F Gb G Ab A Bb B\n") !=
          std::string::npos);
}

TEST_CASE("the library list rejects malformed entries", "[library]") {
    REQUIRE_THROWS_WITH(read_text("file: a.scl\ntitle: t\nrecipe: equal 5\n"),
                        "list.txt:1:1: error: the entry for a.scl has no \"source:\" line");
    REQUIRE_THROWS_WITH(
        read_text("file: A.scl\n"),
        "list.txt:1:7: error: file name \"A.scl\" must be lower-case letters, digits and '-', "
        "ending in .scl");
    REQUIRE_THROWS_WITH(
        read_text("colour: red\n"),
        "list.txt:1:1: error: unknown field \"colour\"; use file, title, recipe, source or names");
    REQUIRE_THROWS_WITH(
        read_text("names: sharp\n"),
        "list.txt:1:8: error: unknown spelling \"sharp\"; use sharps, flats or mixed");
    REQUIRE_THROWS_WITH(
        read_text("no colon here\n"),
        "list.txt:1:1: error: expected \"field: value\" (file, title, recipe, source or names)");
    REQUIRE_THROWS_WITH(read_text("file: a.scl\nfile: b.scl\n"),
                        "list.txt:2:1: error: \"file:\" is given twice in this entry");
    REQUIRE_THROWS_WITH(
        read_text("file: a.scl\ntitle: t\nrecipe: equal 5 of 0\nsource: s\n"),
        "list.txt:3:20: error: in the recipe of a.scl: 0 is not an interval; a ratio must "
        "be positive");
    REQUIRE_THROWS_WITH(read_text("file: a.scl\ntitle: t\nrecipe: equal 5\nsource: s\n\n"
                                  "file: a.scl\ntitle: u\nrecipe: equal 6\nsource: s\n"),
                        "list.txt:6:1: error: a.scl is listed twice (first on line 1)");
}
