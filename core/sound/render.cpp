#include "core/sound/render.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>
#include <utility>

#include "core/analysis/chord.hpp"
#include "core/error.hpp"
#include "core/sound/level.hpp"

namespace terzo {

namespace {

std::string num(double v) {
    std::ostringstream s;
    s << v;
    return s.str();
}

void check_range(const char* option, double value, double lo, double hi, const std::string& what) {
    if (!(value >= lo && value <= hi))
        fail({option, 0, 0}, num(value) + " is out of range; " + what + " must be between " +
                                 num(lo) + " and " + num(hi));
}

// Note number n as (degree, period): floor division, so -1 is the top degree one period down.
std::pair<long long, long long> degree_and_period(int n, std::size_t scale_size) {
    const long long size = static_cast<long long>(scale_size);
    long long period = n / size, degree = n % size;
    if (degree < 0) degree += size, --period;
    return {degree, period};
}

} // namespace

std::string model_name(Model m) {
    switch (m) {
    case Model::none:
        return "none";
    case Model::poly:
        return "poly";
    case Model::oscillator:
        return "oscillator";
    case Model::predicted:
        return "predicted";
    }
    return "none";
}

std::optional<Model> parse_model(const std::string& name) {
    for (Model m : {Model::none, Model::poly, Model::oscillator, Model::predicted})
        if (model_name(m) == name) return m;
    return std::nullopt;
}

const char* hearing_caution() {
    return "Caution: combination tones are heard best loud, and loud sound damages hearing. "
           "Start playback at a low volume, raise it slowly, keep it moderate, and stop if "
           "the sound is uncomfortable.";
}

double highest_partial_hz(int sample_rate) {
    return sample_rate / 6.0;
}

void check_render_settings(const RenderSettings& s, std::size_t note_count) {
    namespace L = render_limits;
    if (s.sample_rate != 44100 && s.sample_rate != 48000)
        fail({"--sample-rate", 0, 0},
             std::to_string(s.sample_rate) + " is not supported; use 44100 or 48000");
    check_range("--seconds", s.seconds, L::min_seconds, L::max_seconds, "the duration in seconds");
    if (note_count == 0) fail({"--notes", 0, 0}, "give at least one note");
    if (note_count > L::max_notes)
        fail({"--notes", 0, 0}, std::to_string(note_count) + " notes is too many; at most " +
                                    std::to_string(L::max_notes) + " sound together");
    check_range("--ref-hz", s.ref_hz, L::min_ref_hz, L::max_ref_hz,
                "the frequency of degree 0 in Hz");
    if (s.timbre.partials < 1 || s.timbre.partials > L::max_partials)
        fail({"--partials", 0, 0},
             std::to_string(s.timbre.partials) +
                 " is out of range; the number of partials must be between 1 and " +
                 std::to_string(L::max_partials));
    check_range("--rolloff", s.timbre.rolloff_db_per_octave, 0.0, L::max_rolloff_db,
                "the roll-off in dB per octave");
    check_range("--attack", s.envelope.attack_s, L::min_ramp_s, L::max_ramp_s,
                "the fade-in in seconds");
    check_range("--release", s.envelope.release_s, L::min_ramp_s, L::max_ramp_s,
                "the fade-out in seconds");
    if (s.envelope.attack_s + s.envelope.release_s > s.seconds)
        fail({"--seconds", 0, 0}, num(s.seconds) +
                                      " s is shorter than the fade-in and fade-out together (" +
                                      num(s.envelope.attack_s + s.envelope.release_s) + " s)");
    check_range("--peak-db", s.peak_dbfs, L::min_peak_dbfs, L::max_peak_dbfs,
                "the peak level in dBFS");
    if (s.model == Model::poly) {
        check_range("--c2", s.polynomial.c2, -L::max_coefficient, L::max_coefficient, "c2");
        check_range("--c3", s.polynomial.c3, -L::max_coefficient, L::max_coefficient, "c3");
    }
    if (s.model == Model::oscillator) {
        check_range("--c2", s.oscillator.c2, -L::max_coefficient, L::max_coefficient, "c2");
        check_range("--c3", s.oscillator.c3, -L::max_coefficient, L::max_coefficient, "c3");
        check_range("--resonance-hz", s.oscillator.resonance_hz, L::min_resonance_hz,
                    L::max_resonance_hz, "the resonance in Hz");
        check_range("--q", s.oscillator.q, L::min_q, L::max_q, "the quality factor Q");
    }
    if (s.model == Model::predicted) {
        check_range("--predicted-db", s.predicted_db, L::min_predicted_db, L::max_predicted_db,
                    "the level of predicted tones in dB");
        if (s.predicted_order < 2 || s.predicted_order > L::max_predicted_order)
            fail({"--order", 0, 0},
                 std::to_string(s.predicted_order) +
                     " is out of range; the order of predicted tones must be between 2 and " +
                     std::to_string(L::max_predicted_order));
    }
}

std::vector<double> note_frequencies(const Scale& scale, const std::vector<int>& notes,
                                     double ref_hz) {
    std::vector<double> out;
    for (int n : notes) {
        const auto [degree, period] = degree_and_period(n, scale.size());
        const double cents =
            double(period) * scale.period().cents() + scale.degree(std::size_t(degree)).cents();
        out.push_back(ref_hz * std::exp2(cents / 1200.0));
    }
    return out;
}

std::vector<Partial> predicted_partials(const Scale& scale, const std::vector<int>& notes,
                                        const RenderSettings& s, double note_amplitude) {
    // The resultant engine's notes are exact where the scale is; render() has already
    // checked every note's frequency, so the periods here are few.
    const Keyboard kb(scale, s.ref_hz, 1);
    std::vector<Note> chord;
    for (int n : notes) {
        const auto [degree, period] = degree_and_period(n, scale.size());
        chord.push_back(kb.note(int(degree), int(period)));
    }
    ToneOptions options;
    options.order = s.predicted_order;
    options.partials = 1;
    options.exact = false; // only frequencies are needed here
    const double level = note_amplitude * std::pow(10.0, s.predicted_db / 20.0);
    const double top = highest_partial_hz(s.sample_rate);
    std::vector<Partial> out;
    for (const DyadTones& dyad : chord_tones(kb, chord, options))
        for (const Tone& t : dyad.tones)
            if (t.hz >= render_limits::min_note_hz && t.hz <= top && t.audibility > 0.0)
                out.push_back({t.hz, level * t.audibility});
    if (out.size() > render_limits::max_predicted_tones) {
        auto louder = [](const Partial& x, const Partial& y) {
            return x.amplitude != y.amplitude ? x.amplitude > y.amplitude
                                              : x.frequency_hz < y.frequency_hz;
        };
        std::partial_sort(out.begin(), out.begin() + render_limits::max_predicted_tones, out.end(),
                          louder);
        out.resize(render_limits::max_predicted_tones);
    }
    return out;
}

// The chain: notes -> sum of partials (peak at most 1) -> envelope -> model -> DC removal
// -> envelope again -> peak cap. The first envelope shapes the notes the model hears; the
// second makes the output start and end in silence whatever the model does (the oscillator
// rings on after its input stops, and DC removal leaves a slow tail after a quadratic term's
// offset). The drive into a model is fixed: every note's partials together
// reach 1 / (number of notes), so the dry mix never exceeds full scale.
std::vector<double> render(const Scale& scale, const std::vector<int>& notes,
                           const RenderSettings& s) {
    check_render_settings(s, notes.size());
    const double top = highest_partial_hz(s.sample_rate);
    const std::vector<double> hz = note_frequencies(scale, notes, s.ref_hz);
    for (std::size_t i = 0; i < hz.size(); ++i)
        if (!(hz[i] >= render_limits::min_note_hz && hz[i] <= top))
            fail({"--notes", 0, 0}, "note " + std::to_string(notes[i]) + " is at " + num(hz[i]) +
                                        " Hz, outside the playable range " +
                                        num(render_limits::min_note_hz) + " to " + num(top) +
                                        " Hz at " + std::to_string(s.sample_rate) + " Hz");
    double harmonics_sum = 0.0;
    for (int k = 1; k <= s.timbre.partials; ++k)
        harmonics_sum += harmonic_gain(s.timbre, k);
    const double note_amplitude = 1.0 / (double(hz.size()) * harmonics_sum);

    const auto frames = static_cast<std::size_t>(std::llround(s.seconds * s.sample_rate));
    std::vector<Partial> partials = harmonic_partials(hz, note_amplitude, s.timbre, top);
    if (s.model == Model::predicted) {
        const auto extra = predicted_partials(scale, notes, s, note_amplitude);
        partials.insert(partials.end(), extra.begin(), extra.end());
    }
    std::vector<double> out = synthesize(partials, frames, s.sample_rate);
    apply_envelope(out, s.envelope, s.sample_rate);
    switch (s.model) {
    case Model::none:
    case Model::predicted:
        break;
    case Model::poly:
        apply_polynomial(out, s.polynomial);
        break;
    case Model::oscillator:
        out = drive_oscillator(out, s.oscillator, s.sample_rate);
        break;
    }
    remove_dc(out, s.sample_rate);
    apply_envelope(out, s.envelope, s.sample_rate);
    scale_to_peak(out, s.peak_dbfs);
    return out;
}

} // namespace terzo
