#include <catch2/catch.hpp>

#include <algorithm>

#include "core/analysis/combination.hpp"
#include "helpers.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;

namespace {

// A tone with its exact value materialised: the engine keeps only which kind it has and
// computes the value on request (DyadExact), so the tests ask for it here.
struct ExactTone : Tone {
    std::optional<Ratio> ratio;
    std::optional<PrimeVector> vector;
    std::optional<Pitch> exact_value() const {
        if (ratio) return Pitch::from_ratio(*ratio);
        if (vector) return Pitch::from_vector(*vector);
        return std::nullopt;
    }
};

template <class T>
const T* find(const std::vector<T>& tones, int a, int b, int i = 1, int j = 1) {
    for (const auto& t : tones)
        if (t.term.a == a && t.term.b == b && t.low_partial == i && t.high_partial == j) return &t;
    return nullptr;
}

std::vector<ExactTone> tones_of(const Keyboard& kb, const Note& lo, const Note& hi, int order, int partials = 1) {
    ToneOptions o;
    o.order = order;
    o.partials = partials;
    const DyadExact exact = lo.cents > hi.cents ? DyadExact(hi, lo) : DyadExact(lo, hi);
    std::vector<ExactTone> out;
    for (const Tone& t : dyad_tones(kb, lo, hi, o)) {
        ExactTone e;
        static_cast<Tone&>(e) = t;
        e.ratio = exact.ratio(t);
        if (t.exact == ExactKind::vector) e.vector = exact.value(t)->vector();
        out.push_back(e);
    }
    return out;
}

} // namespace

TEST_CASE("combination terms carry the names practitioners use", "[combination]") {
    // docs/references.md section 5: f2-f1 the (quadratic) difference tone, 2f1-f2 the cubic
    // difference tone, f1+f2 the summation tone.
    CHECK(CombinationTerm{-1, 1}.name() == "difference tone");
    CHECK(CombinationTerm{2, -1}.name() == "cubic difference tone");
    CHECK(CombinationTerm{1, 1}.name() == "summation tone");
    CHECK(CombinationTerm{3, -2}.name() == "3L-2H");
    CHECK(CombinationTerm{-1, 2}.name() == "2H-L");
    CHECK(CombinationTerm{2, 1}.name() == "2L+H");
    CHECK(CombinationTerm{3, -2}.order() == 5);
}

TEST_CASE("terms come by order, both coefficients non-zero, never both negative", "[combination]") {
    auto t = combination_terms(3);
    std::vector<std::pair<int, int>> ab;
    for (auto x : t) ab.push_back({x.a, x.b});
    CHECK(ab == std::vector<std::pair<int, int>>{
                    {1, 1}, {1, -1}, {-1, 1}, {2, 1}, {2, -1}, {1, 2}, {1, -2}, {-1, 2}, {-2, 1}});
    // 4(k-1) terms of order k have both coefficients non-zero; (k-1) of them are both negative.
    CHECK(combination_terms(5).size() == 3 * (1 + 2 + 3 + 4));
}

TEST_CASE("combination frequencies match the worked examples of docs/references.md", "[combination]") {
    // docs/references.md section 5.2 [C] (constructed, recomputed with python3).
    SECTION("400 and 500 Hz (5:4)") {
        Keyboard kb(test::ratio_scale({{5, 4}}), 400.0);
        auto t = tones_of(kb, kb.note(0, 0), kb.note(1, 0), 5);
        CHECK_THAT(find(t, -1, 1)->hz, WithinAbs(100, 1e-9));
        CHECK_THAT(find(t, 2, -1)->hz, WithinAbs(300, 1e-9));
        CHECK_THAT(find(t, 3, -2)->hz, WithinAbs(200, 1e-9));
        CHECK_THAT(find(t, -1, 2)->hz, WithinAbs(600, 1e-9));
        CHECK_THAT(find(t, 1, 1)->hz, WithinAbs(900, 1e-9));
        CHECK_THAT(find(t, 2, 1)->hz, WithinAbs(1300, 1e-9));
        CHECK_THAT(find(t, 1, 2)->hz, WithinAbs(1400, 1e-9));
        CHECK(find(t, 3, -2)->ratio == Ratio(1, 2));
        CHECK(find(t, -1, 1)->ratio == Ratio(1, 4));
    }
    SECTION("440 and 660 Hz (3:2): 3f1-2f2 is zero and absent, f2-f1 = 2f1-f2 = 220 Hz") {
        Keyboard kb(test::ratio_scale({{3, 2}}), 440.0);
        auto t = tones_of(kb, kb.note(0, 0), kb.note(1, 0), 5);
        CHECK(find(t, 3, -2) == nullptr);
        CHECK(find(t, -1, 1)->ratio == Ratio(1, 2));
        CHECK(find(t, 2, -1)->ratio == Ratio(1, 2));
        CHECK_THAT(find(t, 2, -1)->hz, WithinAbs(220, 1e-9));
    }
    SECTION("1800 and 2000 Hz: the cubic difference tone is 1600 Hz (matches Colman)") {
        Keyboard kb(test::ratio_scale({{10, 9}}), 1800.0);
        auto t = tones_of(kb, kb.note(0, 0), kb.note(1, 0), 3);
        CHECK_THAT(find(t, 2, -1)->hz, WithinAbs(1600, 1e-9));
    }
    SECTION("12-TET A4-E5: f2-f1 and 2f1-f2 differ by the fifth's beat rate 1.4898 Hz") {
        Keyboard kb(test::equal_division(12), 440.0);
        auto t = tones_of(kb, kb.note(0, 0), kb.note(7, 0), 5);
        CHECK_THAT(find(t, -1, 1)->hz, WithinAbs(219.2551, 1e-4));
        CHECK_THAT(find(t, 2, -1)->hz, WithinAbs(220.7449, 1e-4));
        CHECK_THAT(find(t, 3, -2)->hz, WithinAbs(1.4898, 1e-4));
        CHECK_FALSE(find(t, 3, -2)->ratio);
    }
    SECTION("12-TET C4-E4") {
        Keyboard kb(test::equal_division(12), default_ref_hz);
        auto t = tones_of(kb, kb.note(0, 0), kb.note(4, 0), 3);
        CHECK_THAT(find(t, -1, 1)->hz, WithinAbs(68.0020, 1e-4));
        CHECK_THAT(find(t, 2, -1)->hz, WithinAbs(193.6236, 1e-4));
        CHECK_THAT(find(t, -1, 2)->hz, WithinAbs(397.6295, 1e-4));
        CHECK_THAT(find(t, 1, 1)->hz, WithinAbs(591.2531, 1e-4));
        CHECK_THAT(find(t, 2, 1)->hz, WithinAbs(852.8787, 1e-4));
        CHECK_THAT(find(t, 1, 2)->hz, WithinAbs(920.8807, 1e-4));
    }
}

TEST_CASE("in a just major triad 4:5:6 every difference tone lands exactly on the root's pitch class", "[combination]") {
    // Common practice; docs/references.md section 5.2: on 264 Hz the pairs give f2-f1 = 66, 66, 132 Hz.
    Keyboard kb(test::ratio_scale({{5, 4}, {3, 2}}), 264.0);
    const Note n[] = {kb.note(0, 0), kb.note(1, 0), kb.note(2, 0)};
    const double want[3][3] = {{0, 66, 132}, {0, 0, 66}};
    for (int i = 0; i < 3; ++i)
        for (int j = i + 1; j < 3; ++j) {
            auto t = tones_of(kb, n[i], n[j], 2);
            const auto* d = find(t, -1, 1);
            REQUIRE(d);
            CHECK_THAT(d->hz, WithinAbs(want[i][j], 1e-9));
            CHECK(d->landing.degree == 0);
            CHECK(d->landing.exact);
            CHECK(d->landing.deviation_cents == 0.0);
        }
}

TEST_CASE("the difference tone of a 12-TET major third misses the scale by 32.6 cents", "[combination]") {
    // docs/references.md section 5.2: for C4-E4, f2-f1 = 68.0020 Hz, 67.374 c above C2 (the just
    // third's difference tone). python3: 1200*log2(2**(1/3) - 1) + 2400 = 67.374. The nearest
    // 12-TET degree is therefore C#2, 100 - 67.374 = 32.626 c above the tone. (The "about
    // 14 cents" often quoted for the tempered third is the third's own error against 5/4,
    // +13.686 c, docs/references.md section 1, not where its difference tone lands.)
    Keyboard kb(test::equal_division(12));
    auto t = tones_of(kb, kb.note(0, 0), kb.note(4, 0), 2);
    const auto* d = find(t, -1, 1);
    CHECK(d->landing.degree == 1);
    CHECK(d->landing.period == -2);
    CHECK_THAT(d->landing.deviation_cents, WithinAbs(67.374 - 100.0, 1e-3));
    CHECK_FALSE(d->landing.exact);
    CHECK_FALSE(d->ratio);
    CHECK_FALSE(d->vector);
    CHECK_THAT(d->cents + 2400.0, WithinAbs(67.374, 1e-3));
}

TEST_CASE("the cubic difference tone of a just fifth 2:3 lands exactly on 1:1", "[combination]") {
    // 2*2 - 3 = 1 (docs/references.md section 5.2: 440 and 660 Hz give 2f1-f2 = 220 Hz).
    Keyboard kb(test::just12());
    auto t = tones_of(kb, kb.note(0, 0), kb.note(7, 0), 3);
    const auto* c = find(t, 2, -1);
    CHECK(c->ratio == Ratio(1, 2));
    CHECK(c->landing.degree == 0);
    CHECK(c->landing.period == -1);
    CHECK(c->landing.exact);
}

TEST_CASE("tempered dyads with a rational ratio give exact tempered tones", "[combination]") {
    // E4 and E5 of 12-TET: 2^(1/3) and 2^(4/3); the difference tone is E4 itself, exactly.
    Keyboard kb(test::equal_division(12), default_ref_hz, 2);
    auto t = tones_of(kb, kb.note(4, 0), kb.note(4, 1), 3);
    const auto* d = find(t, -1, 1);
    REQUIRE(d->vector);
    CHECK(d->vector->str() == "2^(1/3)");
    CHECK_FALSE(d->ratio);
    CHECK(d->landing.exact);
    CHECK(d->landing.degree == 4);
    CHECK(d->landing.period == 0);
    const auto* s = find(t, 1, 1); // 3 * 2^(1/3): a tempered value that is no note
    REQUIRE(s->vector);
    CHECK_FALSE(s->landing.exact);
    CHECK(s->exact_value()->str() == "2^(1/3)*3");
    SECTION("the same dyad from cents-only degrees is never exact") {
        Keyboard c(test::equal_division_cents(12), default_ref_hz, 2);
        auto u = tones_of(c, c.note(4, 0), c.note(4, 1), 3);
        CHECK_FALSE(find(u, -1, 1)->landing.exact);
        CHECK_THAT(find(u, -1, 1)->landing.deviation_cents, WithinAbs(0.0, 1e-9));
        CHECK(find(u, -2, 1) == nullptr); // 2f_high - ... zero in exact terms: removed, not noise
    }
}

TEST_CASE("tones between partials say which partials made them", "[combination]") {
    Keyboard kb(test::just12());
    auto t = tones_of(kb, kb.note(0, 0), kb.note(7, 0), 2, 2);
    // partial 2 of 1/1 (2/1) minus partial 1 of 3/2 gives 1/2, term (1,-1) of partials 2 x 1.
    const auto* x = find(t, 1, -1, 2, 1);
    REQUIRE(x);
    CHECK(x->ratio == Ratio(1, 2));
    CHECK(x->landing.exact);
    CHECK(find(t, 1, -1, 1, 1) == nullptr); // 1 - 3/2 < 0
    CHECK(find(t, 1, 1, 2, 2)->ratio == Ratio(5));
}

TEST_CASE("the exact and floating-point paths agree on frequencies and landings", "[combination]") {
    Keyboard kb(test::just12(), 27.5, 3);
    ToneOptions e, f;
    e.order = f.order = 5;
    f.exact = false;
    auto a = keyboard_tones(kb, e), b = keyboard_tones(kb, f);
    REQUIRE(a.size() == b.size());
    std::size_t exact = 0;
    for (std::size_t i = 0; i < a.size(); ++i) {
        REQUIRE(a[i].tones.size() == b[i].tones.size());
        for (const Tone& x : a[i].tones) {
            // Tones of equal frequency may swap places in floating point: match by term.
            const auto* yp = find(b[i].tones, x.term.a, x.term.b);
            REQUIRE(yp);
            const Tone& y = *yp;
            REQUIRE(std::fabs(x.hz / y.hz - 1) < 1e-9);
            REQUIRE(x.landing.degree == y.landing.degree);
            REQUIRE(x.landing.period == y.landing.period);
            REQUIRE_FALSE(y.landing.exact);
            REQUIRE(y.exact == ExactKind::none);
            exact += x.landing.exact;
        }
    }
    CHECK(exact > 1000); // a just scale's resultants land exactly very often
}

TEST_CASE("Helmholtz's ladder of difference tones is expressed as combination terms", "[combination]") {
    // Level 1 f2-f1; level 2 its difference with a primary; and so on (Helmholtz, On the
    // Sensations of Tone, Part II ch. VII, as described in docs/references.md section 5.1).
    auto h = helmholtz_ladder(400, 500, 5);
    REQUIRE(h.size() >= 4);
    CHECK(h[0].term == CombinationTerm{-1, 1});
    CHECK(h[0].level == 1);
    CHECK(h[1].term == CombinationTerm{2, -1}); // 400 - 100 = 300 Hz
    CHECK(h[1].level == 2);
    CHECK(h[2].term == CombinationTerm{-2, 2}); // 500 - 300 = 200 Hz
    CHECK(h[2].level == 3);
    CHECK(h[3].term == CombinationTerm{3, -2}); // 400 - 200 = 200 Hz
    CHECK(h[3].level == 4);
    // Wider than an octave (300 and 1000 Hz) the second level is f2 - 2 f1 instead.
    auto w = helmholtz_ladder(300, 1000, 3);
    CHECK(w[1].term == CombinationTerm{-2, 1}); // 700 - 300 = 400 Hz
}

TEST_CASE("options outside their limits are rejected, naming the option", "[combination]") {
    Keyboard kb(test::just12());
    ToneOptions o;
    o.order = 1;
    REQUIRE_THROWS_WITH(keyboard_tones(kb, o), "--order: error: order 1 is outside the allowed range 2 to 12");
    o.order = 13;
    REQUIRE_THROWS_WITH(keyboard_tones(kb, o), "--order: error: order 13 is outside the allowed range 2 to 12");
    o.order = 3;
    o.partials = 0;
    REQUIRE_THROWS_WITH(keyboard_tones(kb, o), "--partials: error: partials 0 is outside the allowed range 1 to 32");
    o.partials = 33;
    REQUIRE_THROWS_WITH(dyad_tones(kb, kb.note(0, 0), kb.note(1, 0), o),
                        "--partials: error: partials 33 is outside the allowed range 1 to 32");
    SECTION("the total number of tones is bounded") {
        Keyboard wide(test::just12(), 27.5, 11); // 133 notes, 8778 dyads
        ToneOptions big;
        big.order = 12;
        big.partials = 4; // 198 terms x 16 partial pairs: 27808704 tones
        REQUIRE_THROWS_WITH(keyboard_tones(wide, big),
                            "--order: error: this request could compute 27808704 tones (8778 dyads), more than "
                            "the limit of 20000000; lower --order, --span or --partials");
        CHECK(tone_count_bound(8778, big) == 27808704);
        big.order = 3;
        big.partials = 32;
        CHECK_THROWS_AS(keyboard_tones(wide, big), InputError);
        big.partials = 1;
        CHECK(keyboard_tones(wide, big).size() == 8778);
    }
}
