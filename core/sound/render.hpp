// Rendering a dyad or chord of a tuning into a sample buffer: the notes' frequencies at a
// reference pitch, additive synthesis, an optional ear-nonlinearity model, envelopes, and
// the peak cap. Every setting has a stated range, checked before any work is done.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "core/analysis/keyboard.hpp"
#include "core/sound/envelope.hpp"
#include "core/sound/oscillator.hpp"
#include "core/sound/polynomial.hpp"
#include "core/sound/synth.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// What happens to the mix of notes before it is written.
enum class Model {
    none,       ///< the notes only
    poly,       ///< through the polynomial y = x + c2 x^2 + c3 x^3
    oscillator, ///< through the driven nonlinear oscillator
    predicted,  ///< the notes plus the resultant engine's predicted tones as quiet sines
};

/// "none", "poly", "oscillator", "predicted".
std::string model_name(Model m);
/// The model with that name, or nullopt.
std::optional<Model> parse_model(const std::string& name);

/// Everything a render needs besides the notes. Defaults are the command line's.
struct RenderSettings {
    double ref_hz = default_ref_hz; ///< frequency of degree 0 (C4 when A4 = 440 Hz in 12-TET)
    double seconds = 2.0;
    int sample_rate = 48000;
    Timbre timbre;
    Envelope envelope;
    Model model = Model::poly;
    Polynomial polynomial;
    Oscillator oscillator;
    double peak_dbfs = -12.0; ///< the render's peak level
    /// predicted: each tone's level relative to one note, before the audibility weight
    double predicted_db = -20.0;
    int predicted_order = 3; ///< predicted: highest order |a| + |b| of the tones added
};

/// Limits, each enforced by check_render_settings (and tested).
namespace render_limits {
inline constexpr double min_seconds = 0.1, max_seconds = 60.0;
inline constexpr std::size_t max_notes = 16;
inline constexpr int max_partials = 64;
inline constexpr double min_ref_hz = 16.0, max_ref_hz = 4000.0;
inline constexpr double min_note_hz = 20.0; ///< the highest note is sample_rate / 6
inline constexpr double min_ramp_s = 0.005, max_ramp_s = 10.0;
inline constexpr double min_peak_dbfs = -60.0, max_peak_dbfs = -6.0;
inline constexpr double max_rolloff_db = 40.0;
inline constexpr double max_coefficient = 1.0; ///< |c2| and |c3|, both models
inline constexpr double min_resonance_hz = 50.0, max_resonance_hz = 8000.0;
inline constexpr double min_predicted_db = -60.0, max_predicted_db = 0.0;
inline constexpr int max_predicted_order = 6;
/// predicted: at most this many tones are added, the loudest ones (keeps the worst case,
/// 16 notes at order 6 for 60 s, to a few seconds of work)
inline constexpr std::size_t max_predicted_tones = 512;
inline constexpr double min_q = 0.5, max_q = 20.0;
} // namespace render_limits

/// Highest frequency of any note or harmonic: sample_rate / 6, so that the cubic term's
/// products (up to three times the highest partial) stay below the Nyquist frequency and
/// nothing aliases.
double highest_partial_hz(int sample_rate);

/// The short hearing-safety caution every front end shows beside rendered or played sound.
const char* hearing_caution();

/// Throws InputError naming the option ("--seconds", ...) of the first setting out of range.
void check_render_settings(const RenderSettings& s, std::size_t note_count);
/// Frequency of each note: degree n of the scale, n >= size() continuing into the next
/// periods and negative n into the ones below, with degree 0 at ref_hz.
std::vector<double> note_frequencies(const Scale& scale, const std::vector<int>& notes,
                                     double ref_hz);
/// The predicted combination tones of every pair of the notes (pure tones, orders
/// 2..s.predicted_order, from the resultant engine) as sine partials: each at
/// note_amplitude * 10^(predicted_db / 20) * the engine's audibility estimate, those outside
/// 20 Hz .. highest_partial_hz left out; only the render_limits::max_predicted_tones loudest
/// are kept (ties broken by frequency).
std::vector<Partial> predicted_partials(const Scale& scale, const std::vector<int>& notes,
                                        const RenderSettings& s, double note_amplitude);
/// The rendered mono samples, peaking at s.peak_dbfs. Throws InputError (source "--notes")
/// for a note outside 20 Hz .. highest_partial_hz, and whatever check_render_settings throws.
std::vector<double> render(const Scale& scale, const std::vector<int>& notes,
                           const RenderSettings& s);

} // namespace terzo
