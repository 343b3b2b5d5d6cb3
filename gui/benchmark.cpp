#include "gui/benchmark.hpp"

#include <algorithm>
#include <cstdio>
#include <numeric>

#include "core/format.hpp"
#include "gui/gl_render.hpp"

namespace terzo::gui {

namespace {
double ms_between(FrameBench::Clock::time_point a, FrameBench::Clock::time_point b) {
    return std::chrono::duration<double, std::milli>(b - a).count();
}
} // namespace

bool set_up_benchmark(App& app) {
    const SessionTuning* t = current_tuning(app);
    if (!t) return false;
    const int size = static_cast<int>(t->scale.size());
    app.session.settings.span = std::clamp((87 + size - 1) / size, 1, max_span);
    app.session.settings.max_order = 5;
    app.benchmark = true;
    return true;
}

void FrameBench::record(const Marks& m, const ImDrawData* data) {
    if (seen_++ < warm_up_) return;
    ms_.push_back(ms_between(m.start, m.end));
    part_ms_[0] += ms_between(m.analysis, m.drawing);
    part_ms_[1] += ms_between(m.drawing, m.rasterising);
    part_ms_[2] += ms_between(m.rasterising, m.rasterised);
    vertices_ = data->TotalVtxCount;
    draw_calls_ = 0;
    for (int i = 0; i < data->CmdListsCount; ++i) draw_calls_ += data->CmdLists[i]->CmdBuffer.Size;
}

void FrameBench::print(const App& app) const {
    std::vector<double> sorted = ms_;
    std::sort(sorted.begin(), sorted.end());
    const Analysis& a = app.analysis;
    std::printf("frames %zu (after %d warm-up), keyboard %zu notes, order %d, %zu selected notes; %s\n", sorted.size(), warm_up_,
                a.keyboard ? a.keyboard->notes().size() : 0, app.session.settings.max_order, app.session.selection.size(),
                renderer_name());
    if (!sorted.empty()) {
        std::printf("ms per frame: median %s, worst %s\n", fixed(sorted[sorted.size() / 2], 3).c_str(), fixed(sorted.back(), 3).c_str());
        const double n = static_cast<double>(sorted.size());
        const double all = std::accumulate(sorted.begin(), sorted.end(), 0.0) / n;
        std::printf("mean per frame %s ms (%d ImGui vertices, %d draw commands): analysis %s, ImGui drawing %s, OpenGL rasterising %s, "
                    "the rest (events, display) %s\n",
                    fixed(all, 3).c_str(), vertices_, draw_calls_, fixed(part_ms_[0] / n, 3).c_str(), fixed(part_ms_[1] / n, 3).c_str(),
                    fixed(part_ms_[2] / n, 3).c_str(), fixed(all - (part_ms_[0] + part_ms_[1] + part_ms_[2]) / n, 3).c_str());
    }
    bench::print_steal_since(before_);
    if (!a.error.empty()) std::printf("analysis: %s\n", a.error.c_str());
    const BackgroundFit& b = app.background;
    if (b.completed)
        std::printf("whole-keyboard fit on the worker thread (idle priority): %zu recomputations, mean %s ms each (wall clock)\n", b.completed,
                    fixed(b.total_ms / static_cast<double>(b.completed), 3).c_str());
}

} // namespace terzo::gui
