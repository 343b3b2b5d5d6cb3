#include "core/sound/polynomial.hpp"

namespace terzo {

void apply_polynomial(std::vector<double>& samples, const Polynomial& p) {
    for (double& x : samples)
        x = polynomial_output(p, x);
}

} // namespace terzo
