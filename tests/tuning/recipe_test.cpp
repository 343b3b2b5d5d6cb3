#include <catch2/catch.hpp>

#include <string>

#include "core/tuning/scl.hpp"
#include "core/tuning/recipe.hpp"
#include "core/tuning/temperament.hpp"

using namespace terzo;

namespace {

Pitch ratio(std::int64_t n, std::int64_t d = 1) {
    return Pitch::from_ratio(Ratio(n, d));
}

std::string error_of(const std::string& recipe) {
    try {
        build_recipe(recipe);
    } catch (const InputError& e) {
        return e.what();
    }
    return "(no error)";
}

} // namespace

TEST_CASE("a recipe's first word says what it builds", "[recipe]") {
    CHECK(starts_like_recipe("equal 12"));
    CHECK(starts_like_recipe("  fifths: 0"));
    CHECK(starts_like_recipe("list|mode"));
    CHECK_FALSE(starts_like_recipe("tunings/werckmeister.scl"));
    CHECK_FALSE(starts_like_recipe("equality"));
    CHECK_FALSE(starts_like_recipe(""));
}

TEST_CASE("interval expressions are exact products of rational powers", "[recipe]") {
    // 3/2 narrowed by a quarter syntonic comma is 5^(1/4) (docs/references.md 2.2).
    Scale s = build_recipe("list 3/2*S^(-1/4) (3/2)^2/2 2^(7/12) 9/8*81/80/S 2");
    REQUIRE(s.size() == 5);
    CHECK(*s.degree(1).vector() == PrimeVector::prime_power(5, Ratio(1, 4)));
    CHECK(exactly_equal(s.degree(2), ratio(9, 8)) == true);
    CHECK(s.degree(3).str() == "2^(7/12)");
    CHECK(exactly_equal(s.degree(4), ratio(9, 8)) == true);
    CHECK(s.is_exact());
    // P, S and s are the three commas of docs/references.md section 1.
    Scale commas = build_recipe("list P S s P/S 2");
    CHECK(*commas.degree(1).ratio() == Ratio(531441, 524288));
    CHECK(*commas.degree(2).ratio() == Ratio(81, 80));
    CHECK(*commas.degree(3).ratio() == Ratio(32805, 32768));
    CHECK(*commas.degree(4).ratio() == Ratio(32805, 32768));
    // Cents make a degree cents-only; mixing keeps the sum in cents.
    Scale c = build_recipe("list 701.955c 100c*3/2 2");
    CHECK(c.degree(1).kind() == Pitch::Kind::cents_only);
    CHECK(c.degree(1).cents() == 701.955);
    CHECK(c.degree(2).cents() == Approx(801.955001).margin(1e-6));
}

TEST_CASE("a list keeps its order and ends with the period", "[recipe]") {
    Scale s = build_recipe("list 9/8 5/4 4/3 3/2 5/3 15/8 2");
    CHECK(s.size() == 7);
    CHECK(*s.degree(6).ratio() == Ratio(15, 8));
    CHECK(*s.period().ratio() == Ratio(2));
    CHECK(s.description() == "list of 7 pitches");
    Scale unsorted = build_recipe("list 3/2 9/8 3/1");
    CHECK(*unsorted.degree(1).ratio() == Ratio(3, 2));
    CHECK(*unsorted.period().ratio() == Ratio(3));
}

TEST_CASE("a generator chain is period-reduced and sorted", "[recipe]") {
    Scale s = build_recipe("chain 3/2 up 4");
    // Pythagorean pentatonic: 1/1 9/8 81/64 3/2 27/16 (common practice, no source).
    REQUIRE(s.size() == 5);
    CHECK(*s.degree(1).ratio() == Ratio(9, 8));
    CHECK(*s.degree(2).ratio() == Ratio(81, 64));
    CHECK(*s.degree(3).ratio() == Ratio(3, 2));
    CHECK(*s.degree(4).ratio() == Ratio(27, 16));
    CHECK(s.description() == "chain of 3/2: 4 up, 0 down, period 2/1");
    // Options come in any order; a tritave period.
    Scale bp = build_recipe("chain 9/7 period 3 down 1 up 2");
    REQUIRE(bp.size() == 4);
    CHECK(*bp.degree(1).ratio() == Ratio(9, 7));
    CHECK(*bp.degree(2).ratio() == Ratio(81, 49));
    CHECK(*bp.degree(3).ratio() == Ratio(7, 3));
    // A generator that divides the period evenly repeats notes; each is kept once.
    CHECK(build_recipe("chain 2^(1/4) up 9").size() == 4);
    // Forty fifths pass 64 bits and stay exact (3^40 > 2^63).
    Scale big = build_recipe("chain 3/2 up 40");
    CHECK(big.size() == 41);
    CHECK(big.is_rational());
}

TEST_CASE("a long chain of fifths agrees with Python's fractions module", "[recipe]") {
    // Recomputed with fractions.Fraction: (3/2)^k for k = -50..100, octave-reduced, sorted.
    Scale s = build_recipe("chain 3/2 up 100 down 50");
    REQUIRE(s.size() == 151);
    CHECK(s.degree(75).ratio()->str() == "515377520732011331036461129765621272702107522001/"
                                         "365375409332725729550921208179070754913983135744");
    CHECK(s.degree(150).ratio()->str() == "706965049015104706497203195837614914543357369/"
                                          "356811923176489970264571492362373784095686656");
}

TEST_CASE("a meantone recipe chooses its chain's first note and length", "[recipe]") {
    Scale s = build_recipe("meantone 1/4 from Ab");
    CHECK(s.description() == "1/4-comma meantone, 12 notes from Ab to C#");
    // Ab is 4 fifths below C: (5^(1/4))^(-4) = 1/5, 8/5 after three octaves (772.627 c is the
    // G# of the chain from Eb, 25/16; the chain from Ab has the 8/5 instead).
    CHECK(exactly_equal(s.degree(8), ratio(8, 5)) == true);
    Scale n19 = build_recipe("meantone 1/3 from Gb notes 19");
    CHECK(n19.size() == 19);
    CHECK(n19.description() == "1/3-comma meantone, 19 notes from Gb to B#");
    CHECK(build_recipe("meantone 0").description() == "0-comma meantone, 12 notes from Eb to G#");
    Scale wide = build_recipe("meantone -1/11");
    CHECK(wide.degree(7).cents() == Approx(701.955001 + 21.506290 / 11).margin(1e-6));
}

TEST_CASE("modifiers apply left to right after a bar", "[recipe]") {
    Scale s = build_recipe("list 9/8 5/4 4/3 3/2 5/3 15/8 2 | mode 1 | subset 0 2 4");
    REQUIRE(s.size() == 3);
    CHECK(*s.degree(1).ratio() == Ratio(32, 27)); // (4/3)/(9/8)
    CHECK(*s.degree(2).ratio() == Ratio(40, 27)); // (5/3)/(9/8)
    CHECK(s.description() == "list of 7 pitches | mode 1 | subset 0 2 4");
}

TEST_CASE("recipes reject bad input with the column of the mistake", "[recipe]") {
    SECTION("the recipe as a whole") {
        CHECK(error_of("") ==
              "recipe:1:1: error: empty recipe; start with one of equal, chain, meantone, "
              "fifths, harmonics, subharmonics, diamond, products, list");
        CHECK(error_of("scale 12") ==
              "recipe:1:1: error: unknown recipe kind \"scale\"; a recipe starts with "
              "one of equal, chain, meantone, fifths, harmonics, subharmonics, diamond, "
              "products, list");
        CHECK(error_of("mode 2") ==
              "recipe:1:1: error: \"mode\" changes a tuning and comes after one and "
              "'|', as in \"equal 12 | mode ...\"");
        CHECK(error_of("equal 12 |") ==
              "recipe:1:11: error: expected a modifier after '|': mode, transpose, "
              "stretch or subset");
        CHECK(error_of("equal 12 | | mode 1") ==
              "recipe:1:12: error: expected a recipe before '|'");
        CHECK(error_of("equal 12 | equal 5") ==
              "recipe:1:12: error: only one tuning per recipe; after '|' "
              "comes a modifier: mode, transpose, stretch or subset");
        CHECK(error_of("equal 12 | flip") ==
              "recipe:1:12: error: unknown modifier \"flip\"; after '|' comes "
              "mode, transpose, stretch or subset");
        CHECK(error_of("equal\t12\x01") ==
              "recipe:1:9: error: control character in the recipe; a recipe is "
              "one line of text");
        CHECK(error_of(std::string(max_recipe_length + 1, ' ')) ==
              "recipe:1:10001: error: the recipe is longer than 10000 characters");
    }
    SECTION("intervals") {
        CHECK(error_of("list 3/0 2") ==
              "recipe:1:8: error: 0 is not an interval; a ratio must be positive");
        CHECK(error_of("list 701.9 2") ==
              "recipe:1:6: error: a number with a decimal point is cents and "
              "ends in c, as in 701.9c");
        CHECK(error_of("list 3/2x 2") ==
              "recipe:1:9: error: unexpected \"x\" in the interval \"3/2x\"");
        CHECK(error_of("list (3/2 2") ==
              "recipe:1:10: error: expected ')' to close the '(' at column 6");
        CHECK(error_of("list 2^-1 2") ==
              "recipe:1:8: error: put a negative or fractional exponent in "
              "parentheses, as in ^(-1/4)");
        CHECK(error_of("list 2^(1/0) 2") ==
              "recipe:1:11: error: the exponent's denominator is zero");
        CHECK(error_of("list 2^(1/10001) 2") ==
              "recipe:1:11: error: the exponent's denominator is larger than 10000");
        CHECK(error_of("list 2^10001 2") == "recipe:1:8: error: the exponent is larger than 10000");
        CHECK(error_of("list 2 x") ==
              "recipe:1:8: error: unexpected \"x\" in the interval \"x\"; intervals "
              "are written like 3/2, 2^(1/31), (3/2)*S^(-1/4) or 700c");
        CHECK(error_of("list 1234567890123456789 2") ==
              "recipe:1:6: error: the number \"1234567890123456789\" "
              "is too large (at most 18 digits)");
        CHECK(error_of("list 2^10000 2") ==
              "recipe:1:6: error: the interval \"2^10000\" is out of range (at "
              "most 10000000 cents in size)");
        CHECK(error_of("list 20000000c 2") ==
              "recipe:1:6: error: cents value \"20000000\" is out of range (at "
              "most 10000000)");
        CHECK(error_of("list 2 1/2") ==
              "recipe:1:8: error: the period (the last pitch, \"1/2\") must be larger "
              "than 1/1");
        CHECK(error_of("list") ==
              "recipe:1:5: error: expected the degrees above 1/1 and last the period");
        CHECK(error_of("list " + std::string(51, '(') + "2" + std::string(51, ')') + " 2") ==
              "recipe:1:56: error: parentheses nested more than 50 deep");
        CHECK(build_recipe("list " + std::string(50, '(') + "2" + std::string(50, ')') + " 4")
                  .size() == 2);
    }
    SECTION("equal divisions and chains") {
        CHECK(error_of("equal") == "recipe:1:6: error: expected the number of steps here");
        CHECK(error_of("equal twelve") ==
              "recipe:1:7: error: expected the number of steps (a whole number), "
              "found \"twelve\"");
        CHECK(error_of("equal 0") == "recipe:1:7: error: the number of steps 0 is smaller than 1");
        CHECK(error_of("equal 4097") ==
              "recipe:1:7: error: the number of steps 4097 is larger than 4096");
        CHECK(error_of("equal 12 of 1/1") ==
              "recipe:1:13: error: the interval to divide \"1/1\" must be larger "
              "than 1/1");
        CHECK(error_of("equal 12 by 3") ==
              "recipe:1:10: error: unexpected \"by\"; the form is: equal STEPS "
              "[of INTERVAL]");
        CHECK(error_of("chain 1/1 up 3") == "recipe:1:7: error: the generator must not be 1/1");
        CHECK(error_of("chain 3/2 up 3 up 4") == "recipe:1:16: error: \"up\" is given twice");
        CHECK(error_of("chain 3/2 sideways 3") ==
              "recipe:1:11: error: unexpected \"sideways\"; the form is: "
              "chain GENERATOR [up K] [down M] [period INTERVAL]");
        CHECK(error_of("chain 3/2 up 4000 down 96") ==
              "recipe:1:7: error: the chain has 4097 notes, more "
              "than 4096");
        CHECK(error_of("chain 3/2 up 4096") ==
              "recipe:1:14: error: the number of generators up 4096 is larger "
              "than 4095");
        CHECK(error_of("chain 3/2 up") ==
              "recipe:1:13: error: expected the number of generators up here");
    }
    SECTION("meantones") {
        CHECK(error_of("meantone quarter") ==
              "recipe:1:10: error: expected the fraction of the syntonic comma "
              "such as 1/4 or 2/7, found \"quarter\"");
        CHECK(error_of("meantone 1/0") == "recipe:1:12: error: the denominator is zero in \"1/0\"");
        CHECK(error_of("meantone 1/4 from H") ==
              "recipe:1:19: error: expected a note letter A to G in \"H\"");
        CHECK(error_of("meantone 1/4 from G#") ==
              "recipe:1:19: error: a chain of 12 fifths from G# does not "
              "contain C, which is 1/1; start on C or at most 11 fifths "
              "below it");
        CHECK(error_of("meantone 1/4 notes 5000") ==
              "recipe:1:20: error: the number of notes 5000 is larger "
              "than 4096");
        CHECK(error_of("meantone 1/4 with Eb") ==
              "recipe:1:14: error: unexpected \"with\"; the form is: "
              "meantone FRACTION [from NOTE] [notes N]");
    }
    SECTION("fifth circles") {
        const std::string eleven = "fifths: 0 0 0 0 0 0 0 0 0 0 0";
        CHECK(error_of(eleven) == "recipe:1:30: error: expected 12 fifths after ':', found 11");
        CHECK(error_of(eleven + " 0 0") == "recipe:1:33: error: more than 12 fifths after ':'");
        CHECK(error_of("fifths from C -P/4") ==
              "recipe:1:15: error: expected ':' before the twelve fifths; "
              "the form is: fifths [from NOTE]: T1 T2 ... T12");
        CHECK(error_of("fifths: P/4 0 0 0 0 0 0 0 0 0 0 0") ==
              "recipe:1:9: error: write each tempering with its sign: -P/4 narrows a fifth by a "
              "quarter "
              "Pythagorean comma, +P/4 widens it, 0 leaves it pure; found \"P/4\"");
        CHECK(error_of("fifths: -Q/4 0 0 0 0 0 0 0 0 0 0 0") ==
              "recipe:1:10: error: expected a comma after the fraction: P (Pythagorean), S "
              "(syntonic), s "
              "(schisma) or a ratio in parentheses; found \"Q/4\"");
        CHECK(error_of("fifths: -P/0 0 0 0 0 0 0 0 0 0 0 0") ==
              "recipe:1:12: error: the divisor is zero");
        CHECK(error_of("fifths: -(2c) 0 0 0 0 0 0 0 0 0 0 0") ==
              "recipe:1:11: error: a fifth's tempering must be exact: write it with P, S, s or a "
              "ratio, not "
              "in cents");
        CHECK(error_of("fifths: wolf wolf 0 0 0 0 0 0 0 0 0 0") ==
              "recipe:1:14: error: only one fifth can be the wolf");
        CHECK(error_of("fifths from X: 0") ==
              "recipe:1:13: error: expected a note letter A to G in \"X\"");
    }
    SECTION("just constructions") {
        CHECK(error_of("harmonics 16 8") ==
              "recipe:1:14: error: the highest harmonic number must be larger "
              "than the lowest");
        CHECK(error_of("harmonics 0 8") ==
              "recipe:1:11: error: the lowest harmonic number 0 is smaller than 1");
        CHECK(error_of("harmonics 1 5000") ==
              "recipe:1:13: error: harmonics 1 to 5000 make 4999 degrees, more "
              "than 4096");
        CHECK(error_of("harmonics 1 2000000") ==
              "recipe:1:13: error: the highest harmonic number 2000000 is "
              "larger than 1000000");
        CHECK(error_of("harmonics 8 16 32") ==
              "recipe:1:16: error: unexpected \"32\"; the form is: harmonics "
              "LOW HIGH");
        CHECK(error_of("diamond 1 3 6") ==
              "recipe:1:13: error: the tonality diamond is built from odd "
              "numbers; 6 is even (octaves are already included)");
        CHECK(error_of("diamond 1 3 3") == "recipe:1:13: error: 3 is listed twice");
        CHECK(error_of("diamond") == "recipe:1:8: error: expected an odd numbers here");
        CHECK(error_of("products 2 1 3 5") ==
              "recipe:1:12: error: expected \"of\"; the form is: products K of "
              "N1 N2 ...");
        CHECK(error_of("products 5 of 1 3 5") ==
              "recipe:1:10: error: cannot choose 5 factors from 3");
        std::string many = "products 8 of";
        for (int i = 1; i <= 20; ++i)
            many += " " + std::to_string(i);
        CHECK(error_of(many) ==
              "recipe:1:10: error: choosing 8 of 20 factors makes more than 4096 products");
        std::string too_many = "diamond";
        for (int i = 0; i < 65; ++i)
            too_many += " " + std::to_string(2 * i + 1);
        CHECK(error_of(too_many).find("error: more than 64 numbers") != std::string::npos);
    }
    SECTION("modifiers") {
        CHECK(error_of("equal 12 | mode 12") ==
              "recipe:1:17: error: degree 12 is out of range: the scale has "
              "degrees 0 to 11");
        CHECK(error_of("equal 12 | mode") ==
              "recipe:1:16: error: expected the degree the mode starts on here");
        CHECK(error_of("equal 12 | mode 1 2") ==
              "recipe:1:19: error: unexpected \"2\"; the form is: mode DEGREE");
        CHECK(error_of("equal 7 | transpose F") ==
              "recipe:1:21: error: transposing to a note name needs a "
              "12-note scale, and this one has 7 degrees; give a number "
              "of degrees");
        CHECK(error_of("equal 7 | transpose 7") ==
              "recipe:1:21: error: transposing by 7 degrees is out of "
              "range: the scale has degrees 0 to 6");
        CHECK(error_of("equal 12 | subset 0 4 2") ==
              "recipe:1:23: error: list the degrees in rising order, "
              "each once");
        CHECK(error_of("equal 12 | subset 0 12") ==
              "recipe:1:21: error: degree 12 is out of range: the scale "
              "has degrees 0 to 11");
        CHECK(error_of("equal 12 | stretch 1/2") ==
              "recipe:1:20: error: the new period \"1/2\" must be larger "
              "than 1/1");
    }
}

TEST_CASE("a recipe's tuning survives a round trip through .scl", "[recipe]") {
    for (const char* r : {"meantone 1/4", "equal 13 of 3", "diamond 1 3 5 7",
                          "fifths from C: -S/4 -S/4 -S/4 "
                          "-S/4 0 0 -s 0 0 0 0 0"}) {
        INFO(r);
        Scale s = build_recipe(r);
        std::stringstream text;
        write_scl(text, s, "x.scl");
        Scale back = read_scl(text, "x.scl");
        REQUIRE(back.size() == s.size());
        for (std::size_t i = 0; i < s.size(); ++i) {
            if (s.degree(i).is_rational())
                CHECK(back.degree(i) == s.degree(i));
            else
                CHECK(back.degree(i).cents() == s.degree(i).cents());
        }
    }
}
