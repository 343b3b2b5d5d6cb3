#include <catch2/catch.hpp>

#include "core/analysis/landing.hpp"
#include "helpers.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;

TEST_CASE("a tone lands on the nearest note over all periods, with signed cents", "[landing]") {
    Keyboard kb(test::just12());
    // 3/8 is 3/2 two periods down: degree 7 in period -2.
    Landing l = landing(kb, Pitch::from_ratio(Ratio(3, 8)));
    CHECK(l.degree == 7);
    CHECK(l.period == -2);
    CHECK(l.exact);
    CHECK(l.deviation_cents == 0.0);
    // 7/4 = 968.826 c lies between 5/3 (884.359 c) and 9/5 (1017.596 c): nearer 9/5, below it.
    l = landing(kb, Pitch::from_ratio(Ratio(7, 4)));
    CHECK(l.degree == 10);
    CHECK(l.period == 0);
    CHECK_FALSE(l.exact);
    // cents(7/4) - cents(9/5) = -48.770381 c (python3: 1200*log2(35/36))
    CHECK_THAT(l.deviation_cents, WithinAbs(-48.770381, 1e-6));
    SECTION("above the last degree it may land on degree 0 of the next period") {
        l = landing(kb, Pitch::from_ratio(Ratio(31, 16))); // 1145.036 c, 54.96 c below 2/1
        CHECK(l.degree == 0);
        CHECK(l.period == 1);
        CHECK(l.deviation_cents < 0.0);
    }
}

TEST_CASE("when two notes are equally near, the tone lands on the lower one", "[landing]") {
    // A scale {1/1, 4/1} with period 16/1: a tone of 1200 c lies exactly halfway between
    // 1/1 and 4/1 (0 c and 2400 c), a tie that floating point represents exactly.
    Keyboard kb(test::ratio_scale({{4, 1}}, Ratio(16)));
    Landing l = nearest_note(kb, 1200.0);
    CHECK(l.degree == 0);
    CHECK(l.period == 0);
    CHECK(l.deviation_cents == 1200.0);
    l = landing(kb, Pitch::from_ratio(Ratio(8)));  // 3600 c: between 4 (2400 c) and 16 (4800 c)
    CHECK(l.degree == 1);
    CHECK(l.period == 0);
}

TEST_CASE("coincidence is decided exactly, never by closeness", "[landing]") {
    Keyboard kb(test::just12());
    // (2^40 + 1) / 2^40 is 1.6e-9 cents above 1/1: nearest note 1/1, but not equal to it.
    Ratio near(1099511627777LL, 1099511627776LL);
    Landing l = landing(kb, Pitch::from_ratio(near));
    CHECK(l.degree == 0);
    CHECK(l.period == 0);
    CHECK_FALSE(l.exact);
    CHECK(l.deviation_cents > 0.0);
    // The same through the fast path with a generous error bound: still decided exactly.
    l = landing(kb, cents(near), near, 1e-3);
    CHECK_FALSE(l.exact);
    l = landing(kb, cents(Ratio(2)), Ratio(2), 1e-3);
    CHECK(l.exact);
    CHECK(l.degree == 0);
    CHECK(l.period == 1);
}

TEST_CASE("tempered tones coincide exactly with tempered notes, cents-only ones never", "[landing]") {
    Keyboard kb(test::equal_division(12));
    // 2^(4/12) * 2^-3 is exactly degree 4 in period -3.
    Pitch e = Pitch::from_vector(PrimeVector::prime_power(2, Ratio(4, 12) - Ratio(3)));
    Landing l = landing(kb, e);
    CHECK(l.exact);
    CHECK(l.degree == 4);
    CHECK(l.period == -3);
    // A rational tone is never equal to a tempered degree: 5/4 lands on degree 4, 13.686 c
    // below it (docs/references.md section 1: 12-TET major third error +13.686286 c).
    l = landing(kb, Pitch::from_ratio(Ratio(5, 4)));
    CHECK(l.degree == 4);
    CHECK_FALSE(l.exact);
    CHECK_THAT(l.deviation_cents, WithinAbs(-13.686286, 1e-6));
    // Degree 0 of a tempered scale is still the rational 1/1.
    CHECK(landing(kb, Pitch::from_ratio(Ratio(1, 2))).exact);
    Keyboard c(test::equal_division_cents(12));
    l = landing(c, Pitch::from_cents(400.0));
    CHECK(l.degree == 4);
    CHECK(l.deviation_cents == 0.0);
    CHECK_FALSE(l.exact); // only a tolerance could call cents-only values equal
}

TEST_CASE("degrees given out of order or below 1/1 land correctly", "[landing]") {
    // Degrees 3/2, 9/8, 15/16 (below the unison) in a 2/1 period.
    Keyboard kb(test::ratio_scale({{3, 2}, {9, 8}, {15, 16}}));
    Landing l = landing(kb, Pitch::from_ratio(Ratio(15, 8))); // 15/16 one period up
    CHECK(l.exact);
    CHECK(l.degree == 3);
    CHECK(l.period == 1);
    l = landing(kb, Pitch::from_ratio(Ratio(9, 16)));
    CHECK(l.exact);
    CHECK(l.degree == 2);
    CHECK(l.period == -1);
}

TEST_CASE("the engine's note finder chooses the same note as nearest_note, ties and duplicates included", "[landing]") {
    // nearest_note is the definition; NoteFinder is its table for many searches. Scales with
    // degrees out of order, below 1/1 and at one pitch twice, and points exactly on notes,
    // exactly halfway between them and near period edges.
    const Scale scales[] = {test::just12(), test::scl_text("x\n4\n3/2\n4/5\n3/2\n2/1\n"),
                            test::equal_division(31), test::ratio_scale({{5, 4}, {3, 2}}, Ratio(3))};
    for (const Scale& s : scales) {
        Keyboard kb(s, 261.6255653, 2);
        const NoteFinder finder(kb);
        std::vector<double> points;
        for (const auto& d : kb.sorted_degrees())
            for (int p = -3; p <= 4; ++p) {
                const double c = d.cents_in_period + p * kb.period_cents();
                points.insert(points.end(), {c, c + 1e-9, c - 1e-9, c + 17.25, c - 0.5});
            }
        for (std::size_t i = 0; i + 1 < kb.sorted_degrees().size(); ++i) // halfway: a tie
            points.push_back((kb.sorted_degrees()[i].cents_in_period + kb.sorted_degrees()[i + 1].cents_in_period) / 2);
        for (int k = -4000; k <= 4000; ++k) points.push_back(k * 0.73);
        for (double c : points) {
            INFO(s.description() << " at " << c << " c");
            const Landing want = nearest_note(kb, c);
            const NoteFinder::Around got = finder.around(c);
            REQUIRE(got.nearer.degree == want.degree);
            REQUIRE(got.nearer.period == want.period);
            REQUIRE(got.nearer.deviation_cents == want.deviation_cents);
            REQUIRE_FALSE(got.nearer.exact);
            // The other neighbour lies on the other side of the tone (or on it).
            REQUIRE(std::fabs(got.other.deviation_cents) >= std::fabs(got.nearer.deviation_cents));
        }
    }
}
