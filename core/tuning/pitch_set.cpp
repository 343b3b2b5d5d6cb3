#include "core/tuning/pitch_set.hpp"

#include <algorithm>
#include <cmath>

namespace terzo {

namespace {

// Factors a big positive integer by trial division by primes below 10000; the factors go
// into v with the given sign. False when a factor above that bound remains.
bool trial_factor(Ratio::Big n, int sign, PrimeVector& v) {
    for (std::uint64_t p = 2; p < 10000 && n > 1; ++p) {
        if (!is_prime(p)) continue;
        std::int64_t count = 0;
        while (n % p == 0) {
            n /= p;
            ++count;
        }
        if (count) v = v * PrimeVector::prime_power(p, Ratio(sign * count));
    }
    return n == 1;
}

} // namespace

std::optional<PrimeVector> exact_vector(const Pitch& p) {
    if (auto v = p.vector()) return v;
    if (!p.is_rational()) return std::nullopt;
    PrimeVector v;
    if (!trial_factor(p.ratio()->big_num(), 1, v)) return std::nullopt;
    if (!trial_factor(p.ratio()->big_den(), -1, v)) return std::nullopt;
    return v;
}

Pitch exact_product(const Pitch& a, const Pitch& b) {
    if (a.is_rational() && b.is_rational()) return Pitch::from_ratio(*a.ratio() * *b.ratio());
    auto va = exact_vector(a), vb = exact_vector(b);
    if (va && vb) return Pitch::from_vector(*va * *vb);
    return Pitch::from_cents(a.cents() + b.cents());
}

Pitch exact_quotient(const Pitch& a, const Pitch& b) {
    if (a.is_rational() && b.is_rational()) return Pitch::from_ratio(*a.ratio() / *b.ratio());
    auto va = exact_vector(a), vb = exact_vector(b);
    if (va && vb) return Pitch::from_vector(*va / *vb);
    return Pitch::from_cents(a.cents() - b.cents());
}

Pitch exact_power(const Pitch& p, const Ratio& e) {
    if (p.is_rational() && e.is_integer() && e.is_small())
        return Pitch::from_ratio(p.ratio()->pow(e.num()));
    if (auto v = exact_vector(p)) return Pitch::from_vector(v->pow(e));
    return Pitch::from_cents(p.cents() * static_cast<double>(e.to_long_double()));
}

Pitch reduce_into_period(const Pitch& p, const Pitch& period) {
    TERZO_ASSERT(period.cents() > 0);
    if (!p.is_exact() || !period.is_exact()) {
        double c = std::fmod(p.cents(), period.cents());
        if (c < 0) c += period.cents();
        if (c >= period.cents()) c = 0; // fmod rounding at the top edge
        return Pitch::from_cents(c);
    }
    // Floating point proposes the number of periods; exact comparisons settle the edges
    // (a value exactly equal to a power of the period reduces to exactly 1/1).
    auto k = static_cast<std::int64_t>(std::floor(p.cents() / period.cents()));
    // Well inside the period already: nothing to divide (saves big-number work in long chains).
    if (k == 0 && p.cents() > 1e-6 && p.cents() < period.cents() - 1e-6) return p;
    Pitch r = exact_quotient(p, exact_power(period, Ratio(k)));
    auto is_unison = [](const Pitch& x) { return exactly_equal(x, Pitch()).value_or(false); };
    if (exactly_equal(r, period).value_or(false)) return Pitch();
    if (is_unison(r)) return r;
    if (r.cents() < 0) return exact_product(r, period);
    if (r.cents() >= period.cents()) return exact_quotient(r, period);
    return r;
}

Scale scale_from_pitch_set(std::string description, const std::vector<Pitch>& pitches,
                           const Pitch& period) {
    std::vector<Pitch> reduced;
    reduced.reserve(pitches.size());
    for (const Pitch& p : pitches)
        reduced.push_back(reduce_into_period(p, period));
    std::stable_sort(reduced.begin(), reduced.end(),
                     [](const Pitch& a, const Pitch& b) { return a.cents() < b.cents(); });
    std::vector<Pitch> unique;
    for (Pitch& p : reduced) {
        bool duplicate = std::any_of(unique.end() - std::min<std::ptrdiff_t>(unique.size(), 2),
                                     unique.end(), [&](const Pitch& q) {
                                         auto eq = exactly_equal(p, q);
                                         return eq ? *eq : p.cents() == q.cents();
                                     });
        if (!duplicate) unique.push_back(std::move(p));
    }
    TERZO_ASSERT(!unique.empty() &&
                 exactly_equal(unique.front(), Pitch()).value_or(unique.front().cents() == 0.0));
    unique.erase(unique.begin());
    return Scale(std::move(description), std::move(unique), period);
}

} // namespace terzo
