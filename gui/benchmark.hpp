// --bench-frames: times every frame of a run that recomputes every view, split into analysis,
// ImGui drawing and OpenGL rasterising, and prints the median with the host's steal.
#pragma once

#include <chrono>
#include <vector>

#include <imgui.h>

#include "bench/steal.hpp"
#include "gui/app.hpp"

namespace terzo::gui {

/// Makes the benchmark's workload: at least 88 notes (a piano's keys) at order 5, every view
/// recomputed each frame. Returns false when no tuning is open.
bool set_up_benchmark(App& app);

class FrameBench {
public:
    using Clock = std::chrono::steady_clock;
    /// The moments a frame passes: it starts, analysis begins, ImGui drawing begins,
    /// rasterising begins, rasterising is done, the frame ends (after display).
    struct Marks {
        Clock::time_point start, analysis, drawing, rasterising, rasterised, end;
    };

    explicit FrameBench(int frames) : frames_(frames) {}
    /// Records one frame (the first few are warm-up and not counted).
    void record(const Marks& m, const ImDrawData* data);
    /// True when enough frames are in.
    bool done() const { return static_cast<int>(ms_.size()) >= frames_; }
    /// Prints the figures (median, worst, the split, vertices, steal, the background fit).
    void print(const App& app) const;

private:
    static constexpr int warm_up_ = 3;
    int frames_;
    int seen_ = 0;
    std::vector<double> ms_;
    double part_ms_[3] = {0, 0, 0}; ///< analysis, ImGui drawing, rasterising, summed
    int draw_calls_ = 0, vertices_ = 0; ///< in the last measured frame
    bench::CpuTicks before_ = bench::machine_cpu_ticks();
};

} // namespace terzo::gui
