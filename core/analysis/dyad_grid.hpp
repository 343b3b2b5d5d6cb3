// The dyad grid: every dyad of one period of a tuning, from each degree to each degree above
// it up to the same degree a period higher, with a summary of where its combination tones
// land (the worst deviation and the fit). The GUI's dyad grid view draws exactly this.
#pragma once

#include <cstddef>
#include <vector>

#include "core/analysis/combination.hpp"
#include "core/analysis/fit.hpp"

namespace terzo {

/// Largest scale the grid covers (its size grows with the square of the degree count).
inline constexpr std::size_t max_grid_degrees = 128;

/// One dyad of the grid.
struct DyadCell {
    int low_degree = 0;         ///< in the keyboard's lowest period
    int high_degree = 0;        ///< in period 0 when it sounds above low_degree, else period 1
    int high_period = 0;
    double interval_cents = 0.0; ///< high minus low
    double worst_cents = 0.0;    ///< largest |landing deviation| of its tones; 0 with no tones
    Fit fit;                     ///< fit() of this dyad alone
};

/// n*n cells, row by row (low degree), then by high degree; n = scale size. Throws
/// InputError (source "dyad grid") beyond max_grid_degrees, naming Setting::order when the
/// n*n dyads could compute more than max_tones tones (the limit of every request), and
/// whatever dyad_tones throws.
std::vector<DyadCell> dyad_grid(const Keyboard& keyboard, const ToneOptions& options);

} // namespace terzo
