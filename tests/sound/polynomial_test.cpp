// Spectrum checks of the polynomial model against the closed-form expansion of
// (A1 cos w1 t + A2 cos w2 t)^2 and ^3, with FFTW3 as the spectrum analyser.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <map>

#include "core/arith/pitch.hpp"
#include "core/sound/polynomial.hpp"
#include "core/sound/render.hpp"
#include "core/sound/synth.hpp"
#include "tests/sound/spectrum.hpp"

using namespace terzo;
using terzo::test::db;

namespace {

// The line spectrum of y = x + c2 x^2 + c3 x^3 for x = A1 cos a + A2 cos b, from
//   cos^2 a = (1 + cos 2a) / 2,   cos^3 a = (3 cos a + cos 3a) / 4,
//   cos a cos b = (cos(a - b) + cos(a + b)) / 2
// (product and multiple-angle formulas, Abramowitz & Stegun, Handbook of Mathematical
// Functions (1964), section 4.3, from memory; equation numbers not checked). Expanding:
//   x^2 = (A1^2 + A2^2)/2 + A1^2/2 cos 2a + A2^2/2 cos 2b + A1 A2 [cos(b - a) + cos(a + b)]
//   x^3 = (3/4 A1^3 + 3/2 A1 A2^2) cos a + (3/4 A2^3 + 3/2 A1^2 A2) cos b
//       + A1^3/4 cos 3a + A2^3/4 cos 3b
//       + 3/4 A1^2 A2 [cos(2a - b) + cos(2a + b)] + 3/4 A1 A2^2 [cos(2b - a) + cos(2b + a)]
// Every term is a cosine with zero phase, so terms landing on the same frequency add, and
// cos(-t) = cos t folds negative frequencies onto positive ones.
std::map<double, double> expected_lines(double f1, double f2, double A1, double A2,
                                        const Polynomial& p) {
    struct Term {
        int a, b;
        double coef;
    };
    const double c2 = p.c2, c3 = p.c3;
    const Term terms[] = {
        {1, 0, A1},
        {0, 1, A2},
        {0, 0, c2 * (A1 * A1 + A2 * A2) / 2},
        {2, 0, c2 * A1 * A1 / 2},
        {0, 2, c2 * A2 * A2 / 2},
        {-1, 1, c2 * A1 * A2},
        {1, 1, c2 * A1 * A2},
        {1, 0, c3 * (0.75 * A1 * A1 * A1 + 1.5 * A1 * A2 * A2)},
        {0, 1, c3 * (0.75 * A2 * A2 * A2 + 1.5 * A1 * A1 * A2)},
        {3, 0, c3 * A1 * A1 * A1 / 4},
        {0, 3, c3 * A2 * A2 * A2 / 4},
        {2, -1, 0.75 * c3 * A1 * A1 * A2},
        {2, 1, 0.75 * c3 * A1 * A1 * A2},
        {-1, 2, 0.75 * c3 * A1 * A2 * A2},
        {1, 2, 0.75 * c3 * A1 * A2 * A2},
    };
    std::map<double, double> lines;
    for (const Term& t : terms)
        lines[std::abs(t.a * f1 + t.b * f2)] += t.coef;
    return lines;
}

// Every bin of the spectrum: the expected lines within 0.5 dB, everything else more than
// 80 dB below the strongest line. Frequencies are whole hertz and the analysis is exactly
// one second long, so every line sits on a bin and a rectangular window has no leakage at
// all: by the orthogonality of the DFT's basis, a whole number of cycles contributes to its
// own bin only. What is left in other bins is the synthesis's own error.
void check_exact_bins(double f1, double f2, double A1, double A2, const Polynomial& p) {
    const double fs = 48000;
    std::vector<double> x = synthesize({{f1, A1}, {f2, A2}}, 48000, fs);
    apply_polynomial(x, p);
    const auto s = terzo::test::amplitude_spectrum(x, fs);
    const auto lines = expected_lines(f1, f2, A1, A2, p);
    double strongest = 0;
    for (auto [f, a] : lines)
        strongest = std::max(strongest, std::abs(a));
    for (auto [f, a] : lines) {
        INFO("line at " << f << " Hz: expected " << a << ", measured " << s.at(f));
        CHECK(std::abs(db(s.at(f) / std::abs(a))) <= 0.5);
    }
    double worst_other = 0;
    for (std::size_t k = 0; k < s.amplitude.size(); ++k)
        if (!lines.count(double(k) * s.bin_hz)) worst_other = std::max(worst_other, s.amplitude[k]);
    INFO("strongest non-line bin " << db(worst_other / strongest) << " dB");
    CHECK(worst_other < strongest * 1e-4);
}

} // namespace

TEST_CASE("the polynomial model puts every combination term up to order 3 at its closed-form level",
          "[polynomial]") {
    SECTION("a major third 440 + 550 Hz, unequal amplitudes, no two terms on one frequency") {
        check_exact_bins(440, 550, 0.5, 0.3, Polynomial{0.2, 0.3});
    }
    SECTION("negative coefficients") {
        check_exact_bins(440, 550, 0.4, 0.4, Polynomial{-0.3, -0.1});
    }
    SECTION("a fifth 200 + 300 Hz, where f2-f1 = 2f1-f2, 2f1 = 2f2-f1 and 2f2 = 3f1 add up") {
        check_exact_bins(200, 300, 0.45, 0.35, Polynomial{0.25, 0.2});
        // The fold-together is what is being tested: 100 Hz holds a quadratic and a cubic term.
        const auto lines = expected_lines(200, 300, 0.45, 0.35, Polynomial{0.25, 0.2});
        CHECK(lines.at(100) == Approx(0.25 * 0.45 * 0.35 + 0.75 * 0.2 * 0.45 * 0.45 * 0.35));
    }
}

TEST_CASE("a rendered just major third through the polynomial has peaks exactly at the combination "
          "frequencies and nothing else above -80 dB",
          "[polynomial]") {
    // Frequencies off the FFT bins, rendered by the whole chain (notes, envelopes, peak cap).
    // A 4-term Blackman-Harris window keeps leakage below -92 dB outside +-4 bins of each line,
    // and zero-padding by 8 leaves at most 1/16 bin between a line and the nearest analysed
    // frequency, where the window's main lobe loses under 0.02 dB.
    const Scale third("third", {Pitch::from_ratio(Ratio(5, 4))}, Pitch::from_ratio(Ratio(2)));
    RenderSettings s;
    s.ref_hz = 300.7;
    s.seconds = 2.0;
    s.sample_rate = 48000;
    s.model = Model::poly;
    const std::vector<double> y = render(third, {0, 1}, s);
    const std::size_t n = 65536, start = 14400; // from 0.3 s, inside the steady part
    std::vector<double> seg(y.begin() + start, y.begin() + start + n);
    const auto spec =
        terzo::test::amplitude_spectrum(seg, s.sample_rate, terzo::test::blackman_harris(n), 8);

    // Each note enters the model at amplitude 1/2 (two notes, pure sines).
    const double f1 = 300.7, f2 = 300.7 * 1.25;
    const auto lines = expected_lines(f1, f2, 0.5, 0.5, s.polynomial);
    const double bin = s.sample_rate / double(n); // unpadded bin
    auto peak_near = [&](double f, double halfwidth) {
        std::size_t lo = std::size_t(std::max(0.0, (f - halfwidth) / spec.bin_hz));
        std::size_t hi = std::size_t((f + halfwidth) / spec.bin_hz);
        std::size_t best = lo;
        for (std::size_t k = lo; k <= hi; ++k)
            if (spec.amplitude[k] > spec.amplitude[best]) best = k;
        return best;
    };
    const double ref_measured = spec.amplitude[peak_near(f1, bin)];
    const double ref_expected = lines.at(f1);
    for (auto [f, a] : lines) {
        if (f == 0) continue; // the constant term sits under the window's own lobe at 0 Hz
        const std::size_t k = peak_near(f, bin);
        INFO("line at " << f << " Hz, peak found at " << double(k) * spec.bin_hz << " Hz");
        CHECK(std::abs(double(k) * spec.bin_hz - f) <= spec.bin_hz);
        CHECK(std::abs(db((spec.amplitude[k] / ref_measured) / (std::abs(a) / ref_expected))) <=
              0.5);
    }
    double worst = 0, worst_hz = 0;
    for (std::size_t k = 0; k < spec.amplitude.size(); ++k) {
        const double f = double(k) * spec.bin_hz;
        const bool near_line = std::any_of(
            lines.begin(), lines.end(), [&](auto& l) { return std::abs(f - l.first) <= 5 * bin; });
        if (!near_line && spec.amplitude[k] > worst) worst = spec.amplitude[k], worst_hz = f;
    }
    INFO("strongest elsewhere: " << db(worst / ref_measured) << " dB at " << worst_hz << " Hz");
    CHECK(worst < ref_measured * 1e-4);
}

TEST_CASE("the default coefficients (our choice) put the resultants of two equal tones about 21 "
          "and 26 dB below the tones",
          "[polynomial]") {
    // c2 = 0.2 and c3 = 0.3 are our choice, not published values: loud enough to hear the
    // resultants, quiet enough to hear them as quieter than the notes. What is checked against
    // something outside is that the measured levels are the closed-form expansion's (above).
    const double fs = 48000;
    std::vector<double> x = synthesize({{400, 0.5}, {500, 0.5}}, 48000, fs);
    apply_polynomial(x, Polynomial{});
    const auto s = terzo::test::amplitude_spectrum(x, fs);
    const auto lines = expected_lines(400, 500, 0.5, 0.5, Polynomial{});
    const double difference = db(s.at(100) / s.at(400)), cubic = db(s.at(300) / s.at(400));
    CHECK(difference == Approx(db(lines.at(100) / lines.at(400))).margin(0.05)); // f2 - f1
    CHECK(cubic == Approx(db(lines.at(300) / lines.at(400))).margin(0.05));      // 2 f1 - f2
    // The levels the defaults were chosen for (our choice).
    CHECK(difference == Approx(-21.3).margin(0.1));
    CHECK(cubic == Approx(-26.3).margin(0.1));
}

TEST_CASE("polynomial_output is x + c2 x^2 + c3 x^3", "[polynomial]") {
    CHECK(polynomial_output(Polynomial{0.5, 0.25}, 2.0) == 2.0 + 0.5 * 4 + 0.25 * 8);
    CHECK(polynomial_output(Polynomial{0, 0}, -0.7) == -0.7);
}
