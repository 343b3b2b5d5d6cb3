#include <catch2/catch.hpp>

#include <fstream>

#include <nlohmann/json.hpp>

#include "tests/support/run.hpp"

using terzo::test::run_terzo;

namespace {

void save_text(const std::filesystem::path& p, const std::string& text) {
    std::filesystem::create_directories(p.parent_path());
    std::ofstream(p) << text;
}

// A just 12-note scale and a Pythagorean one (ratios common practice).
const char* just12 = "just\n 12\n 16/15\n 9/8\n 6/5\n 5/4\n 4/3\n 45/32\n 3/2\n 8/5\n 5/3\n 9/5\n 15/8\n 2/1\n";
const char* pyth12 = "pythagorean\n 12\n 2187/2048\n 9/8\n 32/27\n 81/64\n 4/3\n 729/512\n 3/2\n 6561/4096\n 27/16\n 16/9\n 243/128\n 2/1\n";

} // namespace

TEST_CASE("terzo rank ranks a folder and exits 0 when every file was read", "[rank-cli]") {
    auto dir = terzo::test::temp_folder("rank-ok");
    save_text(dir / "a" / "just.scl", just12);
    save_text(dir / "pyth.scl", pyth12);
    auto r = run_terzo("rank " + dir.string() + " --by worst-fifth --quiet");
    CHECK(r.status == 0);
    CHECK(r.err.empty());
    // Pythagorean: eleven pure fifths and the wolf G#-Eb a Pythagorean comma (23.460 c)
    // narrow; the just scale's worst fifths are D-A and Bb-F, 40/27, a syntonic comma
    // (21.506 c) narrow (docs/references.md section 1; ratios checked by hand).
    auto first = r.out.find("just");
    auto second = r.out.find("pythagorean");
    CHECK(first != std::string::npos);
    CHECK(second != std::string::npos);
    CHECK(first < second);
    auto j = nlohmann::json::parse(run_terzo("rank " + dir.string() + " --by worst-fifth --json --quiet").out);
    CHECK(j["ranked"].size() == 2);
    CHECK(j["ranked"][0]["value"].get<double>() == Approx(21.506290).margin(1e-6));
    CHECK(j["ranked"][1]["value"].get<double>() == Approx(23.460010).margin(1e-6));
    CHECK(j["failed"].empty());
    // A readable tuning the metric does not apply to is skipped, not an error: exit 0.
    save_text(dir / "seven.scl", "seven\n 7\n 9/8\n 5/4\n 4/3\n 3/2\n 5/3\n 15/8\n 2/1\n");
    auto s = run_terzo("rank " + dir.string() + " --quiet");
    CHECK(s.status == 0);
    CHECK(s.err == "terzo rank: 1 tuning skipped: worst-major-third does not apply to it (key metrics need 12 notes; "
                   "--by fit ranks any size); --list-skipped names them\n");
    std::filesystem::remove_all(dir);
}

TEST_CASE("terzo rank reports broken files on stderr, still ranks the rest, and exits 1", "[rank-cli]") {
    auto dir = terzo::test::temp_folder("rank-broken");
    save_text(dir / "good.scl", just12);
    save_text(dir / "sub" / "broken.scl", "broken\n 2\n 3/0\n 2/1\n");
    auto r = run_terzo("rank " + dir.string() + " " + (dir / "gone.scl").string() + " --quiet");
    CHECK(r.status == 1);
    CHECK(r.out.find((dir / "good.scl").string()) != std::string::npos);
    CHECK(r.err == (dir / "gone.scl").string() + ": error: no such file or folder\n" + (dir / "sub" / "broken.scl").string() +
                       ":3:2: error: denominator is zero in \"3/0\"\nterzo rank: 2 could not be ranked, 1 ranked\n");
    auto by = run_terzo("rank " + dir.string() + " --by best");
    CHECK(by.status == 1);
    CHECK(by.out.empty());
    CHECK(by.err.rfind("--by: error: unknown metric \"best\"", 0) == 0);
    std::filesystem::remove_all(dir);
}
