// Rendering: note frequencies, levels, envelopes, the stated limits with their messages, and
// `terzo render` end to end (the written file checked by sox, an independent reader).
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <unistd.h>

#include "core/analysis/audibility.hpp"
#include "core/arith/pitch.hpp"
#include "core/error.hpp"
#include "core/sound/level.hpp"
#include "core/sound/render.hpp"
#include "tests/sound/spectrum.hpp"
#include "tests/support/run.hpp"

using namespace terzo;
namespace fs = std::filesystem;

namespace {

Scale just_triad_scale() {
    return Scale("test", {Pitch::from_ratio(Ratio(5, 4)), Pitch::from_ratio(Ratio(3, 2))},
                 Pitch::from_ratio(Ratio(2)));
}

RenderSettings short_settings(Model m) {
    RenderSettings s;
    s.seconds = 0.5;
    s.model = m;
    return s;
}

} // namespace

TEST_CASE("note numbers continue into the periods above and below", "[render]") {
    const auto hz = note_frequencies(just_triad_scale(), {0, 1, 2, 3, 5, -1, -3}, 100.0);
    CHECK(hz[0] == Approx(100.0).epsilon(1e-12));
    CHECK(hz[1] == Approx(125.0).epsilon(1e-12));
    CHECK(hz[2] == Approx(150.0).epsilon(1e-12));
    CHECK(hz[3] == Approx(200.0).epsilon(1e-12));
    CHECK(hz[4] == Approx(300.0).epsilon(1e-12));
    CHECK(hz[5] == Approx(75.0).epsilon(1e-12));
    CHECK(hz[6] == Approx(50.0).epsilon(1e-12));
}

TEST_CASE("every render peaks exactly at the cap and starts and ends in silence", "[render]") {
    for (Model m : {Model::none, Model::poly, Model::oscillator, Model::predicted}) {
        RenderSettings s = short_settings(m);
        s.timbre.partials = 8;
        for (double cap : {-12.0, -30.0}) {
            s.peak_dbfs = cap;
            const auto y = render(just_triad_scale(), {0, 1, 2}, s);
            INFO("model " << model_name(m) << ", cap " << cap);
            CHECK(y.size() == 24000);
            CHECK(peak(y) == Approx(db_to_gain(cap)).epsilon(1e-12));
            CHECK(y.front() == 0.0);
            CHECK(y.back() == 0.0);
            // The fade-in: no sample of the attack rises above the ramp times the cap.
            const std::size_t a = std::size_t(s.envelope.attack_s * s.sample_rate);
            bool under_ramp = true;
            for (std::size_t i = 0; i < a; ++i)
                under_ramp = under_ramp &&
                             std::abs(y[i]) <= db_to_gain(cap) * ramp_gain(double(i) / a) + 1e-15;
            CHECK(under_ramp);
        }
    }
}

TEST_CASE("a render's fade-in makes no click", "[render]") {
    // A click is a jump: a tone switched on at its crest jumps by its full amplitude in one
    // sample. Under the raised-cosine attack no step between samples may exceed the largest
    // step of the steady tone by more than the ramp's own slope adds (pi / (2 * attack) against
    // the tone's 2 pi f, under 2 % here).
    RenderSettings s = short_settings(Model::poly);
    const auto y = render(just_triad_scale(), {0}, s);
    auto max_step = [&](std::size_t from, std::size_t to) {
        double m = 0;
        for (std::size_t i = from; i + 1 < to; ++i)
            m = std::max(m, std::abs(y[i + 1] - y[i]));
        return m;
    };
    const double steady = max_step(4800, 9600), attack = max_step(0, 2400);
    CHECK(attack <= 1.02 * steady);
    CHECK(std::abs(y[1]) < 1e-3 * steady); // the first steps are tiny, not a jump
}

TEST_CASE("render settings out of range are rejected with the option's name", "[render]") {
    const Scale sc = just_triad_scale();
    auto rejects = [&](auto change, const std::string& message, std::vector<int> notes = {0, 1}) {
        RenderSettings s;
        change(s);
        REQUIRE_THROWS_WITH(render(sc, notes, s), message);
    };
    SECTION("seconds") {
        rejects([](RenderSettings& s) { s.seconds = 60.5; },
                "--seconds: error: 60.5 is out of range; the duration in seconds must be between "
                "0.1 and 60");
        rejects([](RenderSettings& s) { s.seconds = 0.05; },
                "--seconds: error: 0.05 is out of range; the duration in seconds must be between "
                "0.1 and 60");
        rejects(
            [](RenderSettings& s) { s.seconds = 0.2; },
            "--seconds: error: 0.2 s is shorter than the fade-in and fade-out together (0.25 s)");
        RenderSettings ok;
        ok.seconds = 60;
        ok.model = Model::none;
        CHECK(render(sc, {0}, ok).size() == 60u * 48000u);
    }
    SECTION("notes") {
        rejects([](RenderSettings&) {}, "--notes: error: give at least one note", {});
        rejects([](RenderSettings&) {},
                "--notes: error: 17 notes is too many; at most 16 sound together",
                std::vector<int>(17, 0));
        RenderSettings ok = short_settings(Model::poly);
        CHECK_NOTHROW(render(sc, std::vector<int>(16, 1), ok));
        rejects([](RenderSettings&) {},
                "--notes: error: note 15 is at 8372.02 Hz, outside the playable range 20 to 8000 "
                "Hz at 48000 Hz",
                {0, 15});
        rejects([](RenderSettings& s) { s.ref_hz = 30; },
                "--notes: error: note -2 is at 18.75 Hz, outside the playable range 20 to 8000 Hz "
                "at 48000 Hz",
                {-1, -2});
        rejects([](RenderSettings& s) { s.sample_rate = 44100, s.ref_hz = 310; },
                "--notes: error: note 14 is at 7440 Hz, outside the playable range 20 to 7350 Hz "
                "at 44100 Hz",
                {14});
        ok.ref_hz = 310;
        CHECK_NOTHROW(render(sc, {14}, ok)); // 7440 Hz is playable at 48 kHz
    }
    SECTION("sample rate") {
        rejects([](RenderSettings& s) { s.sample_rate = 96000; },
                "--sample-rate: error: 96000 is not supported; use 44100 or 48000");
    }
    SECTION("partials and roll-off") {
        rejects([](RenderSettings& s) { s.timbre.partials = 65; },
                "--partials: error: 65 is out of range; the number of partials must be between 1 "
                "and 64");
        rejects([](RenderSettings& s) { s.timbre.partials = 0; },
                "--partials: error: 0 is out of range; the number of partials must be between 1 "
                "and 64");
        RenderSettings ok = short_settings(Model::poly);
        ok.timbre.partials = 64;
        CHECK_NOTHROW(render(sc, {0}, ok));
        rejects([](RenderSettings& s) { s.timbre.rolloff_db_per_octave = -1; },
                "--rolloff: error: -1 is out of range; the roll-off in dB per octave must be "
                "between 0 and 40");
    }
    SECTION("reference, ramps and peak") {
        rejects([](RenderSettings& s) { s.ref_hz = 5000; },
                "--ref-hz: error: 5000 is out of range; the frequency of degree 0 in Hz must be "
                "between 16 and 4000");
        rejects([](RenderSettings& s) { s.ref_hz = std::nan(""); },
                "--ref-hz: error: nan is out of range; the frequency of degree 0 in Hz must be "
                "between 16 and 4000");
        rejects([](RenderSettings& s) { s.envelope.attack_s = 0.001; },
                "--attack: error: 0.001 is out of range; the fade-in in seconds must be between "
                "0.005 and 10");
        rejects([](RenderSettings& s) { s.envelope.release_s = 11; },
                "--release: error: 11 is out of range; the fade-out in seconds must be between "
                "0.005 and 10");
        rejects([](RenderSettings& s) { s.peak_dbfs = -3; },
                "--peak-db: error: -3 is out of range; the peak level in dBFS must be between -60 "
                "and -6");
    }
    SECTION("model coefficients") {
        rejects([](RenderSettings& s) { s.polynomial.c2 = 1.5; },
                "--c2: error: 1.5 is out of range; c2 must be between -1 and 1");
        rejects([](RenderSettings& s) { s.polynomial.c3 = -2; },
                "--c3: error: -2 is out of range; c3 must be between -1 and 1");
        rejects([](RenderSettings& s) { s.model = Model::oscillator, s.oscillator.q = 30; },
                "--q: error: 30 is out of range; the quality factor Q must be between 0.5 and 20");
        rejects(
            [](RenderSettings& s) {
                s.model = Model::oscillator, s.oscillator.resonance_hz = 9000;
            },
            "--resonance-hz: error: 9000 is out of range; the resonance in Hz must be between 50 "
            "and 8000");
        rejects([](RenderSettings& s) { s.model = Model::predicted, s.predicted_db = 3; },
                "--predicted-db: error: 3 is out of range; the level of predicted tones in dB must "
                "be between -60 and 0");
        rejects([](RenderSettings& s) { s.model = Model::predicted, s.predicted_order = 7; },
                "--order: error: 7 is out of range; the order of predicted tones must be between 2 "
                "and 6");
        RenderSettings ok = short_settings(Model::predicted);
        ok.predicted_order = 6;
        CHECK_NOTHROW(
            render(sc, std::vector<int>{0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 0}, ok));
    }
}

TEST_CASE("the predicted model adds the engine's tones of a dyad at their stated levels",
          "[render]") {
    // 400 and 500 Hz on exact bins of a one-second rectangular window inside the steady part
    // of a 3 s render, measured with FFTW3. Expected frequencies a f1 + b f2 are computed here
    // independently; expected levels are predicted_db below a note times the engine's
    // audibility estimate, relative to the measured note level.
    const Scale sc("third", {Pitch::from_ratio(Ratio(5, 4))}, Pitch::from_ratio(Ratio(2)));
    RenderSettings s;
    s.ref_hz = 400;
    s.seconds = 3;
    s.model = Model::predicted;
    s.predicted_db = -20;
    const auto y = render(sc, {0, 1}, s);
    const auto spec = terzo::test::amplitude_spectrum(
        std::vector<double>(y.begin() + 48000, y.begin() + 96000), 48000);
    const double note = spec.at(400);
    CHECK(spec.at(500) == Approx(note).epsilon(1e-3));
    struct Line {
        int a, b;
    };
    for (Line l : {Line{-1, 1}, Line{1, 1}, Line{2, -1}, Line{-1, 2}, Line{2, 1}, Line{1, 2}}) {
        const double f = l.a * 400.0 + l.b * 500.0;
        const double expected = 0.1 * audibility(CombinationTerm{l.a, l.b}, 400, 500);
        INFO(l.a << " f1 + " << l.b << " f2 = " << f << " Hz");
        CHECK(std::abs(terzo::test::db(spec.at(f) / note / expected)) < 0.5);
    }
    CHECK(spec.at(300) / note ==
          Approx(0.1 * (1.5 - 1.25) / 0.3).epsilon(0.01)); // 2f1-f2 at ratio 5/4
    CHECK(spec.at(200) < 1e-6 * note); // 2 f1 is no combination tone and nothing adds it
}

TEST_CASE("the predicted model adds at most 512 tones, the loudest", "[render]") {
    std::vector<Pitch> cents;
    for (int i = 1; i < 12; ++i)
        cents.push_back(Pitch::from_cents(100.0 * i));
    const Scale twelve("twelve", cents, Pitch::from_ratio(Ratio(2)));
    const std::vector<int> notes{0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15};
    RenderSettings s;
    s.model = Model::predicted;
    s.predicted_order = 6;
    const auto all = predicted_partials(twelve, notes, s, 1.0);
    REQUIRE(all.size() == render_limits::max_predicted_tones);
    s.predicted_order = 2; // fewer candidates: every tone in range is kept
    const auto second = predicted_partials(twelve, notes, s, 1.0);
    CHECK(second.size() < render_limits::max_predicted_tones);
    // Order 2 gives difference tones (audibility estimate 0.5) and summation tones (0.1);
    // the order-6 candidates also hold hundreds of tones at the engine's 0.05 floor or below,
    // so keeping the loudest 512 must keep every order-2 tone.
    for (const Partial& p : second) {
        const bool kept = std::any_of(all.begin(), all.end(), [&](const Partial& q) {
            return q.frequency_hz == p.frequency_hz && q.amplitude == p.amplitude;
        });
        INFO(p.frequency_hz << " Hz");
        CHECK(kept);
    }
}

TEST_CASE("model names read and print the same way", "[render]") {
    for (Model m : {Model::none, Model::poly, Model::oscillator, Model::predicted})
        CHECK(parse_model(model_name(m)) == m);
    CHECK_FALSE(parse_model("Poly").has_value());
}

TEST_CASE("terzo render writes a WAV file, refuses to overwrite it and names bad options",
          "[render]") {
    test::ScratchFolder dir("render");
    const fs::path scl = dir.path / "third.scl";
    std::ofstream(scl) << "! third.scl\nA just third and fifth\n 3\n5/4\n3/2\n2/1\n";
    const std::string wav = (dir.path / "chord.wav").string();
    const std::string base = "render '" + scl.string() + "' --out '" + wav + "' ";

    test::RunResult r = test::run_terzo(base + "--notes 0,1,2 --seconds 1 --sample-rate 44100");
    REQUIRE(r.status == 0);
    CHECK(r.err.empty());
    CHECK(r.out == "wrote " + wav +
                       ": 1.000 s, 44100 Hz, int16, mono, model poly (c2 0.2, c3 0.3), "
                       "peak -12.0 dBFS\n\n"
                       "note       Hz\n"
                       "-------------\n"
                       "   0  261.626\n"
                       "   1  327.032\n"
                       "   2  392.438\n\n" +
                       std::string(hearing_caution()) + "\n");
    // The header as sox reads it: 44.1 kHz, mono, one second of samples, 16-bit.
    CHECK(test::run("sox --i -r '" + wav + "'").out == "44100\n");
    CHECK(test::run("sox --i -c '" + wav + "'").out == "1\n");
    CHECK(test::run("sox --i -s '" + wav + "'").out == "44100\n");
    CHECK(test::run("sox --i -b '" + wav + "'").out == "16\n");

    SECTION("an existing file is kept without --force and replaced with it") {
        const auto before = fs::file_size(wav);
        r = test::run_terzo(base + "--notes 0,1 --seconds 2");
        CHECK(r.status == 1);
        CHECK(r.out.empty());
        CHECK(
            r.err ==
            wav +
                ": error: already exists and was not changed; give --force to replace it\n");
        CHECK(fs::file_size(wav) == before);
        r = test::run_terzo(
            base + "--notes 0,1 --seconds 2 --force --model oscillator --sample-format float32");
        CHECK(r.status == 0);
        CHECK(fs::file_size(wav) > before);
    }
    SECTION("every model writes a file that sox reads with the requested header") {
        for (const std::string model : {"none", "poly", "oscillator", "predicted"}) {
            for (const std::string format : {"int16", "float32"}) {
                const std::string f = (dir.path / (model + "-" + format + ".wav")).string();
                r = test::run_terzo("render '" + scl.string() + "' --notes 0,1,2 --seconds 0.5 --model " +
                                model + " --sample-format " + format + " --out '" + f + "'");
                INFO(model << " " << format);
                CHECK(r.status == 0);
                CHECK(test::run("sox --i -s '" + f + "'").out == "24000\n");
                CHECK(test::run("sox --i -r '" + f + "'").out == "48000\n");
                CHECK(test::run("sox --i -e '" + f + "'").out ==
                      (format == "int16" ? "Signed Integer PCM\n" : "Floating Point PCM\n"));
            }
        }
    }
    SECTION("bad options leave no file and an empty stdout") {
        const std::string other = (dir.path / "other.wav").string();
        const std::string b2 = "render '" + scl.string() + "' --out '" + other + "' ";
        auto rejects = [&](const std::string& args, const std::string& err) {
            test::RunResult bad = test::run_terzo(b2 + args);
            CHECK(bad.status == 1);
            CHECK(bad.out.empty());
            CHECK(bad.err == err + "\n");
            CHECK_FALSE(fs::exists(other));
        };
        rejects("--notes 0,,1",
                "--notes: error: \"\" is not a degree number; write whole numbers separated by "
                "commas, such as 0,4,7");
        rejects("--notes 0,1.5",
                "--notes: error: \"1.5\" is not a degree number; write whole numbers separated "
                "by commas, such as 0,4,7");
        rejects("--notes 0,1234567",
                "--notes: error: \"1234567\" is not a degree number; write whole numbers "
                "separated by commas, such as 0,4,7");
        rejects("--notes 0 --model loud",
                "--model: error: \"loud\" is not a model; use none, poly, oscillator or predicted");
        rejects("--notes 0 --sample-format int24",
                "--sample-format: error: \"int24\" is not a sample format; use int16 or float32");
        rejects("--notes 0 --seconds 61", "--seconds: error: 61 is out of range; the duration in "
                                          "seconds must be between 0.1 and 60");
    }
}
