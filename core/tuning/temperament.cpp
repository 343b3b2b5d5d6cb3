#include "core/tuning/temperament.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include "core/tuning/scl.hpp"
#include "core/tuning/pitch_set.hpp"

namespace terzo {

namespace {

PrimeVector ratio_vector(std::int64_t num, std::int64_t den) {
    return PrimeVector::from_ratio(Ratio(num, den));
}

PrimeVector pure_fifth() {
    return ratio_vector(3, 2);
}

} // namespace

PrimeVector pythagorean_comma() {
    return ratio_vector(531441, 524288);
}
PrimeVector syntonic_comma() {
    return ratio_vector(81, 80);
}
PrimeVector schisma() {
    return ratio_vector(32805, 32768);
}

Scale equal_division(int steps, const Pitch& interval, std::string description) {
    TERZO_ASSERT(steps >= 1 && static_cast<std::size_t>(steps) <= max_scale_size);
    TERZO_ASSERT(interval.cents() > 0);
    std::vector<Pitch> degrees;
    for (int i = 1; i < steps; ++i)
        degrees.push_back(exact_power(interval, Ratio(i, steps)));
    return Scale(std::move(description), std::move(degrees), interval);
}

Scale generator_chain(const Pitch& generator, int up, int down, const Pitch& period,
                      std::string description) {
    TERZO_ASSERT(up >= 0 && down >= 0 &&
                 static_cast<std::size_t>(up) + static_cast<std::size_t>(down) < max_scale_size);
    std::vector<Pitch> pitches;
    auto g = exact_vector(generator), p = exact_vector(period);
    for (int j = -down; j <= up; ++j) {
        if (g && p) {
            // In prime-vector form a power and a period reduction cost no big-number
            // arithmetic; only the final conversion to a ratio does.
            PrimeVector v = g->pow(Ratio(j));
            auto k = static_cast<std::int64_t>(std::floor(v.cents() / p->cents()));
            pitches.push_back(Pitch::from_vector(v / p->pow(Ratio(k))));
        } else {
            pitches.push_back(exact_power(generator, Ratio(j)));
        }
    }
    return scale_from_pitch_set(std::move(description), pitches, period);
}

PrimeVector meantone_fifth(const Ratio& fraction) {
    return pure_fifth() * syntonic_comma().pow(-fraction);
}

std::optional<int> wolf_index(const FifthCircle& circle) {
    for (int i = 0; i < 12; ++i)
        if (!circle.tempering[static_cast<std::size_t>(i)]) return i;
    return std::nullopt;
}

PrimeVector circle_leftover(const FifthCircle& circle) {
    PrimeVector total;
    for (const auto& t : circle.tempering) {
        TERZO_ASSERT(t.has_value());
        total = total * pure_fifth() * *t;
    }
    return total / PrimeVector::prime_power(2, Ratio(7));
}

PrimeVector circle_fifth(const FifthCircle& circle, int i) {
    TERZO_ASSERT(i >= 0 && i < 12);
    const auto& t = circle.tempering[static_cast<std::size_t>(i)];
    if (t) return pure_fifth() * *t;
    // The wolf is seven octaves divided by the other eleven fifths.
    PrimeVector others;
    for (int j = 0; j < 12; ++j)
        if (j != i) others = others * circle_fifth(circle, j);
    return PrimeVector::prime_power(2, Ratio(7)) / others;
}

Scale fifth_circle_scale(const FifthCircle& circle, std::string description) {
    auto wolf = wolf_index(circle);
    int wolves = static_cast<int>(std::count_if(circle.tempering.begin(), circle.tempering.end(),
                                                [](const auto& t) { return !t; }));
    TERZO_ASSERT(wolves <= 1);
    TERZO_ASSERT(wolf || circle_leftover(circle) == PrimeVector());
    // Walk eleven fifths, starting just after the wolf (or after the last fifth when the
    // circle closes, where any start gives the same notes), then measure from C.
    int first = wolf ? (*wolf + 1) % 12 : 0;
    int pc = (circle.start_pitch_class + 7 * first) % 12;
    std::array<PrimeVector, 12> above_start; // by pitch class, relative to the walk's first note
    above_start[static_cast<std::size_t>(pc)] = PrimeVector();
    PrimeVector value;
    for (int step = 0; step < 11; ++step) {
        value = value * circle_fifth(circle, (first + step) % 12);
        pc = (pc + 7) % 12;
        above_start[static_cast<std::size_t>(pc)] = value;
    }
    Pitch octave = Pitch::from_ratio(Ratio(2));
    std::vector<Pitch> degrees;
    for (int note = 1; note < 12; ++note) {
        Pitch p = Pitch::from_vector(above_start[static_cast<std::size_t>(note)] / above_start[0]);
        degrees.push_back(reduce_into_period(p, octave));
    }
    return Scale(std::move(description), std::move(degrees), octave);
}

} // namespace terzo
