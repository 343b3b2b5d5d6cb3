#include "core/analysis/measure_match.hpp"

#include <algorithm>
#include <cmath>
#include <map>

namespace terzo {

namespace {

double cents_of(double a, double b) {
    return 1200.0 * std::log2(a / b);
}

// The key whose equal-tempered pitch at the reference is nearest to hz.
int nearest_equal_key(const PitchReference& ref, double hz) {
    return midi_key(ref.note) + int(std::lround(12.0 * std::log2(hz / ref.hz)));
}

} // namespace

NoteCheck check_note(const NoteMap& map, double hz) {
    TERZO_ASSERT(hz > 0 && std::isfinite(hz));
    // A 12-note tuning's notes lie within a few tenths of a semitone of equal temperament, so
    // the nearest note is the equal-tempered key or one of its neighbours.
    const int centre = nearest_equal_key(map.reference(), hz);
    NoteCheck best;
    double best_abs = INFINITY;
    for (int key = centre - 1; key <= centre + 1; ++key) {
        const NoteName n = note_of_key(key);
        const double target = map.hz(n);
        const double dev = cents_of(hz, target);
        if (std::abs(dev) < best_abs) {
            best_abs = std::abs(dev);
            best = {n, hz, target, dev, hz - target};
        }
    }
    return best;
}

Beat measured_beat(double f_low, double f_high, const CheckedInterval& kind) {
    Beat b;
    b.hz = beat_rate(f_low, f_high, kind.p, kind.q);
    b.cents = cents_of(f_high / f_low, double(kind.p) / double(kind.q));
    b.tempering = std::abs(b.cents) < measured_pure_tolerance ? Tempering::pure
                  : b.cents > 0                                  ? Tempering::wide
                                                                 : Tempering::narrow;
    b.exact = false;
    return b;
}

std::optional<IntervalCheck> check_interval(const NoteMap& map, const NoteCheck& a, const NoteCheck& b) {
    const bool rising = midi_key(a.note) < midi_key(b.note);
    const NoteCheck& low = rising ? a : b;
    const NoteCheck& high = rising ? b : a;
    for (const CheckedInterval& kind : checked_intervals())
        if (midi_key(high.note) - midi_key(low.note) == kind.semitones) {
            IntervalCheck c;
            c.kind = &kind;
            c.low = low.note;
            c.high = high.note;
            c.measured = measured_beat(low.hz, high.hz, kind);
            c.target = beat(map.interval(c.low, c.high), map.hz(c.low), kind);
            return c;
        }
    return std::nullopt;
}

std::vector<IntervalCheck> check_intervals(const NoteMap& map, const std::vector<NoteCheck>& notes) {
    std::map<int, const NoteCheck*> by_key; // the last measurement of each note
    for (const NoteCheck& n : notes) by_key[midi_key(n.note)] = &n;
    std::vector<IntervalCheck> out;
    for (const CheckedInterval& kind : checked_intervals())
        for (const auto& [key, low] : by_key) {
            auto high = by_key.find(key + kind.semitones);
            if (high == by_key.end()) continue;
            auto c = check_interval(map, *low, *high->second);
            TERZO_ASSERT(c && c->kind == &kind);
            out.push_back(*c);
        }
    return out;
}

// The fit as a function of the shift s (cents from the guess) is a sum of parabolas whose
// pieces change where a tone's nearest note changes, so it is searched from a start every
// 10 cents: assign the nearest notes, move s to the mean of the tones' offsets from them
// (the least-squares shift for that assignment), and repeat until the assignment holds.
TuningFit fit_tuning(const Scale& scale, const std::string& name, int tonic,
                     const PitchReference& guess, const std::vector<double>& hz,
                     const StandardRange& range) {
    TERZO_ASSERT(!hz.empty());
    const NoteMap map(scale, tonic, guess, name);
    // Every key's position in cents from the guess's reference frequency.
    std::vector<double> position(128);
    for (int key = 0; key < 128; ++key) position[std::size_t(key)] = cents_of(map.hz(note_of_key(key)), guess.hz);
    std::vector<double> m; // the tones in cents from the reference frequency
    for (double f : hz) {
        TERZO_ASSERT(f > 0 && std::isfinite(f));
        m.push_back(cents_of(f, guess.hz));
    }
    const int ref_key = midi_key(guess.note);
    auto nearest = [&](double c) { // c: cents from the reference frequency
        const int centre = std::clamp(ref_key + int(std::lround(c / 100.0)), 0, 127);
        int best = centre;
        for (int key = std::max(0, centre - 1); key <= std::min(127, centre + 1); ++key)
            if (std::abs(c - position[std::size_t(key)]) < std::abs(c - position[std::size_t(best)]))
                best = key;
        return best;
    };
    auto rms_at = [&](double s) {
        double sum = 0;
        for (double c : m) {
            const double r = c - s - position[std::size_t(nearest(c - s))];
            sum += r * r;
        }
        return std::sqrt(sum / double(m.size()));
    };
    double best_s = 0, best_rms = rms_at(0);
    for (double start = -range.below_cents; start <= range.above_cents + 1e-9; start += 10.0) {
        double s = start;
        for (int iter = 0; iter < 8; ++iter) {
            double mean = 0;
            for (double c : m) mean += c - position[std::size_t(nearest(c - s))];
            mean /= double(m.size());
            const double next = std::clamp(mean, -range.below_cents, range.above_cents);
            if (std::abs(next - s) < 1e-9) break;
            s = next;
        }
        const double r = rms_at(s);
        // Equal within rounding: keep the standard nearer the guess.
        if (r < best_rms - 1e-9 || (std::abs(r - best_rms) <= 1e-9 && std::abs(s) < std::abs(best_s)))
            best_rms = r, best_s = s;
    }
    TuningFit fit;
    fit.name = name;
    fit.reference = PitchReference{guess.note, guess.hz * std::pow(2.0, best_s / 1200.0)};
    fit.rms_cents = best_rms;
    return fit;
}

std::vector<TuningFit> closest_tunings(const std::vector<std::pair<std::string, Scale>>& candidates,
                                       int tonic, const PitchReference& guess,
                                       const std::vector<double>& hz, const StandardRange& range) {
    std::vector<TuningFit> out;
    for (const auto& [name, scale] : candidates) out.push_back(fit_tuning(scale, name, tonic, guess, hz, range));
    std::sort(out.begin(), out.end(), [](const TuningFit& a, const TuningFit& b) {
        if (a.rms_cents != b.rms_cents) return a.rms_cents < b.rms_cents;
        return a.name < b.name;
    });
    return out;
}

} // namespace terzo
