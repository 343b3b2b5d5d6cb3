#include "core/analysis/lattice.hpp"

#include <catch2/catch.hpp>

using namespace terzo;
using Catch::Matchers::WithinAbs;

namespace {
Pitch ratio(std::int64_t n, std::int64_t d) { return Pitch::from_ratio(Ratio(n, d)); }
Pitch edo_step(int k, int n) { return Pitch::from_vector(PrimeVector::prime_power(2, Ratio(k, n))); }
using E = std::array<int, 3>;
} // namespace

TEST_CASE("a 7-limit ratio sits at its own exponents of 3, 5 and 7", "[lattice]") {
    // Exponents by prime factorisation (common practice, no source): 15/8 = 3*5/2^3,
    // 81/80 = 3^4/(2^4*5), 7/4 = 7/2^2, 3/1 reduces to 3/2 within the octave.
    auto p = place_on_lattice(ratio(15, 8));
    CHECK(p.how == LatticeHow::exact);
    CHECK(p.exponents == E{1, 1, 0});
    CHECK(p.just == Ratio(15, 8));
    CHECK(p.deviation_cents == 0.0);
    CHECK(place_on_lattice(ratio(81, 80)).exponents == E{4, -1, 0});
    CHECK(place_on_lattice(ratio(7, 4)).exponents == E{0, 0, 1});
    auto twelfth = place_on_lattice(ratio(3, 1));
    CHECK(twelfth.exponents == E{1, 0, 0});
    CHECK(twelfth.just == Ratio(3, 2));
    CHECK(place_on_lattice(ratio(2, 1)).exponents == E{0, 0, 0});
    // Octave equivalence: 5/4 and 5/2 and 5/8 are one point.
    CHECK(place_on_lattice(ratio(5, 8)).exponents == E{0, 1, 0});
    CHECK(place_on_lattice(ratio(5, 8)).just == Ratio(5, 4));
}

TEST_CASE("exact placement ignores the odd limit and the tolerance", "[lattice]") {
    // Pythagorean C# = 3^7/2^11 (docs/references.md 2.3, Pythagorean row, [CP]).
    LatticeOptions narrow{1.0, 3};
    auto p = place_on_lattice(ratio(2187, 2048), narrow);
    CHECK(p.how == LatticeHow::exact);
    CHECK(p.exponents == E{7, 0, 0});
}

TEST_CASE("lattice_exponents rejects ratios with primes above 7", "[lattice]") {
    CHECK(lattice_exponents(Ratio(11, 8)) == std::nullopt);
    CHECK(lattice_exponents(Ratio(13, 7)) == std::nullopt);
    CHECK(lattice_exponents(Ratio(225, 224)) == E{2, 2, -1});
}

TEST_CASE("equal-tempered degrees take their nearest just interpretation", "[lattice]") {
    // 12-TET errors from docs/references.md section 1 ([CP]): fifth -1.955001, major third
    // +13.686286, minor third -15.641287 cents.
    auto fifth = place_on_lattice(edo_step(7, 12));
    CHECK(fifth.how == LatticeHow::nearest);
    CHECK(fifth.exponents == E{1, 0, 0});
    CHECK_THAT(fifth.deviation_cents, WithinAbs(-1.955001, 1e-6));
    auto third = place_on_lattice(edo_step(4, 12));
    CHECK(third.just == Ratio(5, 4));
    CHECK_THAT(third.deviation_cents, WithinAbs(13.686286, 1e-6));
    auto minor = place_on_lattice(edo_step(3, 12));
    CHECK(minor.just == Ratio(6, 5));
    CHECK_THAT(minor.deviation_cents, WithinAbs(-15.641287, 1e-6));
    // Near 1000 cents 16/9 (-3.91) beats 9/5 (-17.60), both within odd limit 9.
    CHECK(place_on_lattice(edo_step(10, 12)).just == Ratio(16, 9));
    // 31 equal divisions: step 10 is 5/4 + 0.783, step 25 is 7/4 - 1.084
    // (docs/references.md section 3, 31-EDO row; Huygens 1691 [M]).
    auto t31 = place_on_lattice(edo_step(10, 31));
    CHECK(t31.exponents == E{0, 1, 0});
    CHECK_THAT(t31.deviation_cents, WithinAbs(0.783, 5e-4));
    auto s31 = place_on_lattice(edo_step(25, 31));
    CHECK(s31.exponents == E{0, 0, 1});
    CHECK_THAT(s31.deviation_cents, WithinAbs(-1.084, 5e-4));
}

TEST_CASE("a meantone fifth is read as a narrowed 3/2", "[lattice]") {
    // 1/4-comma fifth = 300*log2(5) = 696.578428 cents (docs/references.md 2.2, Aron [M]).
    auto v = PrimeVector::prime_power(5, Ratio(1, 4)); // 5^(1/4) = fifth / octave-reduced
    auto p = place_on_lattice(Pitch::from_vector(v));
    CHECK(p.exponents == E{1, 0, 0});
    CHECK_THAT(p.deviation_cents, WithinAbs(696.578428 - 701.955001, 1e-6));
}

TEST_CASE("cents-only degrees are placed by their nearest just ratio", "[lattice]") {
    auto p = place_on_lattice(Pitch::from_cents(386.0));
    CHECK(p.how == LatticeHow::nearest);
    CHECK(p.exponents == E{0, 1, 0});
    CHECK_THAT(p.deviation_cents, WithinAbs(386.0 - 386.313714, 1e-6));
    // Octave-equivalent: 1586 cents is the same point.
    CHECK(place_on_lattice(Pitch::from_cents(1586.0)).exponents == E{0, 1, 0});
    // Just below the octave wraps to 1/1 with a negative deviation.
    auto near_octave = place_on_lattice(Pitch::from_cents(1195.0));
    CHECK(near_octave.just == Ratio(1));
    CHECK_THAT(near_octave.deviation_cents, WithinAbs(-5.0, 1e-9));
}

TEST_CASE("the tolerance and odd limit bound the nearest-just search", "[lattice]") {
    // 11/8 = 551.318 cents: nothing of odd limit 15 within 20 cents (7/5 is 31.2 away).
    auto none = place_on_lattice(ratio(11, 8));
    CHECK(none.how == LatticeHow::none);
    CHECK(none.exponents == E{0, 0, 0});
    // With odd limit 3 the 12-TET major third has no interpretation within 20 cents ...
    CHECK(place_on_lattice(edo_step(4, 12), {20.0, 3}).how == LatticeHow::none);
    // ... and with a 10-cent tolerance neither has the minor third.
    CHECK(place_on_lattice(edo_step(3, 12), {10.0, 15}).how == LatticeHow::none);
    // 12-TET semitone: 16/15 (11.73 away) rather than 15/14 (19.44 away).
    CHECK(place_on_lattice(edo_step(1, 12)).just == Ratio(16, 15));
}

TEST_CASE("lattice options out of range are rejected", "[lattice]") {
    Pitch p = edo_step(7, 12);
    REQUIRE_THROWS_WITH(place_on_lattice(p, {0.0, 15}),
                        "lattice tolerance: error: tolerance 0.000 cents is out of range; it "
                        "must be above 0 and at most 600");
    REQUIRE_THROWS_WITH(place_on_lattice(p, {601.0, 15}),
                        "lattice tolerance: error: tolerance 601.000 cents is out of range; it "
                        "must be above 0 and at most 600");
    REQUIRE_THROWS_WITH(place_on_lattice(p, {20.0, 0}),
                        "odd limit: error: odd limit 0 is out of range; it must be from 1 to 243");
    REQUIRE_THROWS_WITH(place_on_lattice(p, {20.0, 245}),
                        "odd limit: error: odd limit 245 is out of range; it must be from 1 to 243");
}
