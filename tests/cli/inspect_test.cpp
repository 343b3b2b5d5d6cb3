#include <catch2/catch.hpp>

#include <nlohmann/json.hpp>

#include "tests/support/run.hpp"

using terzo::test::source_path;
using terzo::test::run_terzo;

TEST_CASE("terzo inspect prints the degree table of a .scl file", "[inspect]") {
    auto r = run_terzo("inspect " + source_path("assets/demo.scl"));
    CHECK(r.status == 0);
    CHECK(r.err.empty());
    CHECK(r.out.find("     4  3/2           701.955  +203.910\n") != std::string::npos);
    CHECK(r.out.find("period  2/1          1200.000  +111.731\n") != std::string::npos);
}

TEST_CASE("terzo inspect --json prints one object with the documented keys", "[inspect]") {
    auto r = run_terzo("inspect --json " + source_path("assets/demo.scl"));
    REQUIRE(r.status == 0);
    auto j = nlohmann::json::parse(r.out);
    CHECK(j["size"] == 8);
    CHECK(j["period"]["ratio"] == "2/1");
    CHECK(j["period"]["cents"] == 1200.0);
    REQUIRE(j["degrees"].size() == 8);
    CHECK(j["degrees"][0]["index"] == 0);
    CHECK(j["degrees"][0]["ratio"] == "1/1");
    CHECK(j["degrees"][0]["exact"] == true);
    CHECK(j["degrees"][6]["ratio"] == "7/4");
    // docs/references.md section 1: 7/4 = 968.825906 c (common practice).
    CHECK(j["degrees"][6]["cents"].get<double>() == Approx(968.825906).margin(1e-6));
}

TEST_CASE("terzo inspect reports a malformed file on stderr with a non-zero exit", "[inspect]") {
    auto dir = terzo::test::temp_folder("inspect-bad");
    std::string bad = (dir / "bad.scl").string();
    std::ofstream(bad) << "broken\n 2\n 3/0\n 2/1\n";
    auto r = run_terzo("inspect " + bad);
    CHECK(r.status == 1);
    CHECK(r.out.empty());
    CHECK(r.err == bad + ":3:2: error: denominator is zero in \"3/0\"\n");
    auto missing = run_terzo("inspect --json " + (dir / "none.scl").string());
    CHECK(missing.status == 1);
    CHECK(missing.out.empty());
    CHECK(missing.err == (dir / "none.scl").string() +
                         ": error: no such file (a TUNING is a .scl file or a recipe such as \"equal 12\")\n");
    std::filesystem::remove_all(dir);
}

TEST_CASE("terzo explains its commands and rejects unknown options", "[inspect]") {
    auto help = run_terzo("--help");
    CHECK(help.status == 0);
    CHECK(help.out.find("inspect") != std::string::npos);
    auto sub = run_terzo("inspect --help");
    CHECK(sub.status == 0);
    CHECK(sub.out.find("--json") != std::string::npos);
    auto version = run_terzo("--version");
    CHECK(version.status == 0);
    CHECK(version.out.rfind("terzo ", 0) == 0);
    auto wrong = run_terzo("inspect --jsn x.scl");
    CHECK(wrong.status != 0);
    CHECK(wrong.out.empty());
    CHECK(wrong.err.find("--jsn") != std::string::npos);
    auto none = run_terzo("");
    CHECK(none.status != 0);
}
