#include <catch2/catch.hpp>

#include "core/analysis/chord.hpp"
#include "helpers.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;

TEST_CASE("a chord is read from degree numbers or ratios", "[chord]") {
    Keyboard kb(test::just12());
    auto c = parse_chord("0,4,7,12", kb, {"--chord"});
    REQUIRE(c.size() == 4);
    CHECK(c[1].degree == 4);
    CHECK(c[1].ratio() == Ratio(5, 4));
    CHECK(c[3].degree == 0);
    CHECK(c[3].period == 1); // numbers past the last degree continue into the next period
    auto r = parse_chord("1/1, 5/4 ,7/4", kb, {"--chord"});
    CHECK(r[1].on_scale);
    CHECK(r[1].degree == 4);
    CHECK_FALSE(r[2].on_scale); // 7/4 is no note of this scale
    CHECK(r[2].ratio() == Ratio(7, 4));
}

TEST_CASE("a malformed chord is rejected with the rule it broke", "[chord]") {
    Keyboard kb(test::just12());
    auto bad = [&](const char* s) { parse_chord(s, kb, {"--chord"}); };
    REQUIRE_THROWS_WITH(bad("0,,4"), "--chord: error: empty chord note in \"0,,4\" (give degree numbers or ratios separated by commas)");
    REQUIRE_THROWS_WITH(bad("0,x"), "--chord: error: chord note \"x\" is neither a degree number nor a ratio p/q");
    REQUIRE_THROWS_WITH(bad("0,-3/2"), "--chord: error: chord ratio \"-3/2\" is not positive");
    REQUIRE_THROWS_WITH(bad("0,1/0"), "--chord: error: denominator is zero in \"1/0\"");
    REQUIRE_THROWS_WITH(bad("7"), "--chord: error: a chord needs at least two notes, got \"7\"");
    REQUIRE_THROWS_WITH(bad(""), "--chord: error: no chord notes given; give degree numbers or ratios separated by commas, such as 0,4,7");
    REQUIRE_THROWS_WITH(bad("  "), "--chord: error: no chord notes given; give degree numbers or ratios separated by commas, such as 0,4,7");
    REQUIRE_THROWS_WITH(bad("0,200"), "--chord: error: degree 200 is beyond the last allowed degree 144 (12 periods of 12 degrees)");
    std::string many = "0";
    for (int i = 1; i <= 32; ++i) many += "," + std::to_string(i);
    REQUIRE_THROWS_WITH(bad(many.c_str()), "--chord: error: a chord has at most 32 notes");
}

TEST_CASE("a chord's pairs give every pairwise resultant, lower note first", "[chord]") {
    Keyboard kb(test::just12());
    auto pairs = chord_tones(kb, parse_chord("7,0,4", kb, {"--chord"}), {});
    REQUIRE(pairs.size() == 3);
    CHECK(pairs[0].low.degree == 0);
    CHECK(pairs[0].high.degree == 4);
    CHECK(pairs[2].low.degree == 4);
    CHECK(pairs[2].high.degree == 7);
    ToneOptions huge;
    huge.order = 12;
    huge.partials = 32; // 198 terms x 1024 partial pairs: 202752 tones per dyad
    CHECK_NOTHROW(chord_tones(kb, parse_chord("0,4,7", kb, {"--chord"}), huge));
    REQUIRE_THROWS_WITH(chord_tones(kb, parse_chord("0,1,2,3,4,5,6,7,8,9,10,11,12,13,14", kb, {"--chord"}), huge),
                        "--order: error: this request could compute 21288960 tones (105 dyads), more than the limit "
                        "of 20000000; lower --order, --span or --partials");
}

TEST_CASE("the common bass of an exact chord is the gcd of its frequencies", "[chord]") {
    // 4:5:6: the bass is 1/4 of the root, two periods down (common practice).
    Keyboard kb(test::just12());
    CommonBass b = common_bass(kb, parse_chord("0,4,7", kb, {"--chord"}));
    CHECK_FALSE(b.approximate);
    CHECK(b.ratio == Ratio(1, 4));
    CHECK(b.multiples == std::vector<std::string>{"4", "5", "6"});
    CHECK(b.landing.exact);
    CHECK(b.landing.degree == 0);
    CHECK(b.landing.period == -2);
    // 1/1, 9/8, 7/4: gcd(8, 9, 14)/8 = 1/8 (python3: math.gcd, fractions).
    b = common_bass(kb, parse_chord("1/1,9/8,7/4", kb, {"--chord"}));
    CHECK(b.ratio == Ratio(1, 8));
    CHECK(b.multiples == std::vector<std::string>{"8", "9", "14"});
}

TEST_CASE("a tempered chord with rational ratios keeps an exact bass", "[chord]") {
    // E4 and E5 of 12-TET: the bass is E4 itself, 2^(1/3), exactly.
    Keyboard kb(test::equal_division(12), default_ref_hz, 2);
    CommonBass b = common_bass(kb, parse_chord("4,16", kb, {"--chord"}));
    CHECK_FALSE(b.approximate);
    REQUIRE(b.vector);
    CHECK(b.vector->str() == "2^(1/3)");
    CHECK(b.multiples == std::vector<std::string>{"1", "2"});
    CHECK(b.landing.exact);
}

TEST_CASE("an inexact chord gets an approximate bass, labelled so", "[chord]") {
    // 12-TET major triad: as 4:5:6 the notes are off by 0, +13.686 and -1.955 c
    // (docs/references.md section 1); the least-squares bass sits (13.686 - 1.955)/3 = 3.910 c
    // above C2, and the worst note, E, is 13.686 - 3.910 = 9.776 c from its multiple.
    Keyboard kb(test::equal_division(12));
    CommonBass b = common_bass(kb, parse_chord("0,4,7", kb, {"--chord"}));
    CHECK(b.approximate);
    CHECK(b.found);
    CHECK(b.multiples == std::vector<std::string>{"4", "5", "6"});
    CHECK_THAT(b.max_error_cents, WithinAbs(9.776, 1e-3));
    CHECK_THAT(b.cents, WithinAbs(-2400 + 3.910, 1e-3));
    CHECK(b.landing.degree == 0);
    CHECK_FALSE(b.landing.exact);
    SECTION("with a tighter tolerance there is none") {
        CommonBass none = common_bass(kb, parse_chord("0,4,7", kb, {"--chord"}), 1.0);
        CHECK_FALSE(none.found);
    }
}
