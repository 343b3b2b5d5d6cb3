#include "core/sound/level.hpp"

#include <algorithm>
#include <cmath>

namespace terzo {

double db_to_gain(double db) {
    return std::pow(10.0, db / 20.0);
}

double gain_to_db(double gain) {
    return 20.0 * std::log10(gain);
}

double peak(const std::vector<double>& samples) {
    double p = 0.0;
    for (double s : samples)
        p = std::max(p, std::abs(s));
    return p;
}

// y[n] = x[n] - x[n-1] + R y[n-1] has a zero at DC and a pole at R = exp(-2 pi fc / fs);
// its gain at frequency f is about f / sqrt(f^2 + fc^2) for f well below fs.
void remove_dc(std::vector<double>& samples, double sample_rate, double cutoff_hz) {
    const double r = std::exp(-2.0 * M_PI * cutoff_hz / sample_rate);
    double x1 = 0.0, y1 = 0.0;
    for (double& s : samples) {
        const double y = s - x1 + r * y1;
        x1 = s;
        y1 = y;
        s = y;
    }
}

void scale_to_peak(std::vector<double>& samples, double peak_dbfs) {
    const double p = peak(samples);
    if (p == 0.0) return;
    const double g = db_to_gain(peak_dbfs) / p;
    for (double& s : samples)
        s *= g;
}

} // namespace terzo
