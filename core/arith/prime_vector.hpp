// PrimeVector: a positive number written as a product of rational powers of primes, such as
// 2^(1/31) or 3/2 * (80/81)^(1/6) = 2^(-2/3) * 3^(1/3) * 5^(1/6). Tempered intervals are
// exact in this form: products, quotients and rational powers stay exact; only cents() rounds.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "core/arith/ratio.hpp"

namespace terzo {

/// Largest numerator or denominator, in bits, that to_ratio() builds (see there).
inline constexpr int max_ratio_bits = 4096;

class PrimeVector {
public:
    using Term = std::pair<std::uint64_t, Ratio>; ///< (prime, exponent)

    /// The number 1.
    PrimeVector() = default;
    /// A positive ratio whose numerator and denominator fit in 64 bits, factored into primes.
    static PrimeVector from_ratio(const Ratio& r);
    /// prime^exponent; prime must be prime.
    static PrimeVector prime_power(std::uint64_t prime, const Ratio& exponent);

    /// The terms, sorted by prime, every exponent non-zero.
    const std::vector<Term>& terms() const { return terms_; }
    /// The exponent of one prime (zero when absent).
    Ratio exponent(std::uint64_t prime) const;

    friend PrimeVector operator*(const PrimeVector& a, const PrimeVector& b);
    friend PrimeVector operator/(const PrimeVector& a, const PrimeVector& b);
    /// this^e for a rational e.
    PrimeVector pow(const Ratio& e) const;
    friend bool operator==(const PrimeVector& a, const PrimeVector& b) {
        return a.terms_ == b.terms_;
    }
    friend bool operator!=(const PrimeVector& a, const PrimeVector& b) { return !(a == b); }

    /// True when every exponent is an integer, i.e. the value is a rational number.
    bool is_rational() const;
    /// The value as a Ratio when is_rational() and its numerator and denominator have at most
    /// max_ratio_bits bits; larger rational values stay in this form (and a Pitch made from
    /// them stays tempered-kind, still exact).
    std::optional<Ratio> to_ratio() const;
    /// 1200 * log2 of the value, summed in long double.
    double cents() const;
    /// log2 of the value in long double.
    long double log2() const;
    /// Text form: "1/1", "5/4" when rational, else "2^(1/31)", "2^(-1)*5^(1/4)".
    std::string str() const;

private:
    // Invariant: sorted by prime, primes distinct, no zero exponent.
    std::vector<Term> terms_;
};

/// True when n is prime (Boost.Multiprecision's Miller-Rabin test, 32 rounds; the same answer every call).
bool is_prime(std::uint64_t n);
/// The prime factors of n > 0 with multiplicity, ascending.
std::vector<std::uint64_t> factor(std::uint64_t n);

} // namespace terzo
