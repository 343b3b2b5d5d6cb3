#include <catch2/catch.hpp>

#include <cmath>
#include <sstream>

#include "core/io/frequency_table.hpp"
#include "core/tuning/scl.hpp"
#include "tests/support/scales.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;

namespace {


std::string csv(const KeyMap& map) {
    std::ostringstream out;
    write_csv(out, frequency_table(map));
    return out.str();
}

std::string line(const std::string& text, int n) {
    std::istringstream in(text);
    std::string l;
    for (int i = 0; i <= n; ++i)
        std::getline(in, l);
    if (!l.empty() && l.back() == '\r') l.pop_back(); // CSV rows end in CRLF (RFC 4180)
    return l;
}

} // namespace

TEST_CASE("the frequency table lists every key of a 12-note tuning with names and ratios",
          "[frequency_table]") {
    // A just 12-note scale on C4 = 261.6255653 Hz (12-TET C4 at A4 = 440, docs/references.md 8).
    const KeyMap map(
        test::scl_text("! just\njust "
            "twelve\n12\n16/15\n9/8\n6/5\n5/4\n4/3\n45/32\n3/2\n8/5\n5/3\n9/5\n15/8\n2/1\n"),
        60, {60, 440.0 * std::exp2(-9.0 / 12.0)});
    const std::string text = csv(map);
    CHECK(line(text, 0) == "key,note,degree,period,hz,cents_from_12tet,ratio,mts");
    CHECK(line(text, 128).substr(0, 4) == "127,");
    CHECK(line(text, 129).empty());
    // Key 60 is the reference; key 64 is 5/4: 386.314 cents, -13.686 from 12-TET
    // (docs/references.md 1 and 2.4, computed), 327.031957 Hz, MTS 3F 6E 3E (docs/references.md 6.4 [C]).
    CHECK(line(text, 61) == "60,C4,0,0,261.625565,0.000000,1/1,3C 00 00");
    CHECK(line(text, 65) == "64,E4,4,0,327.031957,-13.686286,5/4,3F 6E 3E");
    // A3 is 5/6: 884.358713 cents (5/3, docs/references.md 1) less 900 is -15.641287; 57 -
    // 0.15641287 semitones = 38 + 13821/16384 -> 38 6B 7D.
    CHECK(line(text, 58) == "57,A3,9,-1,218.021304,-15.641287,5/6,38 6B 7D");
    CHECK(line(text, 1) == "0,C-1,0,-5,8.175799,0.000000,1/32,00 00 00");
}

TEST_CASE("the frequency table of a 7-note scale has no note names and marks unsendable keys",
          "[frequency_table]") {
    const KeyMap map(test::scl_text("!\nseven\n7\n9/8\n5/4\n4/3\n3/2\n5/3\n7/4\n2/1\n"), 60, {60, 264.0});
    const std::string text = csv(map);
    // Key 69 is 5/2 above the reference key 60: 264 * 5/2 = 660 Hz, MTS 4C 02 40
    // (docs/references.md 6.4 [C]); 1200 + 386.313714 (5/4, docs/references.md 1) - 900 cents of 12-TET.
    CHECK(line(text, 70) == "69,,2,1,660.000000,+686.313714,5/2,4C 02 40");
    // Key 0 is 264 * 4/3 / 512 = 0.6875 Hz, below what the MIDI Tuning Standard can send:
    // 498.044999 (4/3, docs/references.md 1) - 9 * 1200 + 6000 cents.
    CHECK(line(text, 1) == "0,,3,-9,0.687500,-4301.955001,1/384,");

    nlohmann::ordered_json j = frequency_table_json(map);
    CHECK(j["size"] == 7);
    CHECK(j["root_key"] == 60);
    CHECK(j["reference"]["note"] == "C4");
    REQUIRE(j["keys"].size() == 128);
    CHECK(j["keys"][69]["note"].is_null());
    CHECK(j["keys"][69]["ratio"] == "5/2");
    CHECK(j["keys"][69]["hz"].get<double>() == 660.0);
    CHECK(j["keys"][69]["mts"] == "4C 02 40");
    CHECK(j["keys"][0]["mts"].is_null());
}

TEST_CASE("cents-only degrees have no exact ratio in the table", "[frequency_table]") {
    const KeyMap map(test::scl_text("!\nfifths\n2\n700.\n2/1\n"), 60, {69, 440.0});
    nlohmann::ordered_json j = frequency_table_json(map);
    CHECK(j["keys"][61]["ratio"].is_null());
    CHECK(j["keys"][61]["exact"] == false);
    CHECK(j["keys"][62]["ratio"] == "2/1");
    CHECK(line(csv(map), 62).find(",,") != std::string::npos);
}
