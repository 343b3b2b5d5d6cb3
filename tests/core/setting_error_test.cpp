#include <catch2/catch.hpp>

#include "core/setting_error.hpp"

namespace {
// A front end's own wording, as the window's labels would be.
std::string label_wording(terzo::Setting s) {
    return s == terzo::Setting::order ? "\"order\" slider" : "\"" + std::string(terzo::setting_name(s)) + "\"";
}
} // namespace

TEST_CASE("a setting named in an error is worded by each front end its own way", "[setting_error]") {
    using terzo::Setting;
    try {
        terzo::fail(Setting::order, "too many; lower {order}, {span} or {partials} (not {other})");
        FAIL("fail() returned");
    } catch (const terzo::InputError& e) {
        // what() is the command-line wording: the CLI prints it, and a message kept as text
        // reads the same.
        CHECK(std::string(e.what()) == "--order: error: too many; lower --order, --span or --partials (not {other})");
        CHECK(e.pos().source == "--order");
        CHECK(terzo::worded(e, terzo::option_wording) == e.what());
        CHECK(terzo::worded(e, label_wording) ==
              "\"order\" slider: error: too many; lower \"order\" slider, \"span\" or \"partials\" (not {other})");
    }
    SECTION("an input's message words only the settings it names") {
        try {
            terzo::fail({"a.scl", 0, 0}, "check {span} and {order}", {Setting::span});
            FAIL("fail() returned");
        } catch (const terzo::InputError& e) {
            CHECK(std::string(e.what()) == "a.scl: error: check --span and {order}");
            CHECK(terzo::worded(e, label_wording) == "a.scl: error: check \"span\" and {order}");
        }
    }
    SECTION("other input errors read the same in every wording") {
        terzo::InputError e({"r", 1, 2}, "{order}");
        CHECK(terzo::worded(e, label_wording) == "r:1:2: error: {order}");
    }
    SECTION("the neutral names") {
        CHECK(terzo::setting_name(Setting::order) == "order");
        CHECK(terzo::setting_name(Setting::ref_hz) == "ref-hz");
        CHECK(terzo::option_wording(Setting::partials) == "--partials");
    }
}
