#include <catch2/catch.hpp>

#include "core/analysis/audibility.hpp"

using namespace terzo;

// The estimate encodes published findings (docs/references.md section 5.1); these tests check
// that it says what those findings say, in the direction they say it.
TEST_CASE("the cubic difference tone is the most audible term for close primaries", "[audibility]") {
    // Colman, Oxford Dictionary of Psychology: for 1800 + 2000 Hz the most audible
    // combination tone is 2f1-f2 = 1600 Hz.
    const double cdt = audibility({2, -1}, 1800, 2000);
    CHECK(cdt == 1.0);
    for (auto t : combination_terms(6))
        if (!(t == CombinationTerm{2, -1})) CHECK(audibility(t, 1800, 2000) < cdt);
}

TEST_CASE("the cubic difference tone fades as the interval widens", "[audibility]") {
    // Goldstein 1967; Smoorenburg 1972b (from memory): strongest for f2/f1 about 1.1-1.2,
    // hard to hear above about 1.3-1.5.
    CHECK(audibility({2, -1}, 1000, 1100) == 1.0);
    CHECK(audibility({2, -1}, 1000, 1200) == 1.0);
    CHECK(audibility({2, -1}, 1000, 1350) == Approx(0.5));
    CHECK(audibility({2, -1}, 1000, 1500) == 0.0);
    CHECK(audibility({2, -1}, 1000, 2000) == 0.0);
}

TEST_CASE("the family f1 - k(f2 - f1) is heard up to k = 5 or 6", "[audibility]") {
    // Smoorenburg 1972a (abstract): audible up to k = 5 or 6.
    double previous = 2.0;
    for (int k = 1; k <= 6; ++k) {
        double w = audibility({k + 1, -k}, 1000, 1100);
        CHECK(w > 0.0);
        CHECK(w < previous);
        previous = w;
    }
    CHECK(audibility({8, -7}, 1000, 1100) == 0.0);
}

TEST_CASE("the quadratic difference tone needs high levels; summation tones are seldom heard", "[audibility]") {
    // Plomp 1965 (from memory): f2-f1 only at high levels; Truax 1999: summation tones seldom
    // heard. Both are constant estimates, the difference tone above the summation tone.
    CHECK(audibility({-1, 1}, 1000, 1100) == 0.5);
    CHECK(audibility({-1, 1}, 1000, 1900) == 0.5);
    CHECK(audibility({1, 1}, 1000, 1100) == Approx(0.1));
    CHECK(audibility({1, 1}, 1000, 1100) < audibility({-1, 1}, 1000, 1100));
}

TEST_CASE("between partials the primaries are the partials, in their real order", "[audibility]") {
    // Partial 2 of 1000 Hz (2000 Hz) and partial 1 of 1900 Hz: the primaries are 1900 and
    // 2000 Hz. Term (1,-1) on them is 2000 - 1900: the quadratic difference tone, weighted by
    // 1 / (2 * 1).
    CHECK(audibility({1, -1}, 1000, 1900, 2, 1) == Approx(0.5 / 2));
    // term (-1, 2) on (2000, 1900) is 3800 - 2000 = 2 f1' - f2': the cubic difference tone
    // of primaries 1900 and 2000 (ratio 1.05), weighted by 1 / (2 * 1).
    CHECK(audibility({-1, 2}, 1000, 1900, 2, 1) == Approx(1.0 / 2));
}
