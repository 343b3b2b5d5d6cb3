#include <catch2/catch.hpp>

#include <algorithm>
#include <string>
#include <vector>

#include "core/analysis/candidates.hpp"
#include "tests/support/scales.hpp"

using namespace terzo;

namespace {

std::vector<Pitch> pitches(const std::string& spec, const Pitch& period = Pitch::from_ratio(Ratio(2))) {
    return candidate_pitches(parse_candidate_spec(spec, {"--candidates"}), period, {"--candidates"});
}

std::vector<std::string> texts(const std::vector<Pitch>& ps) {
    std::vector<std::string> out;
    for (const Pitch& p : ps) out.push_back(p.is_exact() ? p.str() : std::to_string(p.cents()));
    return out;
}

bool contains(const std::vector<Pitch>& ps, const Ratio& r) {
    return std::any_of(ps.begin(), ps.end(), [&](const Pitch& p) { return p == Pitch::from_ratio(r); });
}

} // namespace

TEST_CASE("odd:15 gives the 48 ratios of the 15-odd-limit inside the octave", "[candidates]") {
    // Python's fractions module: {2^k a/b : a, b odd <= 15, coprime} inside (1, 2) has 48
    // members (49 with 1/1, the size of the 15-odd-limit tonality diamond, common practice).
    auto c = pitches("odd:15");
    REQUIRE(c.size() == 48);
    CHECK(c.front() == Pitch::from_ratio(Ratio(16, 15)));
    CHECK(c.back() == Pitch::from_ratio(Ratio(15, 8)));
    CHECK(std::is_sorted(c.begin(), c.end(), [](const Pitch& a, const Pitch& b) { return a.cents() < b.cents(); }));
    CHECK(contains(c, Ratio(11, 8)));
    CHECK(contains(c, Ratio(13, 8)));
    CHECK(!contains(c, Ratio(17, 16)));
}

TEST_CASE("odd:9 gives the 18 ratios of the 9-odd-limit inside the octave", "[candidates]") {
    // Python's fractions module, the same enumeration with odd numbers up to 9.
    CHECK(texts(pitches("odd:9")) ==
          std::vector<std::string>{"10/9", "9/8", "8/7", "7/6", "6/5", "5/4", "9/7", "4/3", "7/5",
                                   "10/7", "3/2", "14/9", "8/5", "5/3", "12/7", "7/4", "16/9", "9/5"});
}

TEST_CASE("a prime limit narrows an odd limit", "[candidates]") {
    // Python's fractions module: odd limit 27 and primes up to 11 leave 62 ratios in the octave.
    auto c = pitches("prime:11,odd:27");
    CHECK(c.size() == 62);
    CHECK(contains(c, Ratio(11, 8)));
    CHECK(contains(c, Ratio(27, 16)));
    CHECK(contains(c, Ratio(25, 16)));
    CHECK(!contains(c, Ratio(13, 8)));
    CHECK(!contains(c, Ratio(17, 16)));
}

TEST_CASE("a non-octave period takes every power of two that fits inside it", "[candidates]") {
    // Python's fractions module: 2^k a/b with a, b odd <= 5 inside (1, 3).
    CHECK(texts(pitches("odd:5", Pitch::from_ratio(Ratio(3)))) ==
          std::vector<std::string>{"6/5", "5/4", "4/3", "3/2", "8/5", "5/3", "2/1", "12/5", "5/2", "8/3"});
}

TEST_CASE("edo:N gives the exact steps of the octave's equal division", "[candidates]") {
    auto c = pitches("edo:12");
    REQUIRE(c.size() == 11);
    CHECK(c[5] == Pitch::from_vector(PrimeVector::prime_power(2, Ratio(1, 2))));
    CHECK(c[5].is_exact());
    CHECK(c[0].cents() == Approx(100.0).margin(1e-9));
    SECTION("steps shared by two divisions are given once") {
        CHECK(pitches("edo:12,edo:24").size() == 23);
    }
    SECTION("a tritave period holds the steps up to it") {
        // 3/1 is 1901.955 c: steps 1..19 of 12 (1900 c) lie inside it, 2/1 among them.
        auto t = pitches("edo:12", Pitch::from_ratio(Ratio(3)));
        CHECK(t.size() == 19);
        CHECK(contains(t, Ratio(2)));
    }
}

TEST_CASE("explicit ratios and cents are reduced into the period", "[candidates]") {
    auto c = pitches("9/4, 350.0,7/4,7/4,2/1,3");
    // 9/4 -> 9/8, 3 -> 3/2, 2/1 is the unison of the next period and is dropped, 7/4 once.
    REQUIRE(c.size() == 4);
    CHECK(c[0] == Pitch::from_ratio(Ratio(9, 8)));
    CHECK(!c[1].is_exact());
    CHECK(c[1].cents() == 350.0);
    CHECK(c[2] == Pitch::from_ratio(Ratio(3, 2)));
    CHECK(c[3] == Pitch::from_ratio(Ratio(7, 4)));
    CHECK(pitches("-100.0")[0].cents() == Approx(1100.0).margin(1e-9));
    CHECK(pitches("odd:7,7/4").size() == pitches("odd:7").size());
}

TEST_CASE("candidates already in the scale are skipped", "[candidates]") {
    SECTION("exactly equal, also written another way") {
        Keyboard kb(test::ratio_scale({{9, 8}, {5, 4}, {3, 2}}));
        auto c = new_candidates(kb, pitches("9/8,18/16,4/3,5/4,11/8"));
        CHECK(texts(c) == std::vector<std::string>{"4/3", "11/8"});
    }
    SECTION("a tempered step equal to a just degree is exact: 2^(12/12) is the period") {
        Keyboard kb(test::equal_division(12));
        CHECK(new_candidates(kb, pitches("edo:24")).size() == 12);
    }
    SECTION("within 0.5 c of a cents-only degree") {
        Keyboard kb(test::equal_division_cents(12));
        auto c = new_candidates(kb, pitches("400.4,400.6,699.6,1199.7,0.3"));
        CHECK(texts(c) == std::vector<std::string>{"400.600000"});
    }
    SECTION("a just ratio close to an exact tempered degree is not the same note") {
        Keyboard kb(test::equal_division(12));
        CHECK(new_candidates(kb, pitches("3/2")).size() == 1);
    }
}

TEST_CASE("a bad candidate list is rejected with its place and the rule", "[candidates]") {
    auto bad = [](const std::string& spec) { return parse_candidate_spec(spec, {"--candidates", 0, 0}); };
    CHECK_THROWS_WITH(bad(""), "--candidates: error: no candidates given; give odd:N, prime:N with odd:N, edo:N, ratios or cents separated by commas, such as odd:15 or 7/4,11/8");
    CHECK_THROWS_WITH(bad("odd:15,,7/4"), "--candidates: error: empty candidate in \"odd:15,,7/4\" (give items separated by commas)");
    CHECK_THROWS_WITH(bad("odd:x"), "--candidates: error: expected a whole number after \"odd:\" in \"odd:x\"");
    CHECK_THROWS_WITH(bad("odd:257"), "--candidates: error: odd value in \"odd:257\" is outside the allowed range 1 to 255");
    CHECK_THROWS_WITH(bad("odd:0"), "--candidates: error: odd value in \"odd:0\" is outside the allowed range 1 to 255");
    CHECK_THROWS_WITH(bad("odd:3,odd:5"), "--candidates: error: odd:N is given twice");
    CHECK_THROWS_WITH(bad("prime:9,odd:9"), "--candidates: error: prime limit 9 is not a prime number");
    CHECK_THROWS_WITH(bad("prime:7"), "--candidates: error: prime:7 needs an odd limit as well, such as prime:11,odd:27");
    CHECK_THROWS_WITH(bad("edo:0"), "--candidates: error: edo value in \"edo:0\" is outside the allowed range 1 to 1200");
    CHECK_THROWS_WITH(bad("limit:5"), "--candidates: error: unknown candidate kind \"limit\"; use odd:N, prime:N, edo:N, ratios or cents");
    CHECK_THROWS_WITH(bad("3/0"), "--candidates: error: denominator is zero in \"3/0\"");
    CHECK_THROWS_WITH(bad("-3/2"), "--candidates: error: candidate ratio \"-3/2\" is not positive");
    CHECK_THROWS_WITH(bad("99999999999999999999/2"), "--candidates: error: number too large in \"99999999999999999999/2\" (numerators and denominators are limited to 9223372036854775807)");
    CHECK_THROWS_WITH(bad("0/5"), "--candidates: error: candidate ratio \"0/5\" is not positive");
    CHECK_THROWS_WITH(bad("1.2.3"), "--candidates: error: candidate \"1.2.3\" is not a ratio p/q, a cents value such as 350.0, or odd:N, prime:N, edo:N");
    CHECK_THROWS_WITH(bad("."), "--candidates: error: candidate \".\" is not a ratio p/q, a cents value such as 350.0, or odd:N, prime:N, edo:N");
    CHECK_THROWS_WITH(bad("200000.0"), "--candidates: error: cents value \"200000.0\" is outside the allowed range -100000 to 100000");
    SECTION("columns count from the option's text when it has one") {
        CHECK_THROWS_WITH(parse_candidate_spec("7/4, foo", {"x", 1, 1}), "x:1:6: error: candidate \"foo\" is not a ratio p/q, a cents value such as 350.0, or odd:N, prime:N, edo:N");
    }
    SECTION("too many pitches") {
        CHECK_THROWS_WITH(pitches("edo:1200", Pitch::from_ratio(Ratio(1 << 30))),
                          "--candidates: error: the candidates would be more than 20000 pitches in one period; choose lower limits or fewer divisions");
    }
}
