#include <catch2/catch.hpp>

#include "core/error.hpp"

TEST_CASE("input errors are formatted the way compilers format them", "[error]") {
    using terzo::SourcePos;
    CHECK(terzo::format_error({"mytuning.scl", 12, 5}, "denominator is zero in \"3/0\"") ==
          "mytuning.scl:12:5: error: denominator is zero in \"3/0\"");
    CHECK(terzo::format_error({"a.scl", 3, 0}, "m") == "a.scl:3: error: m");
    CHECK(terzo::format_error({"--order", 0, 0}, "m") == "--order: error: m");
    CHECK(terzo::format_error({}, "m") == "input: error: m");
    try {
        terzo::fail({"r", 1, 7}, "bad");
        FAIL("fail() returned");
    } catch (const terzo::InputError& e) {
        CHECK(std::string(e.what()) == "r:1:7: error: bad");
        CHECK(e.message() == "bad");
        CHECK(e.pos().column == 7);
    }
}
