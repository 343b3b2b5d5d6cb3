// The driven nonlinear oscillator against perturbation theory for a forced anharmonic
// oscillator, with FFTW3 measuring the amplitudes of the simulated response.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <complex>

#include "core/error.hpp"
#include "core/sound/oscillator.hpp"
#include "core/sound/synth.hpp"
#include "tests/sound/spectrum.hpp"

using namespace terzo;

namespace {

// Perturbation theory for x'' + gamma x' + w0^2 x + alpha x^2 = f1 cos w1 t + f2 cos w2 t
// (L. D. Landau and E. M. Lifshitz, Mechanics, section 29 "Anharmonic oscillations", from
// memory; there with damping written 2 lambda). First order: the linear response
//   x1 = a1 cos(w1 t + p1) + a2 cos(w2 t + p2),  a_i = f_i / |D(w_i)|,
//   D(w) = w0^2 - w^2 + i gamma w.
// Second order: x2'' + gamma x2' + w0^2 x2 = -alpha x1^2, and x1^2 holds a1 a2 cos((w2-w1) t + ...)
// (cos a cos b = (cos(a-b) + cos(a+b))/2), so the difference tone has amplitude
//   alpha a1 a2 / |D(w2 - w1)|,
// the summation tone the same with D(w1 + w2), and 2 w1 has alpha a1^2 / (2 |D(2 w1)|).
// terzo's form x'' + gamma x' + w0^2 (x + c2 x^2) = w0^2 u has f_i = w0^2 A_i, alpha = w0^2 c2.
struct Theory {
    double w0, gamma, alpha;
    double response(double w) const {
        return 1.0 / std::abs(std::complex<double>(w0 * w0 - w * w, gamma * w));
    }
};

// Drives the oscillator with A1 cos(2 pi f1 t) + A2 cos(2 pi f2 t) (whole hertz) for 1.5 s
// at sample rate fs and returns the spectrum of the last second: by then the start-up transient has
// decayed (by exp(-gamma t / 2), under 1e-100 here) and the response is periodic in one second, so
// every line sits on a bin of the rectangular window.
terzo::test::Spectrum steady_spectrum(const Oscillator& osc, double f1, double A1, double f2,
                                      double A2, int fs = 48000) {
    const std::vector<double> u = synthesize({{f1, A1}, {f2, A2}}, std::size_t(1.5 * fs), fs);
    const std::vector<double> x = drive_oscillator(u, osc, fs);
    return terzo::test::amplitude_spectrum(std::vector<double>(x.begin() + fs / 2, x.end()), fs);
}

void check_against_theory(const Oscillator& osc, double f1, double A1, double f2, double A2,
                          int fs = 48000) {
    const double w0 = 2 * M_PI * osc.resonance_hz;
    const Theory t{w0, w0 / osc.q, w0 * w0 * osc.c2};
    const auto s = steady_spectrum(osc, f1, A1, f2, A2, fs);
    const double w1 = 2 * M_PI * f1, w2 = 2 * M_PI * f2;
    const double a1 = w0 * w0 * A1 * t.response(w1), a2 = w0 * w0 * A2 * t.response(w2);
    // First order: the tones themselves (the integrator's frequency warp is 0.04 % here).
    CHECK(s.at(f1) == Approx(a1).epsilon(0.005));
    CHECK(s.at(f2) == Approx(a2).epsilon(0.005));
    // Second order, the required check: the difference tone within 5 %.
    const double diff = t.alpha * a1 * a2 * t.response(w2 - w1);
    INFO("difference tone: theory " << diff << ", simulated " << s.at(f2 - f1));
    CHECK(std::abs(s.at(f2 - f1) / diff - 1.0) < 0.05);
    // The other second-order lines, same tolerance.
    CHECK(std::abs(s.at(f1 + f2) / (t.alpha * a1 * a2 * t.response(w1 + w2)) - 1.0) < 0.05);
    CHECK(std::abs(s.at(2 * f1) / (t.alpha * a1 * a1 / 2 * t.response(2 * w1)) - 1.0) < 0.05);
}

} // namespace

TEST_CASE("for small k the oscillator's difference tone matches second-order perturbation theory",
          "[oscillator]") {
    SECTION("a broad resonance above the tones (the default shape)") {
        check_against_theory(Oscillator{2000, 0.7, 1e-3, 0}, 400, 0.5, 500, 0.3);
    }
    SECTION("a sharper resonance between the tones and their difference") {
        check_against_theory(Oscillator{600, 5, 1e-3, 0}, 400, 0.4, 500, 0.4);
    }
    SECTION("at 44.1 kHz, a fourth 330 + 440 Hz, k ten times larger") {
        check_against_theory(Oscillator{1500, 1, 1e-2, 0}, 330, 0.5, 440, 0.5, 44100);
    }
}

TEST_CASE("the difference tone grows in proportion to k while k is small", "[oscillator]") {
    const auto s1 = steady_spectrum(Oscillator{2000, 0.7, 1e-3, 0}, 400, 0.5, 500, 0.5);
    const auto s2 = steady_spectrum(Oscillator{2000, 0.7, 2e-3, 0}, 400, 0.5, 500, 0.5);
    CHECK(s2.at(100) / s1.at(100) == Approx(2.0).epsilon(0.001));
}

TEST_CASE("without nonlinear terms the oscillator adds no combination tones", "[oscillator]") {
    const auto s = steady_spectrum(Oscillator{2000, 0.7, 0, 0}, 400, 0.5, 500, 0.5);
    CHECK(s.at(100) < 1e-12);
    CHECK(s.at(300) < 1e-12);
}

TEST_CASE("the cubic term of the oscillator makes the cubic difference tone 2 f1 - f2",
          "[oscillator]") {
    // 400 and 510 Hz: an odd nonlinearity makes only terms a f1 + b f2 with a + b odd, and
    // the lowest such term on 110 Hz = f2 - f1 has order 89 (-52 f1 + 41 f2), so nothing
    // measurable may appear there, while 2 f1 - f2 = 290 Hz is a third-order term.
    const auto s = steady_spectrum(Oscillator{2000, 0.7, 0, 0.3}, 400, 0.5, 510, 0.5);
    CHECK(s.at(290) > 1e-2 * s.at(400));
    CHECK(s.at(110) < 1e-9 * s.at(400));
}

TEST_CASE("the oscillator starts at rest and follows a slow input with gain 1", "[oscillator]") {
    std::vector<double> u(48000, 0.25);
    const auto x = drive_oscillator(u, Oscillator{2000, 0.7, 0, 0}, 48000);
    CHECK(std::abs(x[0]) < 0.25);
    CHECK(x.back() == Approx(0.25).epsilon(1e-9));
}

TEST_CASE("a drive past the quadratic model's barrier is reported, not written", "[oscillator]") {
    // x + x^2 = u has no solution for u < -1/4: the potential has no minimum to settle in.
    std::vector<double> u(4800, -0.5);
    REQUIRE_THROWS_MATCHES(
        drive_oscillator(u, Oscillator{2000, 0.7, 1.0, 0}, 48000), InputError,
        Catch::Matchers::Message(
            "--model: error: the oscillator model diverged at 0.001 s; use a smaller "
            "quadratic coefficient c2 or a larger cubic coefficient c3 (c2^2 <= 3 c3 "
            "never diverges)"));
}

TEST_CASE("the default oscillator stays bounded at full drive at every allowed Q", "[oscillator]") {
    // c2^2 <= 3 c3 makes the restoring force grow monotonically, so there is no second well.
    // A bound from the model itself: the stiffness (x + c2 x^2 + c3 x^3) / x never falls below
    // 1 - c2^2 / (4 c3) (the minimum of the quadratic 1 + c2 x + c3 x^2), so the output is at
    // most the input's peak over that, times the resonance's gain (at most max(1, Q) for a
    // second-order system; common practice, no source), times 2 for the start-up transient of
    // an input that starts at full level.
    std::vector<double> u = synthesize({{200, 0.5}, {300, 0.5}}, 48000, 48000);
    double input_peak = 0;
    for (double v : u) input_peak = std::max(input_peak, std::abs(v));
    for (double q : {0.5, 0.7, 5.0, 20.0}) {
        Oscillator o;
        o.q = q;
        const double stiffness = 1 - o.c2 * o.c2 / (4 * o.c3);
        const double bound = 2 * std::max(1.0, q) * input_peak / stiffness;
        for (double f0 : {250.0, 2000.0}) {
            o.resonance_hz = f0;
            const auto x = drive_oscillator(u, o, 48000);
            REQUIRE(x.size() == u.size());
            double peak = 0;
            bool finite = true;
            for (double v : x) {
                finite = finite && std::isfinite(v);
                peak = std::max(peak, std::abs(v));
            }
            INFO("Q " << q << ", resonance " << f0 << " Hz: peak " << peak << ", bound " << bound);
            CHECK(finite);
            CHECK(peak <= bound);
            CHECK(peak >= 0.25 * input_peak); // it passes the input on: not a silent output
        }
    }
}
