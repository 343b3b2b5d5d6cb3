#include "core/analysis/landing.hpp"

#include <algorithm>
#include <cmath>

#include "core/error.hpp"

namespace terzo {

namespace {

// The two notes around a tone: the highest note at or below it and the lowest note above it.
struct Neighbours {
    Landing below, above;
};

Neighbours neighbours(const Keyboard& kb, double cents) {
    const auto& sorted = kb.sorted_degrees();
    const double period = kb.period_cents();
    int p = static_cast<int>(std::floor(cents / period));
    double in = cents - p * period;
    if (in >= period) {
        in -= period;
        ++p;
    }
    // First entry strictly above `in`.
    const std::size_t lo = std::size_t(
        std::upper_bound(sorted.begin(), sorted.end(), in,
                         [](double c, const Keyboard::SortedDegree& e) { return c < e.cents_in_period; }) -
        sorted.begin());
    Neighbours n;
    auto set = [&](Landing& l, const Keyboard::SortedDegree& e, int in_period) {
        l.degree = e.degree;
        l.period = in_period - e.shift;
        l.deviation_cents = cents - (in_period * period + e.cents_in_period);
    };
    if (lo > 0) {
        // Of several degrees at the same pitch, the lowest-numbered one.
        std::size_t i = lo - 1;
        while (i > 0 && sorted[i - 1].cents_in_period == sorted[i].cents_in_period) --i;
        set(n.below, sorted[i], p);
    } else {
        std::size_t i = sorted.size() - 1;
        while (i > 0 && sorted[i - 1].cents_in_period == sorted[i].cents_in_period) --i;
        set(n.below, sorted[i], p - 1);
    }
    if (lo < sorted.size())
        set(n.above, sorted[lo], p);
    else
        set(n.above, sorted.front(), p + 1);
    return n;
}

// Nearest of the two; on a tie (equal distance in floating point) the lower note.
bool below_wins(const Neighbours& n) {
    return std::fabs(n.below.deviation_cents) <= std::fabs(n.above.deviation_cents);
}

// Floating point has chosen a nearest note; where the deviation is within the rounding error
// of the computation, exact comparison decides. `equal(l)` compares exactly. The other
// neighbour is tried too when it is also within the error, so a tone equal to a note is
// never missed because rounding picked its neighbour (only possible for notes a rounding
// error apart).
template <class Equal>
Landing confirm(const Neighbours& n, double error_cents, Equal equal) {
    Landing first = below_wins(n) ? n.below : n.above;
    Landing second = below_wins(n) ? n.above : n.below;
    for (Landing* l : {&first, &second}) {
        if (std::fabs(l->deviation_cents) <= error_cents && equal(*l)) {
            l->exact = true;
            l->deviation_cents = 0.0;
            return *l;
        }
    }
    return first;
}

// Exact equality of a tone with the note of landing l: the cached ratio when the note is
// rational through the period cache, the general Pitch comparison otherwise (a tempered
// period still leaves degree 0 of period 0 rational, for instance).
bool equals_note(const Keyboard& kb, const Landing& l, const Pitch& tone) {
    if (auto r = tone.ratio())
        if (auto nr = kb.note_ratio(l.degree, l.period)) return *nr == *r;
    return exactly_equal(kb.note(l.degree, l.period).pitch, tone).value_or(false);
}

} // namespace

NoteFinder::NoteFinder(const Keyboard& keyboard) : period_(keyboard.period_cents()) {
    const auto& sorted = keyboard.sorted_degrees();
    const std::size_t n = sorted.size();
    TERZO_ASSERT(n > 0);
    // first[i]: the first entry of the group of equal pitches that holds entry i.
    std::vector<std::size_t> first(n);
    for (std::size_t i = 0; i < n; ++i)
        first[i] = i > 0 && sorted[i - 1].cents_in_period == sorted[i].cents_in_period ? first[i - 1] : i;
    auto side = [&](std::size_t i, int step) {
        const auto& e = sorted[i];
        return Side{e.cents_in_period, e.degree, step - e.shift, step};
    };
    for (const auto& e : sorted) cuts_.push_back(e.cents_in_period);
    // Eight slices per degree: the search starts at its slice's upper bound and corrects it
    // by a step or two (the result is exactly std::upper_bound's, the slices only guess).
    const std::size_t slices = 8 * n;
    buckets_per_cent_ = double(slices) / period_;
    for (std::size_t b = 0; b < slices; ++b)
        bucket_.push_back(std::size_t(std::upper_bound(cuts_.begin(), cuts_.end(), double(b) / buckets_per_cent_) -
                                      cuts_.begin()));
    // The same neighbours as neighbours() above, for every upper bound lo = 0..n.
    for (std::size_t lo = 0; lo <= n; ++lo) {
        below_.push_back(lo > 0 ? side(first[lo - 1], 0) : side(first[n - 1], -1));
        above_.push_back(lo < n ? side(lo, 0) : side(0, 1));
    }
}

NoteFinder::Around NoteFinder::around(double cents) const {
    int p = static_cast<int>(std::floor(cents / period_));
    double in = cents - p * period_;
    if (in >= period_) {
        in -= period_;
        ++p;
    }
    // The upper bound of `in` in cuts_: the first entry strictly above it.
    std::size_t lo = bucket_[std::min(bucket_.size() - 1, std::size_t(std::max(0.0, in * buckets_per_cent_)))];
    while (lo > 0 && cuts_[lo - 1] > in) --lo;
    while (lo < cuts_.size() && cuts_[lo] <= in) ++lo;
    // Written as neighbours() computes it, so both give the same bits.
    auto landing_of = [&](const Side& s) {
        Landing l;
        const int in_period = p + s.step;
        l.degree = s.degree;
        l.period = p + s.period_shift;
        l.deviation_cents = cents - (in_period * period_ + s.cents_in_period);
        return l;
    };
    const Landing below = landing_of(below_[lo]), above = landing_of(above_[lo]);
    if (std::fabs(below.deviation_cents) <= std::fabs(above.deviation_cents)) return {below, above};
    return {above, below};
}

Landing nearest_note(const Keyboard& keyboard, double cents) {
    Neighbours n = neighbours(keyboard, cents);
    return below_wins(n) ? n.below : n.above;
}

Landing landing(const Keyboard& keyboard, const Pitch& tone) {
    Neighbours n = neighbours(keyboard, tone.cents());
    if (!tone.is_exact()) return below_wins(n) ? n.below : n.above;
    // Pitch::cents() of an exact value is rounded once from a long double logarithm: far
    // below 1e-6 cents for any size terzo accepts.
    constexpr double error_cents = 1e-6;
    return confirm(n, error_cents, [&](const Landing& l) { return equals_note(keyboard, l, tone); });
}

Landing landing(const Keyboard& keyboard, double cents, const Ratio& tone, double error_cents) {
    Neighbours n = neighbours(keyboard, cents);
    return confirm(n, error_cents, [&](const Landing& l) {
        if (auto nr = keyboard.note_ratio(l.degree, l.period)) return *nr == tone;
        return equals_note(keyboard, l, Pitch::from_ratio(tone));
    });
}

} // namespace terzo
