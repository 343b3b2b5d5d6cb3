#include <catch2/catch.hpp>

#include "core/arith/pitch.hpp"

using terzo::Pitch;
using terzo::PrimeVector;
using terzo::Ratio;

TEST_CASE("a pitch knows whether it is exact", "[pitch]") {
    Pitch just = Pitch::from_ratio(Ratio(5, 4));
    Pitch tempered = Pitch::from_vector(PrimeVector::prime_power(2, Ratio(1, 12)));
    Pitch typed = Pitch::from_cents(386.3137);
    CHECK(just.is_exact());
    CHECK(just.is_rational());
    CHECK(tempered.is_exact());
    CHECK_FALSE(tempered.is_rational());
    CHECK_FALSE(typed.is_exact());
    CHECK(just.str() == "5/4");
    CHECK(tempered.str() == "2^(1/12)");
    CHECK(typed.str() == "386.313700");
    CHECK(tempered.cents() == Approx(100.0).margin(1e-9));
}

TEST_CASE("a tempered pitch with integer exponents becomes rational", "[pitch]") {
    Pitch p = Pitch::from_vector(PrimeVector::prime_power(2, Ratio(1, 12)).pow(Ratio(12)));
    CHECK(p.is_rational());
    CHECK(*p.ratio() == Ratio(2));
}

TEST_CASE("stacking pitches stays exact only when both are exact", "[pitch]") {
    Pitch fifth = Pitch::from_ratio(Ratio(3, 2));
    Pitch fourth = Pitch::from_ratio(Ratio(4, 3));
    CHECK(*(fifth * fourth).ratio() == Ratio(2));
    Pitch et_step = Pitch::from_vector(PrimeVector::prime_power(2, Ratio(1, 12)));
    Pitch mixed = fifth * et_step;
    CHECK(mixed.kind() == Pitch::Kind::tempered);
    CHECK(mixed.str() == "2^(-11/12)*3");
    Pitch inexact = fifth * Pitch::from_cents(10.0);
    CHECK_FALSE(inexact.is_exact());
    CHECK(inexact.cents() == Approx(711.955001).margin(1e-6));
    CHECK(*(fifth / fourth).ratio() == Ratio(9, 8));
}

TEST_CASE("exact equality is decided without a tolerance", "[pitch]") {
    Pitch a = Pitch::from_ratio(Ratio(5, 4));
    Pitch b = Pitch::from_vector(PrimeVector::prime_power(5, Ratio(1, 4)).pow(Ratio(4)) /
                                 PrimeVector::from_ratio(Ratio(4)));
    CHECK(exactly_equal(a, b) == true);
    // 2^(1/12)^4 is 400 cents, within 14 cents of 5/4 but not equal.
    Pitch c = Pitch::from_vector(PrimeVector::prime_power(2, Ratio(1, 3)));
    CHECK(exactly_equal(a, c) == false);
    // A cents-only value is never exactly equal to anything, even with the same cents.
    CHECK_FALSE(exactly_equal(a, Pitch::from_cents(a.cents())).has_value());
}
