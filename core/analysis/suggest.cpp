#include "core/analysis/suggest.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <cstdlib>
#include <numeric>

#include "core/analysis/audibility.hpp"
#include "core/analysis/candidates.hpp"
#include "core/analysis/chord.hpp"

namespace terzo {

namespace {

__extension__ typedef __int128 i128;

// Where a deviation is this small, exact arithmetic decides whether a tone equals the new
// note (the resultant engine uses the same bound for its rational fast path).
constexpr double exact_check_cents = 1e-7;

bool fits64(i128 v) { return v > i128(INT64_MIN) && v <= i128(INT64_MAX); }

// Running sums of the fit: all counted tones, and those at or above the pitch-perception
// floor (to tell whether a gain rests on infrasonic tones).
struct Sums {
    double squares = 0.0, weight = 0.0;
    double audible_squares = 0.0, audible_weight = 0.0;
    void add(double w, double dev, double hz) {
        squares += w * dev * dev;
        weight += w;
        if (hz >= pitch_perception_floor_hz) {
            audible_squares += w * dev * dev;
            audible_weight += w;
        }
    }
    // A counted tone's landing moves: its weight stays, its squared deviation changes.
    void move(double w, double from, double to, double hz) {
        const double change = w * (to * to - from * from);
        squares += change;
        if (hz >= pitch_perception_floor_hz) audible_squares += change;
    }
};

double rms(double squares, double weight) { return weight > 0.0 ? std::sqrt(squares / weight) : 0.0; }

// A tone of the existing dyads that counts in the fit.
struct Counted {
    double cents, weight, deviation, hz;
    bool exact;
    std::uint32_t dyad, tone;
};

// The new note nearest a tone: its period k and the deviation, computed as landing() does
// (tone minus note, the note at k periods plus its place in the period).
struct CandidateLanding {
    int period;
    double deviation;
};

CandidateLanding candidate_landing(double cents, double x, double period) {
    const int k = int(std::lround((cents - x) / period));
    return {k, cents - (k * period + x)};
}

// Would the landing move from a note at deviation `old` to the new note at `d`? The nearer
// wins; on a tie, the lower note, as landing() decides.
bool takes_landing(double d, double old) {
    const double a = std::fabs(d), b = std::fabs(old);
    return a < b || (a == b && d >= 0.0 && old < 0.0);
}

// A note of the new degree, computed as Keyboard::note computes notes of its own degrees.
Note candidate_note(const Keyboard& kb, const Pitch& pitch, int period) {
    Note n;
    n.degree = -1;
    n.period = period;
    n.pitch = pitch * period_power(kb.scale().period(), period);
    n.cents = n.pitch.cents();
    long double factor;
    if (auto r = n.pitch.ratio())
        factor = r->is_small() ? r->to_long_double() : std::exp2(r->log2());
    else if (auto v = n.pitch.vector())
        factor = std::exp2(v->log2());
    else
        factor = std::exp2(static_cast<long double>(n.cents) / 1200.0L);
    n.hz = static_cast<double>(kb.ref_hz() * factor);
    return n;
}

// The exact value of A*f_low + B*f_high when the notes allow (rational notes, or exact notes
// whose ratio is rational), as the engine computes it.
std::optional<Pitch> exact_tone(const Note& low, const Note& high, std::int64_t A, std::int64_t B) {
    auto rl = low.pitch.ratio(), rh = high.pitch.ratio();
    if (rl && rh) {
        Ratio r = Ratio(A) * *rl + Ratio(B) * *rh;
        if (r.sign() > 0) return Pitch::from_ratio(r);
        return std::nullopt;
    }
    if (!low.pitch.is_exact() || !high.pitch.is_exact()) return std::nullopt;
    Pitch q = high.pitch / low.pitch;
    if (!q.is_rational()) return std::nullopt;
    Ratio m = Ratio(A) + Ratio(B) * *q.ratio();
    if (m.sign() <= 0) return std::nullopt;
    return low.pitch * Pitch::from_ratio(m);
}

bool equals_candidate_note(const Keyboard& kb, const std::optional<Pitch>& tone, const Pitch& candidate,
                           int period) {
    if (!tone) return false;
    return exactly_equal(*tone, candidate * period_power(kb.scale().period(), period)).value_or(false);
}

// What the scoring of one candidate collects.
struct Score {
    Sums delta; // added to the base sums
    std::size_t exact = 0, near = 0, infrasonic = 0;
};

// The part of the work that does not depend on the candidate.
class Grower {
public:
    Grower(const Keyboard& kb, const SuggestOptions& o)
        : kb_(kb), o_(o), terms_(combination_terms(o.tones.order)) {
        dyads_ = o.chord ? chord_tones(kb, *o.chord, o.tones) : keyboard_tones(kb, o.tones);
        for (std::size_t i = 0; i < dyads_.size(); ++i)
            for (std::size_t j = 0; j < dyads_[i].tones.size(); ++j) {
                const Tone& t = dyads_[i].tones[j];
                const double w = fit_weight(t, o.fit);
                if (w <= 0.0) continue;
                counted_.push_back({t.cents, w, t.landing.deviation_cents, t.hz, t.landing.exact,
                                    std::uint32_t(i), std::uint32_t(j)});
                base_.add(w, t.landing.deviation_cents, t.hz);
            }
        base_fit_ = fit(dyads_, o.fit);
        if (!o.chord) {
            const std::uint64_t n = kb.notes().size() + std::uint64_t(kb.span());
            check_tone_count(n * (n - 1) / 2, o.tones); // the grown keyboard's dyads
        }
    }

    const Fit& base_fit() const { return base_fit_; }

    Addition score(const Pitch& candidate) const {
        Score s;
        const double x = candidate.cents(), period = kb_.period_cents();
        const double near = o_.near_cents;
        auto note_landing = [&](double dev, double hz, bool exact) {
            if (std::fabs(dev) > near) return;
            ++s.near;
            if (exact) ++s.exact;
            if (hz < pitch_perception_floor_hz) ++s.infrasonic;
        };

        // Existing tones: only landings move.
        for (const Counted& t : counted_) {
            if (t.exact) continue; // an exact landing has deviation 0 and keeps its note
            CandidateLanding c = candidate_landing(t.cents, x, period);
            if (!takes_landing(c.deviation, t.deviation)) continue;
            bool exact = false;
            if (std::fabs(c.deviation) <= exact_check_cents) {
                const Tone& tone = dyads_[t.dyad].tones[t.tone];
                exact = equals_candidate_note(kb_, tone.exact_value(), candidate, c.period);
                if (exact) c.deviation = 0.0;
            }
            s.delta.move(t.weight, t.deviation, c.deviation, t.hz);
            note_landing(c.deviation, t.hz, exact);
        }

        // New dyads: each note of the new degree with every other note of the grown keyboard.
        if (!o_.chord) {
            std::vector<Note> added;
            for (int p = 0; p < kb_.span(); ++p) added.push_back(candidate_note(kb_, candidate, p));
            for (std::size_t i = 0; i < added.size(); ++i) {
                for (const Note& other : kb_.notes()) dyad(added[i], other, candidate, s, note_landing);
                for (std::size_t j = i + 1; j < added.size(); ++j)
                    dyad(added[i], added[j], candidate, s, note_landing);
            }
        }

        Addition a;
        a.pitch = candidate;
        a.fit = rms(base_.squares + s.delta.squares, base_.weight + s.delta.weight);
        a.gain = base_fit_.rms_cents - a.fit;
        a.exact_landings = s.exact;
        a.near_landings = s.near;
        if (o_.fit.pitch_floor_hz < pitch_perception_floor_hz) {
            a.infrasonic_landings = s.infrasonic;
            const double audible_gain =
                rms(base_.audible_squares, base_.audible_weight) -
                rms(base_.audible_squares + s.delta.audible_squares,
                    base_.audible_weight + s.delta.audible_weight);
            a.gain_is_infrasonic = a.gain > 0.0 && audible_gain <= 0.0;
        }
        return a;
    }

private:
    // The counted tones of one new dyad (the candidate's note `c` and `other`), landed on the
    // grown keyboard: the base keyboard's nearest note, or the new note when it is nearer.
    // Tones are computed as the engine computes them: for rational notes over a common
    // denominator (the sign decided exactly, cents from the exact ratio in double), otherwise
    // in floating point with the engine's rule that a tone below 1e-9 of its parts is zero.
    template <class OnLanding>
    void dyad(const Note& c, const Note& other, const Pitch& candidate, Score& s,
              OnLanding& on_landing) const {
        if (c.cents == other.cents) return; // a unison is no dyad
        const Note& low = c.cents < other.cents ? c : other;
        const Note& high = c.cents < other.cents ? other : c;
        const double fl = low.hz, fh = high.hz, ref = kb_.ref_hz();
        const double x = candidate.cents(), period = kb_.period_cents();

        bool small = false;
        std::int64_t nl = 0, nh = 0, den = 1;
        if (o_.tones.exact) {
            auto rl = low.pitch.ratio(), rh = high.pitch.ratio();
            if (rl && rh && rl->is_small() && rh->is_small()) {
                const std::int64_t g = std::gcd(rl->den(), rh->den());
                const i128 d = i128(rl->den() / g) * rh->den();
                const i128 a = i128(rl->num()) * (d / rl->den()), b = i128(rh->num()) * (d / rh->den());
                if (fits64(d) && fits64(a) && fits64(b)) {
                    small = true;
                    nl = std::int64_t(a);
                    nh = std::int64_t(b);
                    den = std::int64_t(d);
                }
            }
        }

        for (int i = 1; i <= o_.tones.partials; ++i)
            for (int j = 1; j <= o_.tones.partials; ++j)
                for (const CombinationTerm& t : terms_) {
                    const std::int64_t A = std::int64_t(t.a) * i, B = std::int64_t(t.b) * j;
                    double hz, ratio = 0.0;
                    if (small) {
                        const i128 n = i128(A) * nl + i128(B) * nh;
                        if (n <= 0) continue;
                        ratio = double(n) / double(den);
                        hz = ref * ratio;
                    } else {
                        hz = A * fl + B * fh;
                        if (hz <= 1e-9 * (std::abs(A) * fl + std::abs(B) * fh)) continue;
                    }
                    const double w = fit_weight(t, audibility(t, fl, fh, i, j), hz, o_.fit);
                    if (w <= 0.0) continue;
                    const double cents = small ? 1200.0 * std::log2(ratio) : 1200.0 * std::log2(hz / ref);
                    const Landing base = nearest_note(kb_, cents);
                    CandidateLanding cl = candidate_landing(cents, x, period);
                    if (!takes_landing(cl.deviation, base.deviation_cents)) {
                        s.delta.add(w, base.deviation_cents, hz);
                        continue;
                    }
                    bool exact = false;
                    if (std::fabs(cl.deviation) <= exact_check_cents) {
                        exact = equals_candidate_note(kb_, exact_tone(low, high, A, B), candidate, cl.period);
                        if (exact) cl.deviation = 0.0;
                    }
                    s.delta.add(w, cl.deviation, hz);
                    on_landing(cl.deviation, hz, exact);
                }
    }

    const Keyboard& kb_;
    const SuggestOptions& o_;
    std::vector<CombinationTerm> terms_;
    std::vector<DyadTones> dyads_;
    std::vector<Counted> counted_;
    Sums base_;
    Fit base_fit_;
};

std::vector<DyadTones> tones_for(const Keyboard& kb, const SuggestOptions& o) {
    return o.chord ? chord_tones(kb, *o.chord, o.tones) : keyboard_tones(kb, o.tones);
}

} // namespace

Scale grown_scale(const Scale& scale, const Pitch& pitch, std::size_t* index) {
    std::vector<Pitch> above(scale.degrees().begin() + 1, scale.degrees().end());
    std::size_t at = 0;
    while (at < above.size() && above[at].cents() < pitch.cents()) ++at;
    above.insert(above.begin() + std::ptrdiff_t(at), pitch);
    if (index) *index = at + 1;
    return Scale(scale.description(), above, scale.period());
}

Scale shrunk_scale(const Scale& scale, std::size_t degree) {
    TERZO_ASSERT(degree >= 1 && degree < scale.size());
    std::vector<Pitch> above;
    for (std::size_t d = 1; d < scale.size(); ++d)
        if (d != degree) above.push_back(scale.degree(d));
    return Scale(scale.description(), above, scale.period());
}

Suggestions suggest(const Keyboard& keyboard, const std::vector<Pitch>& candidates,
                    const SuggestOptions& options, bool removals) {
    check_options(options.tones);
    check_fit_options(options.fit);
    Grower grower(keyboard, options);
    Suggestions out;
    out.base = grower.base_fit();
    for (const Pitch& c : new_candidates(keyboard, candidates)) out.add.push_back(grower.score(c));
    std::stable_sort(out.add.begin(), out.add.end(), [](const Addition& a, const Addition& b) {
        return a.fit != b.fit ? a.fit < b.fit : a.pitch.cents() < b.pitch.cents();
    });
    if (removals) {
        for (std::size_t d = 1; d < keyboard.scale().size(); ++d) {
            Keyboard kb(shrunk_scale(keyboard.scale(), d), keyboard.ref_hz(), keyboard.span());
            Removal r;
            r.degree = int(d);
            r.fit = fit(tones_for(kb, options), options.fit).rms_cents;
            r.gain = out.base.rms_cents - r.fit;
            out.remove.push_back(r);
        }
        std::stable_sort(out.remove.begin(), out.remove.end(), [](const Removal& a, const Removal& b) {
            return a.fit != b.fit ? a.fit < b.fit : a.degree < b.degree;
        });
    }
    return out;
}

Addition addition_from_scratch(const Keyboard& keyboard, const Pitch& candidate,
                               const SuggestOptions& options, double base_fit) {
    std::size_t index = 0;
    Keyboard kb(grown_scale(keyboard.scale(), candidate, &index), keyboard.ref_hz(), keyboard.span());
    const auto dyads = tones_for(kb, options);
    Addition a;
    a.pitch = candidate;
    a.fit = fit(dyads, options.fit).rms_cents;
    a.gain = base_fit - a.fit;
    for (const auto& d : dyads)
        for (const auto& t : d.tones) {
            if (fit_weight(t, options.fit) <= 0.0 || t.landing.degree != int(index) ||
                std::fabs(t.landing.deviation_cents) > options.near_cents)
                continue;
            ++a.near_landings;
            if (t.landing.exact) ++a.exact_landings;
            if (t.hz < pitch_perception_floor_hz) ++a.infrasonic_landings;
        }
    if (options.fit.pitch_floor_hz < pitch_perception_floor_hz) {
        FitOptions audible = options.fit;
        audible.pitch_floor_hz = pitch_perception_floor_hz;
        const double gain = fit(tones_for(keyboard, options), audible).rms_cents - fit(dyads, audible).rms_cents;
        a.gain_is_infrasonic = a.gain > 0.0 && gain <= 0.0;
    } else {
        a.infrasonic_landings = 0;
    }
    return a;
}

} // namespace terzo
