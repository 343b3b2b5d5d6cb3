#include "core/analysis/lattice.hpp"

#include <cmath>
#include <cstdint>
#include <numeric>
#include <string>
#include <vector>

#include "core/error.hpp"
#include "core/format.hpp"

namespace terzo {

namespace {

// Counts how often p divides n and removes it.
int strip(std::uint64_t& n, std::uint64_t p) {
    int k = 0;
    while (n % p == 0) {
        n /= p;
        ++k;
    }
    return k;
}

std::optional<std::array<int, 3>> exponents_of(std::uint64_t num, std::uint64_t den) {
    strip(num, 2);
    strip(den, 2);
    std::array<int, 3> e{};
    const std::uint64_t primes[3] = {3, 5, 7};
    for (int i = 0; i < 3; ++i) e[i] = strip(num, primes[i]) - strip(den, primes[i]);
    if (num != 1 || den != 1) return std::nullopt;
    return e;
}

Ratio octave_reduced(Ratio r) {
    const Ratio two(2);
    while (r >= two) r /= two;
    while (r < Ratio(1)) r *= two;
    return r;
}

// Octave-reduced difference a - b in cents, in [-600, 600).
double wrapped(double a, double b) {
    double d = std::fmod(a - b, 1200.0);
    if (d < -600.0) d += 1200.0;
    if (d >= 600.0) d -= 1200.0;
    return d;
}

bool is_seven_smooth_odd(std::uint64_t n) {
    strip(n, 3);
    strip(n, 5);
    strip(n, 7);
    return n == 1;
}

} // namespace

std::optional<std::array<int, 3>> lattice_exponents(const Ratio& r) {
    TERZO_ASSERT(r.sign() > 0);
    if (!r.is_small()) return std::nullopt;
    return exponents_of(static_cast<std::uint64_t>(r.num()), static_cast<std::uint64_t>(r.den()));
}

LatticePlace place_on_lattice(const Pitch& p, const LatticeOptions& options) {
    if (!(options.tolerance_cents > 0.0 && options.tolerance_cents <= 600.0))
        fail({"lattice tolerance", 0, 0},
             "tolerance " + fixed(options.tolerance_cents, 3) +
                 " cents is out of range; it must be above 0 and at most 600");
    if (options.odd_limit < 1 || options.odd_limit > 243)
        fail({"odd limit", 0, 0}, "odd limit " + std::to_string(options.odd_limit) +
                                      " is out of range; it must be from 1 to 243");

    LatticePlace place;
    if (auto r = p.ratio()) {
        if (auto e = lattice_exponents(*r)) {
            place.how = LatticeHow::exact;
            place.exponents = *e;
            place.just = octave_reduced(*r);
            return place;
        }
    }

    // Nearest just interpretation among n/d with n, d odd, 7-smooth, coprime, <= odd limit.
    std::vector<std::uint64_t> odds;
    for (std::uint64_t n = 1; n <= static_cast<std::uint64_t>(options.odd_limit); n += 2)
        if (is_seven_smooth_odd(n)) odds.push_back(n);
    bool found = false;
    double best_dev = 0.0;
    std::uint64_t best_limit = 0;
    Ratio best;
    for (std::uint64_t n : odds) {
        for (std::uint64_t d : odds) {
            if (std::gcd(n, d) != 1) continue;
            Ratio cand = octave_reduced(Ratio(static_cast<std::int64_t>(n), static_cast<std::int64_t>(d)));
            double dev = wrapped(p.cents(), cents(cand));
            if (std::abs(dev) > options.tolerance_cents) continue;
            std::uint64_t limit = std::max(n, d);
            bool better = !found || std::abs(dev) < std::abs(best_dev) ||
                          (std::abs(dev) == std::abs(best_dev) &&
                           (limit < best_limit || (limit == best_limit && cand < best)));
            if (better) {
                found = true;
                best_dev = dev;
                best_limit = limit;
                best = cand;
            }
        }
    }
    if (!found) return place;
    place.how = LatticeHow::nearest;
    place.exponents = *lattice_exponents(best);
    place.just = best;
    place.deviation_cents = best_dev;
    return place;
}

} // namespace terzo
