#include <catch2/catch.hpp>

#include "core/tuning/pitch_set.hpp"

using namespace terzo;

namespace {
Pitch p(std::int64_t n, std::int64_t d = 1) {
    return Pitch::from_ratio(Ratio(n, d));
}
} // namespace

TEST_CASE("reducing into the period is exact at the edges", "[pitch_set]") {
    CHECK(*reduce_into_period(p(9, 4), p(2)).ratio() == Ratio(9, 8));
    CHECK(*reduce_into_period(p(2, 3), p(2)).ratio() == Ratio(4, 3));
    CHECK(*reduce_into_period(p(8), p(2)).ratio() == Ratio(1));
    CHECK(*reduce_into_period(p(1, 2), p(2)).ratio() == Ratio(1));
    // 2^(12/12) is exactly the period: it reduces to 1/1, not to a degree at 1200 c.
    Pitch twelfth_of_octave = Pitch::from_vector(PrimeVector::prime_power(2, Ratio(1, 12)));
    CHECK(*reduce_into_period(exact_power(twelfth_of_octave, Ratio(24)), p(2)).ratio() == Ratio(1));
    CHECK(reduce_into_period(Pitch::from_cents(-100), p(2)).cents() == Approx(1100));
}

TEST_CASE("rationals beyond 64 bits keep their prime vector", "[pitch_set]") {
    Pitch big = exact_power(p(3, 2), Ratio(45)); // 3^45 > 2^63
    REQUIRE(big.is_rational());
    CHECK_FALSE(big.ratio()->is_small());
    auto v = exact_vector(big);
    REQUIRE(v);
    CHECK(v->exponent(3) == Ratio(45));
    CHECK(v->exponent(2) == Ratio(-45));
    // Multiplying it by a tempered pitch stays exact.
    Pitch t = exact_product(big, Pitch::from_vector(PrimeVector::prime_power(5, Ratio(1, 4))));
    CHECK(t.kind() == Pitch::Kind::tempered);
    CHECK(t.vector()->exponent(3) == Ratio(45));
}

TEST_CASE("a pitch set becomes a sorted scale without duplicates", "[pitch_set]") {
    Scale s = scale_from_pitch_set("set", {p(3, 2), p(1), p(3), p(9, 8), p(9, 4)}, p(2));
    REQUIRE(s.size() == 3);
    CHECK(*s.degree(1).ratio() == Ratio(9, 8));
    CHECK(*s.degree(2).ratio() == Ratio(3, 2));
}
