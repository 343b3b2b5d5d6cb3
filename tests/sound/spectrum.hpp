// Test helper: amplitude spectra computed by FFTW3, the outside reference the spectrum
// checks in tests/sound compare terzo's synthesis and models against. Not part of core.
#pragma once

#include <fftw3.h>

#include <cmath>
#include <complex>
#include <vector>

namespace terzo::test {

/// Amplitude of each DFT bin, scaled so that a sinusoid A cos(2 pi f t) centred on a bin
/// reads A (and a constant A reads A in bin 0); bin k is at k * bin_hz.
struct Spectrum {
    std::vector<double> amplitude;
    double bin_hz = 0.0;
    double at(double hz) const { return amplitude.at(std::size_t(std::llround(hz / bin_hz))); }
};

/// 4-term Blackman-Harris window: highest side lobe about -92 dB, main lobe +-4 bins wide.
/// Coefficients 0.35875, 0.48829, 0.14128, 0.01168 from F. J. Harris, "On the use of windows
/// for harmonic analysis with the discrete Fourier transform", Proc. IEEE 66 (1978) 51-83
/// (from memory).
inline std::vector<double> blackman_harris(std::size_t n) {
    std::vector<double> w(n);
    for (std::size_t i = 0; i < n; ++i) {
        const double t = 2.0 * M_PI * double(i) / double(n);
        w[i] =
            0.35875 - 0.48829 * std::cos(t) + 0.14128 * std::cos(2 * t) - 0.01168 * std::cos(3 * t);
    }
    return w;
}

/// Spectrum of x (windowed by w when w is not empty), zero-padded to pad * x.size() points.
inline Spectrum amplitude_spectrum(const std::vector<double>& x, double sample_rate,
                                   const std::vector<double>& w = {}, std::size_t pad = 1) {
    const std::size_t n = x.size(), m = n * pad;
    std::vector<double> in(m, 0.0);
    double wsum = 0.0;
    for (std::size_t i = 0; i < n; ++i) {
        const double wi = w.empty() ? 1.0 : w[i];
        in[i] = x[i] * wi;
        wsum += wi;
    }
    std::vector<std::complex<double>> out(m / 2 + 1);
    fftw_plan plan = fftw_plan_dft_r2c_1d(
        int(m), in.data(), reinterpret_cast<fftw_complex*>(out.data()), FFTW_ESTIMATE);
    fftw_execute(plan);
    fftw_destroy_plan(plan);
    Spectrum s;
    s.bin_hz = sample_rate / double(m);
    s.amplitude.resize(out.size());
    for (std::size_t k = 0; k < out.size(); ++k)
        s.amplitude[k] = std::abs(out[k]) * (k == 0 ? 1.0 : 2.0) / wsum;
    return s;
}

inline double db(double ratio) {
    return 20.0 * std::log10(ratio);
}

} // namespace terzo::test
