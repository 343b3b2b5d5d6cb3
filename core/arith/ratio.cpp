#include "core/arith/ratio.hpp"

#include <cmath>
#include <limits>
#include <numeric>

namespace terzo {

namespace {

__extension__ typedef __int128 i128;
__extension__ typedef unsigned __int128 u128;

u128 abs128(i128 v) { return v < 0 ? u128(0) - u128(v) : u128(v); }

u128 gcd128(u128 a, u128 b) {
    while (b != 0) {
        u128 t = a % b;
        a = b;
        b = t;
    }
    return a;
}

// int64 range less INT64_MIN, so that every stored value can be negated.
bool fits64(i128 v) { return v > i128(INT64_MIN) && v <= i128(INT64_MAX); }

Ratio::Big to_big(i128 v) {
    u128 m = abs128(v);
    Ratio::Big b = static_cast<std::uint64_t>(m >> 64);
    b <<= 64;
    b += static_cast<std::uint64_t>(m);
    return v < 0 ? Ratio::Big(-b) : b;
}

} // namespace

Ratio::Ratio(std::int64_t num, std::int64_t den) {
    TERZO_ASSERT(den != 0);
    TERZO_ASSERT(num != INT64_MIN && den != INT64_MIN);
    if (den < 0) {
        num = -num;
        den = -den;
    }
    std::int64_t g = std::gcd(num, den);
    num_ = num / g;
    den_ = den / g;
}

Ratio Ratio::normalized(Big num, Big den) {
    TERZO_ASSERT(den != 0);
    if (den < 0) {
        num = -num;
        den = -den;
    }
    Big g = boost::multiprecision::gcd(num, den);
    if (g != 1) {
        num /= g;
        den /= g;
    }
    static const Big lo = Big(INT64_MIN) + 1, hi = Big(INT64_MAX);
    if (num >= lo && num <= hi && den <= hi) {
        Ratio r;
        r.num_ = static_cast<std::int64_t>(num);
        r.den_ = static_cast<std::int64_t>(den);
        return r;
    }
    Ratio r;
    r.big_ = std::make_shared<const BigPair>(BigPair{std::move(num), std::move(den)});
    return r;
}

Ratio Ratio::from_reduced(std::int64_t num, std::int64_t den) {
    TERZO_ASSERT(den > 0 && num != INT64_MIN);
    Ratio r;
    r.num_ = num;
    r.den_ = den;
    return r;
}

Ratio Ratio::from_big(Big num, Big den) { return normalized(std::move(num), std::move(den)); }

std::int64_t Ratio::num() const {
    TERZO_ASSERT(is_small());
    return num_;
}
std::int64_t Ratio::den() const {
    TERZO_ASSERT(is_small());
    return den_;
}
Ratio::Big Ratio::big_num() const { return big_ ? big_->num : Big(num_); }
Ratio::Big Ratio::big_den() const { return big_ ? big_->den : Big(den_); }

int Ratio::sign() const {
    if (big_) return big_->num.sign();
    return (num_ > 0) - (num_ < 0);
}

bool Ratio::is_integer() const { return big_ ? big_->den == 1 : den_ == 1; }

Ratio Ratio::operator-() const {
    if (!big_) {
        Ratio r = *this;
        r.num_ = -num_;
        return r;
    }
    return normalized(-big_->num, big_->den);
}

// Small operands: the cross products of two 63-bit values need at most 126 bits and their
// sum 127, so every intermediate fits in __int128; only the reduced result can fail to fit
// in 64 bits, and then it is promoted.
static Ratio add_small(std::int64_t a, std::int64_t b, std::int64_t c, std::int64_t d) {
    std::int64_t g = std::gcd(b, d);
    i128 n = i128(a) * (d / g) + i128(c) * (b / g);
    i128 m = i128(b / g) * d;
    if (fits64(n) && fits64(m)) {
        // The common case: reduce with a 64-bit gcd, which is much cheaper than a 128-bit one.
        std::int64_t n64 = std::int64_t(n), m64 = std::int64_t(m);
        std::int64_t h = std::gcd(n64, m64);
        return Ratio::from_reduced(n64 / h, m64 / h);
    }
    u128 h = gcd128(abs128(n), u128(m));
    if (h > 1) {
        n /= i128(h);
        m /= i128(h);
    }
    if (fits64(n) && fits64(m)) return Ratio::from_reduced(std::int64_t(n), std::int64_t(m));
    return Ratio::from_big(to_big(n), to_big(m));
}

Ratio operator+(const Ratio& x, const Ratio& y) {
    if (!x.big_ && !y.big_) return add_small(x.num_, x.den_, y.num_, y.den_);
    return Ratio::normalized(x.big_num() * y.big_den() + y.big_num() * x.big_den(),
                             x.big_den() * y.big_den());
}

Ratio operator-(const Ratio& x, const Ratio& y) { return x + (-y); }

Ratio operator*(const Ratio& x, const Ratio& y) {
    if (!x.big_ && !y.big_) {
        if (x.num_ == 0 || y.num_ == 0) return Ratio();
        std::int64_t g1 = std::gcd(x.num_, y.den_);
        std::int64_t g2 = std::gcd(y.num_, x.den_);
        i128 n = i128(x.num_ / g1) * (y.num_ / g2);
        i128 m = i128(x.den_ / g2) * (y.den_ / g1);
        if (fits64(n) && fits64(m)) return Ratio::from_reduced(std::int64_t(n), std::int64_t(m));
        return Ratio::from_big(to_big(n), to_big(m));
    }
    return Ratio::normalized(x.big_num() * y.big_num(), x.big_den() * y.big_den());
}

Ratio Ratio::reciprocal() const {
    TERZO_ASSERT(!is_zero());
    if (!big_) return Ratio(den_, num_);
    return normalized(big_->den, big_->num);
}

Ratio operator/(const Ratio& x, const Ratio& y) { return x * y.reciprocal(); }

bool operator==(const Ratio& x, const Ratio& y) {
    // Both sides are canonical, and a value is big exactly when it does not fit in 64 bits.
    if (!x.big_ && !y.big_) return x.num_ == y.num_ && x.den_ == y.den_;
    if (!x.big_ || !y.big_) return false;
    return x.big_->num == y.big_->num && x.big_->den == y.big_->den;
}

bool operator<(const Ratio& x, const Ratio& y) {
    if (!x.big_ && !y.big_) return i128(x.num_) * y.den_ < i128(y.num_) * x.den_;
    return x.big_num() * y.big_den() < y.big_num() * x.big_den();
}

Ratio Ratio::pow(std::int64_t e) const {
    if (e < 0) return reciprocal().pow(-e);
    Ratio result(1), base = *this;
    while (e > 0) {
        if (e & 1) result *= base;
        e >>= 1;
        if (e) base *= base;
    }
    return result;
}

Ratio::Big Ratio::floor() const {
    Big n = big_num(), d = big_den();
    Big q = n / d; // truncates toward zero
    if (n.sign() < 0 && q * d != n) q -= 1;
    return q;
}

namespace {
// log2 of a positive big integer: keep its top 64 bits, add the shifted-out bit count.
long double log2_big(const Ratio::Big& v) {
    TERZO_ASSERT(v > 0);
    std::size_t bits = boost::multiprecision::msb(v) + 1;
    if (bits <= 64) return std::log2(static_cast<long double>(static_cast<std::uint64_t>(v)));
    std::size_t shift = bits - 64;
    auto top = static_cast<std::uint64_t>(Ratio::Big(v >> shift));
    return std::log2(static_cast<long double>(top)) + static_cast<long double>(shift);
}
} // namespace

long double Ratio::to_long_double() const {
    if (!big_) return static_cast<long double>(num_) / static_cast<long double>(den_);
    int s = sign();
    if (s == 0) return 0.0L;
    long double l = log2_big(abs(big_->num)) - log2_big(big_->den);
    return s * std::exp2(l);
}

long double Ratio::log2() const {
    TERZO_ASSERT(sign() > 0);
    if (!big_) return std::log2(static_cast<long double>(num_)) -
                      std::log2(static_cast<long double>(den_));
    return log2_big(big_->num) - log2_big(big_->den);
}

std::string Ratio::str() const {
    if (!big_) return std::to_string(num_) + '/' + std::to_string(den_);
    return big_->num.str() + '/' + big_->den.str();
}

double cents(const Ratio& r) { return static_cast<double>(1200.0L * r.log2()); }

namespace {
// Digits only, at most int64; column points at the first character of the number.
std::int64_t parse_integer(std::string_view digits, const SourcePos& pos,
                           std::string_view whole, const char* what) {
    if (digits.empty()) fail(pos, "expected a " + std::string(what) + " in " + excerpt(whole));
    std::uint64_t v = 0;
    for (char c : digits) {
        if (c < '0' || c > '9')
            fail(pos, "expected a ratio p/q or an integer, found " + excerpt(whole));
        if (v > (std::uint64_t(INT64_MAX) - (c - '0')) / 10)
            fail(pos, "number too large in " + excerpt(whole) +
                          " (numerators and denominators are limited to 9223372036854775807)");
        v = v * 10 + std::uint64_t(c - '0');
    }
    return static_cast<std::int64_t>(v);
}
} // namespace

Ratio parse_ratio(std::string_view text, const SourcePos& pos) {
    bool negative = !text.empty() && text.front() == '-';
    std::string_view body = negative ? text.substr(1) : text;
    auto slash = body.find('/');
    std::int64_t num = parse_integer(body.substr(0, slash), pos, text, "numerator");
    std::int64_t den = 1;
    if (slash != std::string_view::npos) {
        den = parse_integer(body.substr(slash + 1), pos, text, "denominator");
        if (den == 0) fail(pos, "denominator is zero in " + excerpt(text));
    }
    return Ratio(negative ? -num : num, den);
}

} // namespace terzo
