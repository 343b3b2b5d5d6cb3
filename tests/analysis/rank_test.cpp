#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>

#include "core/analysis/rank.hpp"
#include "core/tuning/scl.hpp"
#include "tests/analysis/test_tunings.hpp"

using namespace terzo;
namespace fs = std::filesystem;

namespace {

fs::path fresh_folder(const std::string& name) {
    fs::path dir = fs::temp_directory_path() / ("terzo-rank-" + name + "-" + std::to_string(::getpid()));
    fs::remove_all(dir);
    fs::create_directories(dir / "deeper" / "deepest");
    return dir;
}

void save(const fs::path& p, const Scale& s) {
    std::ofstream out(p);
    write_scl(out, s, p.filename().string());
}

void save_text(const fs::path& p, const std::string& text) {
    std::ofstream out(p);
    out << text;
}

SearchControl threads(int n) {
    SearchControl c;
    c.threads = n;
    return c;
}

} // namespace

TEST_CASE("a folder of tunings is ranked by the worst major third, broken files reported on the side", "[rank]") {
    fs::path dir = fresh_folder("folder");
    save(dir / "equal.scl", test::equal_12());
    save(dir / "deeper" / "werckmeister.SCL", test::werckmeister_3());
    save(dir / "deeper" / "deepest" / "quarter.scl", test::quarter_comma());
    save_text(dir / "deeper" / "broken.scl", "broken\n 2\n 3/0\n 2/1\n");
    save_text(dir / "seven.scl", "seven notes\n 7\n 9/8\n 5/4\n 4/3\n 3/2\n 5/3\n 15/8\n 2/1\n");
    save_text(dir / "notes.txt", "not a tuning, and not read\n");
    Ranking r = rank_tunings({dir.string(), (dir / "missing.scl").string()}, RankMetric::worst_major_third, threads(2));
    CHECK(r.files == 5);
    REQUIRE(r.entries.size() == 3);
    // 12-TET's thirds are all +13.686 c; Werckmeister III keeps Pythagorean thirds, a syntonic
    // comma (21.506 c) wide; quarter-comma meantone's diminished fourths are an enharmonic
    // diesis (41.059 c) wide of 5/4 (docs/references.md sections 1 and 2.1).
    CHECK(r.entries[0].path == (dir / "equal.scl").string());
    CHECK(r.entries[0].value == Approx(13.686286).margin(1e-6));
    CHECK(r.entries[1].path == (dir / "deeper" / "werckmeister.SCL").string());
    CHECK(r.entries[1].value == Approx(21.506290).margin(1e-6));
    CHECK(r.entries[2].value == Approx(41.058858).margin(1e-6));
    CHECK(r.entries[2].notes == 12);
    REQUIRE(r.failures.size() == 2);
    CHECK(r.failures[0].message == (dir / "missing.scl").string() + ": error: no such file or folder");
    CHECK(r.failures[1].message == (dir / "deeper" / "broken.scl").string() + ":3:2: error: denominator is zero in \"3/0\"");
    REQUIRE(r.skipped.size() == 1);
    CHECK(r.skipped[0].message == (dir / "seven.scl").string() +
                                      ": error: this needs a 12-note tuning to name its notes C, C#, D …; it has 7 degrees");
    CHECK_FALSE(r.cancelled);
    fs::remove_all(dir);
}

TEST_CASE("the fit metric ranks tunings of any size, and rankings do not depend on threads", "[rank]") {
    fs::path dir = fresh_folder("fit");
    save(dir / "equal.scl", test::equal_12());
    save(dir / "pyth.scl", test::pythagorean());
    save_text(dir / "seven.scl", "seven just notes\n 7\n 9/8\n 5/4\n 4/3\n 3/2\n 5/3\n 15/8\n 2/1\n");
    Ranking one = rank_tunings({dir.string()}, RankMetric::fit, threads(1));
    Ranking two = rank_tunings({dir.string()}, RankMetric::fit, threads(2));
    REQUIRE(one.entries.size() == 3);
    CHECK(one.failures.empty());
    for (std::size_t i = 0; i < 3; ++i) {
        CHECK(one.entries[i].path == two.entries[i].path);
        CHECK(one.entries[i].value == two.entries[i].value);
    }
    // The measure is the resultant engine's fit (tested there); here: the 7-note file is
    // ranked beside the 12-note ones, and the order is ascending.
    CHECK(one.entries[0].notes + one.entries[1].notes + one.entries[2].notes == 31);
    for (std::size_t i = 1; i < 3; ++i) CHECK(one.entries[i - 1].value <= one.entries[i].value);
    fs::remove_all(dir);
}

TEST_CASE("rank metric names are parsed and unknown ones rejected", "[rank]") {
    CHECK(parse_rank_metric("worst-fifth", "--by") == RankMetric::worst_fifth);
    CHECK(parse_rank_metric("wolves", "--by") == RankMetric::wolves);
    CHECK_THROWS_WITH(parse_rank_metric("best", "--by"),
                      "--by: error: unknown metric \"best\"; use one of mean-fifth, worst-fifth, mean-major-third, "
                      "worst-major-third, mean-minor-third, worst-minor-third, wolves, fit");
    // Wolves: quarter-comma meantone has the G#-Eb wolf fifth and 4 + 3 wolf thirds (its
    // diminished fourths and augmented seconds, docs/references.md 2.2 via compare.hpp's thresholds).
    CHECK(measure_tuning(test::quarter_comma(), RankMetric::wolves, "q") == 8);
    CHECK(measure_tuning(test::equal_12(), RankMetric::wolves, "e") == 0);
    CHECK_THROWS_WITH(rank_tunings({}, RankMetric::fit, threads(0)), "--threads: error: thread count 0 is outside 1..64");
}

TEST_CASE("key metrics of 12-note octave tunings agree with the key comparison", "[rank]") {
    // measure_tuning takes a shortcut through doubles for period 2/1; compare_keys is the
    // exact route. A scale stretched to 2401/1200 of an octave takes compare_keys itself.
    std::vector<Scale> scales = {test::equal_12(), test::werckmeister_3(), test::quarter_comma(), test::pythagorean()};
    std::vector<Pitch> degrees;
    for (int i = 1; i < 12; ++i) degrees.push_back(Pitch::from_cents(i * 100.5 + (i % 3) * 7.0));
    scales.push_back(Scale("cents", degrees, Pitch::from_ratio(Ratio(2))));
    scales.push_back(Scale("stretched", degrees, Pitch::from_cents(1206)));
    for (const Scale& s : scales) {
        CompareSummary c = compare_keys(s, {}, "x").summary;
        INFO(s.description());
        CHECK(measure_tuning(s, RankMetric::mean_fifth, "x") == Approx(c.mean_fifth).margin(1e-9));
        CHECK(measure_tuning(s, RankMetric::worst_fifth, "x") == Approx(c.worst_fifth).margin(1e-9));
        CHECK(measure_tuning(s, RankMetric::mean_major_third, "x") == Approx(c.mean_major_third).margin(1e-9));
        CHECK(measure_tuning(s, RankMetric::worst_major_third, "x") == Approx(c.worst_major_third).margin(1e-9));
        CHECK(measure_tuning(s, RankMetric::mean_minor_third, "x") == Approx(c.mean_minor_third).margin(1e-9));
        CHECK(measure_tuning(s, RankMetric::worst_minor_third, "x") == Approx(c.worst_minor_third).margin(1e-9));
        CHECK(measure_tuning(s, RankMetric::wolves, "x") == static_cast<double>(c.wolves.size()));
    }
}
