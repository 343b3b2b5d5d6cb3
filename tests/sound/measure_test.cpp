// Note finding and pitch measurement against synthetic recordings whose truth is known: every
// note's onset, damper and first-partial frequency are chosen by the test. The tones follow
// the stiff-string model f_k = k f0 sqrt(1 + B k^2) (H. Fletcher, J. Acoust. Soc. Am. 36(1),
// 1964, 203-209), decay, start with a burst of noise and sit on white noise 45 dB under the
// recording's peak. The target frequencies come from published temperaments in scales/
// (docs/references.md) laid over the keyboard by NoteMap, at A4 = 440 and A4 = 415 Hz.
#include <catch2/catch.hpp>

#include <cmath>

#include "core/analysis/sheet.hpp"
#include "core/tuning/scl.hpp"
#include "core/sound/measure.hpp"
#include "tests/sound/recording.hpp"

using namespace terzo;
using test::cents_between;

namespace {

std::vector<double> sine(double hz, double seconds, double rate, double amp = 0.5) {
    std::vector<double> x(std::size_t(seconds * rate));
    for (std::size_t i = 0; i < x.size(); ++i) x[i] = amp * std::sin(2 * M_PI * hz * double(i) / rate);
    return x;
}

// The temperament octave F3..F4 plus the A4 above (14 notes), each detuned by a known amount
// from the tuning's target, as a tuner finds an instrument before tuning it.
struct Detuned {
    std::vector<test::StringNote> notes;
    std::vector<double> true_hz;
};

Detuned detuned_octave(const Scale& scale, double a4_hz, double gap_s) {
    NoteMap map(scale, 0, PitchReference{NoteName{9, 4}, a4_hz}, "test");
    Detuned d;
    const double detune[] = {0.0, 3.2, -1.7, 7.5, -4.4, 0.9, -12.0, 2.5, 5.1, -0.6, 1.3, -2.8, 9.9, -6.1};
    int i = 0;
    for (int key = 53; key <= 65; ++key, ++i) {
        const double hz = map.hz(note_of_key(key)) * std::pow(2.0, detune[i] / 1200.0);
        d.true_hz.push_back(hz);
        d.notes.push_back({hz, 0.9, gap_s, -3.0 * (i % 3)});
    }
    const double hz = map.hz(NoteName{9, 4}) * std::pow(2.0, detune[i] / 1200.0);
    d.true_hz.push_back(hz);
    d.notes.push_back({hz, 0.9, gap_s, 0.0});
    return d;
}

} // namespace

TEST_CASE("YIN finds the period of a pure tone and of a tone without much fundamental",
          "[measure]") {
    // de Cheveigné and Kawahara 2002: the cumulative mean normalised difference dips near zero
    // at the period of a periodic sound.
    const double rate = 44100;
    auto x = sine(220.0, 0.2, rate);
    auto p = yin_pitch(x.data(), x.size(), rate, 27.0, 4200.0);
    REQUIRE(p);
    CHECK(std::abs(cents_between(p->hz, 220.0)) < 2.0);
    CHECK(p->aperiodicity < 0.01);

    // Partials 1..6 at 1/k: the period, not the strong second partial's.
    std::vector<double> y(8820, 0.0);
    for (int k = 1; k <= 6; ++k)
        for (std::size_t i = 0; i < y.size(); ++i)
            y[i] += (k == 1 ? 0.2 : 1.0 / k) * std::cos(2 * M_PI * 110.0 * k * double(i) / rate);
    p = yin_pitch(y.data(), y.size(), rate, 27.0, 4200.0);
    REQUIRE(p);
    CHECK(std::abs(cents_between(p->hz, 110.0)) < 2.0);

    SECTION("white noise has no period") {
        std::mt19937 rng(3);
        std::normal_distribution<double> g(0, 0.3);
        std::vector<double> z(8820);
        for (double& v : z) v = g(rng);
        CHECK_FALSE(yin_pitch(z.data(), z.size(), rate, 27.0, 4200.0));
    }
}

TEST_CASE("the stiff-string fit recovers the first partial and B of an inharmonic tone",
          "[measure]") {
    // One note, no noise: the fit must return the model's own parameters closely.
    for (double b : {0.0, 5e-5, 4e-4}) {
        test::StringSound s;
        s.inharmonicity = b;
        s.noise_db = -120;
        s.attack_noise_db = -200;
        auto r = test::string_recording({{261.6256, 1.2, 0.0, 0.0}}, s, 0.0);
        const std::size_t a = std::size_t(0.06 * s.sample_rate);
        auto e = estimate_pitch(r.samples.data() + a, std::size_t(s.sample_rate), s.sample_rate);
        REQUIRE(e);
        INFO("B = " << b);
        CHECK(std::abs(cents_between(e->hz, 261.6256)) < 0.02);
        CHECK(e->inharmonicity == Approx(b).margin(2e-6));
        CHECK(e->partials.size() >= 12);
        CHECK(e->confidence > 0.9);
    }
}

TEST_CASE("notes with silence between are found with their start and end times",
          "[measure]") {
    test::StringSound s;
    s.sample_rate = 44100;
    std::vector<test::StringNote> notes = {
        {196.0, 0.8, 0.4, 0.0}, {293.66, 0.6, 0.5, -6.0}, {440.0, 1.0, 0.3, -12.0}};
    auto r = test::string_recording(notes, s);
    auto found = find_notes(r.samples, s.sample_rate);
    REQUIRE(found.size() == 3);
    for (std::size_t i = 0; i < 3; ++i) {
        INFO("note " << i);
        CHECK(found[i].start_s == Approx(r.onset_s[i]).margin(0.01));
        // The end: the damper's 30 ms fall takes the note under the noise level.
        CHECK(found[i].end_s == Approx(r.damper_s[i] + 0.03).margin(0.05));
    }

    SECTION("silence and steady noise hold no notes") {
        std::vector<double> quiet(44100 * 2, 0.0);
        CHECK(find_notes(quiet, 44100).empty());
        std::mt19937 rng(5);
        std::normal_distribution<double> g(0, 0.01);
        for (double& v : quiet) v = g(rng);
        CHECK(find_notes(quiet, 44100).empty());
        CHECK(measure_notes(quiet, 44100).empty());
    }
}

TEST_CASE("three temperaments at two pitch standards are measured within 0.3 cents",
          "[measure]") {
    // Equal temperament, quarter-comma meantone and Werckmeister III from scales/ (sources in
    // their comment lines), at A4 = 440 and A4 = 415, notes detuned by known amounts; half the
    // recordings play the notes one after another (the damper ends each at the next onset),
    // half with silence between. Every note must be found once and its first partial measured
    // within 0.3 cents.
    const char* files[] = {"equal-12.scl", "meantone-quarter-comma.scl", "werckmeister-iii.scl"};
    int run = 0;
    for (const char* file : files) {
        const Scale scale = read_scl_file(std::string(TERZO_SOURCE_DIR) + "/scales/" + file);
        for (double a4 : {440.0, 415.0}) {
            const double gap = run % 2 == 0 ? 0.0 : 0.25;
            Detuned d = detuned_octave(scale, a4, gap);
            test::StringSound s;
            s.sample_rate = run % 3 == 0 ? 44100 : 48000;
            s.inharmonicity = 2e-5 * (1 + run);
            s.seed = std::uint32_t(10 + run);
            auto r = test::string_recording(d.notes, s);
            auto notes = measure_notes(r.samples, s.sample_rate);
            INFO(file << " at A4 = " << a4 << ", gap " << gap << " s");
            REQUIRE(notes.size() == d.true_hz.size());
            for (std::size_t i = 0; i < notes.size(); ++i) {
                INFO("note " << i << " true " << d.true_hz[i] << " measured " << notes[i].pitch.hz);
                // Within 15 ms: back to back, the damped note and the new one overlap.
                CHECK(notes[i].span.start_s == Approx(r.onset_s[i]).margin(0.015));
                const double err = cents_between(notes[i].pitch.hz, d.true_hz[i]);
                CHECK(std::abs(err) < 0.3);
                CHECK(notes[i].pitch.inharmonicity == Approx(s.inharmonicity).margin(1e-5));
            }
            ++run;
        }
    }
}

TEST_CASE("measuring rejects a sample rate that is not positive", "[measure]") {
    std::vector<double> x(100, 0.0);
    CHECK_THROWS_AS(measure_notes(x, 0.0), std::invalid_argument);
    CHECK_THROWS_AS(find_notes(x, -1.0), std::invalid_argument);
}

TEST_CASE("the live check measures the last stretch of sound fed to it in pieces",
          "[measure]") {
    test::StringSound s;
    s.sample_rate = 48000;
    auto r = test::string_recording({{220.0, 1.5, 0.0, 0.0}}, s, 0.5);
    LivePitch live(s.sample_rate, 0.4);
    std::size_t fed = 0;
    auto feed_until = [&](double t) {
        const std::size_t end = std::min(r.samples.size(), std::size_t(t * s.sample_rate));
        while (fed < end) { // in pieces of 441 samples, as a capture device delivers them
            const std::size_t n = std::min<std::size_t>(441, end - fed);
            live.feed(r.samples.data() + fed, n);
            fed += n;
        }
    };
    feed_until(0.3);
    CHECK_FALSE(live.measure()); // not yet 0.4 s
    feed_until(0.45);
    CHECK_FALSE(live.measure()); // the background noise alone: quiet
    feed_until(1.2);
    auto p = live.measure();
    REQUIRE(p);
    CHECK(std::abs(cents_between(p->hz, 220.0)) < 0.3);
    live.clear();
    CHECK_FALSE(live.measure());
}
