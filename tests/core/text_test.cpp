#include <catch2/catch.hpp>

#include <nlohmann/json.hpp>

#include "core/text.hpp"

using terzo::is_printable;
using terzo::is_valid_utf8;
using terzo::printable;
using terzo::valid_utf8;

static const std::string fffd = "\xEF\xBF\xBD";

TEST_CASE("valid UTF-8 passes through unchanged", "[text]") {
    const std::string s = "Werckmeister \xE2\x80\x94 C\xE2\x99\xAF \xF0\x9D\x84\x9E \xC3\xA9";
    CHECK(is_valid_utf8(s));
    CHECK(valid_utf8(s) == s);
    CHECK(printable(s) == s);
}

TEST_CASE("each maximal invalid subpart becomes one U+FFFD", "[text]") {
    // The examples of Unicode 15, section 3.9, "U+FFFD Substitution of Maximal Subparts"
    // (table 3-8): 61 F1 80 80 E1 80 C2 62 80 63 80 BF 64 gives a FFFD FFFD FFFD b FFFD c
    // FFFD FFFD d.
    CHECK(valid_utf8("\x61\xF1\x80\x80\xE1\x80\xC2\x62\x80\x63\x80\xBF\x64") ==
          "a" + fffd + fffd + fffd + "b" + fffd + "c" + fffd + fffd + "d");
    // Overlong forms and surrogates are not UTF-8 (table 3-7): C0 AF, E0 80 AF, ED A0 80.
    CHECK(valid_utf8("\xC0\xAF") == fffd + fffd);
    CHECK(valid_utf8("\xE0\x80\xAF") == fffd + fffd + fffd);
    CHECK(valid_utf8("\xED\xA0\x80") == fffd + fffd + fffd);
    CHECK(valid_utf8("\xF4\x90\x80\x80") == fffd + fffd + fffd + fffd); // above U+10FFFF
    CHECK(valid_utf8("bad \xFF") == "bad " + fffd);
    CHECK_FALSE(is_valid_utf8("bad \xFF"));
    CHECK(valid_utf8("\xE2\x82") == fffd); // cut short at the end
}

TEST_CASE("printable text has no control characters but keeps tabs and newlines", "[text]") {
    CHECK(printable("a\x1B[31mred\x1B[0m") == "a" + fffd + "[31mred" + fffd + "[0m");
    CHECK(printable("tab\tand\nline") == "tab\tand\nline");
    CHECK(printable("del\x7F") == "del" + fffd);
    CHECK(printable("c1 \xC2\x9B") == "c1 " + fffd); // U+009B, a CSI on some terminals
    CHECK(printable("cr\r") == "cr" + fffd);
    // A CSV row ends in \r\n (RFC 4180): that pair is a line end, not a control character.
    CHECK(printable("a,b\r\nc,d\r\n") == "a,b\r\nc,d\r\n");
    CHECK(printable("a\rb\n") == "a" + fffd + "b\n");
    CHECK_FALSE(is_printable("\x1B"));
    CHECK(is_printable("plain"));
}

TEST_CASE("json_text writes invalid UTF-8 in a string as U+FFFD instead of throwing", "[text]") {
    nlohmann::ordered_json j = {{"description", "bad \xFF"}, {"escape", "\x1B"}};
    CHECK_THROWS(j.dump(2)); // nlohmann's default, which every writer used to hit
    CHECK(terzo::json_text(j) == "{\n  \"description\": \"bad " + fffd + "\",\n  \"escape\": \"\\u001b\"\n}");
    CHECK(nlohmann::json::parse(terzo::json_text(j))["description"] == "bad " + fffd);
}
