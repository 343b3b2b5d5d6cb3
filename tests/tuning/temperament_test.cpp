#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <string>

#include "core/tuning/recipe.hpp"
#include "core/tuning/temperament.hpp"

using namespace terzo;

namespace {

Pitch ratio(std::int64_t n, std::int64_t d) {
    return Pitch::from_ratio(Ratio(n, d));
}

// One row of docs/references.md section 2.3, "Degrees in cents above C", C first.
using Row = std::array<double, 12>;

void check_row(const std::string& recipe, const Row& expected) {
    INFO(recipe);
    Scale s = build_recipe(recipe);
    REQUIRE(s.size() == 12);
    CHECK(s.is_exact());
    CHECK(*s.period().ratio() == Ratio(2));
    // The table prints three decimals; 0.0006 c is the rounding of the printed digit, well
    // inside the 0.01 c the issue asks for.
    for (std::size_t i = 0; i < 12; ++i) {
        INFO("degree " << i);
        CHECK(s.degree(i).cents() == Approx(expected[i]).margin(0.0006));
    }
}

} // namespace

TEST_CASE("the commas are the exact intervals of their definitions", "[temperament]") {
    // docs/references.md section 1: P = 3^12/2^19 and S = 81:80 (Barbour 1951, preface [S]);
    // the schisma 32805/32768 (Ellis [M]) and the identity P - S = s (verified with Fraction).
    CHECK(*pythagorean_comma().to_ratio() == Ratio(531441, 524288));
    CHECK(*syntonic_comma().to_ratio() == Ratio(81, 80));
    CHECK(schisma() == pythagorean_comma() / syntonic_comma());
    CHECK(pythagorean_comma().cents() == Approx(23.460010).margin(1e-6));
    CHECK(syntonic_comma().cents() == Approx(21.506290).margin(1e-6));
    CHECK(schisma().cents() == Approx(1.953721).margin(1e-6));
}

TEST_CASE("meantone fifths are the published sizes", "[temperament]") {
    // docs/references.md 2.2: 1/4-comma fifth 696.578428 = 300*log2(5) (Aron 1523; Zarlino 1571,
    // Salinas 1577 [M]); 1/6-comma fifth 698.370619 (Silbermann as reported by Sorge
    // [M, uncertain]); 1/3-comma 694.786238 (Salinas 1577 [M]); 2/7-comma 695.810347
    // (Zarlino 1558 [M]); 1/5-comma 697.653743 (Verheijen via Stevin, Barbour [M, uncertain]).
    CHECK(meantone_fifth(Ratio(1, 4)).cents() == Approx(696.578428).margin(1e-6));
    CHECK(meantone_fifth(Ratio(1, 6)).cents() == Approx(698.370619).margin(1e-6));
    CHECK(meantone_fifth(Ratio(1, 3)).cents() == Approx(694.786238).margin(1e-6));
    CHECK(meantone_fifth(Ratio(2, 7)).cents() == Approx(695.810347).margin(1e-6));
    CHECK(meantone_fifth(Ratio(1, 5)).cents() == Approx(697.653743).margin(1e-6));
    // The quarter-comma fifth is exactly the fourth root of 5 (docs/references.md 2.2).
    CHECK(meantone_fifth(Ratio(1, 4)) == PrimeVector::prime_power(5, Ratio(1, 4)));
    CHECK(meantone_fifth(Ratio(0)) == PrimeVector::from_ratio(Ratio(3, 2)));
}

TEST_CASE("historical temperaments match the degree table of docs/references.md 2.3", "[temperament]") {
    // docs/references.md 2.3 (computed from the definitions in 2.1; cross-checked there against
    // Barbour 1951's rounded tables [M] and R. Rhodes 2001 for Werckmeister III [S]).
    check_row("chain 3/2 up 8 down 3",
              {0.000, 113.685, 203.910, 294.135, 407.820, 498.045, 611.730, 701.955, 815.640,
               905.865, 996.090, 1109.775}); // Pythagorean [CP]
    check_row("meantone 1/4", {0.000, 76.049, 193.157, 310.265, 386.314, 503.422, 579.471, 696.578,
                               772.627, 889.735, 1006.843, 1082.892}); // Aron 1523 [M]
    check_row("meantone 1/3", {0.000, 63.504, 189.572, 315.641, 379.145, 505.214, 568.717, 694.786,
                               758.290, 884.359, 1010.428, 1073.931}); // Salinas 1577 [M]
    check_row("meantone 2/7", {0.000, 70.672, 191.621, 312.569, 383.241, 504.190, 574.862, 695.810,
                               766.483, 887.431, 1008.379, 1079.052}); // Zarlino 1558 [M]
    check_row("meantone 1/5",
              {0.000, 83.576, 195.307, 307.039, 390.615, 502.346, 585.922, 697.654, 781.230,
               892.961, 1004.693, 1088.269}); // Verheijen/Stevin [M, uncertain]
    check_row("meantone 1/6",
              {0.000, 88.594, 196.741, 304.888, 393.482, 501.629, 590.224, 698.371, 786.965,
               895.112, 1003.259, 1091.853}); // Silbermann/Sorge [M, uncertain]
    // Werckmeister III, the standard P/4 reading (docs/references.md 2.5 and 9.2).
    check_row("fifths from C: -P/4 -P/4 -P/4 0 0 -P/4 0 0 0 0 0 0",
              {0.000, 90.225, 192.180, 294.135, 390.225, 498.045, 588.270, 696.090, 792.180,
               888.270, 996.090, 1092.180});
    // Kirnberger III, S/4 on C-G..A-E and the schisma on F#-C# (Kirnberger's letter [S]; the
    // schisma's place is the standard reading, docs/references.md 2.3).
    check_row("fifths from C: -S/4 -S/4 -S/4 -S/4 0 0 -s 0 0 0 0 0",
              {0.000, 90.225, 193.157, 294.135, 386.314, 498.045, 590.224, 696.578, 792.180,
               889.735, 996.090, 1088.269});
    // Vallotti 1779 [M]: F-C..E-B each P/6 narrow.
    check_row("fifths from F: -P/6 -P/6 -P/6 -P/6 -P/6 -P/6 0 0 0 0 0 0",
              {0.000, 94.135, 196.090, 298.045, 392.180, 501.955, 592.180, 698.045, 796.090,
               894.135, 1000.000, 1090.225});
    // Young No. 2, Phil. Trans. 1800 (encyclopedia summaries [S]): C-G..B-F# each P/6 narrow.
    check_row("fifths from C: -P/6 -P/6 -P/6 -P/6 -P/6 -P/6 0 0 0 0 0 0",
              {0.000, 90.225, 196.090, 294.135, 392.180, 498.045, 588.270, 698.045, 792.180,
               894.135, 996.090, 1090.225});
    check_row("equal 12", {0, 100, 200, 300, 400, 500, 600, 700, 800, 900, 1000, 1100});
    check_row(
        "fifths from C: -P/12 -P/12 -P/12 -P/12 -P/12 -P/12 -P/12 -P/12 -P/12 -P/12 -P/12 -P/12",
        {0, 100, 200, 300, 400, 500, 600, 700, 800, 900, 1000, 1100});
}

TEST_CASE("each comma-fraction meantone makes its defining interval exactly pure",
          "[temperament]") {
    // docs/references.md 2.2, "Defining property (verified)". Degrees: 3 = Eb, 4 = E, 6 = F#, 11 = B.
    CHECK(exactly_equal(build_recipe("meantone 1/4").degree(4), ratio(5, 4)) == true);
    CHECK(exactly_equal(build_recipe("meantone 1/3").degree(3), ratio(6, 5)) == true);
    CHECK(exactly_equal(build_recipe("meantone 1/5").degree(11), ratio(15, 8)) == true);
    CHECK(exactly_equal(build_recipe("meantone 1/6").degree(6), ratio(45, 32)) == true);
    // 2/7-comma: major and minor thirds both S/7 narrow of just.
    Scale z = build_recipe("meantone 2/7");
    PrimeVector seventh = syntonic_comma().pow(Ratio(-1, 7));
    CHECK(*z.degree(4).vector() == PrimeVector::from_ratio(Ratio(5, 4)) * seventh);
    CHECK(*z.degree(3).vector() == PrimeVector::from_ratio(Ratio(6, 5)) * seventh);
    CHECK(z.degree(4).cents() - cents(Ratio(5, 4)) == Approx(-3.072327).margin(1e-6));
}

TEST_CASE("the wolf of a chain Eb to G# is the published size", "[temperament]") {
    // docs/references.md 2.2, column "Wolf G#-Eb"; the wolf is what 7 octaves leave to G#-Eb.
    auto meantone_wolf = [](const Ratio& k) {
        FifthCircle c;
        c.start_pitch_class = 3;
        for (int i = 0; i < 11; ++i)
            c.tempering[static_cast<std::size_t>(i)] = syntonic_comma().pow(-k);
        CHECK(wolf_index(c) == 11);
        return circle_fifth(c, 11).cents();
    };
    CHECK(meantone_wolf(Ratio(0)) == Approx(678.494990).margin(1e-6));
    CHECK(meantone_wolf(Ratio(1, 3)) == Approx(757.351386).margin(1e-6));
    CHECK(meantone_wolf(Ratio(2, 7)) == Approx(746.086186).margin(1e-6));
    CHECK(meantone_wolf(Ratio(1, 4)) == Approx(737.637287).margin(1e-6));
    CHECK(meantone_wolf(Ratio(1, 5)) == Approx(725.808828).margin(1e-6));
    CHECK(meantone_wolf(Ratio(1, 6)) == Approx(717.923188).margin(1e-6));
    // The same wolf read off the chain: Eb an octave up over G#.
    Scale q = build_recipe("meantone 1/4");
    CHECK(1200.0 + q.degree(3).cents() - q.degree(8).cents() == Approx(737.637287).margin(1e-6));
    // A circle written with a wolf gives the same notes as the chain.
    Scale w =
        build_recipe("fifths from Eb: -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 wolf");
    CHECK(w.degrees() == q.degrees());
    CHECK(w.description() ==
          "fifths from Eb: -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 -S/4 wolf"
          " (wolf G#-Eb 737.637 c)");
}

TEST_CASE("circulating temperaments close the circle exactly", "[temperament]") {
    // docs/references.md 2.1: "the narrowings add up to exactly one Pythagorean comma".
    for (const char* r : {"fifths from C: -P/4 -P/4 -P/4 0 0 -P/4 0 0 0 0 0 0",
                          "fifths from C: -S/4 -S/4 -S/4 -S/4 0 0 -s 0 0 0 0 0",
                          "fifths from F: -P/6 -P/6 -P/6 -P/6 -P/6 -P/6 0 0 0 0 0 0"}) {
        INFO(r);
        CHECK_NOTHROW(build_recipe(r));
    }
    FifthCircle w3;
    for (int i : {0, 1, 2, 5})
        w3.tempering[static_cast<std::size_t>(i)] = pythagorean_comma().pow(Ratio(-1, 4));
    for (int i : {3, 4, 6, 7, 8, 9, 10, 11})
        w3.tempering[static_cast<std::size_t>(i)] = PrimeVector();
    CHECK(circle_leftover(w3) == PrimeVector());
    CHECK(wolf_index(w3) == std::nullopt);
}

TEST_CASE("Werckmeister III read with the syntonic comma leaves a schisma over", "[temperament]") {
    // docs/references.md 2.5: "With S/4 the circle does not close: a schisma is left over".
    FifthCircle c;
    for (int i = 0; i < 12; ++i)
        c.tempering[static_cast<std::size_t>(i)] = PrimeVector();
    for (int i : {0, 1, 2, 5})
        c.tempering[static_cast<std::size_t>(i)] = syntonic_comma().pow(Ratio(-1, 4));
    CHECK(circle_leftover(c) == schisma());
    REQUIRE_THROWS_WITH(
        build_recipe("fifths from C: -S/4 -S/4 -S/4 0 0 -S/4 0 0 0 0 0 0"),
        "recipe:1:16: error: the 12 fifths do not close the circle: together they are "
        "32805/32768 (1.954 c) wider than 7 octaves; change a fifth, or write wolf for "
        "the fifth that takes up the difference");
    // Twelve pure fifths overshoot seven octaves by the Pythagorean comma (docs/references.md 1).
    REQUIRE_THROWS_WITH(
        build_recipe("fifths: 0 0 0 0 0 0 0 0 0 0 0 0"),
        "recipe:1:9: error: the 12 fifths do not close the circle: together they are "
        "531441/524288 (23.460 c) wider than 7 octaves; change a fifth, or write wolf "
        "for the fifth that takes up the difference");
    // Five quarter-comma fifths narrow the circle by P/4 too much: P^(1/4) = 3^3/2^(19/4).
    REQUIRE_THROWS_WITH(
        build_recipe("fifths: -P/4 -P/4 -P/4 -P/4 -P/4 0 0 0 0 0 0 0"),
        "recipe:1:9: error: the 12 fifths do not close the circle: together they are "
        "2^(-19/4)*3^(3) (5.865 c) narrower than 7 octaves; change a fifth, or write wolf "
        "for the fifth that takes up the difference");
}

TEST_CASE("the other published forms of Kirnberger III give their published degrees",
          "[temperament]") {
    // docs/references.md 2.5, rational form in Kirnberger's letter [S transcription]: D 193.190,
    // G 696.603, A 889.744, the rest as the S/4 form.
    Scale letter =
        build_recipe("fifths from C: -(324/323) -(323/322) -(321/320) -(322/321) 0 0 -s 0 0 0 0 0");
    CHECK(letter.is_rational());
    CHECK(letter.degree(2).cents() == Approx(193.190).margin(0.0006));
    CHECK(letter.degree(7).cents() == Approx(696.603).margin(0.0006));
    CHECK(letter.degree(9).cents() == Approx(889.744).margin(0.0006));
    CHECK(letter.degree(4).cents() == Approx(386.314).margin(0.0006));
    // The four narrowings multiply to 81/80 exactly, so E is the just 5/4.
    CHECK(*letter.degree(4).ratio() == Ratio(5, 4));
    // P/12 form, Bellermann 1871 p. 572 via Meister 1991 [S secondary]:
    // C-G 2/12, G-D 2.5/12, D-A 3.5/12, A-E 3/12, F#-C# 1/12 of P.
    Scale twelfths =
        build_recipe("fifths from C: -2/12P -5/24P -7/24P -3/12P 0 0 -1/12P 0 0 0 0 0");
    const double expected[12] = {0.000,   90.225,  195.112, 294.135, 386.315, 498.045,
                                 590.225, 698.045, 792.180, 890.225, 996.090, 1088.270};
    for (std::size_t i = 0; i < 12; ++i) {
        INFO("degree " << i);
        CHECK(twelfths.degree(i).cents() == Approx(expected[i]).margin(0.0006));
    }
}

TEST_CASE("Vallotti is Young No. 2 transposed to F", "[temperament]") {
    // docs/references.md 2.3: "Vallotti starting on F equals Young starting on C".
    Scale young =
        build_recipe("fifths from C: -P/6 -P/6 -P/6 -P/6 -P/6 -P/6 0 0 0 0 0 0 | transpose F");
    Scale vallotti = build_recipe("fifths from F: -P/6 -P/6 -P/6 -P/6 -P/6 -P/6 0 0 0 0 0 0");
    CHECK(young.degrees() == vallotti.degrees());
}

TEST_CASE("equal divisions have the best fifths and thirds of the reference table",
          "[temperament]") {
    // docs/references.md section 3 (common practice, recomputed there; 19: Barbour ch. VI p. 107
    // [page S, content M]; 31: Huygens 1691 [M]; 53: Mercator/Holder, Bosanquet 1876 [M]).
    struct Case {
        int n, fifth_steps;
        double fifth;
        int third_steps;
        double third;
    };
    for (Case c : {Case{19, 11, 694.737, 6, 378.947}, Case{31, 18, 696.774, 10, 387.097},
                   Case{53, 31, 701.887, 17, 384.906}, Case{12, 7, 700.000, 4, 400.000}}) {
        INFO(c.n << " equal divisions");
        Scale s = build_recipe("equal " + std::to_string(c.n));
        auto nearest = [&](double target) {
            std::size_t best = 0;
            for (std::size_t i = 0; i < s.size(); ++i)
                if (std::abs(s.degree(i).cents() - target) <
                    std::abs(s.degree(best).cents() - target))
                    best = i;
            return best;
        };
        std::size_t f = nearest(cents(Ratio(3, 2))), t = nearest(cents(Ratio(5, 4)));
        CHECK(f == static_cast<std::size_t>(c.fifth_steps));
        CHECK(t == static_cast<std::size_t>(c.third_steps));
        CHECK(s.degree(f).cents() == Approx(c.fifth).margin(0.0006));
        CHECK(s.degree(t).cents() == Approx(c.third).margin(0.0006));
        CHECK(*s.degree(f).vector() == PrimeVector::prime_power(2, Ratio(c.fifth_steps, c.n)));
    }
}

TEST_CASE("13 equal divisions of 3/1 have the published step and consonances", "[temperament]") {
    // docs/references.md section 3: step 146.304231 c = 3^(1/13); 3 steps 438.913, 6 steps 877.825,
    // 8 steps 1170.434 (Bohlen 1978; Mathews, Pierce, Reeves & Roberts 1988 [M]).
    Scale s = build_recipe("equal 13 of 3/1");
    REQUIRE(s.size() == 13);
    CHECK(*s.period().ratio() == Ratio(3));
    CHECK(s.degree(1).cents() == Approx(146.304231).margin(1e-6));
    CHECK(s.degree(3).cents() == Approx(438.913).margin(0.0006));
    CHECK(s.degree(6).cents() == Approx(877.825).margin(0.0006));
    CHECK(s.degree(8).cents() == Approx(1170.434).margin(0.0006));
    CHECK(s.degree(1).str() == "3^(1/13)");
}

TEST_CASE("an equal division of a cents value is cents-only and says so", "[temperament]") {
    Scale s = build_recipe("equal 4 of 1000c");
    CHECK_FALSE(s.is_exact());
    CHECK(s.degree(1).kind() == Pitch::Kind::cents_only);
    CHECK(s.degree(3).cents() == Approx(750.0).margin(1e-9));
    CHECK(s.description() == "4 equal divisions of 1000.000 cents");
}
