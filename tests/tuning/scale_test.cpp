#include <catch2/catch.hpp>

#include "core/tuning/scale.hpp"

using terzo::Pitch;
using terzo::Ratio;
using terzo::Scale;

TEST_CASE("a scale's degree 0 is the unison and the period is kept apart", "[scale]") {
    Scale s("tetrachord", {Pitch::from_ratio(Ratio(9, 8)), Pitch::from_ratio(Ratio(5, 4))},
            Pitch::from_ratio(Ratio(4, 3)));
    CHECK(s.size() == 3);
    CHECK(*s.degree(0).ratio() == Ratio(1));
    CHECK(*s.degree(2).ratio() == Ratio(5, 4));
    CHECK(*s.period().ratio() == Ratio(4, 3));
    CHECK(s.is_exact());
    CHECK(s.is_rational());
    CHECK_THROWS(s.degree(3));
}

TEST_CASE("a scale with a cents-only degree is not exact", "[scale]") {
    Scale s("mixed", {Pitch::from_cents(100.0)}, Pitch::from_ratio(Ratio(2)));
    CHECK_FALSE(s.is_exact());
    CHECK_FALSE(s.is_rational());
}
