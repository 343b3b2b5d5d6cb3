#include "core/tuning/just.hpp"

#include <algorithm>

#include "core/tuning/pitch_set.hpp"

namespace terzo {

namespace {

const Pitch& octave() {
    static const Pitch two = Pitch::from_ratio(Ratio(2));
    return two;
}

} // namespace

Scale harmonic_segment(std::int64_t low, std::int64_t high, std::string description) {
    TERZO_ASSERT(low >= 1 && low < high);
    std::vector<Pitch> degrees;
    for (std::int64_t n = low + 1; n < high; ++n)
        degrees.push_back(Pitch::from_ratio(Ratio(n, low)));
    return Scale(std::move(description), std::move(degrees), Pitch::from_ratio(Ratio(high, low)));
}

Scale subharmonic_segment(std::int64_t low, std::int64_t high, std::string description) {
    TERZO_ASSERT(low >= 1 && low < high);
    std::vector<Pitch> degrees;
    for (std::int64_t n = high - 1; n > low; --n)
        degrees.push_back(Pitch::from_ratio(Ratio(high, n)));
    return Scale(std::move(description), std::move(degrees), Pitch::from_ratio(Ratio(high, low)));
}

Scale tonality_diamond(const std::vector<std::int64_t>& odds, std::string description) {
    std::vector<Pitch> pitches;
    for (std::int64_t a : odds)
        for (std::int64_t b : odds)
            pitches.push_back(Pitch::from_ratio(Ratio(a, b)));
    return scale_from_pitch_set(std::move(description), pitches, octave());
}

std::int64_t choose_count(int n, int k, std::int64_t limit) {
    TERZO_ASSERT(n >= 0 && n <= 64 && k >= 0);
    if (k > n) return 0;
    k = std::min(k, n - k);
    // C(n, i) = C(n, i-1) * (n-i+1) / i stays an integer at every step; with n <= 64 and
    // every value checked against limit (at most 2^32), the product fits in 64 bits.
    TERZO_ASSERT(limit <= (std::int64_t(1) << 32));
    std::int64_t c = 1;
    for (int i = 1; i <= k; ++i) {
        c = c * (n - i + 1) / i;
        if (c > limit) return -1;
    }
    return c;
}

Scale product_set(int k, const std::vector<std::int64_t>& factors, std::string description) {
    int n = static_cast<int>(factors.size());
    TERZO_ASSERT(k >= 1 && k <= n);
    std::vector<Ratio> products;
    std::vector<int> pick(static_cast<std::size_t>(k));
    for (int i = 0; i < k; ++i)
        pick[static_cast<std::size_t>(i)] = i;
    for (;;) {
        Ratio product(1);
        for (int i : pick)
            product *= Ratio(factors[static_cast<std::size_t>(i)]);
        products.push_back(product);
        // Next combination in lexicographic order.
        int i = k - 1;
        while (i >= 0 && pick[static_cast<std::size_t>(i)] == n - k + i)
            --i;
        if (i < 0) break;
        ++pick[static_cast<std::size_t>(i)];
        for (int j = i + 1; j < k; ++j)
            pick[static_cast<std::size_t>(j)] = pick[static_cast<std::size_t>(j - 1)] + 1;
    }
    Ratio smallest = *std::min_element(products.begin(), products.end());
    std::vector<Pitch> pitches;
    for (const Ratio& p : products)
        pitches.push_back(Pitch::from_ratio(p / smallest));
    return scale_from_pitch_set(std::move(description), pitches, octave());
}

} // namespace terzo
