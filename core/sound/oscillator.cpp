#include "core/sound/oscillator.hpp"

#include <cmath>

#include "core/error.hpp"
#include "core/format.hpp"

namespace terzo {

// Integrator: the implicit trapezoidal rule with one step per sample, h = 1 / sample_rate.
// Why this fixed-step method:
// - It needs the input only at the sample instants, which is what a rendered buffer has;
//   explicit Runge-Kutta methods evaluate the input between samples and would need an
//   interpolator whose error adds to theirs.
// - It is A-stable: no resonance or damping the limits allow can make it blow up, while an
//   explicit method is stable only for w0 h below a bound.
// - On the linear part it is the bilinear transform: the discrete response at frequency w is
//   the exact continuous response at w' = (2/h) tan(w h / 2), with no gain error of its own
//   (Oppenheim & Schafer, Discrete-Time Signal Processing, section on the bilinear
//   transformation, from memory). At 2 kHz and 48 kHz, w'/w - 1 is 0.6 %; at 500 Hz, 0.04 %.
//   It is second-order accurate for the nonlinear terms too.
// Each step solves one scalar equation for x_{n+1} by Newton's method. With
//   v_{n+1} = 2 (x_{n+1} - x_n) / h - v_n   (the trapezoidal rule for x' = v)
// the rule for v' = a(x, v, u) becomes G(X) = 0 with
//   G(X) = V(X) - v_n - h/2 (a_n + a(X, V(X), u_{n+1})),
//   G'(X) = 2/h + gamma + h/2 w0^2 (1 + 2 c2 X + 3 c3 X^2),
// and G' stays near 2/h for any |x| below the divergence bound, so Newton converges in two
// or three iterations from the explicit guess x_n + h v_n + h^2/2 a_n.
std::vector<double> drive_oscillator(const std::vector<double>& input, const Oscillator& osc,
                                     double sample_rate) {
    const double w0 = 2.0 * M_PI * osc.resonance_hz, w0sq = w0 * w0;
    const double gamma = w0 / osc.q;
    const double h = 1.0 / sample_rate;
    auto accel = [&](double x, double v, double u) {
        return w0sq * (u - x - x * x * (osc.c2 + osc.c3 * x)) - gamma * v;
    };
    std::vector<double> out(input.size());
    double x = 0.0, v = 0.0, u = 0.0;
    for (std::size_t n = 0; n < input.size(); ++n) {
        const double u1 = input[n];
        const double a = accel(x, v, u);
        double X = x + h * v + 0.5 * h * h * a;
        for (int it = 0; it < 8; ++it) {
            const double V = 2.0 * (X - x) / h - v;
            const double g = V - v - 0.5 * h * (a + accel(X, V, u1));
            const double dg =
                2.0 / h + gamma + 0.5 * h * w0sq * (1.0 + X * (2.0 * osc.c2 + 3.0 * osc.c3 * X));
            const double dx = g / dg;
            X -= dx;
            if (std::abs(dx) <= 1e-14 * (1.0 + std::abs(X))) break;
        }
        v = 2.0 * (X - x) / h - v;
        x = X;
        u = u1;
        if (!(std::abs(x) <= oscillator_divergence_bound))
            fail({"--model", 0, 0}, "the oscillator model diverged at " + fixed(double(n) * h, 3) +
                                        " s; use a smaller quadratic coefficient c2 or a larger "
                                        "cubic coefficient c3 (c2^2 <= 3 c3 never diverges)");
        out[n] = x;
    }
    return out;
}

} // namespace terzo
