#include "core/sound/level.hpp"

#include <algorithm>
#include <cmath>

namespace terzo {

double db_to_gain(double db) { return std::pow(10.0, db / 20.0); }

double gain_to_db(double gain) { return 20.0 * std::log10(gain); }

double peak(const std::vector<double>& samples) {
    double p = 0.0;
    for (double s : samples) p = std::max(p, std::abs(s));
    return p;
}

void scale_to_peak(std::vector<double>& samples, double peak_dbfs) {
    const double p = peak(samples);
    if (p == 0.0) return;
    const double g = db_to_gain(peak_dbfs) / p;
    for (double& s : samples) s *= g;
}

} // namespace terzo
