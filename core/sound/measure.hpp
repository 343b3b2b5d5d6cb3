// Measuring recorded notes: finding where each note of a recording starts and ends, and
// estimating its pitch finely enough to check a tuning (a few tenths of a cent). Plucked and
// struck strings are inharmonic, so the pitch is the first partial of a stiff-string fit of
// many measured partials rather than the position of one spectral peak. Works on sample
// buffers; reading files is core/io/wav's job and a live check feeds buffers the same way.
#pragma once

#include <cstddef>
#include <optional>
#include <vector>

namespace terzo {

/// Limits and choices of the measurement.
struct MeasureSettings {
    double min_hz = 27.0;        ///< lowest fundamental searched (A0 is 27.5 Hz)
    double max_hz = 4200.0;      ///< highest fundamental searched (C8 is 4186 Hz)
    double skip_attack_s = 0.06; ///< time after an onset left out of the pitch analysis
    double max_analysis_s = 1.0; ///< longest stretch of one note analysed
    double min_note_s = 0.08;    ///< shorter sounds are not reported as notes
    int max_partials = 20;       ///< most partials fitted
    double max_partial_hz = 10000.0; ///< partials above this are not used
};

/// Where one note sounds in the recording, in seconds from its start.
struct NoteSpan {
    double start_s = 0, end_s = 0;
};

/// Onsets by spectral flux (Bello et al., "A tutorial on onset detection in music signals",
/// IEEE Trans. Speech Audio Process. 13(5), 2005: the rectified rise of the log-magnitude
/// spectrum, here against each bin's own noise level); a note ends at the next onset or when
/// its level falls to the recording's noise level or 45 dB under its own peak.
std::vector<NoteSpan> find_notes(const std::vector<double>& samples, double sample_rate,
                                 const MeasureSettings& settings = {});

/// A period estimate from the YIN method.
struct CoarsePitch {
    double hz = 0;
    double aperiodicity = 1; ///< the normalised difference at the chosen lag: 0 is periodic
};
/// YIN (A. de Cheveigné and H. Kawahara, "YIN, a fundamental frequency estimator for speech
/// and music", J. Acoust. Soc. Am. 111(4), 2002, 1917-1930), steps 1-5: difference function,
/// cumulative mean normalisation, absolute threshold 0.1, parabolic interpolation. Uses the
/// first n samples; empty when they are too few for min_hz or hold no periodic sound.
std::optional<CoarsePitch> yin_pitch(const double* samples, std::size_t n, double sample_rate,
                                     double min_hz, double max_hz);

/// One measured partial.
struct MeasuredPartial {
    int k = 1;        ///< partial number (1 = the lowest)
    double hz = 0;    ///< from the interpolated spectral peak
    double snr_db = 0; ///< peak level above the local noise level
};

/// The pitch of one stretch of sound.
struct PitchEstimate {
    double f0 = 0;           ///< f0 of the stiff-string model
    double inharmonicity = 0; ///< B of the model, >= 0
    double hz = 0;           ///< the first partial, f0 * sqrt(1 + B)
    double confidence = 0;   ///< 0..1, see measure.cpp (not a probability)
    double fit_rms_cents = 0; ///< weighted RMS of the partials' residuals from the fit
    std::vector<MeasuredPartial> partials; ///< those the fit kept
};

/// Pitch of samples[0..n): a YIN estimate refined by the partials of a Hann-windowed,
/// zero-padded FFT (each peak interpolated by a parabola through the log magnitudes of three
/// bins) fitted to the stiff-string model f_k = k f0 sqrt(1 + B k^2) (H. Fletcher, "Normal
/// vibration frequencies of a stiff piano string", J. Acoust. Soc. Am. 36(1), 1964, 203-209),
/// f0 and B together. Empty when no pitch is found.
std::optional<PitchEstimate> estimate_pitch(const double* samples, std::size_t n,
                                            double sample_rate,
                                            const MeasureSettings& settings = {});

/// One note found and measured.
struct MeasuredNote {
    NoteSpan span;
    PitchEstimate pitch;
};

/// find_notes, then estimate_pitch on each note after its attack (up to max_analysis_s);
/// notes without a pitch are left out. Throws std::invalid_argument for a sample rate that
/// is not positive.
std::vector<MeasuredNote> measure_notes(const std::vector<double>& samples, double sample_rate,
                                        const MeasureSettings& settings = {});

/// The live check's ear: keeps the most recent stretch of sound (fed in pieces, as a capture
/// device or a test delivers it) and measures it on demand.
class LivePitch {
  public:
    /// Keeps the last window_s seconds at sample_rate (both > 0).
    LivePitch(double sample_rate, double window_s = 0.4);
    /// Appends samples (full scale +-1).
    void feed(const double* samples, std::size_t n);
    /// Forgets everything fed so far.
    void clear();
    /// The pitch of the kept window once it is full; empty while it fills, when its RMS level
    /// is under quiet_dbfs, or when it has no pitch.
    std::optional<PitchEstimate> measure(const MeasureSettings& settings = {},
                                         double quiet_dbfs = -50.0) const;
    double sample_rate() const { return rate_; }

  private:
    double rate_;
    std::size_t size_;
    std::vector<double> ring_; ///< the last size_ samples, oldest at next_ once full
    std::size_t next_ = 0, filled_ = 0;
};

} // namespace terzo
