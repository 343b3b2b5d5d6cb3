#include "core/analysis/combination.hpp"

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <numeric>
#include <set>
#include <utility>

#include "core/analysis/audibility.hpp"
#include "core/setting_error.hpp"

namespace terzo {

namespace {

__extension__ typedef __int128 i128;

bool fits64(i128 v) { return v > i128(INT64_MIN) && v <= i128(INT64_MAX); }

Ratio::Big to_big(i128 v) {
    bool neg = v < 0;
    __extension__ unsigned __int128 m = neg ? -static_cast<unsigned __int128>(v)
                                            : static_cast<unsigned __int128>(v);
    Ratio::Big b = static_cast<std::uint64_t>(m >> 64);
    b <<= 64;
    b += static_cast<std::uint64_t>(m);
    return neg ? Ratio::Big(-b) : b;
}

// Cents computed from an exact ratio in double carry an error of a few ulps of the ratio
// plus the logarithm's rounding; 1e-7 cents is far above that for every size terzo accepts
// and far below any musically meaningful difference. It only decides where exact
// arithmetic is consulted: the decision itself is always exact.
constexpr double exact_path_error_cents = 1e-7;
// The tempered fast path's cents (the low note's cents plus a logarithm) err by far less than
// this; closer tones take the exact path of landing(Keyboard, Pitch).
constexpr double tempered_error_cents = 1e-6;

Ratio make_ratio(i128 num, std::int64_t den) {
    if (fits64(num)) return Ratio(std::int64_t(num), den);
    return Ratio::from_big(to_big(num), Ratio::Big(den));
}

double to_double(i128 v) { return fits64(v) ? double(std::int64_t(v)) : double(v); }

double cents_of(double hz, double ref_hz) { return 1200.0 * std::log2(hz / ref_hz); }

using Plan = DyadExact::Plan;

} // namespace

// How the tones of one dyad get exact values.
//  - rational_small: both notes rational with 64-bit parts. Over the common denominator L
//    the notes are Nl/L and Nh/L, so a tone is (A*Nl + B*Nh)/L: two integer products and a
//    sum in 128 bits per tone, the sign decided exactly, and equality with a note decided
//    by cross-multiplying (no gcd, no Ratio) on the rare tones that are near one.
//  - rational_big: rational notes with huge parts; Ratio arithmetic (cpp_int when needed).
//  - tempered: exact notes whose ratio q = f_high/f_low is rational (an octave of a tempered
//    scale, or any dyad of a scale built on one tempered generator and rational steps).
//    Then a*f_low + b*f_high = f_low * (a + b*q) exactly: a prime vector times a rational.
//  - none: cents-only notes, or tempered notes with an irrational ratio. A combination tone
//    of such notes is a sum of two irrational frequencies and is in general not a product of
//    rational prime powers at all, so terzo does not represent it exactly and marks it
//    inexact. For exact tempered notes this loses nothing: positive real numbers with a
//    rational power are linearly independent over the rationals when their pairwise ratios
//    are irrational (Mordell 1953, Pacific J. Math. 3, from memory), so a*f_low + b*f_high
//    with a, b non-zero can never equal an exact note f: it would give a rational relation
//    between 1, q and f/f_low, and a rational relation with two terms forces q or the note
//    ratio to be rational. Such a tone's landing is therefore correctly never exact.
DyadExact::DyadExact(const Note& low, const Note& high, bool exact) {
    if (!exact) return;
    auto l = low.pitch.ratio(), h = high.pitch.ratio();
    if (l && h) {
        if (l->is_small() && h->is_small()) {
            std::int64_t g = std::gcd(l->den(), h->den());
            i128 d = i128(l->den() / g) * h->den();
            i128 a = i128(l->num()) * (d / l->den());
            i128 b = i128(h->num()) * (d / h->den());
            if (fits64(d) && fits64(a) && fits64(b)) {
                plan = Plan::rational_small;
                nl = std::int64_t(a);
                nh = std::int64_t(b);
                den = std::int64_t(d);
                return;
            }
        }
        plan = Plan::rational_big;
        rl = *l;
        rh = *h;
        return;
    }
    if (low.pitch.is_exact() && high.pitch.is_exact()) {
        Pitch r = high.pitch / low.pitch;
        auto lv = low.pitch.vector();
        if (r.is_rational() && lv) {
            plan = Plan::tempered;
            q = *r.ratio();
            low_vector = *lv;
        }
    }
}

namespace {

// The tempered plan's multiplier a + b*q, as a Ratio.
Ratio tempered_multiplier(const DyadExact& x, std::int64_t A, std::int64_t B) {
    return Ratio(A) + Ratio(B) * x.q;
}

} // namespace

std::optional<Pitch> DyadExact::value(const Tone& tone) const {
    if (tone.exact == ExactKind::none) return std::nullopt;
    if (auto r = ratio(tone)) return Pitch::from_ratio(*r);
    if (plan != Plan::tempered) return std::nullopt;
    const std::int64_t A = std::int64_t(tone.term.a) * tone.low_partial;
    const std::int64_t B = std::int64_t(tone.term.b) * tone.high_partial;
    return Pitch::from_vector(low_vector * PrimeVector::from_ratio(tempered_multiplier(*this, A, B)));
}

std::optional<Ratio> DyadExact::ratio(const Tone& tone) const {
    if (tone.exact != ExactKind::ratio) return std::nullopt;
    const std::int64_t A = std::int64_t(tone.term.a) * tone.low_partial;
    const std::int64_t B = std::int64_t(tone.term.b) * tone.high_partial;
    switch (plan) {
    case Plan::rational_small: return make_ratio(i128(A) * nl + i128(B) * nh, den);
    case Plan::rational_big: return Ratio(A) * rl + Ratio(B) * rh;
    case Plan::tempered: {
        Pitch p = Pitch::from_vector(low_vector * PrimeVector::from_ratio(tempered_multiplier(*this, A, B)));
        return p.ratio();
    }
    case Plan::none: break;
    }
    return std::nullopt;
}

std::string DyadExact::text(const Tone& tone) const {
    if (tone.exact == ExactKind::ratio) return ratio(tone)->str();
    if (auto v = value(tone)) return v->str();
    return "-";
}

std::optional<Pitch> exact_value(const DyadTones& dyad, const Tone& tone) {
    return DyadExact(dyad.low, dyad.high).value(tone);
}

std::optional<Ratio> exact_ratio(const DyadTones& dyad, const Tone& tone) {
    return DyadExact(dyad.low, dyad.high).ratio(tone);
}

// What the engine prepares once per keyboard and options.
struct ResultantEngine::Tables {
    std::vector<CombinationTerm> terms;
    std::vector<std::size_t> order_start; // terms of order k: [order_start[k-2], order_start[k-1])
    NoteFinder finder;
    // Note ratios num/den of the rational notes in periods [low_period, low_period + periods),
    // filled on first use: den 0 unknown yet, den -1 not rational or not 64-bit.
    static constexpr int low_period = -48, periods = 112;
    mutable std::vector<std::pair<std::int64_t, std::int64_t>> note_ratios;

    // With a rational period, note (d, p) is degree d times a rational power, so whether two
    // notes have a rational ratio depends on their degrees alone: -1 unknown yet, 0 no, 1 yes
    // (degree pairs, for scales of at most max_pair_degrees; empty otherwise).
    static constexpr std::size_t max_pair_degrees = 256;
    mutable std::vector<signed char> degree_pairs;
    std::vector<bool> rational_degree;

    Tables(const Keyboard& kb, int order) : terms(combination_terms(order)), finder(kb) {
        order_start.push_back(0);
        for (std::size_t i = 0; i < terms.size(); ++i)
            if (i + 1 == terms.size() || terms[i + 1].order() != terms[i].order()) order_start.push_back(i + 1);
        const Scale& s = kb.scale();
        if (s.period().is_rational() && s.size() <= max_pair_degrees) {
            degree_pairs.assign(s.size() * s.size(), -1);
            for (std::size_t d = 0; d < s.size(); ++d) rational_degree.push_back(s.degree(d).is_rational());
        }
    }

    // The plan of the dyad low < high. Tempered dyads whose ratio is irrational (most dyads of
    // an equal division) are told apart by the degree-pair table, without dividing pitches.
    DyadExact plan(const Keyboard& kb, const Note& low, const Note& high, bool exact) const {
        if (!exact) return {};
        if (!degree_pairs.empty() && low.on_scale && high.on_scale) {
            const std::size_t l = std::size_t(low.degree), h = std::size_t(high.degree);
            if (!(rational_degree[l] && rational_degree[h])) {
                signed char& known = degree_pairs[l * rational_degree.size() + h];
                if (known < 0) {
                    const Scale& s = kb.scale();
                    known = s.degree(l).is_exact() && s.degree(h).is_exact() &&
                            (s.degree(h) / s.degree(l)).is_rational();
                }
                if (!known) return {};
            }
        }
        return DyadExact(low, high);
    }

    // The note's ratio in 64 bits when cached or cacheable, else nullptr.
    const std::pair<std::int64_t, std::int64_t>* note_ratio(const Keyboard& kb, int degree, int period) const {
        const int p = period - low_period;
        if (p < 0 || p >= periods) return nullptr;
        if (note_ratios.empty()) note_ratios.assign(std::size_t(periods) * kb.scale().size(), {0, 0});
        auto& slot = note_ratios[std::size_t(p) * kb.scale().size() + std::size_t(degree)];
        if (slot.second == 0) {
            auto r = kb.note_ratio(degree, period);
            slot = r && r->is_small() ? std::pair{r->num(), r->den()} : std::pair<std::int64_t, std::int64_t>{0, -1};
        }
        return slot.second > 0 ? &slot : nullptr;
    }
};

namespace {

// The landing of the rational tone n/den (cents in floating point) whose neighbours `a` are
// within rounding error: as landing(Keyboard, double, Ratio, double) decides it, but by
// cross-multiplying with the notes' cached 64-bit ratios (no gcd, no Ratio) where they fit.
Landing exact_landing(const Keyboard& kb, const ResultantEngine::Tables& tb, const NoteFinder::Around& a,
                      double cents, i128 n, std::int64_t den) {
    for (const Landing* l : {&a.nearer, &a.other}) {
        if (!(std::fabs(l->deviation_cents) <= exact_path_error_cents)) continue;
        const auto* r = tb.note_ratio(kb, l->degree, l->period);
        i128 x, y;
        if (!r || __builtin_mul_overflow(n, i128(r->second), &x) ||
            __builtin_mul_overflow(i128(r->first), i128(den), &y))
            return landing(kb, cents, make_ratio(n, den), exact_path_error_cents);
        if (x == y) {
            Landing exact = *l;
            exact.exact = true;
            exact.deviation_cents = 0.0;
            return exact;
        }
    }
    return a.nearer;
}

} // namespace

ResultantEngine::ResultantEngine(const Keyboard& keyboard, const ToneOptions& options)
    : keyboard_(&keyboard), options_(options) {
    check_options(options);
    tables_ = std::make_unique<Tables>(keyboard, options.order);
}

ResultantEngine::~ResultantEngine() = default;

void ResultantEngine::tones(const Note& low, const Note& high, std::vector<Tone>& out) const {
    const Keyboard& kb = *keyboard_;
    const Tables& tb = *tables_;
    const DyadExact plan = tb.plan(kb, low, high, options_.exact);
    const double fl = low.hz, fh = high.hz, ref = kb.ref_hz();
    const double den = double(plan.den);
    out.clear();
    out.reserve(tb.terms.size() * std::size_t(options_.partials) * std::size_t(options_.partials));


    for (int i = 1; i <= options_.partials; ++i) {
        for (int j = 1; j <= options_.partials; ++j) {
            for (std::size_t k = 0; k + 1 < tb.order_start.size(); ++k) {
                const std::size_t block = out.size();
                for (std::size_t t = tb.order_start[k]; t < tb.order_start[k + 1]; ++t) {
                    const CombinationTerm term = tb.terms[t];
                    const std::int64_t A = std::int64_t(term.a) * i, B = std::int64_t(term.b) * j;
                    Tone tone;
                    tone.term = term;
                    tone.low_partial = i;
                    tone.high_partial = j;
                    switch (plan.plan) {
                    case Plan::rational_small: {
                        const i128 n = i128(A) * plan.nl + i128(B) * plan.nh;
                        if (n <= 0) continue;
                        const double r = to_double(n) / den;
                        tone.hz = ref * r;
                        tone.cents = 1200.0 * std::log2(r);
                        tone.exact = ExactKind::ratio;
                        const NoteFinder::Around a = tb.finder.around(tone.cents);
                        tone.landing = a.nearer;
                        if (std::fabs(a.nearer.deviation_cents) <= exact_path_error_cents ||
                            std::fabs(a.other.deviation_cents) <= exact_path_error_cents)
                            tone.landing = exact_landing(kb, tb, a, tone.cents, n, plan.den);
                        break;
                    }
                    case Plan::rational_big: {
                        Ratio r = Ratio(A) * plan.rl + Ratio(B) * plan.rh;
                        if (r.sign() <= 0) continue;
                        tone.cents = 1200.0 * static_cast<double>(r.log2());
                        tone.hz = ref * std::exp2(tone.cents / 1200.0);
                        tone.landing = landing(kb, tone.cents, r, exact_path_error_cents);
                        tone.exact = ExactKind::ratio;
                        break;
                    }
                    case Plan::tempered: {
                        // The tone is f_low * m with m = A + B*q rational. With q in 64 bits, m's
                        // sign and size come from one 128-bit sum and floating point finds the
                        // nearest note; the exact value (a prime vector) is built only when the
                        // tone is within rounding error of a note. It is never rational: f_low
                        // is not (else both notes would be, and the plan rational).
                        if (plan.q.is_small()) {
                            const i128 mn = i128(A) * plan.q.den() + i128(B) * plan.q.num();
                            if (mn <= 0) continue;
                            if (fits64(mn)) {
                                const double c = low.cents + 1200.0 * std::log2(double(std::int64_t(mn)) /
                                                                                double(plan.q.den()));
                                const NoteFinder::Around a = tb.finder.around(c);
                                if (std::fabs(a.nearer.deviation_cents) > tempered_error_cents &&
                                    std::fabs(a.other.deviation_cents) > tempered_error_cents) {
                                    tone.cents = c;
                                    tone.hz = ref * std::exp2(c / 1200.0);
                                    tone.landing = a.nearer;
                                    tone.exact = ExactKind::vector;
                                    break;
                                }
                            }
                        }
                        Ratio m = tempered_multiplier(plan, A, B);
                        if (m.sign() <= 0) continue;
                        if (!m.is_small()) { // not factorable cheaply: fall back to floating point
                            tone.hz = A * fl + B * fh;
                            tone.cents = cents_of(tone.hz, ref);
                            tone.landing = nearest_note(kb, tone.cents);
                            break;
                        }
                        Pitch p = Pitch::from_vector(plan.low_vector * PrimeVector::from_ratio(m));
                        tone.cents = p.cents();
                        tone.hz = ref * std::exp2(tone.cents / 1200.0);
                        tone.landing = landing(kb, p);
                        tone.exact = p.is_rational() ? ExactKind::ratio : ExactKind::vector;
                        break;
                    }
                    case Plan::none: {
                        // Floating point only: a mathematically zero tone (possible for cents-only
                        // notes in a simple relation) must not survive as rounding noise, so a tone
                        // below 1e-9 of its parts' size counts as zero (no exactness is claimed).
                        const double hz = A * fl + B * fh;
                        if (hz <= 1e-9 * (std::abs(A) * fl + std::abs(B) * fh)) continue;
                        tone.hz = hz;
                        tone.cents = cents_of(hz, ref);
                        tone.landing = tb.finder.around(tone.cents).nearer;
                        break;
                    }
                    }
                    tone.audibility = audibility(term, fl, fh, i, j);
                    // Terms come by order already; within an order, by frequency (stable).
                    std::size_t at = out.size();
                    out.push_back(tone);
                    while (at > block && out[at - 1].hz > tone.hz) {
                        out[at] = out[at - 1];
                        --at;
                    }
                    out[at] = tone;
                }
            }
        }
    }
}

namespace {

std::string coefficient(int c, const char* letter, bool first) {
    std::string s;
    if (c < 0)
        s += '-';
    else if (!first)
        s += '+';
    int m = std::abs(c);
    if (m != 1) s += std::to_string(m);
    return s + letter;
}

} // namespace

std::string CombinationTerm::name() const {
    if (a == -1 && b == 1) return "difference tone";
    if (a == 2 && b == -1) return "cubic difference tone";
    if (a == 1 && b == 1) return "summation tone";
    // Written with the positive coefficient first: 3L-2H, 2H-L.
    if (a < 0 && b > 0) return coefficient(b, "H", true) + coefficient(a, "L", false);
    return coefficient(a, "L", true) + coefficient(b, "H", false);
}

std::vector<CombinationTerm> combination_terms(int order) {
    std::vector<CombinationTerm> terms;
    for (int n = 2; n <= order; ++n)
        for (int a = n - 1; a >= -(n - 1); --a) {
            if (a == 0) continue;
            int m = n - std::abs(a);
            terms.push_back({a, m});
            if (a > 0) terms.push_back({a, -m});
        }
    return terms;
}

std::vector<HelmholtzTone> helmholtz_ladder(double f_low, double f_high, int order) {
    std::vector<HelmholtzTone> out;
    if (!(f_high > f_low) || order < 2) return out;
    auto value = [&](const CombinationTerm& t) { return t.a * f_low + t.b * f_high; };
    const double scale = f_low + f_high;
    std::set<std::pair<int, int>> seen{{-1, 1}};
    std::vector<CombinationTerm> level{{-1, 1}};
    for (int k = 1; !level.empty(); ++k) {
        std::vector<CombinationTerm> next;
        for (const auto& t : level) {
            out.push_back({t, k});
            const double v = value(t);
            for (auto [pa, pb] : {std::pair<int, int>{1, 0}, std::pair<int, int>{0, 1}}) {
                const double pv = pa * f_low + pb * f_high;
                // A difference of (numerically) zero is no tone.
                if (std::fabs(v - pv) <= 1e-9 * scale) continue;
                CombinationTerm d = v > pv ? CombinationTerm{t.a - pa, t.b - pb}
                                           : CombinationTerm{pa - t.a, pb - t.b};
                // Multiples of one primary (a or b zero) are harmonics, not combination tones.
                if (d.a == 0 || d.b == 0 || d.order() > order) continue;
                if (!seen.insert({d.a, d.b}).second) continue;
                next.push_back(d);
            }
        }
        level = std::move(next);
    }
    return out;
}

void check_options(const ToneOptions& options) {
    if (options.order < 2 || options.order > max_order)
        fail(Setting::order, "order " + std::to_string(options.order) +
                              " is outside the allowed range 2 to " + std::to_string(max_order));
    if (options.partials < 1 || options.partials > max_partials)
        fail(Setting::partials, "partials " + std::to_string(options.partials) +
                                 " is outside the allowed range 1 to " + std::to_string(max_partials));
}

std::uint64_t tone_count_bound(std::uint64_t dyads, const ToneOptions& options) {
    std::uint64_t n = std::uint64_t(std::max(options.order, 1));
    std::uint64_t terms = 3 * n * (n - 1) / 2; // 3(k-1) terms of each order k = 2..n
    std::uint64_t pairs = std::uint64_t(options.partials) * std::uint64_t(options.partials);
    return dyads * terms * pairs;
}

void check_tone_count(std::uint64_t dyads, const ToneOptions& options) {
    std::uint64_t bound = tone_count_bound(dyads, options);
    if (bound > max_tones)
        fail(Setting::order, "this request could compute " + std::to_string(bound) + " tones (" +
                                 std::to_string(dyads) + " dyads), more than the limit of " +
                                 std::to_string(max_tones) + "; lower {order}, {span} or {partials}");
}

std::vector<Tone> dyad_tones(const Keyboard& keyboard, const Note& low, const Note& high,
                             const ToneOptions& options) {
    const ResultantEngine engine(keyboard, options);
    std::vector<Tone> out;
    if (low.cents > high.cents)
        engine.tones(high, low, out);
    else
        engine.tones(low, high, out);
    return out;
}

void for_each_keyboard_dyad(const Keyboard& keyboard, const ToneOptions& options,
                            const std::function<void(const DyadTones&)>& visit) {
    check_options(options);
    const auto& notes = keyboard.notes();
    const std::uint64_t n = notes.size();
    check_tone_count(n * (n - 1) / 2, options);
    const ResultantEngine engine(keyboard, options);
    DyadTones dyad;
    for (std::size_t i = 0; i < notes.size(); ++i)
        for (std::size_t j = i + 1; j < notes.size(); ++j) {
            const Note* lo = &notes[i];
            const Note* hi = &notes[j];
            if (lo->cents == hi->cents) continue; // a unison is no dyad
            if (lo->cents > hi->cents) std::swap(lo, hi);
            dyad.low = *lo;
            dyad.high = *hi;
            engine.tones(*lo, *hi, dyad.tones);
            visit(dyad);
        }
}

std::vector<DyadTones> keyboard_tones(const Keyboard& keyboard, const ToneOptions& options) {
    std::vector<DyadTones> out;
    for_each_keyboard_dyad(keyboard, options, [&](const DyadTones& d) { out.push_back(d); });
    return out;
}

} // namespace terzo
