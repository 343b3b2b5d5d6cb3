#include "core/analysis/audibility.hpp"

#include <algorithm>
#include <utility>

namespace terzo {

// The estimate, term by term. It encodes qualitative findings, not fitted data; the
// numbers are our own choice of scale, in [0, 1]:
//  - Cubic difference tone 2f1-f2 and its family f1 - k(f2 - f1) = (k+1)f1 - k f2: the most
//    easily audible combination tone for two pure tones (Colman, Oxford Dictionary of
//    Psychology, "combination tone"); its level relative to the primaries falls steeply as
//    f2/f1 grows, strongest for f2/f1 about 1.1-1.2 and hard to hear above about 1.3-1.5
//    (Goldstein, JASA 41, 1967, 676-689; Smoorenburg, JASA 52, 1972, 615-632; both from
//    memory); the family is heard up to k = 5 or 6 (Smoorenburg, "Audibility region of
//    combination tones", JASA 52, 1972, 603-614, abstract). Estimate: 1 up to f2/f1 = 1.2,
//    falling linearly to 0 at 1.5, times 1 - (k-1)/6 (0 from k = 7).
//  - Quadratic difference tone f2-f1: audible only at high primary levels, roughly 50 dB SL
//    and above (Plomp, JASA 37, 1965, 1110-1123, from memory), where it becomes comparable
//    with 2f1-f2 (Greenwood 1971-72, as summarised in docs/references.md). Estimate: 0.5 at any
//    ratio (terzo assumes the loud playing under which resultants are heard at all).
//  - Summation tone f1+f2: seldom heard (Truax, Handbook for Acoustic Ecology, 1999), much
//    weaker than difference tones in Helmholtz's model (On the Sensations of Tone, App. XII).
//    Estimate: 0.1.
//  - Any other term: no data used here. Estimate: 0.05 / (order - 2), a small floor.
double audibility(const CombinationTerm& term, double f_low, double f_high) {
    CombinationTerm t = term;
    if (f_low > f_high) { // the estimate is stated for f1 < f2
        std::swap(f_low, f_high);
        std::swap(t.a, t.b);
    }
    if (!(f_low > 0.0)) return 0.0;
    const double r = f_high / f_low;
    if (t.b < 0 && t.a == 1 - t.b) { // (k+1, -k)
        const int k = -t.b;
        const double by_ratio = r <= 1.2 ? 1.0 : r >= 1.5 ? 0.0 : (1.5 - r) / 0.3;
        const double by_k = std::max(0.0, 1.0 - (k - 1) / 6.0);
        return by_ratio * by_k;
    }
    if (t.a == -1 && t.b == 1) return 0.5;
    if (t.a == 1 && t.b == 1) return 0.1;
    return 0.05 / std::max(1, t.order() - 2);
}

double audibility(const CombinationTerm& term, double f_low, double f_high, int low_partial,
                  int high_partial) {
    const double base = audibility(term, low_partial * f_low, high_partial * f_high);
    return base / (double(low_partial) * double(high_partial));
}

} // namespace terzo
