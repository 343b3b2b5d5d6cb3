#include <catch2/catch.hpp>

#include <nlohmann/json.hpp>

#include "core/text.hpp"
#include "core/report/rank_report.hpp"

using namespace terzo;

namespace {
Ranking two_entries() {
    Ranking r;
    r.files = 3;
    r.entries = {{"a.scl", "plain", 12, 1.5}, {"b.scl", "bad \xFF and \x1B[2J", 12, 2.25}};
    r.failures = {{"c.scl", "c.scl:1: error: contains a NUL byte; a .scl file is plain text"}};
    return r;
}
} // namespace

TEST_CASE("the ranking table shows descriptions with unsafe bytes replaced", "[rank_report]") {
    const std::string text = ranking_text(two_entries(), RankMetric::worst_fifth);
    CHECK(text.find("\x1B") == std::string::npos);
    CHECK(text.find("bad \xEF\xBF\xBD and \xEF\xBF\xBD[2J") != std::string::npos);
    CHECK(text.find("1.500") != std::string::npos);
    CHECK(ranking_text(Ranking{}, RankMetric::worst_fifth).empty());
}

TEST_CASE("the ranking JSON keeps every entry when a description is not UTF-8", "[rank_report]") {
    auto j = nlohmann::json::parse(json_text(ranking_json(two_entries(), RankMetric::fit)));
    CHECK(j["metric"] == "fit");
    REQUIRE(j["ranked"].size() == 2);
    CHECK(j["ranked"][1]["description"] == "bad \xEF\xBF\xBD and \x1B[2J");
    CHECK(j["failed"][0]["path"] == "c.scl");
}

TEST_CASE("the lines after the ranking name failures, the odd description and the count", "[rank_report]") {
    CHECK(ranking_messages(two_entries(), RankMetric::worst_fifth, false, false) ==
          "c.scl:1: error: contains a NUL byte; a .scl file is plain text\n"
          "terzo rank: note: 1 description holds bytes that are not UTF-8 or are control characters (the first in "
          "b.scl); terminal output shows each as U+FFFD, JSON replaces the bytes that are not UTF-8\n"
          "terzo rank: 1 could not be ranked, 2 ranked\n");
    Ranking stopped = two_entries();
    stopped.cancelled = true;
    CHECK(ranking_messages(stopped, RankMetric::worst_fifth, false, true, true).find(
              "terzo rank: stopped at the time limit (--time-limit); the ranking above covers the files read before stopping\n") !=
          std::string::npos);
}
