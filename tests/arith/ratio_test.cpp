#include <catch2/catch.hpp>

#include <boost/multiprecision/cpp_int.hpp>
#include <boost/rational.hpp>

#include <random>

#include "core/arith/ratio.hpp"

using terzo::Ratio;
using Big = Ratio::Big;

TEST_CASE("a ratio is stored in lowest terms with a positive denominator", "[ratio]") {
    Ratio r(6, -4);
    CHECK(r.num() == -3);
    CHECK(r.den() == 2);
    CHECK(r.str() == "-3/2");
    CHECK(Ratio(0, -5).str() == "0/1");
    CHECK(Ratio(2).str() == "2/1");
}

TEST_CASE("ratios add, subtract, multiply and divide exactly", "[ratio]") {
    CHECK(Ratio(3, 2) * Ratio(4, 3) == Ratio(2));
    CHECK(Ratio(5, 4) + Ratio(1, 4) == Ratio(3, 2));
    CHECK(Ratio(5, 4) - Ratio(3, 2) == Ratio(-1, 4));
    CHECK(Ratio(9, 8) / Ratio(10, 9) == Ratio(81, 80));
    CHECK(Ratio(3, 2).pow(-2) == Ratio(4, 9));
    CHECK(Ratio(7, 3).floor() == 2);
    CHECK(Ratio(-7, 3).floor() == -3);
}

TEST_CASE("ratios compare by value", "[ratio]") {
    CHECK(Ratio(5, 4) < Ratio(4, 3));
    CHECK(Ratio(-1, 2) < Ratio(1, 3));
    CHECK(Ratio(81, 80) > Ratio(1));
    CHECK(Ratio(10, 8) == Ratio(5, 4));
}

TEST_CASE("stacking fifths past 64 bits promotes to big integers and stays exact", "[ratio]") {
    // STYLE.md: stacking forty 3/2s already passes int64 (3^40 > 2^63).
    Ratio r(1);
    for (int i = 0; i < 40; ++i) r *= Ratio(3, 2);
    CHECK_FALSE(r.is_small());
    CHECK(r.big_num() == boost::multiprecision::pow(Big(3), 40));
    CHECK(r.big_den() == boost::multiprecision::pow(Big(2), 40));
    // Coming back down demotes to the fast representation.
    for (int i = 0; i < 40; ++i) r /= Ratio(3, 2);
    CHECK(r.is_small());
    CHECK(r == Ratio(1));
}

TEST_CASE("additions that overflow 64 bits are promoted, not wrapped", "[ratio]") {
    Ratio big(INT64_MAX);
    Ratio sum = big + big;
    CHECK_FALSE(sum.is_small());
    CHECK(sum.big_num() == Big(INT64_MAX) * 2);
    CHECK(sum - big == big);
    Ratio tiny(1, INT64_MAX);
    CHECK((tiny * tiny).big_den() == Big(INT64_MAX) * Big(INT64_MAX));
}

TEST_CASE("cents of published intervals", "[ratio]") {
    // docs/references.md section 1 (values recomputed with Python's math.log2): fifth and fourth
    // common practice; syntonic and Pythagorean comma as defined in Barbour 1951, preface [S].
    CHECK(terzo::cents(Ratio(3, 2)) == Approx(701.955001).margin(1e-6));
    CHECK(terzo::cents(Ratio(4, 3)) == Approx(498.044999).margin(1e-6));
    CHECK(terzo::cents(Ratio(5, 4)) == Approx(386.313714).margin(1e-6));
    CHECK(terzo::cents(Ratio(6, 5)) == Approx(315.641287).margin(1e-6));
    CHECK(terzo::cents(Ratio(7, 4)) == Approx(968.825906).margin(1e-6));
    CHECK(terzo::cents(Ratio(81, 80)) == Approx(21.506290).margin(1e-6));
    CHECK(terzo::cents(Ratio(531441, 524288)) == Approx(23.460010).margin(1e-6));
    CHECK(terzo::cents(Ratio(32805, 32768)) == Approx(1.953721).margin(1e-6));
    CHECK(terzo::cents(Ratio(2048, 2025)) == Approx(19.552569).margin(1e-6));
    CHECK(terzo::cents(Ratio(128, 125)) == Approx(41.058858).margin(1e-6));
    CHECK(terzo::cents(Ratio(225, 224)) == Approx(7.711523).margin(1e-6));
}

TEST_CASE("comma identities hold exactly", "[ratio]") {
    // docs/references.md section 1, "Exact identities, each checked with `Fraction`".
    CHECK(Ratio(3, 2).pow(12) / Ratio(2).pow(7) == Ratio(531441, 524288));
    CHECK(Ratio(531441, 524288) / Ratio(81, 80) == Ratio(32805, 32768));
    CHECK(Ratio(81, 80) / Ratio(32805, 32768) == Ratio(2048, 2025));
    CHECK(Ratio(2) / Ratio(5, 4).pow(3) == Ratio(128, 125));
    CHECK(Ratio(16, 15).pow(2) / Ratio(9, 8) == Ratio(2048, 2025));
    CHECK(Ratio(15, 14) / Ratio(16, 15) == Ratio(225, 224));
}

TEST_CASE("cents of huge ratios are computed from their leading bits", "[ratio]") {
    Ratio r = Ratio(3, 2).pow(100);
    CHECK_FALSE(r.is_small());
    CHECK(terzo::cents(r) == Approx(100 * 701.955000865).epsilon(1e-12));
}

TEST_CASE("random operations agree with boost::rational over cpp_int", "[ratio]") {
    // Reference: Boost.Multiprecision's cpp_int inside boost::rational, which is exact.
    using Ref = boost::rational<Big>;
    std::mt19937_64 rng(20261202);
    std::uniform_int_distribution<int> pick(0, 3);
    auto operand = [&](int bits) {
        std::uniform_int_distribution<std::int64_t> d(1, (std::int64_t(1) << bits) - 1);
        std::int64_t n = d(rng) * (rng() % 2 ? 1 : -1), m = d(rng);
        return std::pair{Ratio(n, m), Ref(Big(n), Big(m))};
    };
    int checked = 0;
    for (int round = 0; round < 1000; ++round) {
        // Widths from small musical values to near the 64-bit edge, so both paths are hit.
        int bits = 4 + round % 59;
        auto [x, rx] = operand(bits);
        for (int step = 0; step < 100; ++step, ++checked) {
            auto [y, ry] = operand(bits);
            switch (pick(rng)) {
            case 0: x += y; rx += ry; break;
            case 1: x -= y; rx -= ry; break;
            case 2: x *= y; rx *= ry; break;
            default: x /= y; rx /= ry; break;
            }
            if (x.is_zero()) { x = Ratio(1); rx = 1; }
            // Keep the reference sizes bounded: restart the chain when it gets large.
            if (boost::multiprecision::msb(abs(rx.numerator()) + 1) > 400) {
                x = Ratio(1);
                rx = 1;
            }
            REQUIRE(x.big_num() == rx.numerator());
            REQUIRE(x.big_den() == rx.denominator());
            REQUIRE(x.is_small() == (abs(rx.numerator()) <= Big(INT64_MAX) && rx.denominator() <= Big(INT64_MAX)));
        }
    }
    CHECK(checked == 100000);
}

TEST_CASE("ratio text is parsed strictly", "[ratio]") {
    terzo::SourcePos pos{"t.scl", 3, 2};
    CHECK(terzo::parse_ratio("5/4", pos) == Ratio(5, 4));
    CHECK(terzo::parse_ratio("3", pos) == Ratio(3));
    CHECK(terzo::parse_ratio("-3/2", pos) == Ratio(-3, 2));
    SECTION("bad input") {
        CHECK_THROWS_WITH(terzo::parse_ratio("3/0", pos), "t.scl:3:2: error: denominator is zero in \"3/0\"");
        CHECK_THROWS_WITH(terzo::parse_ratio("3/x", pos),
                          "t.scl:3:2: error: expected a ratio p/q or an integer, found \"3/x\"");
        CHECK_THROWS_WITH(terzo::parse_ratio("/4", pos), "t.scl:3:2: error: expected a numerator in \"/4\"");
        CHECK_THROWS_WITH(terzo::parse_ratio("4/", pos), "t.scl:3:2: error: expected a denominator in \"4/\"");
        CHECK_THROWS_WITH(terzo::parse_ratio("3/2/1", pos),
                          "t.scl:3:2: error: expected a ratio p/q or an integer, found \"3/2/1\"");
        CHECK_THROWS_WITH(terzo::parse_ratio("99999999999999999999/1", pos),
                          Catch::Contains("number too large in \"99999999999999999999/1\""));
        CHECK_THROWS_WITH(terzo::parse_ratio("9223372036854775808", pos),
                          Catch::Contains("number too large"));
        CHECK(terzo::parse_ratio("9223372036854775807", pos) == Ratio(INT64_MAX));
    }
}
