// Tunings built directly from exact prime powers for the analysis tests, so that reference
// checks do not depend on any recipe parser. Each follows docs/references.md section 2.1.
#pragma once

#include <vector>

#include "core/tuning/scale.hpp"

namespace terzo::test {

/// The Pythagorean comma 3^12 / 2^19 as a prime vector.
inline PrimeVector pythagorean_comma() {
    return PrimeVector::from_ratio(Ratio(531441, 524288));
}
/// The syntonic comma 81/80.
inline PrimeVector syntonic_comma() {
    return PrimeVector::from_ratio(Ratio(81, 80));
}

/// A 12-note scale on C from its twelve fifths in circle order C-G, G-D … F-C. Notes C#..G#
/// are reached by rising fifths from C, F, Bb, Eb by falling ones, so the G#-Eb fifth is the
/// one that closes the circle (the wolf of a meantone).
inline Scale scale_from_fifths(const std::vector<PrimeVector>& fifths, const char* name) {
    std::vector<PrimeVector> pc(12);
    PrimeVector two = PrimeVector::from_ratio(Ratio(2));
    auto reduce = [&](PrimeVector v) {
        while (v.cents() >= 1200.0)
            v = v / two;
        while (v.cents() < 0.0)
            v = v * two;
        return v;
    };
    PrimeVector up;
    for (int i = 1; i <= 8; ++i) {
        up = reduce(up * fifths[static_cast<std::size_t>(i - 1)]);
        pc[static_cast<std::size_t>(7 * i % 12)] = up;
    }
    PrimeVector down;
    for (int i = 1; i <= 3; ++i) {
        down = reduce(down / fifths[static_cast<std::size_t>(12 - i)]);
        pc[static_cast<std::size_t>((12 - 7 * i % 12) % 12)] = down;
    }
    std::vector<Pitch> degrees;
    for (int i = 1; i < 12; ++i)
        degrees.push_back(Pitch::from_vector(pc[static_cast<std::size_t>(i)]));
    return Scale(name, degrees, Pitch::from_ratio(Ratio(2)));
}

inline PrimeVector pure_fifth() {
    return PrimeVector::from_ratio(Ratio(3, 2));
}

/// 12-tone equal temperament: every fifth P/12 narrow.
inline Scale equal_12() {
    std::vector<PrimeVector> f(12, pure_fifth() / pythagorean_comma().pow(Ratio(1, 12)));
    return scale_from_fifths(f, "12-TET");
}

/// Werckmeister III: C-G, G-D, D-A and B-F# each P/4 narrow, the rest pure.
inline Scale werckmeister_3() {
    PrimeVector narrow = pure_fifth() / pythagorean_comma().pow(Ratio(1, 4));
    std::vector<PrimeVector> f(12, pure_fifth());
    f[0] = f[1] = f[2] = f[5] = narrow;
    return scale_from_fifths(f, "Werckmeister III");
}

/// Quarter-comma meantone on the chain Eb..G#: every fifth S/4 narrow (exactly 5^(1/4)).
inline Scale quarter_comma() {
    std::vector<PrimeVector> f(12, pure_fifth() / syntonic_comma().pow(Ratio(1, 4)));
    return scale_from_fifths(f, "quarter-comma meantone");
}

/// Pythagorean tuning on the chain Eb..G#: every fifth pure but the wolf G#-Eb.
inline Scale pythagorean() {
    return scale_from_fifths(std::vector<PrimeVector>(12, pure_fifth()), "Pythagorean");
}

} // namespace terzo::test
