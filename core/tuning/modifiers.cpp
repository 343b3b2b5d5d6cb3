#include "core/tuning/modifiers.hpp"

#include "core/tuning/pitch_set.hpp"

namespace terzo {

namespace {

// x with d = p^x when d's prime vector is a rational multiple of p's.
std::optional<Ratio> log_ratio(const PrimeVector& d, const PrimeVector& p) {
    if (d == PrimeVector()) return Ratio(0);
    if (p.terms().empty() || d.terms().size() != p.terms().size()) return std::nullopt;
    std::optional<Ratio> x;
    for (std::size_t i = 0; i < d.terms().size(); ++i) {
        if (d.terms()[i].first != p.terms()[i].first) return std::nullopt;
        Ratio r = d.terms()[i].second / p.terms()[i].second;
        if (x && *x != r) return std::nullopt;
        x = r;
    }
    return x;
}

} // namespace

Scale rotate_to_degree(const Scale& scale, std::size_t k, std::string description) {
    std::size_t n = scale.size();
    TERZO_ASSERT(k < n);
    const Pitch& base = scale.degree(k);
    std::vector<Pitch> degrees;
    for (std::size_t i = 1; i < n; ++i) {
        std::size_t j = k + i;
        Pitch d = j < n ? scale.degree(j) : exact_product(scale.degree(j - n), scale.period());
        degrees.push_back(exact_quotient(d, base));
    }
    return Scale(std::move(description), std::move(degrees), scale.period());
}

Scale transpose_pattern(const Scale& scale, std::size_t k, std::string description) {
    TERZO_ASSERT(k < scale.size());
    return rotate_to_degree(scale, (scale.size() - k) % scale.size(), std::move(description));
}

Scale stretch_period(const Scale& scale, const Pitch& new_period, std::string description) {
    TERZO_ASSERT(new_period.cents() > 0);
    auto old_vector = exact_vector(scale.period());
    auto stretch = [&](const Pitch& d) {
        if (old_vector && new_period.is_exact()) {
            if (auto dv = exact_vector(d)) {
                if (auto x = log_ratio(*dv, *old_vector)) return exact_power(new_period, *x);
            }
        }
        return Pitch::from_cents(d.cents() * new_period.cents() / scale.period().cents());
    };
    std::vector<Pitch> degrees;
    for (std::size_t i = 1; i < scale.size(); ++i)
        degrees.push_back(stretch(scale.degree(i)));
    return Scale(std::move(description), std::move(degrees), new_period);
}

Scale keep_degrees(const Scale& scale, const std::vector<std::size_t>& indexes,
                   std::string description) {
    std::vector<Pitch> degrees;
    std::size_t previous = 0;
    for (std::size_t i : indexes) {
        TERZO_ASSERT(i < scale.size() && (i > previous || i == 0));
        if (i == 0) continue;
        degrees.push_back(scale.degree(i));
        previous = i;
    }
    return Scale(std::move(description), std::move(degrees), scale.period());
}

} // namespace terzo
