#include <catch2/catch.hpp>

#include <sstream>

#include "core/error.hpp"
#include "core/tuning/scl.hpp"
#include "core/report/search_report.hpp"

using namespace terzo;

namespace {
TargetCost fifth_only() {
    TargetCost c;
    c.targets.push_back(parse_target("3/2", "--target"));
    return c;
}
} // namespace

TEST_CASE("the equal-division report shows the step and each target's error", "[search_report]") {
    TargetCost cost = fifth_only();
    const Pitch octave = Pitch::from_ratio(Ratio(2));
    auto results = search_equal(cost, 1200.0, 60, 1);
    REQUIRE(results.size() == 1);
    // 53 equal divisions: the fifth is 31 steps, 701.887 c, 0.068 c below 3/2 (701.955 c)
    // (common practice, no source; 1200 * 31 / 53 and 1200 * log2(3/2) by hand).
    EqualReport report{cost, octave, 60, results};
    const std::string text = equal_text(report);
    CHECK(text.rfind("equal divisions of 2/1 into 1 to 60 steps\ncost: rms of the errors of 3/2\n\n", 0) == 0);
    CHECK(text.find("   1     53  22.642  0.0682  -0.068 (31)\n") != std::string::npos);
    auto j = equal_json(report, nullptr);
    CHECK(j.begin().key() == "space");
    CHECK(j["results"][0]["steps"] == 53);
    std::vector<std::string> files{"out/equal-01.scl"};
    CHECK(equal_json(report, &files).begin().key() == "scl_files");
}

TEST_CASE("results beyond the largest scale are reported but not made into .scl files", "[search_report]") {
    TargetCost cost = fifth_only();
    const Pitch octave = Pitch::from_ratio(Ratio(2));
    std::vector<EqualResult> results{evaluate_equal(cost, 1200.0, 53), evaluate_equal(cost, 1200.0, 5000)};
    EqualReport report{cost, octave, 5000, results};
    CHECK(equal_text(report).find("   2   5000   0.240") != std::string::npos);
    CHECK_THROWS_WITH(equal_scales(report),
                      "--write-scl: error: result 2 has 5000 steps, more than 4096, the largest scale terzo writes; "
                      "give --max-steps 4096 or leave out --write-scl (no file was written)");
    results.pop_back();
    EqualReport small{cost, octave, 60, results};
    REQUIRE(equal_scales(small).size() == 1);
    CHECK(equal_scales(small)[0].size() == 53);
}

TEST_CASE("written .scl files record the search in their comments and read back", "[search_report]") {
    TargetCost cost = fifth_only();
    auto results = search_equal(cost, 1200.0, 20, 2);
    EqualReport report{cost, Pitch::from_ratio(Ratio(2)), 20, results};
    auto files = search_scl_files("equal", equal_scales(report), {"Made by: terzo search equal --target 3/2", "line\ntwo"});
    REQUIRE(files.size() == 2);
    CHECK(files[1].name == "equal-02.scl");
    CHECK(files[0].text.rfind("! equal-01.scl\n! Made by: terzo search equal --target 3/2\n! line two\n! Rank 1 of 2.\n!\n", 0) == 0);
    std::istringstream in(files[0].text);
    CHECK(read_scl(in, "equal-01.scl").size() == static_cast<std::size_t>(results[0].steps));
}

TEST_CASE("the cost is described in words, constraints on their own line", "[search_report]") {
    Cost c;
    c.deviations.push_back({KeyInterval::major_third, Statistic::rms, 1.0});
    CHECK(describe_cost(c) == "cost: 1.00 x rms of the major-thirds' deviations\n");
    c.constraints.no_wide_fifths = true;
    CHECK(describe_cost(c) == "cost: 1.00 x rms of the major-thirds' deviations\nconstraints: no fifth wider than pure\n");
}
