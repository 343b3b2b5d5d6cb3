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

// How the tones of one dyad get exact values.
//  - rational_small: both notes rational with 64-bit parts. Over the common denominator L
//    the notes are Nl/L and Nh/L, so a tone is (A*Nl + B*Nh)/L: two integer products and a
//    sum in 128 bits per tone, one gcd to reduce, and the sign decided exactly.
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
enum class Plan { rational_small, rational_big, tempered, none };

struct DyadPlan {
    Plan plan = Plan::none;
    std::int64_t nl = 0, nh = 0, den = 1; // rational_small
    Ratio rl, rh;                         // rational_big
    PrimeVector low_vector;               // tempered
    Ratio q;                              // tempered
};

DyadPlan make_plan(const Note& low, const Note& high, bool exact) {
    DyadPlan d;
    if (!exact) return d;
    auto rl = low.pitch.ratio(), rh = high.pitch.ratio();
    if (rl && rh) {
        if (rl->is_small() && rh->is_small()) {
            std::int64_t g = std::gcd(rl->den(), rh->den());
            i128 den = i128(rl->den() / g) * rh->den();
            i128 nl = i128(rl->num()) * (den / rl->den());
            i128 nh = i128(rh->num()) * (den / rh->den());
            if (fits64(den) && fits64(nl) && fits64(nh)) {
                d.plan = Plan::rational_small;
                d.nl = std::int64_t(nl);
                d.nh = std::int64_t(nh);
                d.den = std::int64_t(den);
                return d;
            }
        }
        d.plan = Plan::rational_big;
        d.rl = *rl;
        d.rh = *rh;
        return d;
    }
    if (low.pitch.is_exact() && high.pitch.is_exact()) {
        Pitch q = high.pitch / low.pitch;
        auto lv = low.pitch.vector();
        if (q.is_rational() && lv) {
            d.plan = Plan::tempered;
            d.q = *q.ratio();
            d.low_vector = *lv;
        }
    }
    return d;
}

Ratio make_ratio(i128 num, std::int64_t den) {
    if (fits64(num)) return Ratio(std::int64_t(num), den);
    return Ratio::from_big(to_big(num), Ratio::Big(den));
}

double cents_of(double hz, double ref_hz) { return 1200.0 * std::log2(hz / ref_hz); }

// The tones of one dyad; `terms` is combination_terms(options.order).
std::vector<Tone> tones_of(const Keyboard& kb, const Note& low, const Note& high,
                           const ToneOptions& options, const std::vector<CombinationTerm>& terms) {
    const DyadPlan plan = make_plan(low, high, options.exact);
    const double fl = low.hz, fh = high.hz, ref = kb.ref_hz();
    std::vector<Tone> out;
    std::vector<Tone> block;
    std::vector<std::size_t> order_index;
    out.reserve(terms.size() * std::size_t(options.partials) * std::size_t(options.partials));
    block.reserve(terms.size());
    for (int i = 1; i <= options.partials; ++i) {
        for (int j = 1; j <= options.partials; ++j) {
            block.clear();
            for (const CombinationTerm& t : terms) {
                const std::int64_t A = std::int64_t(t.a) * i, B = std::int64_t(t.b) * j;
                Tone tone;
                tone.term = t;
                tone.low_partial = i;
                tone.high_partial = j;
                switch (plan.plan) {
                case Plan::rational_small: {
                    i128 n = i128(A) * plan.nl + i128(B) * plan.nh;
                    if (n <= 0) continue;
                    double r = double(n) / double(plan.den);
                    tone.hz = ref * r;
                    tone.cents = 1200.0 * std::log2(r);
                    tone.ratio = make_ratio(n, plan.den);
                    tone.landing = landing(kb, tone.cents, *tone.ratio, exact_path_error_cents);
                    break;
                }
                case Plan::rational_big: {
                    Ratio r = Ratio(A) * plan.rl + Ratio(B) * plan.rh;
                    if (r.sign() <= 0) continue;
                    tone.cents = 1200.0 * static_cast<double>(r.log2());
                    tone.hz = ref * std::exp2(tone.cents / 1200.0);
                    tone.landing = landing(kb, tone.cents, r, exact_path_error_cents);
                    tone.ratio = std::move(r);
                    break;
                }
                case Plan::tempered: {
                    Ratio m = Ratio(A) + Ratio(B) * plan.q;
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
                    if (auto r = p.ratio())
                        tone.ratio = *r;
                    else
                        tone.vector = p.vector();
                    break;
                }
                case Plan::none: {
                    // Floating point only: a mathematically zero tone (possible for cents-only
                    // notes in a simple relation) must not survive as rounding noise, so a tone
                    // below 1e-9 of its parts' size counts as zero (no exactness is claimed).
                    double hz = A * fl + B * fh;
                    if (hz <= 1e-9 * (std::abs(A) * fl + std::abs(B) * fh)) continue;
                    tone.hz = hz;
                    tone.cents = cents_of(hz, ref);
                    tone.landing = nearest_note(kb, tone.cents);
                    break;
                }
                }
                tone.audibility = audibility(t, fl, fh, i, j);
                block.push_back(std::move(tone));
            }
            // Terms come by order already; within an order, by frequency.
            order_index.resize(block.size());
            std::iota(order_index.begin(), order_index.end(), std::size_t(0));
            std::stable_sort(order_index.begin(), order_index.end(), [&](std::size_t x, std::size_t y) {
                int ox = block[x].term.order(), oy = block[y].term.order();
                return ox != oy ? ox < oy : block[x].hz < block[y].hz;
            });
            for (std::size_t k : order_index) out.push_back(std::move(block[k]));
        }
    }
    return out;
}

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

std::optional<Pitch> Tone::exact_value() const {
    if (ratio) return Pitch::from_ratio(*ratio);
    if (vector) return Pitch::from_vector(*vector);
    return std::nullopt;
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
    check_options(options);
    const auto terms = combination_terms(options.order);
    if (low.cents > high.cents) return tones_of(keyboard, high, low, options, terms);
    return tones_of(keyboard, low, high, options, terms);
}

std::vector<DyadTones> keyboard_tones(const Keyboard& keyboard, const ToneOptions& options) {
    check_options(options);
    const auto& notes = keyboard.notes();
    const std::uint64_t n = notes.size();
    check_tone_count(n * (n - 1) / 2, options);
    const auto terms = combination_terms(options.order);
    std::vector<DyadTones> out;
    out.reserve(n * (n - 1) / 2);
    for (std::size_t i = 0; i < notes.size(); ++i)
        for (std::size_t j = i + 1; j < notes.size(); ++j) {
            const Note* lo = &notes[i];
            const Note* hi = &notes[j];
            if (lo->cents == hi->cents) continue; // a unison is no dyad
            if (lo->cents > hi->cents) std::swap(lo, hi);
            out.push_back({*lo, *hi, tones_of(keyboard, *lo, *hi, options, terms)});
        }
    return out;
}

} // namespace terzo
