#include "core/sound/measure.hpp"

#include <algorithm>
#include <cmath>
#include <complex>
#include <mutex>
#include <stdexcept>

#include <fftw3.h>

namespace terzo {

namespace {

// FFTW's planner is not thread-safe (executing a plan is): plans are made and destroyed under
// this lock, so a live check on another thread can measure while the window computes.
std::mutex& planner_lock() {
    static std::mutex m;
    return m;
}

// One real-to-complex transform of a fixed size with its own buffers.
class RealFft {
  public:
    explicit RealFft(std::size_t n) : n_(n) {
        std::lock_guard<std::mutex> lock(planner_lock());
        in_ = fftw_alloc_real(n);
        out_ = fftw_alloc_complex(n / 2 + 1);
        plan_ = fftw_plan_dft_r2c_1d(int(n), in_, out_, FFTW_ESTIMATE);
    }
    ~RealFft() {
        std::lock_guard<std::mutex> lock(planner_lock());
        fftw_destroy_plan(plan_);
        fftw_free(in_);
        fftw_free(out_);
    }
    RealFft(const RealFft&) = delete;
    RealFft& operator=(const RealFft&) = delete;

    std::size_t size() const { return n_; }
    double* input() { return in_; }
    void run() { fftw_execute(plan_); }
    /// |X_k| for k = 0..n/2.
    double magnitude(std::size_t k) const { return std::hypot(out_[k][0], out_[k][1]); }
    /// |X_k|^2 (cheaper: no square root).
    double power(std::size_t k) const { return out_[k][0] * out_[k][0] + out_[k][1] * out_[k][1]; }
    std::complex<double> bin(std::size_t k) const { return {out_[k][0], out_[k][1]}; }

  private:
    std::size_t n_;
    double* in_ = nullptr;
    fftw_complex* out_ = nullptr;
    fftw_plan plan_ = nullptr;
};

std::size_t next_pow2(std::size_t n) {
    std::size_t p = 1;
    while (p < n) p <<= 1;
    return p;
}

std::vector<double> hann(std::size_t n) {
    std::vector<double> w(n);
    for (std::size_t i = 0; i < n; ++i)
        w[i] = 0.5 - 0.5 * std::cos(2.0 * M_PI * (double(i) + 0.5) / double(n));
    return w;
}

double percentile(std::vector<double> v, double q) {
    if (v.empty()) return 0.0;
    const std::size_t i = std::min(v.size() - 1, std::size_t(q * double(v.size())));
    std::nth_element(v.begin(), v.begin() + std::ptrdiff_t(i), v.end());
    return v[i];
}

double level_db(double mean_square) {
    return 10.0 * std::log10(mean_square + 1e-30);
}

} // namespace

// --- Note finding ---------------------------------------------------------------------------
//
// Frames of 25 to 50 ms (a power of two: 2048 samples at 44.1 and 48 kHz) every eighth of a
// frame. A first pass over every
// fourth frame takes each bin's 20th-percentile magnitude as its noise level; the second pass
// sums, over the bins, the rise of log(max(|X|, 8 x noise)) from one frame to the next. The
// floor 8 x the 20th percentile (about 18 dB) keeps steady noise out of the sum: a Rayleigh
// noise bin passes it with probability below 1e-6. A sustained or decaying note adds nothing,
// so the sum stands out only where new partials (or an attack's noise) appear.
std::vector<NoteSpan> find_notes(const std::vector<double>& x, double rate,
                                 const MeasureSettings& settings) {
    if (!(rate > 0)) throw std::invalid_argument("find_notes: sample rate must be positive");
    std::vector<NoteSpan> notes;
    if (x.empty()) return notes;
    const std::size_t n = x.size();
    const std::size_t frame = next_pow2(std::size_t(std::ceil(rate * 0.05))) / 2;
    const std::size_t hop = frame / 8, bins = frame / 2 + 1;
    const std::size_t frames = (n + hop - 1) / hop;
    const std::vector<double> window = hann(frame);
    RealFft fft(frame);
    auto transform = [&](std::size_t t) {
        double* in = fft.input();
        const std::size_t s = t * hop;
        for (std::size_t i = 0; i < frame; ++i) in[i] = s + i < n ? x[s + i] * window[i] : 0.0;
        fft.run();
    };

    // Level of each frame (mean square over the frame), from a running sum of squares.
    std::vector<double> sq(n + 1, 0.0);
    for (std::size_t i = 0; i < n; ++i) sq[i + 1] = sq[i] + x[i] * x[i];
    std::vector<double> level(frames);
    for (std::size_t t = 0; t < frames; ++t) {
        const std::size_t a = t * hop, b = std::min(n, a + frame);
        level[t] = level_db((sq[b] - sq[a]) / double(frame));
    }

    // Pass 1: each bin's noise level.
    std::vector<std::vector<float>> sampled(bins);
    for (std::size_t t = 0; t < frames; t += 4) {
        transform(t);
        for (std::size_t k = 0; k < bins; ++k) sampled[k].push_back(float(fft.magnitude(k)));
    }
    std::vector<double> floor(bins);
    const double tiny = 1e-12 * double(frame);
    // The broadband noise level from the same floors, so that it is right also when notes
    // sound all the time: white noise of mean square v gives E|X_k|^2 = v * sum(w^2)
    // = 0.375 v N under a Hann window, and the 20th percentile of a Rayleigh magnitude is
    // sqrt(-ln 0.8) = 0.472 times its RMS.
    double noise_power = 0;
    for (std::size_t k = 0; k < bins; ++k) {
        auto& v = sampled[k];
        const std::size_t i = std::min(v.size() - 1, v.size() / 5);
        std::nth_element(v.begin(), v.begin() + std::ptrdiff_t(i), v.end());
        floor[k] = std::log(8.0 * double(v[i]) + tiny);
        noise_power += (double(v[i]) / 0.472) * (double(v[i]) / 0.472);
        std::vector<float>().swap(v);
    }
    const double noise_level = level_db(noise_power / double(bins) / (0.375 * double(frame)));

    // Pass 2: the flux.
    // Most bins sit under their floor: compare powers first and take a logarithm only above.
    std::vector<double> floor_power(bins);
    for (std::size_t k = 0; k < bins; ++k) floor_power[k] = std::exp(2.0 * floor[k]);
    std::vector<double> flux(frames, 0.0), prev(floor), cur(bins);
    for (std::size_t t = 0; t < frames; ++t) {
        transform(t);
        double sum = 0;
        for (std::size_t k = 0; k < bins; ++k) {
            const double p = fft.power(k);
            cur[k] = p > floor_power[k] ? 0.5 * std::log(p) : floor[k];
            sum += std::max(0.0, cur[k] - prev[k]);
        }
        flux[t] = sum;
        std::swap(prev, cur);
    }

    // Onsets: the largest flux within 50 ms either side, at least 6 (a dozen bins rising by
    // half a neper, or a few partials appearing well above the noise) and a twentieth of the
    // largest flux of the recording (a note 20 dB softer than the loudest still passes: its
    // partials rise fewer nepers, not fewer of them; a damper's fall, whose spreading
    // spectrum raises a few bins, does not), followed within 100 ms by a level 10 dB above
    // the noise level.
    const std::size_t reach = std::max<std::size_t>(1, std::size_t(0.05 * rate / double(hop)));
    const std::size_t ahead = std::max<std::size_t>(1, std::size_t(0.1 * rate / double(hop)));
    const double threshold = std::max(6.0, 0.05 * *std::max_element(flux.begin(), flux.end()));
    std::vector<std::size_t> onsets;
    for (std::size_t t = 0; t < frames; ++t) {
        if (flux[t] < threshold) continue;
        const std::size_t lo = t >= reach ? t - reach : 0, hi = std::min(frames - 1, t + reach);
        bool is_max = true;
        for (std::size_t u = lo; u <= hi && is_max; ++u)
            if (flux[u] > flux[t] || (flux[u] == flux[t] && u < t)) is_max = false;
        if (!is_max) continue;
        double loudest = -400;
        for (std::size_t u = t; u < std::min(frames, t + ahead); ++u)
            loudest = std::max(loudest, level[u]);
        if (loudest < noise_level + 10.0) continue;
        onsets.push_back(t);
    }

    // Each onset to the sample. The flux peaks at the first frame that holds enough of the
    // new sound to resolve its partials: measured on synthetic plucks, that is when the onset
    // lies about 0.3 of a frame before the frame's end. Start there and move up to 12 ms
    // either way to the largest rise from the mean level of the 4 blocks of about 1 ms
    // before to that of the 4 from there on (4 ms averages smooth a waveform's own ups and
    // downs; a previous note still sounding only lowers the rise).
    const std::size_t block = std::max<std::size_t>(1, std::size_t(rate / 1000.0));
    auto refine = [&](std::size_t t) {
        const std::size_t guess = std::min(n, t * hop + frame * 7 / 10);
        const std::size_t reach_s = 12 * block + 4 * block;
        const std::size_t a = guess > reach_s ? guess - reach_s : 0;
        const std::size_t b = std::min(n, guess + reach_s);
        std::vector<double> e;
        for (std::size_t s = a; s + block <= b; s += block)
            e.push_back(level_db((sq[s + block] - sq[s]) / double(block)));
        if (e.size() < 9) return guess;
        std::size_t best = 0;
        double best_rise = -INFINITY;
        for (std::size_t i = 4; i + 4 <= e.size(); ++i) {
            const double rise = (e[i] + e[i + 1] + e[i + 2] + e[i + 3]) - (e[i - 4] + e[i - 3] + e[i - 2] + e[i - 1]);
            if (rise > best_rise) best_rise = rise, best = i;
        }
        return a + best * block;
    };

    for (std::size_t i = 0; i < onsets.size(); ++i) {
        const std::size_t t = onsets[i];
        const std::size_t next_t = i + 1 < onsets.size() ? onsets[i + 1] : frames;
        const std::size_t start = refine(t);
        std::size_t end = i + 1 < onsets.size() ? refine(next_t) : n;
        // The note's peak level within its first 100 ms, then the first frame after it below
        // both the noise level + 6 dB and the peak - 45 dB marks the end.
        double peak = -400;
        std::size_t peak_t = t;
        for (std::size_t u = t; u < std::min(next_t, t + ahead); ++u)
            if (level[u] > peak) peak = level[u], peak_t = u;
        const double stop = std::max(noise_level + 6.0, peak - 45.0);
        for (std::size_t u = peak_t; u < next_t; ++u)
            if (level[u] < stop) {
                end = std::min(end, u * hop + frame / 2);
                break;
            }
        end = std::min(end, n);
        if (end <= start || double(end - start) < settings.min_note_s * rate) continue;
        notes.push_back({double(start) / rate, double(end) / rate});
    }
    return notes;
}

// --- YIN ------------------------------------------------------------------------------------
//
// The difference function d(tau) = sum_{j<W} (x_j - x_{j+tau})^2 is expanded as
// e(0) + e(tau) - 2 r(tau), with the energies from a running sum and the cross-correlation r
// from one FFT of size >= 2W + tau_max (no wrap-around for tau <= tau_max).
std::optional<CoarsePitch> yin_pitch(const double* x, std::size_t n, double rate, double min_hz,
                                     double max_hz) {
    if (!(rate > 0) || !(min_hz > 0) || !(max_hz > min_hz)) return std::nullopt;
    std::size_t tau_max = std::size_t(std::ceil(rate / min_hz)) + 1;
    const std::size_t tau_min = std::max<std::size_t>(2, std::size_t(std::floor(rate / max_hz)));
    if (n < 2 * tau_max) tau_max = n / 2;
    if (tau_max <= tau_min + 2) return std::nullopt;
    const std::size_t w = std::min(n - tau_max, std::max(tau_max, std::size_t(0.03 * rate)));

    const std::size_t m = next_pow2(w + tau_max + 1);
    RealFft fa(m), fb(m);
    std::fill(fa.input(), fa.input() + m, 0.0);
    std::fill(fb.input(), fb.input() + m, 0.0);
    std::copy(x, x + w, fa.input());
    std::copy(x, x + w + tau_max, fb.input());
    fa.run();
    fb.run();
    std::vector<std::complex<double>> spec(m / 2 + 1);
    for (std::size_t k = 0; k <= m / 2; ++k) spec[k] = std::conj(fa.bin(k)) * fb.bin(k);
    std::vector<double> r(m);
    {
        std::unique_lock<std::mutex> lock(planner_lock());
        fftw_plan back = fftw_plan_dft_c2r_1d(int(m), reinterpret_cast<fftw_complex*>(spec.data()),
                                              r.data(), FFTW_ESTIMATE);
        lock.unlock();
        fftw_execute(back);
        lock.lock();
        fftw_destroy_plan(back);
    }
    std::vector<double> sq(w + tau_max + 1, 0.0);
    for (std::size_t i = 0; i < w + tau_max; ++i) sq[i + 1] = sq[i] + x[i] * x[i];
    const double e0 = sq[w];
    if (!(e0 > 0)) return std::nullopt;

    // Cumulative mean normalised difference d'(tau) = d(tau) / ((1/tau) sum_{j=1..tau} d(j)).
    std::vector<double> dn(tau_max + 1, 1.0);
    double running = 0;
    for (std::size_t tau = 1; tau <= tau_max; ++tau) {
        const double d = std::max(0.0, e0 + (sq[w + tau] - sq[tau]) - 2.0 * r[tau] / double(m));
        running += d;
        dn[tau] = running > 0 ? d * double(tau) / running : 1.0;
    }
    // Step 4: the first dip below 0.1, followed to its bottom; else the deepest point.
    std::size_t best = 0;
    for (std::size_t tau = tau_min; tau < tau_max; ++tau)
        if (dn[tau] < 0.1) {
            while (tau + 1 < tau_max && dn[tau + 1] < dn[tau]) ++tau;
            best = tau;
            break;
        }
    if (best == 0) {
        best = tau_min;
        for (std::size_t tau = tau_min; tau < tau_max; ++tau)
            if (dn[tau] < dn[best]) best = tau;
    }
    // Step 5: parabolic interpolation of the dip.
    double period = double(best);
    if (best + 1 <= tau_max) {
        const double a = dn[best - 1], b = dn[best], c = dn[best + 1];
        const double den = a - 2 * b + c;
        if (den > 0) period += 0.5 * (a - c) / den;
    }
    const double aperiodicity = dn[best];
    if (aperiodicity > 0.6) return std::nullopt;
    return CoarsePitch{rate / period, aperiodicity};
}

// --- Partials and the stiff-string fit ------------------------------------------------------

namespace {

struct Fit {
    double f0 = 0, b = 0, rms_cents = 0;
};

double model_hz(const Fit& fit, int k) {
    return double(k) * fit.f0 * std::sqrt(1.0 + fit.b * double(k) * double(k));
}

// Squaring the model gives (f_k / k)^2 = f0^2 + f0^2 B k^2: a straight line in k^2, fitted
// by weighted least squares. The error of f_k / k shrinks as 1/k and as the peak's SNR grows,
// so the weight is k^2 times the SNR as a power ratio (capped at 50 dB, above which the
// interpolation's own bias, not noise, limits a peak). B is fitted from three partials on and
// kept at zero when the line comes out falling.
Fit fit_partials(const std::vector<MeasuredPartial>& ps) {
    Fit fit;
    if (ps.empty()) return fit;
    double sw = 0, sx = 0, sy = 0, sxx = 0, sxy = 0;
    for (const auto& p : ps) {
        const double k = p.k, x = k * k, y = (p.hz / k) * (p.hz / k);
        const double w = k * k * std::pow(10.0, std::min(p.snr_db, 50.0) / 10.0);
        sw += w, sx += w * x, sy += w * y, sxx += w * x * x, sxy += w * x * y;
    }
    double a = sy / sw, slope = 0;
    const double det = sw * sxx - sx * sx;
    if (ps.size() >= 3 && det > 1e-12 * sw * sxx) {
        slope = (sw * sxy - sx * sy) / det;
        if (slope > 0)
            a = (sy - slope * sx) / sw;
        else
            slope = 0;
    }
    fit.f0 = std::sqrt(std::max(a, 0.0));
    fit.b = fit.f0 > 0 ? slope / a : 0;
    double rw = 0, rs = 0;
    for (const auto& p : ps) {
        const double w = double(p.k) * double(p.k) * std::pow(10.0, std::min(p.snr_db, 50.0) / 10.0);
        const double c = 1200.0 * std::log2(p.hz / model_hz(fit, p.k)) ;
        rw += w, rs += w * c * c;
    }
    fit.rms_cents = std::sqrt(rs / rw);
    return fit;
}

} // namespace

std::optional<PitchEstimate> estimate_pitch(const double* x, std::size_t n, double rate,
                                            const MeasureSettings& settings) {
    const auto coarse = yin_pitch(x, n, rate, settings.min_hz, settings.max_hz);
    if (!coarse) return std::nullopt;

    // Spectrum: Hann window, zero-padded to at least twice the length.
    const std::size_t m = next_pow2(2 * n);
    RealFft fft(m);
    const std::vector<double> window = hann(n);
    std::fill(fft.input(), fft.input() + m, 0.0);
    for (std::size_t i = 0; i < n; ++i) fft.input()[i] = x[i] * window[i];
    fft.run();
    const std::size_t bins = m / 2 + 1;
    // Powers for all bins; logarithms only where a peak is interpolated (the search and the
    // median are the same on powers, which order the bins as the magnitudes do).
    std::vector<double> power(bins);
    for (std::size_t k = 0; k < bins; ++k) power[k] = fft.power(k) + 1e-300;
    const double bin_hz = rate / double(m);

    // A peak near `hz`: the largest bin within +-width, not at the edge of that range, standing
    // 15 dB above the median of the surrounding +-f0/2 (the local noise and leakage level);
    // its position from the parabola through the log magnitudes of it and its neighbours.
    auto find_peak = [&](double hz, double width, double f0) -> std::optional<MeasuredPartial> {
        const long lo = std::max(1L, long(std::floor((hz - width) / bin_hz)));
        const long hi = std::min(long(bins) - 2, long(std::ceil((hz + width) / bin_hz)));
        if (hi - lo < 2) return std::nullopt;
        long best = lo;
        for (long i = lo; i <= hi; ++i)
            if (power[std::size_t(i)] > power[std::size_t(best)]) best = i;
        if (best == lo || best == hi) return std::nullopt;
        const long nlo = std::max(1L, long((hz - 0.5 * f0) / bin_hz));
        const long nhi = std::min(long(bins) - 1, long((hz + 0.5 * f0) / bin_hz));
        if (nhi <= nlo) return std::nullopt;
        std::vector<double> around(power.begin() + nlo, power.begin() + nhi + 1);
        const double floor = percentile(std::move(around), 0.5);
        const double snr_db = 10.0 * std::log10(power[std::size_t(best)] / floor);
        if (snr_db < 15.0) return std::nullopt;
        const double a = 0.5 * std::log(power[std::size_t(best - 1)]), b = 0.5 * std::log(power[std::size_t(best)]),
                     c = 0.5 * std::log(power[std::size_t(best + 1)]);
        const double den = a - 2 * b + c;
        const double offset = den < 0 ? 0.5 * (a - c) / den : 0.0;
        return MeasuredPartial{0, (double(best) + offset) * bin_hz, snr_db};
    };

    // Partials in rising order, each searched where the fit so far predicts it.
    const double top = std::min(settings.max_partial_hz, 0.45 * rate);
    Fit fit{coarse->hz, 0.0, 0.0};
    std::vector<MeasuredPartial> found;
    for (int k = 1; k <= settings.max_partials; ++k) {
        const double predicted = model_hz(fit, k);
        if (predicted > top) break;
        const double width = std::max(0.12 * fit.f0, 4.0 * bin_hz);
        if (auto p = find_peak(predicted, std::min(width, 0.4 * fit.f0), fit.f0)) {
            p->k = k;
            found.push_back(*p);
            fit = fit_partials(found);
        }
    }
    if (found.empty()) return std::nullopt;

    // Outliers (a peak of another sound, a partial pulled by a neighbour): drop the worst
    // partial while it lies more than 4 times the median residual and over 1 cent off.
    while (found.size() > 3) {
        std::vector<double> res;
        for (const auto& p : found) res.push_back(std::abs(1200.0 * std::log2(p.hz / model_hz(fit, p.k))));
        const double med = percentile(res, 0.5);
        const auto worst = std::size_t(std::max_element(res.begin(), res.end()) - res.begin());
        if (res[worst] <= std::max(4.0 * med, 1.0)) break;
        found.erase(found.begin() + std::ptrdiff_t(worst));
        fit = fit_partials(found);
    }

    PitchEstimate e;
    e.f0 = fit.f0;
    e.inharmonicity = fit.b;
    e.hz = model_hz(fit, 1);
    e.fit_rms_cents = fit.rms_cents;
    e.partials = found;
    // Confidence, a product of four plain factors (each 1 when all is well): YIN's
    // aperiodicity (0 for a periodic sound, up to 0.6 accepted), how many partials the fit
    // rests on (three or more is full), how closely they follow the model (half at 2 cents
    // RMS), and how long the stretch is (a quarter second or more is full).
    const double q_periodic = std::clamp(1.0 - coarse->aperiodicity / 0.6, 0.0, 1.0);
    const double q_count = std::min(1.0, double(found.size()) / 3.0);
    const double q_fit = 1.0 / (1.0 + (fit.rms_cents / 2.0) * (fit.rms_cents / 2.0));
    const double q_length = std::min(1.0, double(n) / rate / 0.25);
    e.confidence = q_periodic * q_count * q_fit * q_length;
    return e;
}

std::vector<MeasuredNote> measure_notes(const std::vector<double>& samples, double rate,
                                        const MeasureSettings& settings) {
    if (!(rate > 0)) throw std::invalid_argument("measure_notes: sample rate must be positive");
    std::vector<MeasuredNote> out;
    for (const NoteSpan& span : find_notes(samples, rate, settings)) {
        const double length = span.end_s - span.start_s;
        // After the attack (its noise and the pitch glide of a plucked or struck string);
        // a short note keeps its last 70 %.
        const double skip = length > settings.skip_attack_s + 0.1 ? settings.skip_attack_s : 0.3 * length;
        const std::size_t a = std::size_t((span.start_s + skip) * rate);
        const std::size_t b = std::min(samples.size(),
                                       std::size_t(std::min(span.end_s, span.start_s + skip + settings.max_analysis_s) * rate));
        if (b <= a) continue;
        auto pitch = estimate_pitch(samples.data() + a, b - a, rate, settings);
        if (!pitch || !(pitch->hz >= 0.9 * settings.min_hz && pitch->hz <= 1.1 * settings.max_hz) ||
            !std::isfinite(pitch->inharmonicity) || !std::isfinite(pitch->confidence))
            continue;
        out.push_back({span, std::move(*pitch)});
    }
    return out;
}

LivePitch::LivePitch(double sample_rate, double window_s)
    : rate_(sample_rate), size_(std::max<std::size_t>(64, std::size_t(sample_rate * window_s))),
      ring_(size_, 0.0) {
    if (!(sample_rate > 0) || !(window_s > 0))
        throw std::invalid_argument("LivePitch: sample rate and window must be positive");
}

void LivePitch::feed(const double* x, std::size_t n) {
    for (std::size_t i = 0; i < n; ++i) {
        ring_[next_] = x[i];
        next_ = (next_ + 1) % size_;
    }
    filled_ = std::min(size_, filled_ + n);
}

void LivePitch::clear() {
    std::fill(ring_.begin(), ring_.end(), 0.0);
    next_ = filled_ = 0;
}

std::optional<PitchEstimate> LivePitch::measure(const MeasureSettings& settings, double quiet_dbfs) const {
    if (filled_ < size_) return std::nullopt;
    std::vector<double> x(size_);
    double sum = 0;
    for (std::size_t i = 0; i < size_; ++i) {
        x[i] = ring_[(next_ + i) % size_];
        sum += x[i] * x[i];
    }
    if (level_db(sum / double(size_)) < quiet_dbfs) return std::nullopt;
    return estimate_pitch(x.data(), x.size(), rate_, settings);
}

} // namespace terzo
