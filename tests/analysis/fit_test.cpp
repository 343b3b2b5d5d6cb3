#include <catch2/catch.hpp>

#include <cmath>

#include "core/analysis/chord.hpp"
#include "core/analysis/fit.hpp"
#include "helpers.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;

TEST_CASE("the fit is the weighted RMS of landing deviations", "[fit]") {
    DyadTones d;
    Tone a, b, c;
    a.term = {2, -1};   // order 3
    a.audibility = 1.0; // weight 1 / 2
    a.landing.deviation_cents = 10.0;
    b.term = {-1, 1};   // order 2
    b.audibility = 0.5; // weight 0.5
    b.landing.deviation_cents = -20.0;
    b.landing.exact = false;
    c.term = {3, -2};
    c.audibility = 0.0; // no weight: left out
    c.landing.deviation_cents = 500.0;
    d.tones = {a, b, c};
    CHECK(fit_weight(a) == 0.5);
    CHECK(fit_weight(b) == 0.5);
    Fit f = fit({d});
    CHECK(f.tones == 2);
    CHECK(f.total_weight == 1.0);
    CHECK_THAT(f.rms_cents, WithinAbs(std::sqrt((0.5 * 100 + 0.5 * 400) / 1.0), 1e-12));
    CHECK(fit({}).rms_cents == 0.0);
}

TEST_CASE("a just triad fits better than the 12-TET triad", "[fit]") {
    // The just triad's difference tones land exactly (common practice), the tempered ones
    // miss by tens of cents (docs/references.md section 5.2), so its fit must be lower.
    Keyboard just(test::just12()), tet(test::equal_division(12));
    ToneOptions o;
    Fit j = fit(chord_tones(just, parse_chord("0,4,7", just, {"--chord"}), o));
    Fit t = fit(chord_tones(tet, parse_chord("0,4,7", tet, {"--chord"}), o));
    CHECK(j.rms_cents < t.rms_cents);
    CHECK(j.exact > 0);
    CHECK(t.exact == 0);
}

TEST_CASE("a pitch floor leaves the tones below it out of the fit", "[fit]") {
    DyadTones d;
    Tone low, high;
    low.term = {-1, 1}; // a difference tone of a few hertz
    low.audibility = 0.5;
    low.hz = 4.0;
    low.landing.deviation_cents = 80.0;
    high.term = {-1, 1};
    high.audibility = 0.5;
    high.hz = 130.0;
    high.landing.deviation_cents = 10.0;
    d.tones = {low, high};
    // Without a floor both count: sqrt((0.5 * 6400 + 0.5 * 100) / 1) (arithmetic).
    CHECK_THAT(fit({d}).rms_cents, WithinAbs(std::sqrt(3250.0), 1e-12));
    FitOptions floor;
    floor.pitch_floor_hz = pitch_perception_floor_hz;
    CHECK(fit_weight(low, floor) == 0.0);
    CHECK(fit_weight(high, floor) == 0.5);
    const Fit f = fit({d}, floor);
    CHECK(f.tones == 1);
    CHECK(f.rms_cents == 10.0);
    SECTION("a tone exactly at the floor counts") {
        high.hz = 20.0;
        CHECK(fit_weight(high, floor) == 0.5);
    }
    SECTION("a floor outside 0 to 20000 Hz is refused") {
        floor.pitch_floor_hz = -1.0;
        CHECK_THROWS_WITH(check_fit_options(floor), "--pitch-floor: error: pitch floor -1 Hz is outside the allowed range 0 to 20000 Hz");
        floor.pitch_floor_hz = 20001.0;
        CHECK_THROWS_WITH(check_fit_options(floor), "--pitch-floor: error: pitch floor 20001 Hz is outside the allowed range 0 to 20000 Hz");
    }
}
