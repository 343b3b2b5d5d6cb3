#include <catch2/catch.hpp>

#include <cmath>

#include "core/analysis/beats.hpp"

using namespace terzo;

namespace {
const CheckedInterval& kind(const char* name) {
    for (const auto& k : checked_intervals())
        if (k.name == name) return k;
    FAIL("no interval " << name);
    return octave_interval();
}
double et(int semitones_from_a4) {
    return 440.0 * std::exp2(semitones_from_a4 / 12.0);
}
Pitch et_interval(int semitones) {
    return Pitch::from_vector(PrimeVector::prime_power(2, Ratio(semitones, 12)));
}
} // namespace

TEST_CASE("the beat rate of an interval near p/q is |q*f_high - p*f_low|", "[beats]") {
    // Definition in docs/references.md section 4 ("lowest coinciding partials").
    CHECK(beat_rate(200.0, 301.0, 3, 2) == Approx(2.0)); // fifth: |2*301 - 3*200|
    CHECK(beat_rate(200.0, 249.0, 5, 4) == Approx(4.0)); // major third: |4*249 - 5*200|
    CHECK(beat_rate(264.0, 330.0, 5, 4) == 0.0);
}

TEST_CASE("the checked intervals are the fifth, fourth, thirds and major sixth", "[beats]") {
    REQUIRE(checked_intervals().size() == 5);
    CHECK(kind("fifth").pure() == Ratio(3, 2));
    CHECK(kind("fourth").pure() == Ratio(4, 3));
    CHECK(kind("major third").pure() == Ratio(5, 4));
    CHECK(kind("minor third").pure() == Ratio(6, 5));
    CHECK(kind("major sixth").pure() == Ratio(5, 3));
    CHECK(kind("major sixth").semitones == 9);
    CHECK(octave_interval().pure() == Ratio(2));
}

TEST_CASE("12-TET beat rates at A4 = 440 Hz match the piano-tuning handbook", "[beats]") {
    // docs/references.md section 4: computed values, and B. Capleton, Theory and Practice of Piano
    // Tuning (2007), table reproduced in Teki et al., J. Neurosci. 32(35) 2012, Table 1
    // [S, seen via the reproduction]; Capleton rounds to 0.1 beats per second.
    struct Case {
        const char* interval;
        int low; // semitones from A4
        double computed, capleton;
        Tempering t;
    };
    const Case cases[] = {
        {"fifth", -16, 0.5912, 0.6, Tempering::narrow},         // F3-C4
        {"fifth", -9, 0.8858, 0.9, Tempering::narrow},          // C4-G4
        {"major third", -16, 6.9294, 6.9, Tempering::wide},     // F3-A3
        {"major third", -12, 8.7305, 8.7, Tempering::wide},     // A3-C#4
        {"major third", -9, 10.3824, 10.4, Tempering::wide},    // C4-E4
        {"fourth", -12, 0.9943, 1.0, Tempering::wide},          // A3-D4
        {"minor third", -12, 11.8722, 11.9, Tempering::narrow}, // A3-C4
        {"major sixth", -16, 7.9237, 7.9, Tempering::wide},     // F3-D4
    };
    for (const Case& c : cases) {
        const CheckedInterval& k = kind(c.interval);
        Beat b = beat(et_interval(k.semitones), et(c.low), k);
        INFO(c.interval << " from " << c.low);
        CHECK(b.hz == Approx(c.computed).margin(0.00005));
        CHECK(std::round(b.hz * 10) / 10 == Approx(c.capleton));
        CHECK(b.tempering == c.t);
        CHECK(b.exact);
        // The direct formula gives the same rate.
        CHECK(beat_rate(et(c.low), et(c.low + k.semitones), k.p, k.q) ==
              Approx(b.hz).epsilon(1e-9));
    }
    // W. Braid White, Piano Tuning and Allied Arts, 5th ed. (1946), Table III p. 68, via a
    // quotation (docs/references.md section 4 [S]): A3-C4 minor third 11.87.
    CHECK(beat(et_interval(3), 220.0, kind("minor third")).hz == Approx(11.87).margin(0.005));
}

TEST_CASE("12-TET fifths are 1.955 cents narrow and major thirds 13.686 cents wide", "[beats]") {
    // docs/references.md section 1, "the errors of 12-tone equal temperament" [CP], computed with fractions/log2.
    CHECK(beat(et_interval(7), 261.6256, kind("fifth")).cents == Approx(-1.955001).margin(1e-6));
    CHECK(beat(et_interval(4), 261.6256, kind("major third")).cents ==
          Approx(13.686286).margin(1e-6));
    CHECK(beat(et_interval(3), 261.6256, kind("minor third")).cents ==
          Approx(-15.641287).margin(1e-6));
}

TEST_CASE("an exact pure interval is pure with zero beats, decided exactly", "[beats]") {
    Beat b = beat(Pitch::from_ratio(Ratio(5, 4)), 261.0, kind("major third"));
    CHECK(b.tempering == Tempering::pure);
    CHECK(b.hz == 0.0);
    CHECK(b.exact);
    // 5^(1/4) stacked four times over two octaves is 5/1: a quarter-comma third is pure.
    PrimeVector q = PrimeVector::prime_power(5, Ratio(1, 4));
    Pitch third = Pitch::from_vector(q.pow(Ratio(4)) / PrimeVector::from_ratio(Ratio(4)));
    CHECK(beat(third, 261.0, kind("major third")).tempering == Tempering::pure);
    CHECK(tempering_name(Tempering::pure) == "pure");
}

TEST_CASE("a cents-only interval is wide or narrow by its cents and not exact", "[beats]") {
    // 386.3137 c typed in a .scl file is 0.000014 c below 5/4: pure as far as it can tell.
    Beat b = beat(Pitch::from_cents(386.3137), 264.0, kind("major third"));
    CHECK_FALSE(b.exact);
    CHECK(b.tempering == Tempering::pure);
    CHECK(b.hz == 0.0);
    // 386.3136 is 0.000114 c below: narrow.
    Beat n = beat(Pitch::from_cents(386.3136), 264.0, kind("major third"));
    CHECK(n.tempering == Tempering::narrow);
    CHECK(n.hz > 0.0);
    CHECK(n.hz < 0.0001);
    Beat w = beat(Pitch::from_cents(702.0), 200.0, kind("fifth"));
    CHECK(w.tempering == Tempering::wide);
    CHECK_FALSE(w.exact);
    CHECK(w.hz == Approx(beat_rate(200.0, 200.0 * std::exp2(702.0 / 1200), 3, 2)));
    CHECK(tempering_name(Tempering::wide) == "wide");
    CHECK(tempering_name(Tempering::narrow) == "narrow");
}
