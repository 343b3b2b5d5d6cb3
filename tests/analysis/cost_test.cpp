#include <catch2/catch.hpp>

#include <cmath>

#include "core/analysis/chord.hpp"
#include "core/analysis/compare.hpp"
#include "core/analysis/cost.hpp"
#include "core/analysis/fit.hpp"
#include "tests/analysis/test_tunings.hpp"

using namespace terzo;

namespace {

Cost cost_of(std::vector<DeviationPart> parts) {
    Cost c;
    c.deviations = std::move(parts);
    return c;
}

const std::vector<DeviationPart> every_statistic = {
    {KeyInterval::fifth, Statistic::mean, 1},       {KeyInterval::fifth, Statistic::worst, 1},
    {KeyInterval::major_third, Statistic::mean, 1}, {KeyInterval::major_third, Statistic::worst, 1},
    {KeyInterval::minor_third, Statistic::mean, 1}, {KeyInterval::minor_third, Statistic::worst, 1},
    {KeyInterval::fifth, Statistic::rms, 1},
};

} // namespace

TEST_CASE("12-TET deviates from pure by the published amounts in every key", "[cost]") {
    // docs/references.md section 1, "the errors of 12-tone equal temperament": fifth -1.955001, major third +13.686286,
    // minor third -15.641287 cents (computed with python3; common practice).
    KeyDeviations d = key_deviations(positions_of(test::equal_12()));
    for (int pc = 0; pc < 12; ++pc) {
        CHECK(d.fifth[static_cast<std::size_t>(pc)] == Approx(-1.955001).margin(1e-6));
        CHECK(d.major_third[static_cast<std::size_t>(pc)] == Approx(13.686286).margin(1e-6));
        CHECK(d.minor_third[static_cast<std::size_t>(pc)] == Approx(-15.641287).margin(1e-6));
    }
    CostModel m(cost_of(every_statistic));
    CostBreakdown b = m.evaluate(positions_of(test::equal_12()));
    CHECK(b.parts[6].name == "fifth:rms");
    CHECK(b.parts[6].value == Approx(1.955001).margin(1e-6));
    CHECK(b.parts[3].value == Approx(13.686286).margin(1e-6));
    CHECK(b.feasible);
}

TEST_CASE("the cost's means and worst values equal the key comparison's summary", "[cost]") {
    // The same quantities computed two ways: compare_keys works key by key with exact
    // pitches; the cost model works on twelve doubles. Werckmeister III and quarter-comma
    // meantone per docs/references.md 2.1.
    for (const Scale& s : {test::werckmeister_3(), test::quarter_comma(), test::pythagorean()}) {
        for (bool weighted : {false, true}) {
            CompareOptions options;
            Cost c = cost_of(every_statistic);
            if (weighted) {
                KeyWeights w;
                for (int k = 0; k < 24; ++k) w.weight[static_cast<std::size_t>(k)] = (k * 7) % 5;
                options.weights = w;
                c.weights = w;
            }
            CompareSummary sum = compare_keys(s, options, "t").summary;
            CostBreakdown b = CostModel(c).evaluate(positions_of(s));
            INFO(s.description() << (weighted ? " weighted" : ""));
            CHECK(b.parts[0].value == Approx(sum.mean_fifth).margin(1e-9));
            CHECK(b.parts[1].value == Approx(sum.worst_fifth).margin(1e-9));
            CHECK(b.parts[2].value == Approx(sum.mean_major_third).margin(1e-9));
            CHECK(b.parts[3].value == Approx(sum.worst_major_third).margin(1e-9));
            CHECK(b.parts[4].value == Approx(sum.mean_minor_third).margin(1e-9));
            CHECK(b.parts[5].value == Approx(sum.worst_minor_third).margin(1e-9));
        }
    }
}

TEST_CASE("beat-rate parts use the key comparison's beats at the reference pitch", "[cost]") {
    Scale w3 = test::werckmeister_3();
    for (const char* ref : {"A4=440", "A4=415", "C4=256"}) {
        Cost c;
        c.reference = parse_pitch_reference(ref, {"--reference", 0, 0});
        c.beats = {{KeyInterval::fifth, 0.0, 1}, {KeyInterval::major_third, 0.0, 1}, {KeyInterval::minor_third, 10.0, 1}};
        CostModel m(c);
        CompareOptions options;
        options.reference = c.reference;
        KeyComparison k = compare_keys(w3, options, "w3");
        double fifths = 0, thirds = 0, minors = 0;
        for (const KeyReport& r : k.keys) {
            if (!r.key.minor) {
                fifths += r.fifth_beat.hz;
                thirds += r.major_third.hz;
            } else {
                minors += std::max(0.0, r.minor_third.hz - 10.0);
            }
        }
        CostBreakdown b = m.evaluate(positions_of(w3));
        INFO(ref);
        CHECK(b.parts[0].value == Approx(fifths).epsilon(1e-9));
        CHECK(b.parts[1].value == Approx(thirds).epsilon(1e-9));
        CHECK(b.parts[2].value == Approx(minors).margin(1e-9));
    }
    // docs/references.md section 4 (computed; Capleton 2007 via Teki et al. 2012 gives 0.9):
    // the 12-TET fifth C4-G4 at A4 = 440 beats 0.8858 times a second; C4 is 261.6256 Hz.
    Cost c;
    c.beats = {{KeyInterval::fifth, 0.0, 1}};
    CostModel m(c);
    Positions et = positions_of(test::equal_12());
    CHECK(m.hz(et, 0) == Approx(261.6256).margin(1e-4));
    KeyDeviations d = key_deviations(et);
    BeatPart only_c{KeyInterval::fifth, 0.0, 1};
    double all = m.beat_excess(only_c, et, d);
    // the twelve fifths C4..B4 beat 0.8858 * 2^(pc/12) each (they all are 1.955 c narrow)
    double expected = 0;
    for (int pc = 0; pc < 12; ++pc) expected += 0.8858 * std::exp2(pc / 12.0);
    CHECK(all == Approx(expected).epsilon(1e-4));
}

TEST_CASE("a chord-fit part is the mean resultant fit of the shape on the twelve roots", "[cost]") {
    // Independent route: the exact 12-TET scale on a keyboard from C4 with exact tones, against
    // the cost model's cents-only copy of the same positions.
    Scale et = test::equal_12();
    Cost c;
    c.fits = {FitPart{{0, 4, 7}, 2, 1.0}};
    CostModel m(c);
    Keyboard kb(et, 261.6255653, 1);
    ToneOptions options;
    options.order = 2;
    double sum = 0;
    for (int root = 0; root < 12; ++root) {
        std::vector<Note> chord;
        for (int s : {0, 4, 7}) chord.push_back(kb.note((root + s) % 12, (root + s) / 12));
        sum += fit(chord_tones(kb, chord, options)).rms_cents;
    }
    CostBreakdown b = m.evaluate(positions_of(et));
    CHECK(b.parts[0].name == "fit:0+4+7");
    CHECK(b.parts[0].value == Approx(sum / 12).epsilon(1e-6));
    CHECK(b.parts[0].value > 1.0); // 12-TET major triads' difference tones miss their notes
}

TEST_CASE("constraints name the first interval that breaks them", "[cost]") {
    Cost c = cost_of({{KeyInterval::fifth, Statistic::rms, 1}});
    c.constraints.max_major_third = 12.0;
    CostBreakdown b = CostModel(c).evaluate(positions_of(test::equal_12()));
    CHECK_FALSE(b.feasible);
    CHECK(b.violation == "the major third from C is +13.686 c from pure");
    Cost w = cost_of({{KeyInterval::fifth, Statistic::rms, 1}});
    w.constraints.no_wide_fifths = true;
    CHECK(CostModel(w).evaluate(positions_of(test::werckmeister_3())).feasible);
    // Quarter-comma meantone's wolf G#-Eb is 35.7 c wide (docs/references.md 2.2: 737.637 c).
    CostBreakdown q = CostModel(w).evaluate(positions_of(test::quarter_comma()));
    CHECK(q.violation == "the fifth from G# is +35.682 c, wider than pure");
}

TEST_CASE("transposing a tuning keeps its cost when the cost treats all keys alike", "[cost]") {
    Cost c = cost_of(every_statistic);
    CostModel m(c);
    REQUIRE(m.transposition_invariant());
    Positions w3 = positions_of(test::werckmeister_3());
    // The same tuning on D: pitch class q of the new tuning is pitch class q+2 of the old.
    Positions moved{};
    for (int q = 0; q < 12; ++q) {
        double v = w3[static_cast<std::size_t>((q + 2) % 12)] + ((q + 2) >= 12 ? 1200 : 0) - w3[2];
        moved[static_cast<std::size_t>(q)] = v - 1200 * std::floor(v / 1200);
    }
    CHECK(m.evaluate(moved).total == Approx(m.evaluate(w3).total).margin(1e-9));
    // With beat rates the position against the reference matters.
    Cost b = c;
    b.beats = {{KeyInterval::major_third, 0, 1}};
    CostModel mb(b);
    CHECK_FALSE(mb.transposition_invariant());
    CHECK(std::fabs(mb.evaluate(moved).total - mb.evaluate(w3).total) > 0.1);
    Cost k = c;
    k.weights = KeyWeights{};
    k.weights->weight[0] = 1;
    CHECK_FALSE(CostModel(k).transposition_invariant());
}

TEST_CASE("cost parts are parsed from short texts and bad ones are rejected", "[cost]") {
    DeviationPart d = parse_deviation_part("major-third:worst:2.5", "--part");
    CHECK(d.interval == KeyInterval::major_third);
    CHECK(d.statistic == Statistic::worst);
    CHECK(d.weight == 2.5);
    BeatPart b = parse_beat_part("fifth:1.5", "--beats");
    CHECK(b.limit_hz == 1.5);
    CHECK(b.weight == 1.0);
    FitPart f = parse_fit_part("0+3+7:0.5", "--fit");
    CHECK(f.shape == std::vector<int>{0, 3, 7});
    CHECK(f.weight == 0.5);
    SECTION("bad input") {
        CHECK_THROWS_WITH(parse_deviation_part("third:rms", "--part"),
                          "--part: error: expected fifth, major-third or minor-third, found \"third\"");
        CHECK_THROWS_WITH(parse_deviation_part("fifth:median", "--part"),
                          "--part: error: expected mean, rms or worst, found \"median\"");
        CHECK_THROWS_WITH(parse_deviation_part("fifth", "--part"),
                          "--part: error: expected INTERVAL:STATISTIC[:WEIGHT] such as \"major-third:rms\", found \"fifth\"");
        CHECK_THROWS_WITH(parse_deviation_part("fifth:rms:x", "--part"),
                          "--part: error: expected a weight (a decimal number), found \"x\"");
        CHECK_THROWS_WITH(parse_beat_part("fifth:fast", "--beats"),
                          "--beats: error: expected a beat rate in Hz (a decimal number), found \"fast\"");
        CHECK_THROWS_WITH(parse_fit_part("0+four+7", "--fit"),
                          "--fit: error: expected semitones joined by '+' such as \"0+4+7\", found \"four\"");
        Cost empty;
        CHECK_THROWS_WITH(CostModel(empty), "--part: error: the cost has no part; give at least one");
        Cost zero = cost_of({{KeyInterval::fifth, Statistic::rms, 0}});
        CHECK_THROWS_WITH(CostModel(zero), "--part: error: no part of the cost has a positive weight");
        Cost heavy = cost_of({{KeyInterval::fifth, Statistic::rms, 2e6}});
        CHECK_THROWS_WITH(CostModel(heavy), "--part: error: weight 2000000.000 is outside 0..1000000");
        Cost many = cost_of(std::vector<DeviationPart>(33));
        CHECK_THROWS_WITH(CostModel(many), "--part: error: the cost has 33 parts; at most 32 are allowed");
        Cost shape;
        shape.fits = {FitPart{{0, 7, 4}, 2, 1}};
        CHECK_THROWS_WITH(CostModel(shape), "--part: error: a chord shape lists rising semitones from 0 to 11, such as 0+4+7");
        Cost neg = cost_of({{KeyInterval::fifth, Statistic::rms, 1}});
        neg.constraints.max_major_third = -1;
        CHECK_THROWS_WITH(CostModel(neg), "--part: error: a constraint in cents must not be negative");
    }
}
