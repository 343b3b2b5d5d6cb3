#include "core/analysis/dyad_grid.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "core/error.hpp"
#include "core/setting_error.hpp"

namespace terzo {

std::vector<DyadCell> dyad_grid(const Keyboard& keyboard, const ToneOptions& options) {
    const std::size_t n = keyboard.scale().size();
    if (n > max_grid_degrees)
        fail({"dyad grid", 0, 0}, "the tuning has " + std::to_string(n) +
                                      " degrees; the dyad grid shows at most " +
                                      std::to_string(max_grid_degrees));
    check_options(options);
    // The same bound as every other request (check_tone_count), said in the grid's terms:
    // its size is fixed by the tuning, so only the order and the partials can be lowered.
    const std::uint64_t bound = tone_count_bound(n * n, options);
    if (bound > max_tones)
        fail(Setting::order, "the dyad grid of " + std::to_string(n) + " degrees could compute " +
                                 std::to_string(bound) + " tones (" + std::to_string(n * n) +
                                 " dyads), more than the limit of " + std::to_string(max_tones) +
                                 "; lower {order} or {partials}");
    const ResultantEngine engine(keyboard, options);
    DyadTones dyad;
    std::vector<DyadCell> cells;
    cells.reserve(n * n);
    for (std::size_t i = 0; i < n; ++i) {
        const Note low = keyboard.note(static_cast<int>(i), 0);
        for (std::size_t j = 0; j < n; ++j) {
            DyadCell c;
            c.low_degree = static_cast<int>(i);
            c.high_degree = static_cast<int>(j);
            // Degrees need not ascend in a .scl file: compare sizes, not indices.
            c.high_period = keyboard.note(c.high_degree, 0).cents > low.cents ? 0 : 1;
            const Note high = keyboard.note(c.high_degree, c.high_period);
            c.interval_cents = high.cents - low.cents;
            // The engine takes the lower note first (a unison is its own low note).
            if (high.cents < low.cents)
                engine.tones(high, low, dyad.tones);
            else
                engine.tones(low, high, dyad.tones);
            FitSum sum;
            sum.add(dyad);
            for (const Tone& t : dyad.tones)
                c.worst_cents = std::max(c.worst_cents, std::abs(t.landing.deviation_cents));
            c.fit = sum.result();
            cells.push_back(std::move(c));
        }
    }
    return cells;
}

} // namespace terzo
