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
