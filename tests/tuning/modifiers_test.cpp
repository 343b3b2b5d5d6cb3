#include <catch2/catch.hpp>

#include "core/tuning/modifiers.hpp"
#include "core/tuning/recipe.hpp"

using namespace terzo;

namespace {
Pitch p(std::int64_t n, std::int64_t d = 1) {
    return Pitch::from_ratio(Ratio(n, d));
}
Scale major() {
    return Scale("major", {p(9, 8), p(5, 4), p(4, 3), p(3, 2), p(5, 3), p(15, 8)}, p(2));
}
} // namespace

TEST_CASE("a mode starts on another degree and wraps round the period", "[modifiers]") {
    Scale dorian = rotate_to_degree(major(), 1, "d");
    REQUIRE(dorian.size() == 7);
    CHECK(*dorian.degree(1).ratio() == Ratio(10, 9));
    CHECK(*dorian.degree(6).ratio() == Ratio(16, 9)); // 2/1 over 9/8
    CHECK(*dorian.period().ratio() == Ratio(2));
    CHECK(rotate_to_degree(major(), 0, "same").degrees() == major().degrees());
}

TEST_CASE("transposing moves the pattern up and equals the complementary mode", "[modifiers]") {
    Scale up2 = transpose_pattern(major(), 2, "t");
    CHECK(up2.degrees() == rotate_to_degree(major(), 5, "m").degrees());
    CHECK(transpose_pattern(major(), 0, "t").degrees() == major().degrees());
}

TEST_CASE("stretching the period keeps exact powers exact", "[modifiers]") {
    Scale e = build_recipe("equal 12");
    Scale s = stretch_period(e, Pitch::from_vector(PrimeVector::prime_power(3, Ratio(1))), "s");
    CHECK(s.degree(1).str() == "3^(1/12)");
    CHECK(*s.period().ratio() == Ratio(3));
    // A just degree is no power of 2/1: it is stretched in proportion and becomes cents-only.
    Scale j = stretch_period(major(), Pitch::from_cents(1210.0), "j");
    CHECK(j.degree(4).kind() == Pitch::Kind::cents_only);
    CHECK(j.degree(4).cents() == Approx(cents(Ratio(3, 2)) * 1210.0 / 1200.0).margin(1e-9));
    // 2/1 itself inside a 4/1 period is half of it.
    Scale oct = Scale("o", {p(2)}, p(4));
    CHECK(*stretch_period(oct, p(9), "n").degree(1).ratio() == Ratio(3));
}

TEST_CASE("a subset keeps the unison and the listed degrees", "[modifiers]") {
    Scale s = keep_degrees(build_recipe("equal 12"), {0, 2, 4, 5, 7, 9, 11}, "k");
    REQUIRE(s.size() == 7);
    CHECK(s.degree(3).str() == "2^(5/12)");
    Scale without_zero = keep_degrees(major(), {2, 4}, "k");
    REQUIRE(without_zero.size() == 3);
    CHECK(*without_zero.degree(1).ratio() == Ratio(5, 4));
}
