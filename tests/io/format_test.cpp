#include <catch2/catch.hpp>

#include "core/io/format.hpp"

TEST_CASE("numbers are printed with fixed decimals and no negative zero", "[format]") {
    CHECK(terzo::fixed(701.955001, 3) == "701.955");
    CHECK(terzo::fixed(-0.0001, 3) == "0.000");
    CHECK(terzo::fixed(-1.9555, 3) == "-1.956");
    CHECK(terzo::signed_fixed(13.686286, 3) == "+13.686");
    CHECK(terzo::signed_fixed(-13.686286, 1) == "-13.7");
    CHECK(terzo::signed_fixed(0.0, 3) == "0.000");
    CHECK(terzo::signed_fixed(-0.0004, 3) == "0.000");
}
