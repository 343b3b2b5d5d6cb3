// A memoryless polynomial model of a nonlinear ear: y = x + c2 x^2 + c3 x^3. The quadratic
// term puts the difference and summation tones (f2 - f1, f1 + f2) into the signal, the cubic
// term the cubic difference tones (2 f1 - f2, 2 f2 - f1). A model, not any particular ear.
#pragma once

#include <vector>

namespace terzo {

/// Coefficients of y = x + c2 x^2 + c3 x^3. The defaults (our choice) put the resultants of
/// two equal tones at full drive about 21 dB (f2 - f1) and 26 dB (2 f1 - f2) below the tones:
/// clearly audible, yet clearly quieter.
struct Polynomial {
    double c2 = 0.2; ///< quadratic coefficient
    double c3 = 0.3; ///< cubic coefficient
};

/// y for one input sample.
inline double polynomial_output(const Polynomial& p, double x) {
    return x + x * x * (p.c2 + p.c3 * x);
}
/// Replaces every sample x by y.
void apply_polynomial(std::vector<double>& samples, const Polynomial& p);

} // namespace terzo
