#include <catch2/catch.hpp>

#include <cstdlib>

#include <sstream>

#include "core/tuning/scl.hpp"

using namespace terzo;

namespace {
Scale read(const std::string& text) {
    std::istringstream in(text);
    return read_scl(in, "t.scl");
}
std::string write(const Scale& s) {
    std::ostringstream out;
    write_scl(out, s, "t.scl");
    return out.str();
}
} // namespace

// The example file and the expected values are docs/references.md section 7 ("an invented
// scenario"; the format rules there are from memory [M], checked with a separate parser).
const char* workshop_bells = "! workshop-bells.scl\n"
                             "!\n"
                             "Eight handbells for an invented workshop test: ratios, cents, an integer\n"
                             " 8\n"
                             "!\n"
                             " 16/15        small semitone\n"
                             " 9/8\n"
                             " 6/5\n"
                             " 386.3137     just major third typed in cents\n"
                             " 4/3\n"
                             " 700.         tempered fifth, trailing dot\n"
                             " 27/16\n"
                             " 2\n";

TEST_CASE("a .scl file with ratios, cents, labels and comments is read", "[scl]") {
    Scale s = read(workshop_bells);
    CHECK(s.description() == "Eight handbells for an invented workshop test: ratios, cents, an integer");
    REQUIRE(s.size() == 8);
    CHECK(*s.degree(0).ratio() == Ratio(1));
    CHECK(*s.degree(1).ratio() == Ratio(16, 15));
    CHECK(s.degree(1).cents() == Approx(111.731285).margin(1e-6));
    CHECK(s.degree(3).cents() == Approx(315.641287).margin(1e-6));
    CHECK_FALSE(s.degree(4).is_exact());
    CHECK(s.degree(4).cents() == 386.3137);
    CHECK(s.degree(6).cents() == 700.0);
    CHECK(s.degree(7).cents() == Approx(905.865003).margin(1e-6));
    CHECK(*s.period().ratio() == Ratio(2));
}

TEST_CASE("the edge cases of the format are read as the format says", "[scl]") {
    // docs/references.md section 7, edge-cases.scl: empty description, negative cents, integer ratio.
    Scale s = read("! edge-cases.scl\n!\n\n   3\n-5.0\n3\n 81/80 !trailing text after the value is ignored\n");
    CHECK(s.description().empty());
    REQUIRE(s.size() == 3);
    CHECK(s.degree(1).cents() == -5.0);
    CHECK(s.degree(2).cents() == Approx(1901.955001).margin(1e-6));
    CHECK(*s.period().ratio() == Ratio(81, 80));
}

TEST_CASE("CRLF line ends, a byte-order mark and trailing blank lines are accepted", "[scl]") {
    Scale s = read("\xEF\xBB\xBF! bom.scl\r\nwith CRLF\r\n2\r\n3/2\r\n2/1\r\n\r\n\n");
    CHECK(s.description() == "with CRLF");
    CHECK(s.size() == 2);
    CHECK(*s.degree(1).ratio() == Ratio(3, 2));
}

TEST_CASE("malformed .scl input is rejected with the file, line and rule", "[scl]") {
    SECTION("empty file") { CHECK_THROWS_WITH(read(""), "t.scl: error: empty file; expected a description line"); }
    SECTION("only comments") {
        CHECK_THROWS_WITH(read("! a\n! b\n"), "t.scl:2: error: only comments; expected a description line");
    }
    SECTION("missing count") {
        CHECK_THROWS_WITH(read("! c\ndescription only\n"),
                          "t.scl:2: error: missing the note count after the description on line 2");
    }
    SECTION("count that is not a number") {
        CHECK_THROWS_WITH(read("d\n twelve\n"),
                          "t.scl:2:2: error: expected the note count (a whole number), found \"twelve\"");
    }
    SECTION("negative count") {
        CHECK_THROWS_WITH(read("d\n-3\n"),
                          "t.scl:2:1: error: expected the note count (a whole number), found \"-3\"");
    }
    SECTION("count too large") {
        CHECK_THROWS_WITH(read("d\n99999999999999999999999\n"),
                          "t.scl:2:1: error: note count 99999999999999999999999 is larger than 4096, "
                          "the largest scale terzo accepts");
    }
    SECTION("zero count") {
        CHECK_THROWS_WITH(read("d\n0\n"), "t.scl:2:1: error: note count is 0; a scale needs at least its period");
    }
    SECTION("fewer pitches than counted") {
        CHECK_THROWS_WITH(read("d\n3\n9/8\n2/1\n"),
                          "t.scl:4: error: the count on line 2 says 3 pitches, but the file has 2");
    }
    SECTION("more pitches than counted") {
        CHECK_THROWS_WITH(read("d\n2\n9/8\n2/1\n 3/1\n"),
                          "t.scl:5:2: error: more pitches than the count of 2 on line 2");
    }
    SECTION("zero ratio") {
        CHECK_THROWS_WITH(read("d\n2\n0/5\n2/1\n"),
                          "t.scl:3:1: error: ratio is zero in \"0/5\"; a pitch ratio must be positive");
    }
    SECTION("negative ratio") {
        CHECK_THROWS_WITH(read("d\n2\n  -3/2\n2/1\n"),
                          "t.scl:3:3: error: ratio is negative in \"-3/2\"; a pitch ratio must be positive");
    }
    SECTION("zero denominator") {
        CHECK_THROWS_WITH(read("d\n2\n3/0\n2/1\n"), "t.scl:3:1: error: denominator is zero in \"3/0\"");
    }
    SECTION("ratio too large") {
        CHECK_THROWS_WITH(read("d\n2\n" + std::string(1000, '7') + "/1\n2/1\n"),
                          Catch::StartsWith("t.scl:3:1: error: number too large in"));
    }
    SECTION("non-numeric pitch") {
        CHECK_THROWS_WITH(read("d\n2\nfifth\n2/1\n"),
                          "t.scl:3:1: error: expected a ratio p/q or an integer, found \"fifth\"");
    }
    SECTION("malformed cents") {
        CHECK_THROWS_WITH(read("d\n2\n1.2.3\n2/1\n"),
                          "t.scl:3:1: error: expected cents such as 701.955, found \"1.2.3\"");
        CHECK_THROWS_WITH(read("d\n2\n7e2.\n2/1\n"),
                          "t.scl:3:1: error: expected cents such as 701.955, found \"7e2.\"");
        CHECK_THROWS_WITH(read("d\n2\nnan.\n2/1\n"),
                          "t.scl:3:1: error: expected cents such as 701.955, found \"nan.\"");
    }
    SECTION("cents that are not finite") {
        CHECK_THROWS_WITH(read("d\n2\n" + std::string(400, '9') + ".0\n2/1\n"),
                          Catch::Contains("is out of range (at most 10000000 in size)"));
    }
    SECTION("empty pitch line") {
        CHECK_THROWS_WITH(read("d\n2\n\n2/1\n"), "t.scl:3:1: error: expected pitch 1 of 2, found an empty line");
    }
    SECTION("period not above the unison") {
        CHECK_THROWS_WITH(read("d\n2\n9/8\n1/2\n"),
                          "t.scl:4: error: the period (the last pitch, 1/2) must be larger than 1/1");
    }
    SECTION("binary data") {
        CHECK_THROWS_WITH(read(std::string("d\n2\n9/8\0\x01\x02\n2/1\n", 13)),
                          "t.scl:3: error: contains a NUL byte; a .scl file is plain text");
    }
}

TEST_CASE("a missing file is reported by name", "[scl]") {
    CHECK_THROWS_WITH(read_scl_file("/nonexistent/x.scl"),
                      "/nonexistent/x.scl: error: cannot open the file for reading");
    CHECK_THROWS_WITH(read_scl_file("/tmp"), "/tmp: error: is a folder, not a .scl file");
}

TEST_CASE("reading, writing and reading again gives the same degrees exactly", "[scl]") {
    Scale first = read(workshop_bells);
    Scale second = read(write(first));
    CHECK(second == first);
    // Cents keep every digit that distinguishes the double, and at least six decimals.
    Scale odd("odd cents", {Pitch::from_cents(386.3137138648348), Pitch::from_cents(-0.1)},
              Pitch::from_cents(1200.0));
    std::string text = write(odd);
    CHECK(text.find(" 386.3137138648348\n") != std::string::npos);
    CHECK(text.find(" -0.100000\n") != std::string::npos);
    CHECK(text.find(" 1200.000000\n") != std::string::npos);
    CHECK(read(text) == odd);
}

TEST_CASE("the writer follows the format's conventions", "[scl]") {
    Scale s("just fifth", {Pitch::from_ratio(Ratio(3, 2))}, Pitch::from_ratio(Ratio(2)));
    CHECK(write(s) == "! t.scl\n!\njust fifth\n 2\n!\n 3/2\n 2/1\n");
    CHECK(scl_cents_text(700.0) == "700.000000");
    CHECK(scl_cents_text(0.5) == "0.500000");
}

TEST_CASE("cents far below a millionth and far above a million are written so that they read back the same", "[scl]") {
    // Found by fuzzing: a degree of -3e-77 cents needs 80 characters in fixed point, more than
    // the writer's buffer held. The extremes of a double are written exactly too (their
    // shortest round-trip text: C++17 std::to_chars).
    for (double c : {-3e-77, 4.9406564584124654e-324, 1.7976931348623157e308, -1e-300}) {
        const std::string text = scl_cents_text(c);
        INFO(text);
        CHECK(std::strtod(text.c_str(), nullptr) == c); // strtod: denormals included
        CHECK(text.find('.') != std::string::npos);
    }
    CHECK(scl_cents_text(-3e-77) == "-0." + std::string(76, '0') + "3");
    // The fuzzer's scale itself, through the writer and the reader.
    Scale tiny("tiny", {Pitch::from_cents(-3e-77), Pitch::from_cents(-0.5)}, Pitch::from_ratio(Ratio(3)));
    CHECK(read(write(tiny)) == tiny);
}

TEST_CASE("a description that starts with '!' survives a round trip", "[scl]") {
    Scale s("!important", {}, Pitch::from_ratio(Ratio(2)));
    CHECK(read(write(s)).description() == "!important");
}
