// Ratio: an exact rational number, the value type for just intervals and for frequencies
// relative to a reference. Arithmetic never overflows silently: values that fit in 64 bits
// use a fast checked path, and any result that does not fit is promoted to an arbitrary-
// precision integer (boost::multiprecision::cpp_int), then demoted again when it fits.
#pragma once

#include <boost/multiprecision/cpp_int.hpp>

#include <cstdint>
#include <memory>
#include <string>
#include <string_view>

#include "core/error.hpp"

namespace terzo {

class Ratio {
public:
    using Big = boost::multiprecision::cpp_int;

    /// Zero.
    Ratio() = default;
    /// The integer n.
    Ratio(std::int64_t n) : num_(n) { TERZO_ASSERT(n != INT64_MIN); }
    /// num/den reduced to lowest terms; den must not be zero.
    Ratio(std::int64_t num, std::int64_t den);
    /// num/den of any size, reduced; den must not be zero.
    static Ratio from_big(Big num, Big den);

    /// True when numerator and denominator fit in 64 bits (the fast representation).
    bool is_small() const { return !big_; }
    /// Numerator and denominator; only when is_small().
    std::int64_t num() const;
    std::int64_t den() const;
    /// Numerator and denominator of any size.
    Big big_num() const;
    Big big_den() const;

    int sign() const;
    bool is_integer() const;
    bool is_zero() const { return sign() == 0; }

    Ratio operator-() const;
    friend Ratio operator+(const Ratio& a, const Ratio& b);
    friend Ratio operator-(const Ratio& a, const Ratio& b);
    friend Ratio operator*(const Ratio& a, const Ratio& b);
    /// Division; b must not be zero.
    friend Ratio operator/(const Ratio& a, const Ratio& b);
    Ratio& operator+=(const Ratio& b) { return *this = *this + b; }
    Ratio& operator-=(const Ratio& b) { return *this = *this - b; }
    Ratio& operator*=(const Ratio& b) { return *this = *this * b; }
    Ratio& operator/=(const Ratio& b) { return *this = *this / b; }

    friend bool operator==(const Ratio& a, const Ratio& b);
    friend bool operator!=(const Ratio& a, const Ratio& b) { return !(a == b); }
    friend bool operator<(const Ratio& a, const Ratio& b);
    friend bool operator>(const Ratio& a, const Ratio& b) { return b < a; }
    friend bool operator<=(const Ratio& a, const Ratio& b) { return !(b < a); }
    friend bool operator>=(const Ratio& a, const Ratio& b) { return !(a < b); }

    /// this^e for any integer e (e < 0 needs a non-zero value).
    Ratio pow(std::int64_t e) const;
    /// The reciprocal; must not be zero.
    Ratio reciprocal() const;
    /// The largest integer not above the value.
    Big floor() const;

    /// Closest long double (correct to long double precision for small values).
    long double to_long_double() const;
    /// log2 of a positive value, in long double, also for huge numerators and denominators.
    long double log2() const;
    /// "n/d" in lowest terms, always with the slash ("2/1", "-3/4").
    std::string str() const;

    /// num/den already in lowest terms with den > 0 (checked only by the invariant's users).
    static Ratio from_reduced(std::int64_t num, std::int64_t den);

private:
    struct BigPair {
        Big num, den;
    };
    static Ratio normalized(Big num, Big den);

    // Invariant: gcd(num, den) = 1 and den > 0, in whichever representation is active.
    // When big_ is set, the value does not fit in int64 (and num_, den_ are unused);
    // INT64_MIN never appears, so negation is always safe.
    std::int64_t num_ = 0;
    std::int64_t den_ = 1;
    std::shared_ptr<const BigPair> big_;
};

/// Size of a positive ratio in cents: 1200 * log2(r).
double cents(const Ratio& r);

/// Parses "p/q" or "p" (decimal digits, optional leading '-'); throws InputError at pos for
/// anything else, for a zero denominator, or for numbers beyond 64 bits.
Ratio parse_ratio(std::string_view text, const SourcePos& pos);

} // namespace terzo
