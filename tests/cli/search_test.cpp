#include <catch2/catch.hpp>

#include <nlohmann/json.hpp>

#include "core/tuning/scl.hpp"
#include "tests/support/run.hpp"

using terzo::test::run_terzo;

TEST_CASE("terzo search circulating prints the best distributions with their cost broken down", "[search-cli]") {
    auto r = run_terzo("search circulating --fractions 0,1/4 --part fifth:rms --top 2 --quiet");
    REQUIRE(r.status == 0);
    CHECK(r.err.empty());
    // Every closed circle of 0 and 1/4 has four fifths P/4 narrow: rms P/(4 sqrt 3) = 3.3862 c.
    CHECK(r.out.find("495 distributions, 29 evaluated; the others are rotations or mirror images of these (same cost), "
                     "or were cut off when their first fifths already cost more than the results kept\n") != std::string::npos);
    CHECK(r.out.find("rank    cost  fifth:rms  copies  C-G  G-D  D-A  A-E  E-B  B-F#  F#-C#  C#-G#  G#-Eb  Eb-Bb  Bb-F  F-C\n") != std::string::npos);
    CHECK(r.out.find("   1  3.3862     3.3862      12  1/4  1/4  1/4  1/4    0     0      0      0      0      0     0    0\n") != std::string::npos);
}

TEST_CASE("terzo search --json and --write-scl give the same results, and files are not overwritten silently", "[search-cli]") {
    auto dir = terzo::test::temp_folder("search-scl");
    std::string args = "search circulating --fractions 0,1/4 --part major-third:worst --top 3 --quiet --write-scl " + dir.string();
    auto r = run_terzo(args + " --json");
    REQUIRE(r.status == 0);
    auto j = nlohmann::json::parse(r.out);
    CHECK(j["distributions"] == 495);
    REQUIRE(j["results"].size() == 3);
    REQUIRE(j["scl_files"].size() == 3);
    CHECK(j["scl_files"][0] == (dir / "circulating-01.scl").string());
    terzo::Scale first = terzo::read_scl_file(dir / "circulating-01.scl");
    REQUIRE(first.size() == 12);
    // Degree 7 (G) lies on the positions the JSON reports, computed by the exact recipe.
    CHECK(first.degree(7).cents() == Approx(j["results"][0]["positions_cents"][7].get<double>()).margin(1e-9));
    auto again = run_terzo(args);
    CHECK(again.status == 1);
    CHECK(again.out.empty());
    CHECK(again.err == (dir / "circulating-01.scl").string() + ": error: already exists and was not changed; give --force to replace it\n");
    auto forced = run_terzo(args + " --force");
    CHECK(forced.status == 0);
    CHECK(forced.out.find("wrote 3 .scl files to " + dir.string() + "\n") != std::string::npos);
    std::filesystem::remove_all(dir);
}

TEST_CASE("terzo search rank2 and equal print their best results", "[search-cli]") {
    auto m = run_terzo("search rank2 --target 3/2=1 --target 5/4=4 --top 1");
    REQUIRE(m.status == 0);
    // least-squares meantone: 3/2 narrowed by 4/17 of the syntonic comma (search_test.cpp)
    CHECK(m.out.find("   1   696.8947  3.6883") != std::string::npos);
    CHECK(m.out.find("-5.060 (1g+0p)  +1.265 (4g-2p)\n") != std::string::npos);
    auto e = run_terzo("search equal --max-steps 60 --top 2");
    REQUIRE(e.status == 0);
    CHECK(e.out.find("   1     53  22.642  1.1229  -0.068 (31)  -1.408 (17)  +1.340 (14)\n") != std::string::npos);
}

TEST_CASE("terzo search rejects bad input with one message and an empty stdout", "[search-cli]") {
    auto space = run_terzo("search diagonal");
    CHECK(space.status == 1);
    CHECK(space.out.empty());
    CHECK(space.err == "SPACE: error: unknown search space \"diagonal\"; use circulating, continuous, rank2 or equal\n");
    auto part = run_terzo("search circulating --part third:rms");
    CHECK(part.status == 1);
    CHECK(part.err == "--part: error: expected fifth, major-third or minor-third, found \"third\"\n");
    auto stat = run_terzo("search equal --statistic median");
    CHECK(stat.err == "--statistic: error: expected rms, mean or worst, found \"median\"\n");
    auto period = run_terzo("search equal --period 1/2");
    CHECK(period.err == "--period: error: the period must be larger than 1/1, found 1/2\n");
}

TEST_CASE("Ctrl-C stops a long search, which prints the best found so far and exits 130", "[search-cli]") {
    // SIGINT after 3 seconds into a search of 1.85e9 distributions; progress goes to stderr
    // as plain lines because stderr is not a terminal here.
    auto r = terzo::test::run("timeout --preserve-status -s INT 3 " + std::string(TERZO_CLI) +
                              " search circulating --fractions=-1/12,0,1/24,1/12,1/8,1/6,1/4,1/3 --all-copies --threads 2 --top 3");
    CHECK(r.status == 130);
    CHECK(r.out.find("cancelled after ") != std::string::npos);
    CHECK(r.out.find("   1  ") != std::string::npos);
    CHECK(r.err.find("search circulating: ") != std::string::npos);
    CHECK(r.err.find("terzo search: interrupted; the results above are the best found before stopping\n") != std::string::npos);
}
