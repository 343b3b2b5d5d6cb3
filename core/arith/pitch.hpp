// Pitch: an interval above a reference, exact when the tuning allows. Three kinds:
// a rational (just) interval, an exact tempered interval (rational powers of primes), or a
// cents-only value read from text, which is inexact and says so.
#pragma once

#include <optional>
#include <string>

#include "core/arith/prime_vector.hpp"
#include "core/arith/ratio.hpp"

namespace terzo {

class Pitch {
public:
    enum class Kind { rational, tempered, cents_only };

    /// The unison 1/1.
    Pitch() : kind_(Kind::rational), ratio_(1), cents_(0.0) {}
    /// A just interval; r must be positive.
    static Pitch from_ratio(const Ratio& r);
    /// An exact tempered interval; becomes rational when every exponent is an integer.
    static Pitch from_vector(const PrimeVector& v);
    /// An inexact interval known only by its size in cents.
    static Pitch from_cents(double c);

    Kind kind() const { return kind_; }
    bool is_exact() const { return kind_ != Kind::cents_only; }
    bool is_rational() const { return kind_ == Kind::rational; }
    /// The ratio of a rational pitch.
    std::optional<Ratio> ratio() const;
    /// The prime vector of an exact pitch (factored on demand for rational pitches whose
    /// numerator and denominator fit in 64 bits).
    std::optional<PrimeVector> vector() const;
    /// Size in cents (rounded to double for exact pitches).
    double cents() const { return cents_; }
    /// Text: "5/4", "2^(1/31)", or cents with six decimals such as "701.955000".
    std::string str() const;

    /// Stacking intervals: exact when both are exact.
    friend Pitch operator*(const Pitch& a, const Pitch& b);
    friend Pitch operator/(const Pitch& a, const Pitch& b);
    /// Same kind and same value (exact values compared exactly, cents-only by their cents).
    friend bool operator==(const Pitch& a, const Pitch& b);
    friend bool operator!=(const Pitch& a, const Pitch& b) { return !(a == b); }

private:
    Kind kind_;
    Ratio ratio_;        // for Kind::rational
    PrimeVector vector_; // for Kind::tempered
    double cents_;       // always set
};

/// Exact equality of two exact pitches; nullopt when either is cents-only (then only a
/// tolerance could say, and this function never uses one).
std::optional<bool> exactly_equal(const Pitch& a, const Pitch& b);

} // namespace terzo
