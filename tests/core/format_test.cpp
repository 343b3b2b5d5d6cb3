#include <catch2/catch.hpp>

#include <cmath>

#include "core/format.hpp"

TEST_CASE("numbers are printed with fixed decimals and no negative zero", "[format]") {
    CHECK(terzo::fixed(701.955001, 3) == "701.955");
    CHECK(terzo::fixed(-0.0001, 3) == "0.000");
    CHECK(terzo::fixed(-1.9555, 3) == "-1.956");
    CHECK(terzo::signed_fixed(13.686286, 3) == "+13.686");
    CHECK(terzo::signed_fixed(-13.686286, 1) == "-13.7");
    CHECK(terzo::signed_fixed(0.0, 3) == "0.000");
    CHECK(terzo::signed_fixed(-0.0004, 3) == "0.000");
}

TEST_CASE("a value from the command line is echoed the way it was typed", "[format]") {
    CHECK(terzo::number_text(0.0) == "0");
    CHECK(terzo::number_text(-5.0) == "-5");
    CHECK(terzo::number_text(261.6255653) == "261.6255653");
    CHECK(terzo::number_text(0.0001) == "0.0001");
    CHECK(terzo::number_text(1e9) == "1000000000");
    CHECK(terzo::number_text(1e12) == "1e+12");
    CHECK(terzo::number_text(std::nan("")) == "nan");
    CHECK(terzo::number_text(-HUGE_VAL) == "-inf");
}

TEST_CASE("sorted numbers are written as runs", "[format]") {
    CHECK(terzo::runs_text({}) == "");
    CHECK(terzo::runs_text({7}) == "7");
    CHECK(terzo::runs_text({0, 1, 2, 3, 125, 127}) == "0-3, 125, 127");
    CHECK(terzo::runs_text({0, 1, 2, 24, 100, 101}) == "0-2, 24, 100-101");
}
