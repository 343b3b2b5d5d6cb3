#include <catch2/catch.hpp>

#include "core/tuning/just.hpp"

using namespace terzo;

namespace {
Ratio r(std::int64_t n, std::int64_t d = 1) {
    return Ratio(n, d);
}
} // namespace

TEST_CASE("a harmonic segment is its harmonics over the lowest one", "[just]") {
    // Harmonics 8..16 over 8 (common practice, no source; ratios checked by hand).
    Scale s = harmonic_segment(8, 16, "h");
    REQUIRE(s.size() == 8);
    CHECK(*s.degree(1).ratio() == r(9, 8));
    CHECK(*s.degree(3).ratio() == r(11, 8));
    CHECK(*s.degree(7).ratio() == r(15, 8));
    CHECK(*s.period().ratio() == r(2));
    // A segment need not span an octave.
    Scale t = harmonic_segment(4, 7, "t");
    CHECK(t.size() == 3);
    CHECK(*t.period().ratio() == r(7, 4));
}

TEST_CASE("a subharmonic segment mirrors the harmonic one", "[just]") {
    Scale s = subharmonic_segment(8, 16, "u");
    REQUIRE(s.size() == 8);
    CHECK(*s.degree(1).ratio() == r(16, 15));
    CHECK(*s.degree(4).ratio() == r(4, 3));
    CHECK(*s.degree(7).ratio() == r(16, 9));
    CHECK(*s.period().ratio() == r(2));
    // Steps of one are the reversed steps of the other.
    Scale h = harmonic_segment(8, 16, "h");
    for (std::size_t i = 1; i < 8; ++i)
        CHECK(*s.degree(i).ratio() * *h.degree(8 - i).ratio() == r(2));
}

TEST_CASE("the tonality diamond of 1 3 5 7 has 13 notes", "[just]") {
    // The 7-limit diamond: 13 distinct octave-reduced ratios a/b (recomputed with Python's
    // fractions module: sorted(set(reduce(Fraction(a, b)) for a in S for b in S))).
    Scale s = tonality_diamond({1, 3, 5, 7}, "d");
    const Ratio expected[13] = {r(1),     r(8, 7), r(7, 6), r(6, 5), r(5, 4),  r(4, 3), r(7, 5),
                                r(10, 7), r(3, 2), r(8, 5), r(5, 3), r(12, 7), r(7, 4)};
    REQUIRE(s.size() == 13);
    for (std::size_t i = 0; i < 13; ++i)
        CHECK(*s.degree(i).ratio() == expected[i]);
    // 1 3 5 7 9 11: 29 notes (same Python computation).
    CHECK(tonality_diamond({1, 3, 5, 7, 9, 11}, "d11").size() == 29);
}

TEST_CASE("a product set holds every product of k chosen factors", "[just]") {
    // Products of 2 from {1,3,5,7}: 3 5 7 15 21 35 over 3, octave-reduced (by hand).
    Scale s = product_set(2, {1, 3, 5, 7}, "p");
    const Ratio expected[6] = {r(1), r(7, 6), r(5, 4), r(35, 24), r(5, 3), r(7, 4)};
    REQUIRE(s.size() == 6);
    for (std::size_t i = 0; i < 6; ++i)
        CHECK(*s.degree(i).ratio() == expected[i]);
    // 3 of 6 factors: C(6,3) = 20 products, all distinct for 1 3 5 7 9 11 (Python check).
    CHECK(product_set(3, {1, 3, 5, 7, 9, 11}, "e").size() == 20);
    // Equal products collapse: 2 of {1, 3, 3}: 3, 3, 9 -> 1/1 and 3 -> 3/2... 9/3 = 3 -> 3/2.
    CHECK(product_set(2, {1, 3, 3}, "dup").size() == 2);
}

TEST_CASE("the number of choices is counted without overflow", "[just]") {
    CHECK(choose_count(6, 3, 4096) == 20);
    CHECK(choose_count(64, 2, 4096) == 2016);
    CHECK(choose_count(64, 32, 4096) == -1);
    CHECK(choose_count(3, 5, 4096) == 0);
    CHECK(choose_count(20, 8, 4096) == -1); // C(20, 8) = 125970
}
