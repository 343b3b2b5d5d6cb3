#include "core/analysis/suggest.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <cstdlib>
#include <map>
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

// A tone of the existing dyads that counts in the fit and is not (within rounding) on a note.
struct Counted {
    double place; // cents reduced into the period
    double cents, weight, deviation, hz;
    std::uint32_t dyad;   // index into the existing dyads
    std::int32_t a, b;    // the tone is a*f_low + b*f_high (partials included)
    std::int64_t n;       // for a rational dyad over a common denominator: the numerator
    bool small;           // n is set
};

// One tone as the engine computes it (see Grower::each_tone).
struct ToneValue {
    const CombinationTerm* term;
    std::int64_t a, b;
    double hz, cents, weight, audibility;
    i128 n;      // numerator over the dyad's common denominator, when `small`
    bool small;
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

    /// The deviation from the nearest degree.
    double operator()(double cents) const {
        CandidateLanding unused;
        return (*this)(cents, 0.0, unused);
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
        std::size_t b = std::size_t(in * inverse_ * double(buckets));
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
        // The existing dyads, in the order keyboard_tones and chord_tones take them.
        const std::vector<Note>& all = o.chord ? *o.chord : kb.notes();
        std::vector<Note> notes = all;
        if (o.chord)
            std::stable_sort(notes.begin(), notes.end(), [](const Note& x, const Note& y) { return x.cents < y.cents; });
        check_tone_count(notes.size() * (notes.size() - 1) / 2, o.tones);
        if (!o.chord) {
            // The grown keyboard's dyads, checked before any work (the scale's own may pass).
            const std::uint64_t n = notes.size() + std::uint64_t(kb.span());
            check_tone_count(n * (n - 1) / 2, o.tones);
        }
        dyads_.reserve(notes.size() * (notes.size() - 1) / 2);
        for (std::size_t i = 0; i < notes.size(); ++i)
            for (std::size_t j = i + 1; j < notes.size(); ++j) {
                const Note* lo = &notes[i];
                const Note* hi = &notes[j];
                if (lo->cents == hi->cents) continue; // a unison is no dyad
                if (lo->cents > hi->cents) std::swap(lo, hi);
                dyads_.push_back({*lo, *hi});
            }

        // The scale's own tones: each counts with its landing on the scale, and those not on
        // a note (within rounding) are kept, by place in the period, for new notes to take.
        const double period = kb.period_cents();
        counted_.reserve(tone_count_bound(dyads_.size(), o.tones)); // one allocation, no copies
        for (std::size_t d = 0; d < dyads_.size(); ++d)
            each_tone(dyads_[d].first, dyads_[d].second, true, [&](const ToneValue& t) {
                const double dev = nearest_(t.cents);
                base_.add(t.weight, dev, t.hz);
                ++base_tones_;
                if (std::fabs(dev) <= exact_check_cents) return; // no other note is that near
                const double place = t.cents - floor_int(t.cents / period) * period;
                counted_.push_back({place, t.cents, t.weight, dev, t.hz, std::uint32_t(d), std::int32_t(t.a),
                                    std::int32_t(t.b), t.small ? std::int64_t(t.n) : 0,
                                    t.small && fits64(t.n)});
                widest_ = std::max(widest_, std::fabs(dev));
            });
        std::sort(counted_.begin(), counted_.end(),
                  [](const Counted& a, const Counted& b) { return a.place < b.place; });
        if (auto r = kb.scale().period().ratio()) {
            power_offset_ = cached_periods;
            for (int k = -cached_periods; k <= kb.span() + cached_periods; ++k) period_powers_.push_back(r->pow(k));
        }
        for (int p = 0; p < kb.span(); ++p) {
            // Powers of a 2/1 period are exact in floating point, so copies keep their hertz.
            const auto r = kb.scale().period().ratio();
            shift_factors_.push_back(r && r->is_small() ? double(r->pow(p).to_long_double())
                                                        : std::exp2(p * period / 1200.0));
        }
        if (!o.chord) {
            std::map<std::pair<int, int>, std::size_t> index;
            for (const Note& n : kb.notes())
                for (int p = 0; p < kb.span(); ++p) {
                    const std::pair<int, int> key{n.degree, n.period - p};
                    auto [it, added] = index.emplace(key, groups_.size());
                    if (added) groups_.push_back({kb.note(key.first, key.second), {}});
                    groups_[it->second].shifts.push_back(p);
                }
            own_shifts_.resize(std::size_t(kb.span()));
            for (int rel = 1; rel < kb.span(); ++rel)
                for (int p = 0; p + rel < kb.span(); ++p) own_shifts_[std::size_t(rel)].push_back(p);
        }
    }

    double base_fit() const { return rms(base_.squares, base_.weight); }
    std::size_t base_tones() const { return base_tones_; }

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
                const auto& [low, high] = dyads_[t.dyad];
                exact = t.small && ratio ? equals_note_ratio(Ratio(t.n, common_denominator(low, high)), *ratio, c.period)
                                         : equals_candidate_note(kb_, exact_tone(low, high, t.a, t.b), candidate, c.period);
                if (exact) c.deviation = 0.0;
            }
            s.delta.move(t.weight, t.deviation, c.deviation, t.hz);
            note_landing(s, c.deviation, t.hz, exact);
        });

        // New dyads: each note of the new degree with every other note of the grown keyboard.
        // The dyad of the new note in period p with a note in period q is the dyad of the new
        // note in period 0 with that note in period q - p, p periods up: its tones are the same
        // p periods up, with the same audibility (a function of the frequency ratio) and the
        // same landings on the periodic keyboard. So each is computed once, in period 0, and
        // counted at every period where the keyboard has it (the pitch floor decided per copy).
        if (!o_.chord) {
            const Note c0 = candidate_note(kb_, candidate, 0);
            for (const Group& g : groups_) new_dyad(c0, g.partner, g.shifts, candidate, ratio, s);
            for (int rel = 1; rel < kb_.span(); ++rel) // pairs of the new degree's own notes
                new_dyad(c0, candidate_note(kb_, candidate, rel), own_shifts_[std::size_t(rel)], candidate, ratio, s);
        }

        Addition a;
        a.pitch = candidate;
        a.fit = rms(base_.squares + s.delta.squares, base_.weight + s.delta.weight);
        a.gain = base_fit() - a.fit;
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
    // The common denominator of two small rational notes, when their numerators over it fit
    // in 64 bits (the engine's fast path); 0 otherwise.
    struct Common {
        std::int64_t nl = 0, nh = 0, den = 0;
    };
    static Common common(const Note& low, const Note& high) {
        Common c;
        auto rl = low.pitch.ratio(), rh = high.pitch.ratio();
        if (!rl || !rh || !rl->is_small() || !rh->is_small()) return c;
        const std::int64_t g = std::gcd(rl->den(), rh->den());
        const i128 d = i128(rl->den() / g) * rh->den();
        const i128 a = i128(rl->num()) * (d / rl->den()), b = i128(rh->num()) * (d / rh->den());
        if (fits64(d) && fits64(a) && fits64(b)) c = {std::int64_t(a), std::int64_t(b), std::int64_t(d)};
        return c;
    }
    static std::int64_t common_denominator(const Note& low, const Note& high) { return common(low, high).den; }

    // Calls f(ToneValue) for every tone of the dyad that counts in the fit, computed as the
    // engine computes it: for rational notes over a common denominator (the sign decided
    // exactly, cents from the exact ratio in double), otherwise in floating point with the
    // engine's rule that a tone below 1e-9 of its parts is zero; weighted by fit_weight.
    // With `floored` false the pitch floor is not applied (the caller applies it per copy).
    template <class F>
    void each_tone(const Note& low, const Note& high, bool floored, F&& f) const {
        const FitOptions unfloored;
        const FitOptions& fit_options = floored ? o_.fit : unfloored;
        const double fl = low.hz, fh = high.hz, ref = kb_.ref_hz();
        const Common c = o_.tones.exact ? common(low, high) : Common{};
        const bool small = c.den != 0;
        for (int i = 1; i <= o_.tones.partials; ++i)
            for (int j = 1; j <= o_.tones.partials; ++j)
                for (const CombinationTerm& t : terms_) {
                    ToneValue v;
                    v.term = &t;
                    v.a = std::int64_t(t.a) * i;
                    v.b = std::int64_t(t.b) * j;
                    v.small = small;
                    double r = 0.0;
                    if (small) {
                        v.n = i128(v.a) * c.nl + i128(v.b) * c.nh;
                        if (v.n <= 0) continue;
                        // (an int64 conversion where it fits: the same double, no library call)
                        r = (fits64(v.n) ? double(std::int64_t(v.n)) : double(v.n)) / double(c.den);
                        v.hz = ref * r;
                    } else {
                        v.n = 0;
                        v.hz = v.a * fl + v.b * fh;
                        if (v.hz <= 1e-9 * (std::abs(v.a) * fl + std::abs(v.b) * fh)) continue;
                    }
                    v.audibility = audibility(t, fl, fh, i, j);
                    v.weight = fit_weight(t, v.audibility, v.hz, fit_options);
                    if (v.weight <= 0.0) continue;
                    v.cents = small ? 1200.0 * std::log2(r) : 1200.0 * std::log2(v.hz / ref);
                    f(v);
                }
    }

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

    // The counted tones of one new dyad (the new note `c` and `other`) and of its copies
    // `shifts` periods up, landed on the grown keyboard: the scale's nearest note, or the new
    // note when it is nearer.
    void new_dyad(const Note& c, const Note& other, const std::vector<int>& shifts, const Pitch& candidate,
                  const std::optional<Ratio>& ratio, Score& s) const {
        if (c.cents == other.cents) return; // a unison is no dyad
        const Note& low = c.cents < other.cents ? c : other;
        const Note& high = c.cents < other.cents ? other : c;
        const double x = candidate.cents(), period = kb_.period_cents();
        std::int64_t den = 0;
        each_tone(low, high, false, [&](const ToneValue& t) {
            for (int p : shifts) {
                const double hz = t.hz * shift_factors_[std::size_t(p)];
                const double w = fit_weight(*t.term, t.audibility, hz, o_.fit);
                if (w <= 0.0) continue;
                const double cents = t.cents + p * period;
                CandidateLanding cl;
                const double base = nearest_(cents, x, cl);
                if (!takes_landing(cl.deviation, base)) {
                    s.delta.add(w, base, hz);
                    continue;
                }
                bool exact = false;
                if (std::fabs(cl.deviation) <= exact_check_cents) {
                    // The copy equals the new note k periods up when the tone in period 0
                    // equals it k - p periods up.
                    if (t.small && ratio && fits64(t.n)) {
                        if (den == 0) den = common_denominator(low, high);
                        exact = equals_note_ratio(Ratio(std::int64_t(t.n), den), *ratio, cl.period - p);
                    } else {
                        exact = equals_candidate_note(kb_, exact_tone(low, high, t.a, t.b), candidate, cl.period - p);
                    }
                    if (exact) cl.deviation = 0.0;
                }
                s.delta.add(w, cl.deviation, hz);
                note_landing(s, cl.deviation, hz, exact);
            }
        });
    }

    static constexpr int cached_periods = 64;

    const Keyboard& kb_;
    const SuggestOptions& o_;
    std::vector<CombinationTerm> terms_;
    NearestDeviation nearest_;
    std::vector<std::pair<Note, Note>> dyads_; // the existing dyads, low note first
    std::vector<Counted> counted_;             // by place in the period
    double widest_ = 0.0;                      // largest |deviation| among them
    Sums base_;
    std::size_t base_tones_ = 0;
    int power_offset_ = 0;
    std::vector<Ratio> period_powers_; // period^k for k = -power_offset_ ..., when rational
    // The keyboard's notes as partners of the new note in period 0: each note (degree d,
    // period q) of the keyboard meets the new note of period p as (d, q - p) meets period 0.
    struct Group {
        Note partner;            // (d, q - p)
        std::vector<int> shifts; // every such p
    };
    std::vector<Group> groups_;
    std::vector<std::vector<int>> own_shifts_; // [rel]: the p with p + rel < span
    std::vector<double> shift_factors_;        // period^p as a frequency factor, p < span
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
    out.base_fit = grower.base_fit();
    out.base_tones = grower.base_tones();
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
            r.gain = out.base_fit - r.fit;
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
