#include <catch2/catch.hpp>

#include "core/tuning/degree_order.hpp"
#include "tests/support/scales.hpp"

using namespace terzo;

namespace {

std::vector<std::string> messages(const Scale& s) {
    std::vector<std::string> out;
    for (const auto& p : degree_order_problems(s)) out.push_back(p.message);
    return out;
}

} // namespace

TEST_CASE("a rising scale inside its period has no order problems", "[degree_order]") {
    CHECK(degree_order_problems(test::just12()).empty());
    CHECK(degree_order_problems(test::equal_division(31)).empty());
}

TEST_CASE("degrees out of place are named with their pitches", "[degree_order]") {
    const Scale s = test::scl_text("!\nodd\n7\n9/8\n3/2\n11/8\n11/8\n-50.0\n9/4\n2/1\n");
    CHECK(messages(s) == std::vector<std::string>{
                             "degree 3 (11/8) is lower than degree 2 (3/2)",
                             "degree 4 (11/8) is the same pitch as degree 3",
                             "degree 5 (-50.000 c) is below 1/1",
                             "degree 6 (9/4) is above the period (2/1)"});
    CHECK(degree_order_problems(s)[2].degree == 5);
    const Scale unison = test::scl_text("!\nodd\n3\n1/1\n2/1\n2/1\n");
    CHECK(messages(unison) == std::vector<std::string>{"degree 1 (1/1) is the unison 1/1, degree 0",
                                                       "degree 2 (2/1) is the period (2/1)"});
}

TEST_CASE("sorting by pitch brings degrees into the period exactly", "[degree_order]") {
    const Scale s = test::scl_text("!\nodd\n5\n3/2\n9/4\n1/2\n5/4\n2/1\n");
    const SortedScale sorted = sort_by_pitch(s);
    // 9/4 comes down to 9/8 and 1/2 up to 1/1; the two unisons keep their written order.
    std::vector<std::string> ratios;
    for (const Pitch& p : sorted.scale.degrees()) ratios.push_back(p.str());
    CHECK(ratios == std::vector<std::string>{"1/1", "1/1", "9/8", "5/4", "3/2"});
    CHECK(sorted.file_degree == std::vector<std::size_t>{0, 3, 2, 4, 1});
    CHECK(sorted.scale.period().str() == "2/1");
    CHECK(degree_order_problems(sorted.scale).size() == 1); // the repeated unison remains
}
