#include "core/arith/prime_vector.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

#include <boost/multiprecision/miller_rabin.hpp>
#include <boost/random/linear_congruential.hpp>

namespace terzo {

namespace {

__extension__ typedef unsigned __int128 u128;

std::uint64_t mul_mod(std::uint64_t a, std::uint64_t b, std::uint64_t m) {
    return static_cast<std::uint64_t>(u128(a) * b % m);
}

// Pollard's rho with Brent's cycle detection; n is an odd composite.
std::uint64_t find_divisor(std::uint64_t n) {
    for (std::uint64_t c = 1;; ++c) {
        std::uint64_t x = 2, y = 2, d = 1;
        auto f = [&](std::uint64_t v) { return (mul_mod(v, v, n) + c) % n; };
        while (d == 1) {
            x = f(x);
            y = f(f(y));
            d = std::gcd(x > y ? x - y : y - x, n);
        }
        if (d != n) return d;
    }
}

void factor_into(std::uint64_t n, std::vector<std::uint64_t>& out) {
    if (n == 1) return;
    if (is_prime(n)) {
        out.push_back(n);
        return;
    }
    std::uint64_t d = find_divisor(n);
    factor_into(d, out);
    factor_into(n / d, out);
}

void add_term(std::vector<PrimeVector::Term>& terms, std::uint64_t p, const Ratio& e) {
    auto it = std::lower_bound(terms.begin(), terms.end(), p,
                               [](const PrimeVector::Term& t, std::uint64_t q) { return t.first < q; });
    if (it != terms.end() && it->first == p) {
        it->second += e;
        if (it->second.is_zero()) terms.erase(it);
    } else if (!e.is_zero()) {
        terms.insert(it, {p, e});
    }
}

} // namespace

bool is_prime(std::uint64_t n) {
    // Boost.Multiprecision's Miller-Rabin test: trial division by the primes up to 227, a
    // Fermat test, then rounds with random bases. The generator is local and seeded the same
    // way on every call, so a given n always gets the same answer and threads share nothing.
    // A composite survives one round with probability at most 1/4, so 32 rounds at most 2^-64.
    boost::random::minstd_rand bases;
    return boost::multiprecision::miller_rabin_test(n, 32, bases);
}

std::vector<std::uint64_t> factor(std::uint64_t n) {
    TERZO_ASSERT(n > 0);
    std::vector<std::uint64_t> out;
    for (std::uint64_t p = 2; p < 1000 && p * p <= n; p += (p == 2 ? 1 : 2)) {
        while (n % p == 0) {
            out.push_back(p);
            n /= p;
        }
    }
    factor_into(n, out);
    std::sort(out.begin(), out.end());
    return out;
}

PrimeVector PrimeVector::from_ratio(const Ratio& r) {
    TERZO_ASSERT(r.sign() > 0 && r.is_small());
    PrimeVector v;
    for (std::uint64_t p : factor(static_cast<std::uint64_t>(r.num()))) add_term(v.terms_, p, 1);
    for (std::uint64_t p : factor(static_cast<std::uint64_t>(r.den()))) add_term(v.terms_, p, -1);
    return v;
}

PrimeVector PrimeVector::prime_power(std::uint64_t prime, const Ratio& exponent) {
    TERZO_ASSERT(is_prime(prime));
    PrimeVector v;
    add_term(v.terms_, prime, exponent);
    return v;
}

Ratio PrimeVector::exponent(std::uint64_t prime) const {
    for (const auto& [p, e] : terms_)
        if (p == prime) return e;
    return Ratio();
}

PrimeVector operator*(const PrimeVector& a, const PrimeVector& b) {
    PrimeVector r = a;
    for (const auto& [p, e] : b.terms_) add_term(r.terms_, p, e);
    return r;
}

PrimeVector operator/(const PrimeVector& a, const PrimeVector& b) {
    PrimeVector r = a;
    for (const auto& [p, e] : b.terms_) add_term(r.terms_, p, -e);
    return r;
}

PrimeVector PrimeVector::pow(const Ratio& e) const {
    if (e.is_zero()) return PrimeVector();
    PrimeVector r = *this;
    for (auto& term : r.terms_) term.second *= e;
    return r;
}

bool PrimeVector::is_rational() const {
    return std::all_of(terms_.begin(), terms_.end(),
                       [](const Term& t) { return t.second.is_integer(); });
}

std::optional<Ratio> PrimeVector::to_ratio() const {
    if (!is_rational()) return std::nullopt;
    // Budget: a numerator or denominator of more than max_ratio_bits bits is left in prime-
    // vector form. Such numbers are far beyond musical use and their gcds would take seconds.
    long double num_bits = 0, den_bits = 0;
    for (const auto& [p, e] : terms_)
        (e.sign() > 0 ? num_bits : den_bits) +=
            std::fabs(e.to_long_double()) * std::log2(static_cast<long double>(p));
    if (num_bits > max_ratio_bits || den_bits > max_ratio_bits) return std::nullopt;
    Ratio::Big num = 1, den = 1;
    for (const auto& [p, e] : terms_) {
        Ratio::Big k = e.big_num(); // an integer here
        bool up = k > 0;
        if (!up) k = -k;
        (up ? num : den) *= boost::multiprecision::pow(Ratio::Big(p), static_cast<unsigned>(k));
    }
    return Ratio::from_big(num, den);
}

long double PrimeVector::log2() const {
    long double sum = 0.0L;
    for (const auto& [p, e] : terms_)
        sum += e.to_long_double() * std::log2(static_cast<long double>(p));
    return sum;
}

double PrimeVector::cents() const { return static_cast<double>(1200.0L * log2()); }

std::string PrimeVector::str() const {
    if (auto r = to_ratio()) return r->str();
    std::string out;
    for (const auto& [p, e] : terms_) {
        if (!out.empty()) out += '*';
        out += std::to_string(p);
        if (e != Ratio(1)) {
            out += "^(";
            out += e.is_integer() ? e.big_num().str() : e.str();
            out += ')';
        }
    }
    return out;
}

} // namespace terzo
