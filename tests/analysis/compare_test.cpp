#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <sstream>

#include "core/analysis/compare.hpp"
#include "test_tunings.hpp"

using namespace terzo;

namespace {
KeyWeights weights_of(const std::string& text) {
    std::istringstream in(text);
    return parse_key_weights(in, "w.txt");
}
Scale equal_division(int steps, const Ratio& period, const char* name) {
    std::vector<Pitch> d;
    PrimeVector p = PrimeVector::from_ratio(period);
    for (int i = 1; i <= steps; ++i)
        d.push_back(Pitch::from_vector(p.pow(Ratio(i, steps))));
    Pitch per = d.back();
    d.pop_back();
    return Scale(name, d, per);
}
int count_wolves(const CompareSummary& s, const char* interval) {
    int n = 0;
    for (const Wolf& w : s.wolves)
        n += w.interval == interval;
    return n;
}
} // namespace

TEST_CASE("in 12-TET every fifth is 1.955 c narrow and every major third 13.686 c wide",
          "[compare]") {
    // docs/references.md section 1, "the errors of 12-tone equal temperament" [CP]: -1.955001, +13.686286, -15.641287.
    KeyComparison c = compare_keys(test::equal_12(), CompareOptions{}, "12-TET");
    REQUIRE(c.keys.size() == 24);
    for (const KeyReport& k : c.keys) {
        INFO(key_name(k.key));
        CHECK(k.fifth_beat.cents == Approx(-1.955001).margin(1e-6));
        CHECK(k.major_third.cents == Approx(13.686286).margin(1e-6));
        CHECK(k.minor_third.cents == Approx(-15.641287).margin(1e-6));
    }
    CHECK(c.summary.mean_fifth == Approx(1.955001).margin(1e-6));
    CHECK(c.summary.worst_major_third == Approx(13.686286).margin(1e-6));
    CHECK(c.summary.wolves.empty());
    // Beat rates of the C4 triad at A4 = 440: docs/references.md section 4 (C4-G4 0.8858,
    // C4-E4 10.3824; E4-G4 is a minor third on E4: 0.0539644250 * 329.6276 = 17.7882).
    CHECK(c.keys[0].fifth_beat.hz == Approx(0.8858).margin(5e-5));
    CHECK(c.keys[0].major_third.hz == Approx(10.3824).margin(5e-5));
    CHECK(c.keys[0].minor_third.hz == Approx(0.0539644250 * 329.6276).margin(5e-4));
    CHECK(key_name(c.keys[0].key) == "C major");
    CHECK(key_name(c.keys[21].key) == "A minor");
    CHECK(note_text(c.keys[21].third) == "C5");
}

TEST_CASE("quarter-comma meantone has 8 pure major thirds and a wolf fifth of 737.6 c",
          "[compare]") {
    // docs/references.md 2.2: 1/4-comma fifth 696.578428 c, wolf G#-Eb 737.637287 c, major third
    // 5/4 pure (Aron 1523; Zarlino 1571, Salinas 1577 [M]).
    KeyComparison c = compare_keys(test::quarter_comma(), CompareOptions{}, "qc");
    CHECK(c.summary.pure_major_thirds == 8);
    CHECK(c.summary.pure_fifths == 0);
    REQUIRE(count_wolves(c.summary, "fifth") == 1);
    const Wolf& wolf = *std::find_if(c.summary.wolves.begin(), c.summary.wolves.end(),
                                     [](const Wolf& w) { return w.interval == "fifth"; });
    CHECK(wolf.from == 8); // G#
    CHECK(701.955001 + wolf.cents == Approx(737.637287).margin(1e-5));
    CHECK(c.keys[0].fifth_beat.cents == Approx(696.578428 - 701.955001).margin(1e-6));
    // The four diminished fourths (2/(5/4)^3 = 128/125 = 41.058858 c wide, docs/references.md 1).
    CHECK(count_wolves(c.summary, "major third") == 4);
    for (const Wolf& w : c.summary.wolves)
        if (w.interval == "major third") CHECK(w.cents == Approx(41.058858).margin(1e-5));
    CHECK(count_wolves(c.summary, "minor third") == 3);
    CHECK(c.keys[0].major_third.tempering == Tempering::pure);
    CHECK(c.keys[0].major_third.exact);
}

TEST_CASE("Pythagorean tuning has one wolf and circulating temperaments none", "[compare]") {
    // docs/references.md 2.2: the Pythagorean wolf is 678.494990 c; Pythagorean thirds 81/64 are a
    // syntonic comma wide and stay below the third threshold.
    KeyComparison p = compare_keys(test::pythagorean(), CompareOptions{}, "p");
    REQUIRE(p.summary.wolves.size() == 1);
    CHECK(701.955001 + p.summary.wolves[0].cents == Approx(678.494990).margin(1e-5));
    CHECK(p.summary.pure_fifths == 11);
    CHECK(p.summary.worst_major_third == Approx(21.506290).margin(1e-5));
    KeyComparison w = compare_keys(test::werckmeister_3(), CompareOptions{}, "w");
    CHECK(w.summary.wolves.empty());
    CHECK(w.summary.pure_fifths == 8);
    // docs/references.md 2.1: four fifths P/4 narrow, so the mean over 12 is P/12.
    CHECK(w.summary.mean_fifth == Approx(23.460010 / 12).margin(1e-6));
    CHECK(w.summary.worst_fifth == Approx(23.460010 / 4).margin(1e-6));
}

TEST_CASE("key weights change the means and the worst keys", "[compare]") {
    CompareOptions o;
    o.weights =
        weights_of("# only C major and its relative minor\nC major 3\nA minor 1  # relative\n");
    KeyComparison c = compare_keys(test::werckmeister_3(), o, "w");
    CHECK(c.summary.weighted);
    // C major: C-G -P/4; A minor: A-E pure. Weighted mean (3 * P/4 + 1 * 0) / 4.
    CHECK(c.summary.mean_fifth == Approx(3 * 23.460010 / 4 / 4).margin(1e-6));
    CHECK(c.summary.worst_fifth == Approx(23.460010 / 4).margin(1e-6));
    // Wolves are counted over all intervals, whatever the weights.
    CHECK(c.summary.wolves.empty());
}

TEST_CASE("the weights file is parsed strictly", "[compare]") {
    KeyWeights w = weights_of("Bb major 2.5\r\n\n  f# minor 0\nEb minor 1e2\n");
    CHECK(w.weight[10] == 2.5);
    CHECK(w.weight[12 + 6] == 0.0);
    CHECK(w.weight[12 + 3] == 100.0);
    CHECK(w.weight[0] == 0.0);
    SECTION("bad input") {
        REQUIRE_THROWS_WITH(weights_of("C major\n"),
                            "w.txt:1:1: error: expected \"<note> major|minor <weight>\" such as "
                            "\"Bb major 2\", found 2 fields");
        REQUIRE_THROWS_WITH(weights_of("C dorian 1\n"),
                            "w.txt:1:3: error: expected major or minor, found \"dorian\"");
        REQUIRE_THROWS_WITH(weights_of("\n H major 1\n"),
                            "w.txt:2:2: error: expected a note letter A to G in \"H\"");
        REQUIRE_THROWS_WITH(
            weights_of("C major -1\n"),
            "w.txt:1:9: error: expected a weight (a non-negative decimal number), found \"-1\"");
        REQUIRE_THROWS_WITH(
            weights_of("C major 1x\n"),
            "w.txt:1:9: error: expected a weight (a non-negative decimal number), found \"1x\"");
        REQUIRE_THROWS_WITH(
            weights_of("C major nan\n"),
            "w.txt:1:9: error: expected a weight (a non-negative decimal number), found \"nan\"");
        REQUIRE_THROWS_WITH(weights_of("C major 2000000\n"),
                            "w.txt:1:9: error: weight 2000000 is larger than the limit 1000000");
        REQUIRE_THROWS_WITH(weights_of("C major 1\nB# major 2 #again\n"),
                            "w.txt:2:1: error: C major is already given on line 1");
        REQUIRE_THROWS_WITH(weights_of("# nothing\nC major 0\n"),
                            "w.txt: error: no key has a positive weight");
        REQUIRE_THROWS_WITH(read_key_weights("/nonexistent/w.txt"),
                            "/nonexistent/w.txt: error: cannot open the weights file");
        std::string many(10001, '\n');
        REQUIRE_THROWS_WITH(weights_of(many),
                            "w.txt:10001:1: error: a weights file has at most 10000 lines");
    }
}

TEST_CASE("a comparison needs a 12-note tuning and an octave on the keyboard", "[compare]") {
    REQUIRE_THROWS_WITH(
        compare_keys(equal_division(19, Ratio(2), "19"), CompareOptions{}, "19edo.scl"),
        "19edo.scl: error: this needs a 12-note tuning to name its notes C, C#, D …; it has 19 "
        "degrees");
    CompareOptions o;
    o.octave = 9;
    REQUIRE_THROWS_WITH(compare_keys(test::equal_12(), o, "t"),
                        "--octave: error: octave 9 is outside 0..8");
}

TEST_CASE("the nearest simple ratio respects the odd limit", "[compare]") {
    // docs/references.md section 3 [CP]: 19-EDO 5 steps 315.789 c is 6/5 + 0.148; 31-EDO 10 steps
    // 387.097 c is 5/4 + 0.783; 53-EDO 31 steps 701.887 c is 3/2 - 0.068.
    CHECK(nearest_simple_ratio(1200.0 * 5 / 19, 5) == Ratio(6, 5));
    CHECK(nearest_simple_ratio(1200.0 * 10 / 31, 5) == Ratio(5, 4));
    CHECK(nearest_simple_ratio(1200.0 * 31 / 53, 3) == Ratio(3, 2));
    CHECK(nearest_simple_ratio(968.8, 7) == Ratio(7, 4));
    CHECK(nearest_simple_ratio(968.8, 5) == Ratio(5, 3));  // 9/5 and 16/9 need 9
    CHECK(nearest_simple_ratio(990.0, 9) == Ratio(16, 9)); // 996.1 c, nearer than 7/4 and 9/5
    CHECK(nearest_simple_ratio(-700.0, 3) == Ratio(2, 3));
    CHECK(nearest_simple_ratio(2400.0, 1) == Ratio(4));
}

TEST_CASE("interval classes list every size a step span takes", "[compare]") {
    SECTION("12-TET: one size per span") {
        auto classes = interval_classes(test::equal_12(), 5, "12");
        REQUIRE(classes.size() == 11);
        REQUIRE(classes[6].sizes.size() == 1);
        CHECK(classes[6].sizes[0].count == 12);
        CHECK(classes[6].sizes[0].nearest == Ratio(3, 2));
        CHECK(classes[6].sizes[0].deviation == Approx(-1.955001).margin(1e-6));
    }
    SECTION("quarter-comma: the wolf fifth and the diminished fourths stand apart") {
        auto classes = interval_classes(test::quarter_comma(), 5, "qc");
        REQUIRE(classes[6].sizes.size() == 2);
        CHECK(classes[6].sizes[0].count == 11);
        CHECK(classes[6].sizes[1].count == 1);
        CHECK(classes[6].sizes[1].size.cents() == Approx(737.637287).margin(1e-5));
        REQUIRE(classes[3].sizes.size() == 2);
        CHECK(classes[3].sizes[0].count == 8);
        CHECK(classes[3].sizes[0].nearest == Ratio(5, 4));
        CHECK(classes[3].sizes[0].deviation == Approx(0).margin(1e-9));
        CHECK(classes[3].sizes[0].size == Pitch::from_ratio(Ratio(5, 4))); // exactly pure
    }
    SECTION("13 equal divisions of 3/1: the scale's own consonances") {
        // docs/references.md section 3 (Bohlen 1978; Mathews et al. 1988 [M]): 3 steps 438.913 c,
        // 9/7 + 3.829; 4 steps 7/5 + 2.705; 6 steps 5/3 - 6.533.
        auto classes = interval_classes(equal_division(13, Ratio(3), "bp"), 9, "bp");
        REQUIRE(classes.size() == 12);
        CHECK(classes[2].sizes[0].nearest == Ratio(9, 7));
        CHECK(classes[2].sizes[0].deviation == Approx(3.829).margin(5e-4));
        CHECK(classes[3].sizes[0].nearest == Ratio(7, 5));
        CHECK(classes[3].sizes[0].deviation == Approx(2.705).margin(5e-4));
        CHECK(classes[5].sizes[0].nearest == Ratio(5, 3));
        CHECK(classes[5].sizes[0].deviation == Approx(-6.533).margin(5e-4));
    }
    SECTION("cents-only sizes group within 1e-6 c") {
        Scale s("c", {Pitch::from_cents(100.0), Pitch::from_cents(200.0000000001)},
                Pitch::from_cents(300.0));
        auto classes = interval_classes(s, 3, "c");
        CHECK(classes[0].sizes.size() == 1);
        CHECK(classes[0].sizes[0].count == 3);
    }
    SECTION("limits") {
        REQUIRE_THROWS_WITH(interval_classes(test::equal_12(), 4, "t"),
                            "--odd-limit: error: odd limit 4 must be an odd number from 1 to 99");
        REQUIRE_THROWS_WITH(interval_classes(test::equal_12(), 101, "t"),
                            "--odd-limit: error: odd limit 101 must be an odd number from 1 to 99");
        REQUIRE_THROWS_WITH(interval_classes(equal_division(257, Ratio(2), "e"), 5, "257.scl"),
                            "257.scl: error: interval classes are made for tunings of at most 256 "
                            "degrees; this one has 257");
    }
}

TEST_CASE("each key's resultant fit is computed by the resultant engine", "[compare]") {
    // A just scale on C (5-limit). Its C major triad is 4:5:6, whose difference and cubic
    // difference tones all fall on C or G (docs/references.md 5.2: just 4:5:6 on 264 Hz gives
    // f2-f1 = 66, 66, 132 and 2f1-f2 = 198, 264, 132); in 12-TET the difference tone of
    // C4-E4 alone is 67.374 c off (docs/references.md 5.2). So the just triad fits better. (Some
    // order-3 tones of 4:5:6, such as 2G-E = 7/4 C, land on no 5-limit note, so the just fit
    // is not 0: a property of the fit's definition in fit.hpp, not a defect here.)
    std::vector<Pitch> just;
    for (auto r : {Ratio(16, 15), Ratio(9, 8), Ratio(6, 5), Ratio(5, 4), Ratio(4, 3), Ratio(45, 32),
                   Ratio(3, 2), Ratio(8, 5), Ratio(5, 3), Ratio(9, 5), Ratio(15, 8)})
        just.push_back(Pitch::from_ratio(r));
    Scale ji("just", just, Pitch::from_ratio(Ratio(2)));
    KeyComparison j = compare_keys(ji, CompareOptions{}, "ji");
    KeyComparison e = compare_keys(test::equal_12(), CompareOptions{}, "et");
    REQUIRE(j.keys[0].fit);
    REQUIRE(e.keys[0].fit);
    CHECK(*j.keys[0].fit < *e.keys[0].fit);
    // Every 12-TET key is the same triad transposed, so every key has the same fit.
    for (const KeyReport& k : e.keys)
        CHECK(*k.fit == Approx(*e.keys[0].fit).margin(1e-6));
    REQUIRE(e.summary.mean_fit);
    CHECK(*e.summary.mean_fit == Approx(*e.keys[0].fit).margin(1e-6));
    CompareOptions off;
    off.fit = false;
    CHECK_FALSE(compare_keys(test::equal_12(), off, "et").keys[0].fit);
    CHECK_FALSE(compare_keys(test::equal_12(), off, "et").summary.mean_fit);
    CompareOptions bad;
    bad.fit_order = 13;
    REQUIRE_THROWS_WITH(compare_keys(test::equal_12(), bad, "et"),
                        "--order: error: order 13 is outside the allowed range 2 to 12");
}
