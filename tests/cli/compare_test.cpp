#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>

#include "tests/support/run.hpp"

using terzo::test::run_terzo;

TEST_CASE("terzo compare prints keys, summary, wolves and interval classes", "[compare]") {
    auto r = run_terzo("compare 'equal 12' 'meantone 1/4 from Eb' --no-fit");
    REQUIRE(r.status == 0);
    CHECK(r.err.empty());
    // docs/references.md section 1 and 4: 12-TET C major -1.955 / +13.686 / -15.641 c, C4-G4 0.89,
    // C4-E4 10.38 beats/s.
    CHECK(r.out.find(
              "C major   C4 E4 G4      -1.955       0.89  +13.686     10.38  -15.641     17.79") !=
          std::string::npos);
    // docs/references.md 2.2: the quarter-comma wolf G#-Eb is 737.637 c, 35.682 c wide of 3/2.
    CHECK(r.out.find("fifth        G#-Eb      +35.682") != std::string::npos);
    CHECK(r.out.find("Interval classes") != std::string::npos);
}

TEST_CASE("terzo compare --json, --csv and --svg", "[compare]") {
    auto dir = terzo::test::temp_folder("compare-out");
    std::string weights = (dir / "w.txt").string(), svg = (dir / "c.svg").string();
    std::ofstream(weights) << "C major 2\nG major 1\nA minor 1\n";
    auto j =
        run_terzo("compare 'equal 12' 'equal 19' --json --weights " + weights + " --svg " + svg);
    REQUIRE(j.status == 0);
    auto doc = nlohmann::json::parse(j.out);
    CHECK(doc["weights"]["C major"] == 2.0);
    CHECK(doc["tunings"][0]["summary"]["weighted"] == true);
    CHECK(doc["tunings"][1]["keys"].is_null()); // 19 notes: interval classes only
    // docs/references.md section 3: 19-EDO 11 steps = 694.737 c, 3/2 - 7.218.
    bool found = false;
    for (const auto& c : doc["tunings"][1]["interval_classes"])
        if (c["steps"] == 11) {
            found = true;
            CHECK(c["sizes"][0]["nearest"] == "3/2");
            CHECK(c["sizes"][0]["deviation_cents"].get<double>() == Approx(-7.218).margin(5e-4));
        }
    CHECK(found);
    CHECK(terzo::test::slurp(svg).find("<svg xmlns") != std::string::npos);
    auto csv = run_terzo("compare 'equal 12' 'equal 12' --csv --part summary --no-fit");
    CHECK(csv.out.rfind("tuning,5th mean,5th worst,M3 mean,M3 worst,m3 mean,m3 worst,pure "
                        "5ths,pure M3,wolves,mean fit\r\n"
                        "equal 12,1.955,1.955,13.686,13.686,15.641,15.641,0,0,0,\r\n",
                        0) == 0);
    std::filesystem::remove_all(dir);
}

TEST_CASE("terzo compare reports bad input and prints nothing", "[compare]") {
    auto dir = terzo::test::temp_folder("compare-bad");
    std::string weights = (dir / "w.txt").string();
    std::ofstream(weights) << "C major 1\nC major 2\n";
    auto r = run_terzo("compare 'equal 12' 'equal 12' --weights " + weights);
    CHECK(r.status == 1);
    CHECK(r.out.empty());
    CHECK(r.err == weights + ":2:1: error: C major is already given on line 1\n");
    CHECK(run_terzo("compare 'equal 12' 'equal 12' --odd-limit 8").err ==
          "--odd-limit: error: odd limit 8 must be an odd number from 1 to 99\n");
    CHECK(run_terzo("compare 'equal 12' 'equal 12' --octave 9").err ==
          "--octave: error: octave 9 is outside 0..8\n");
    CHECK(run_terzo("compare 'equal 19' 'equal 31' --svg " + (dir / "x.svg").string()).err ==
          "--svg: error: the plots need at least one 12-note tuning\n");
    CHECK(run_terzo("compare 'equal 12'").status != 0); // two tunings at least
    std::filesystem::remove_all(dir);
}

TEST_CASE("terzo compare finds the pure thirds of a library file written in cents", "[compare]") {
    // scales/meantone-quarter-comma.scl holds cents-only values (E and G# are written as
    // ratios); its 8 major thirds are pure, most of them within the cents-only tolerance
    // (docs/references.md 2.2: 1/4-comma makes 5/4 pure).
    auto r =
        run_terzo("compare " + terzo::test::source_path("scales/meantone-quarter-comma.scl") + " " +
                  terzo::test::source_path("scales/werckmeister-iii.scl") + " --json --no-fit");
    REQUIRE(r.status == 0);
    auto doc = nlohmann::json::parse(r.out);
    CHECK(doc["tunings"][0]["summary"]["pure_major_thirds"] == 8);
    CHECK(doc["tunings"][0]["keys"][0]["major_third"]["exact"] == true);  // C-E: 1/1 to 5/4
    CHECK(doc["tunings"][0]["keys"][7]["major_third"]["exact"] == false); // G-B: cents only
    CHECK(doc["tunings"][0]["keys"][7]["major_third"]["tempering"] == "pure");
    // docs/references.md 2.1: Werckmeister III has 8 pure fifths and no wolf.
    CHECK(doc["tunings"][1]["summary"]["pure_fifths"] == 8);
    CHECK(doc["tunings"][1]["summary"]["wolves"].empty());
}
