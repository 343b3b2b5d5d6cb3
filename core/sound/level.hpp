// Levels in decibels relative to full scale (dBFS) and the peak cap every render passes
// through: a rendered buffer never peaks above the cap, whatever the model did to it.
#pragma once

#include <vector>

namespace terzo {

/// Linear gain of a level in dB: db_to_gain(-6.0206) is 0.5.
double db_to_gain(double db);
/// Level in dB of a linear gain (gain > 0).
double gain_to_db(double gain);
/// Largest absolute sample value; 0 for an empty or silent buffer.
double peak(const std::vector<double>& samples);
/// Removes a constant offset with a one-pole high-pass (the quadratic term of a model adds
/// one): gain -3 dB at cutoff_hz, above 99.9 % (-0.01 dB) from 30 times the cutoff up.
void remove_dc(std::vector<double>& samples, double sample_rate, double cutoff_hz = 2.0);
/// Scales the buffer so that its peak sits exactly at peak_dbfs (silence stays silence).
void scale_to_peak(std::vector<double>& samples, double peak_dbfs);

} // namespace terzo
