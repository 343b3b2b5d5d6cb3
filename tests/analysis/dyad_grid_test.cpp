#include "core/analysis/dyad_grid.hpp"

#include <catch2/catch.hpp>


#include "core/setting_error.hpp"
#include "core/analysis/combination.hpp"
#include "tests/support/scales.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;

namespace {

using test::equal_division;

Scale demo() { return test::scl_text("demo\n 8\n 9/8\n 5/4\n 4/3\n 3/2\n 5/3\n 7/4\n 15/8\n 2/1\n"); }

ToneOptions order(int n) {
    ToneOptions o;
    o.order = n;
    return o;
}

} // namespace

TEST_CASE("the grid has one cell per ordered pair of degrees of one period", "[dyad_grid]") {
    Keyboard kb(demo(), 261.6255653, 1);
    auto cells = dyad_grid(kb, order(3));
    REQUIRE(cells.size() == 64);
    // Row 2, column 5: 5/4 up to 5/3, in the same period.
    const DyadCell& c = cells[2 * 8 + 5];
    CHECK(c.low_degree == 2);
    CHECK(c.high_degree == 5);
    CHECK(c.high_period == 0);
    CHECK_THAT(c.interval_cents, WithinAbs(884.358713 - 386.313714, 1e-6));
    // On and left of the diagonal the upper note is a period up: row 4, column 4 is 3/2 to 3/1.
    CHECK(cells[4 * 8 + 4].high_period == 1);
    CHECK_THAT(cells[4 * 8 + 4].interval_cents, WithinAbs(1200.0, 1e-9));
    CHECK(cells[5 * 8 + 2].high_period == 1);
}

TEST_CASE("every resultant of a just octave lands exactly on the scale", "[dyad_grid]") {
    // 1:2 at order 3 gives the multiples 1, 3, 4, 5 of the low note (a + 2b for the terms of
    // order <= 3): 1/1, 3/2, 1/1, 5/4 octave-reduced, all degrees of the demo scale
    // (arithmetic as in docs/references.md 5.2 [C]).
    Keyboard kb(demo(), 261.6255653, 1);
    const auto cells = dyad_grid(kb, order(3)); // keep the grid alive while its cell is read
    const DyadCell& octave = cells[0];
    CHECK(octave.worst_cents == 0.0);
    CHECK(octave.fit.tones > 0);
    CHECK(octave.fit.exact == octave.fit.tones);
    CHECK(octave.fit.rms_cents == 0.0);
}

TEST_CASE("the worst landing of a tempered third is its difference tone", "[dyad_grid]") {
    // docs/references.md 5.2 [C]: for the 12-TET third C4-E4, f2 - f1 = 68.0020 Hz, 67.374 c above
    // C2, so 32.626 c below the nearest 12-TET note (C#2). The summation tone 591.2531 Hz lands
    // 11.527 c above D5; at order 2 these are the only tones.
    Keyboard kb(equal_division(12), 261.6255653, 1);
    const auto cells = dyad_grid(kb, order(2));
    const DyadCell& third = cells[4];
    CHECK(third.low_degree == 0);
    CHECK(third.high_degree == 4);
    CHECK_THAT(third.worst_cents, WithinAbs(32.626, 1e-3));
    CHECK(third.fit.exact == 0);
}

TEST_CASE("the grid refuses tunings above its size limit", "[dyad_grid]") {
    Keyboard kb(equal_division(129), 261.6255653, 1);
    REQUIRE_THROWS_WITH(dyad_grid(kb, order(2)),
                        "dyad grid: error: the tuning has 129 degrees; the dyad grid shows at most 128");
    Keyboard ok(equal_division(128), 261.6255653, 1);
    CHECK(dyad_grid(ok, order(2)).size() == 128u * 128u);
}

TEST_CASE("the grid passes option errors through", "[dyad_grid]") {
    // The grid reports the resultant engine's own message for a bad option, word for word.
    Keyboard kb(demo(), 261.6255653, 1);
    std::string engine;
    try {
        check_options(order(13));
    } catch (const InputError& e) {
        engine = e.what();
    }
    REQUIRE_THAT(engine, Catch::Matchers::Contains("order 13 is outside the allowed range 2 to 12"));
    REQUIRE_THROWS_MATCHES(dyad_grid(kb, order(13)), InputError, Catch::Matchers::Message(engine));
}

TEST_CASE("the grid refuses more tones than any one request may compute, naming what to lower", "[dyad_grid]") {
    // 12 degrees: 144 dyads; order 12 has 3(k-1) terms for each order k = 2..12, 198 in all;
    // 32 partials a note make 32^2 pairs: 144 * 198 * 1024 = 29,196,288 tones, over 1,000,000.
    Keyboard kb(equal_division(12), 261.6255653, 1);
    ToneOptions o = order(12);
    o.partials = 32;
    try {
        dyad_grid(kb, o);
        FAIL("the grid was computed");
    } catch (const InputError& e) {
        CHECK(std::string(e.what()) == "--order: error: the dyad grid of 12 degrees could compute 29196288 tones (144 dyads), "
                                       "more than the limit of 20000000; lower --order or --partials");
        // The window words the same refusal with its own labels.
        CHECK(worded(e, [](Setting s) { return "[" + std::string(setting_name(s)) + "]"; }) ==
              "[order]: error: the dyad grid of 12 degrees could compute 29196288 tones (144 dyads), "
              "more than the limit of 20000000; lower [order] or [partials]");
    }
    o.partials = 2; // 144 * 198 * 4 = 114,048 tones: computed
    CHECK(dyad_grid(kb, o).size() == 144u);
}
