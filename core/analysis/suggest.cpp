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

// A tone of the existing dyads that counts in the fit and does not land exactly.
struct Counted {
    double place; // cents reduced into the period
    double cents, weight, deviation, hz;
    std::uint32_t dyad, tone;
};

// The new note nearest a tone: its period k and the deviation, computed as landing() does
// (tone minus note, the note at k periods plus its place in the period).
struct CandidateLanding {
    int period;
    double deviation;
};

// floor and round of values well inside int's range, without a library call.
int floor_int(double v) {
    const int t = int(v);
    return double(t) > v ? t - 1 : t;
}
int round_int(double v) { return floor_int(v + 0.5); }

// `inverse` is 1 / period: a product instead of a division. Near half a period it may pick
// the farther of two notes, but no landing is taken from that far (see takes_landing's uses).
CandidateLanding candidate_landing(double cents, double x, double period, double inverse) {
    const int k = round_int((cents - x) * inverse);
    return {k, cents - (k * period + x)};
}

// The deviation of a tone from the nearest note of the keyboard's own degrees: what
// nearest_note() returns, computed the same way (the tone minus the note, the note at a whole
// number of periods plus its place in the period; on a tie the lower note), with a bucket
// table instead of a binary search because it runs for every new tone of every candidate.
class NearestDeviation {
public:
    explicit NearestDeviation(const Keyboard& kb)
        : period_(kb.period_cents()), inverse_(1.0 / period_), half_(period_ / 2.0) {
        for (const auto& e : kb.sorted_degrees()) places_.push_back(e.cents_in_period);
        // first_[b]: the first place at or above bucket b's start.
        first_.resize(buckets + 1);
        std::size_t i = 0;
        for (std::size_t b = 0; b <= buckets; ++b) {
            const double start = period_ * double(b) / double(buckets);
            while (i < places_.size() && places_[i] < start) ++i;
            first_[b] = i;
        }
    }

    /// The deviation from the nearest degree, and (in `landing`) the nearest note of a degree
    /// placed at `x` in the period, as a period count and deviation.
    double operator()(double cents, double x, CandidateLanding& landing) const {
        // The period count by a product, not a division; corrected when it is one off.
        int p = floor_int(cents * inverse_);
        double in = cents - p * period_;
        if (in >= period_) {
            in -= period_;
            ++p;
        } else if (in < 0.0) {
            in += period_;
            --p;
        }
        const double from_x = in - x;
        landing.period = from_x > half_ ? p + 1 : from_x < -half_ ? p - 1 : p;
        landing.deviation = cents - (landing.period * period_ + x);
        // The first place strictly above `in`, as neighbours() in landing.cpp finds it.
        std::size_t b = std::size_t(in / period_ * double(buckets));
        if (b >= buckets) b = buckets - 1;
        std::size_t hi = first_[b];
        while (hi < places_.size() && places_[hi] <= in) ++hi;
        const double below = hi > 0 ? cents - (p * period_ + places_[hi - 1])
                                    : cents - ((p - 1) * period_ + places_.back());
        const double above = hi < places_.size() ? cents - (p * period_ + places_[hi])
                                                 : cents - ((p + 1) * period_ + places_.front());
        return std::fabs(below) <= std::fabs(above) ? below : above;
    }

private:
    static constexpr std::size_t buckets = 256;
    double period_, inverse_, half_;
    std::vector<double> places_;
    std::vector<std::size_t> first_;
};

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
        : kb_(kb), o_(o), terms_(combination_terms(o.tones.order)), nearest_(kb) {
        if (!o.chord) {
            // The grown keyboard's dyads, checked before any work (the scale's own may pass).
            const std::uint64_t n = kb.notes().size() + std::uint64_t(kb.span());
            check_tone_count(n * (n - 1) / 2, o.tones);
        }
        dyads_ = o.chord ? chord_tones(kb, *o.chord, o.tones) : keyboard_tones(kb, o.tones);
        const double period = kb.period_cents();
        for (std::size_t i = 0; i < dyads_.size(); ++i)
            for (std::size_t j = 0; j < dyads_[i].tones.size(); ++j) {
                const Tone& t = dyads_[i].tones[j];
                const double w = fit_weight(t, o.fit);
                if (w <= 0.0) continue;
                base_.add(w, t.landing.deviation_cents, t.hz);
                if (t.landing.exact) continue; // deviation 0: no new note can take its landing
                const double place = t.cents - floor_int(t.cents / period) * period;
                counted_.push_back({place, t.cents, w, t.landing.deviation_cents, t.hz,
                                    std::uint32_t(i), std::uint32_t(j)});
                widest_ = std::max(widest_, std::fabs(t.landing.deviation_cents));
            }
        std::sort(counted_.begin(), counted_.end(),
                  [](const Counted& a, const Counted& b) { return a.place < b.place; });
        base_fit_ = fit(dyads_, o.fit);
        if (auto r = kb.scale().period().ratio()) {
            power_offset_ = cached_periods;
            for (int k = -cached_periods; k <= kb.span() + cached_periods; ++k) period_powers_.push_back(r->pow(k));
        }
    }

    const Fit& base_fit() const { return base_fit_; }

    Addition score(const Pitch& candidate) const {
        Score s;
        const double x = candidate.cents(), period = kb_.period_cents(), inverse = 1.0 / period;
        const std::optional<Ratio> ratio = candidate.ratio();

        // Existing tones: only landings move, and only those of tones whose place in the
        // period lies within the widest deviation of the new note.
        const double reach = widest_ + 1e-9;
        for_places(x - reach, x + reach, [&](const Counted& t) {
            CandidateLanding c = candidate_landing(t.cents, x, period, inverse);
            if (!takes_landing(c.deviation, t.deviation)) return;
            bool exact = false;
            if (std::fabs(c.deviation) <= exact_check_cents) {
                const Tone& tone = dyads_[t.dyad].tones[t.tone];
                exact = tone.ratio && ratio ? equals_note_ratio(*tone.ratio, *ratio, c.period)
                                            : equals_candidate_note(kb_, tone.exact_value(), candidate, c.period);
                if (exact) c.deviation = 0.0;
            }
            s.delta.move(t.weight, t.deviation, c.deviation, t.hz);
            note_landing(s, c.deviation, t.hz, exact);
        });

        // New dyads: each note of the new degree with every other note of the grown keyboard.
        if (!o_.chord) {
            std::vector<Note> added;
            for (int p = 0; p < kb_.span(); ++p) added.push_back(candidate_note(kb_, candidate, p));
            for (std::size_t i = 0; i < added.size(); ++i) {
                for (const Note& other : kb_.notes()) dyad(added[i], other, candidate, ratio, s);
                for (std::size_t j = i + 1; j < added.size(); ++j)
                    dyad(added[i], added[j], candidate, ratio, s);
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
    // Calls f for each counted tone whose place in the period lies in [low, high], a range
    // that may reach past either end of the period (it wraps).
    template <class F>
    void for_places(double low, double high, F&& f) const {
        const double period = kb_.period_cents();
        if (high - low >= period) {
            for (const Counted& t : counted_) f(t);
            return;
        }
        auto run = [&](double a, double b) {
            auto it = std::lower_bound(counted_.begin(), counted_.end(), a,
                                       [](const Counted& t, double v) { return t.place < v; });
            for (; it != counted_.end() && it->place <= b; ++it) f(*it);
        };
        if (low < 0.0) {
            run(low + period, period);
            run(0.0, high);
        } else if (high >= period) {
            run(low, period);
            run(0.0, high - period);
        } else {
            run(low, high);
        }
    }

    void note_landing(Score& s, double dev, double hz, bool exact) const {
        if (std::fabs(dev) > o_.near_cents) return;
        ++s.near;
        if (exact) ++s.exact;
        if (hz < pitch_perception_floor_hz) ++s.infrasonic;
    }

    // Is the rational tone equal to the new note `period` periods up (candidate * P^period)?
    bool equals_note_ratio(const Ratio& tone, const Ratio& candidate, int period) const {
        if (period == 0) return tone == candidate;
        if (period_powers_.empty()) return false; // a tempered period: other periods are irrational
        const int i = period + power_offset_;
        if (i >= 0 && std::size_t(i) < period_powers_.size()) return tone == candidate * period_powers_[std::size_t(i)];
        return tone == candidate * kb_.scale().period().ratio()->pow(period);
    }

    // The counted tones of one new dyad (the new note `c` and `other`), landed on the grown
    // keyboard: the base keyboard's nearest note, or the new note when it is nearer. Tones are
    // computed as the engine computes them: for rational notes over a common denominator (the
    // sign decided exactly, cents from the exact ratio in double), otherwise in floating point
    // with the engine's rule that a tone below 1e-9 of its parts is zero.
    void dyad(const Note& c, const Note& other, const Pitch& candidate, const std::optional<Ratio>& ratio,
              Score& s) const {
        if (c.cents == other.cents) return; // a unison is no dyad
        const Note& low = c.cents < other.cents ? c : other;
        const Note& high = c.cents < other.cents ? other : c;
        const double fl = low.hz, fh = high.hz, ref = kb_.ref_hz();
        const double x = candidate.cents();

        bool small = false;
        std::int64_t nl = 0, nh = 0, den = 1;
        if (o_.tones.exact && ratio) {
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
                    double hz, r = 0.0;
                    i128 n = 0;
                    if (small) {
                        n = i128(A) * nl + i128(B) * nh;
                        if (n <= 0) continue;
                        // (an int64 conversion where it fits: the same double, no library call)
                        r = (fits64(n) ? double(std::int64_t(n)) : double(n)) / double(den);
                        hz = ref * r;
                    } else {
                        hz = A * fl + B * fh;
                        if (hz <= 1e-9 * (std::abs(A) * fl + std::abs(B) * fh)) continue;
                    }
                    const double w = fit_weight(t, audibility(t, fl, fh, i, j), hz, o_.fit);
                    if (w <= 0.0) continue;
                    const double cents = small ? 1200.0 * std::log2(r) : 1200.0 * std::log2(hz / ref);
                    CandidateLanding cl;
                    const double base = nearest_(cents, x, cl);
                    if (!takes_landing(cl.deviation, base)) {
                        s.delta.add(w, base, hz);
                        continue;
                    }
                    bool exact = false;
                    if (std::fabs(cl.deviation) <= exact_check_cents) {
                        exact = small && fits64(n)
                                    ? equals_note_ratio(Ratio(std::int64_t(n), den), *ratio, cl.period)
                                    : equals_candidate_note(kb_, exact_tone(low, high, A, B), candidate, cl.period);
                        if (exact) cl.deviation = 0.0;
                    }
                    s.delta.add(w, cl.deviation, hz);
                    note_landing(s, cl.deviation, hz, exact);
                }
    }

    static constexpr int cached_periods = 64;

    const Keyboard& kb_;
    const SuggestOptions& o_;
    std::vector<CombinationTerm> terms_;
    NearestDeviation nearest_;
    std::vector<DyadTones> dyads_;
    std::vector<Counted> counted_; // by place in the period
    double widest_ = 0.0;          // largest |deviation| among them
    Sums base_;
    Fit base_fit_;
    int power_offset_ = 0;
    std::vector<Ratio> period_powers_; // period^k for k = -power_offset_ ..., when rational
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
