#include "core/arith/pitch.hpp"

#include <cmath>
#include <cstdio>

namespace terzo {

Pitch Pitch::from_ratio(const Ratio& r) {
    TERZO_ASSERT(r.sign() > 0);
    Pitch p;
    p.kind_ = Kind::rational;
    p.ratio_ = r;
    p.cents_ = terzo::cents(r);
    return p;
}

Pitch Pitch::from_vector(const PrimeVector& v) {
    if (v.is_rational()) {
        if (auto r = v.to_ratio()) return from_ratio(*r);
    }
    Pitch p;
    p.kind_ = Kind::tempered;
    p.vector_ = v;
    p.ratio_ = Ratio(0);
    p.cents_ = v.cents();
    return p;
}

Pitch Pitch::from_cents(double c) {
    TERZO_ASSERT(std::isfinite(c));
    Pitch p;
    p.kind_ = Kind::cents_only;
    p.ratio_ = Ratio(0);
    p.cents_ = c;
    return p;
}

std::optional<Ratio> Pitch::ratio() const {
    if (kind_ == Kind::rational) return ratio_;
    return std::nullopt;
}

std::optional<PrimeVector> Pitch::vector() const {
    switch (kind_) {
    case Kind::tempered:
        return vector_;
    case Kind::rational:
        if (ratio_.is_small()) return PrimeVector::from_ratio(ratio_);
        return std::nullopt;
    case Kind::cents_only:
        break;
    }
    return std::nullopt;
}

std::string Pitch::str() const {
    switch (kind_) {
    case Kind::rational:
        return ratio_.str();
    case Kind::tempered:
        return vector_.str();
    case Kind::cents_only:
        break;
    }
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.6f", cents_);
    return buf;
}

Pitch operator*(const Pitch& a, const Pitch& b) {
    if (a.is_rational() && b.is_rational()) return Pitch::from_ratio(a.ratio_ * b.ratio_);
    if (a.is_exact() && b.is_exact()) {
        auto va = a.vector(), vb = b.vector();
        if (va && vb) return Pitch::from_vector(*va * *vb);
    }
    return Pitch::from_cents(a.cents_ + b.cents_);
}

Pitch operator/(const Pitch& a, const Pitch& b) {
    if (a.is_rational() && b.is_rational()) return Pitch::from_ratio(a.ratio_ / b.ratio_);
    if (a.is_exact() && b.is_exact()) {
        auto va = a.vector(), vb = b.vector();
        if (va && vb) return Pitch::from_vector(*va / *vb);
    }
    return Pitch::from_cents(a.cents_ - b.cents_);
}

bool operator==(const Pitch& a, const Pitch& b) {
    if (a.kind_ != b.kind_) return false;
    switch (a.kind_) {
    case Pitch::Kind::rational:
        return a.ratio_ == b.ratio_;
    case Pitch::Kind::tempered:
        return a.vector_ == b.vector_;
    case Pitch::Kind::cents_only:
        break;
    }
    return a.cents_ == b.cents_;
}

std::optional<bool> exactly_equal(const Pitch& a, const Pitch& b) {
    if (!a.is_exact() || !b.is_exact()) return std::nullopt;
    // Kinds are canonical (a tempered pitch is never rational), so kind and value decide.
    return a == b;
}

} // namespace terzo
