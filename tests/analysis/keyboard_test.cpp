#include <catch2/catch.hpp>

#include "core/analysis/keyboard.hpp"
#include "helpers.hpp"

using namespace terzo;
using Catch::Matchers::WithinRel;

TEST_CASE("a 12-note scale over one period has 13 notes, closing on the period", "[keyboard]") {
    Keyboard kb(test::just12());
    REQUIRE(kb.notes().size() == 13);
    CHECK(kb.notes().front().degree == 0);
    CHECK(kb.notes().back().degree == 0);
    CHECK(kb.notes().back().period == 1);
    CHECK(kb.notes().back().ratio() == Ratio(2));
    Keyboard wide(test::just12(), 27.5, 8);
    CHECK(wide.notes().size() == 97); // 12 * 8 + 1: the 88 keys from 27.5 Hz fit inside
}

TEST_CASE("the default reference is C4 of 12-tone equal temperament at A4 = 440 Hz", "[keyboard]") {
    // 440 * 2^(-9/12) = 261.6255653 Hz (docs/references.md section 8: C4 for A4 = 440 is 261.6256).
    CHECK_THAT(default_ref_hz, WithinRel(440.0 * std::exp2(-9.0 / 12.0), 1e-9));
    Keyboard kb(test::just12());
    CHECK(kb.ref_hz() == default_ref_hz);
}

TEST_CASE("notes carry their exact ratio to the reference and their frequency", "[keyboard]") {
    // docs/references.md section 7: the workshop example with 1/1 = 264 Hz gives 6/5 = 316.8 Hz,
    // 27/16 = 445.5 Hz and 2/1 = 528 Hz.
    Keyboard kb(test::ratio_scale({{6, 5}, {27, 16}}), 264.0, 2);
    CHECK_THAT(kb.note(1, 0).hz, WithinRel(316.8, 1e-12));
    CHECK_THAT(kb.note(2, 0).hz, WithinRel(445.5, 1e-12));
    CHECK_THAT(kb.note(0, 1).hz, WithinRel(528.0, 1e-12));
    CHECK(kb.note(2, 1).ratio() == Ratio(27, 8));
    SECTION("also off the keyboard, below it and far above") {
        CHECK(kb.note(1, -3).ratio() == Ratio(6, 40));
        CHECK(kb.note(1, 90).ratio() == Ratio(6, 5) * Ratio(2).pow(90)); // beyond the cached powers
        CHECK(kb.note_ratio(2, -70) == Ratio(27, 16) / Ratio(2).pow(70));
    }
}

TEST_CASE("tempered and cents-only notes have no ratio but the right frequency", "[keyboard]") {
    Keyboard kb(test::equal_division(12), 440.0, 2);
    // A fifth of 12-TET above A4 = 440 Hz is E5 = 659.2551 Hz (docs/references.md section 5.2).
    CHECK_THAT(kb.note(7, 0).hz, WithinRel(659.2551, 1e-7));
    CHECK_FALSE(kb.note(7, 0).ratio());
    CHECK(kb.note(7, 0).pitch.kind() == Pitch::Kind::tempered);
    CHECK(kb.note(0, 1).ratio() == Ratio(2));
    Keyboard c(test::equal_division_cents(12), 440.0);
    CHECK_THAT(c.note(7, 0).hz, WithinRel(659.2551, 1e-7));
    CHECK_FALSE(c.note(7, 0).pitch.is_exact());
}

TEST_CASE("a keyboard rejects a reference or span outside its limits", "[keyboard]") {
    REQUIRE_THROWS_WITH(Keyboard(test::just12(), 0.0),
                        "--ref-hz: error: reference frequency 0 Hz is outside the allowed range 0.001 to 100000 Hz");
    REQUIRE_THROWS_WITH(Keyboard(test::just12(), 200000.0),
                        "--ref-hz: error: reference frequency 200000 Hz is outside the allowed range 0.001 to 100000 Hz");
    REQUIRE_THROWS_WITH(Keyboard(test::just12(), std::nan("")),
                        "--ref-hz: error: reference frequency nan Hz is outside the allowed range 0.001 to 100000 Hz");
    REQUIRE_THROWS_WITH(Keyboard(test::just12(), 440.0, 0),
                        "--span: error: span 0 is outside the allowed range 1 to 11 periods");
    REQUIRE_THROWS_WITH(Keyboard(test::just12(), 440.0, 12),
                        "--span: error: span 12 is outside the allowed range 1 to 11 periods");
    CHECK_NOTHROW(Keyboard(test::just12(), 440.0, max_span));
}

TEST_CASE("a keyboard rejects a tiny period and notes out of any audible or sane range", "[keyboard]") {
    Scale tiny("tiny", {}, Pitch::from_cents(0.5));
    REQUIRE_THROWS_WITH(Keyboard(tiny), "tuning: error: period of 0.5 cents is smaller than the 1 cent a keyboard needs");
    Scale huge("huge", {Pitch::from_cents(30000.0)}, Pitch::from_cents(36000.0)); // 440 * 2^25 Hz
    REQUIRE_THROWS_WITH(Keyboard(huge, 440.0),
                        "tuning: error: degree 1, period 0 would sound at 1.476395008e+10 Hz, outside the 0.000001 to "
                        "1000000000 Hz a keyboard allows; check the tuning, --ref-hz and --span");
    REQUIRE_THROWS_WITH(Keyboard(tiny, 440.0, 1, "tiny.scl"),
                        "tiny.scl: error: period of 0.5 cents is smaller than the 1 cent a keyboard needs");
}
