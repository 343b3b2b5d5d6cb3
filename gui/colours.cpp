#include "gui/colours.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "core/format.hpp"

namespace terzo::gui {

namespace {

struct Stop {
    double at;
    int r, g, b;
};

// The stops of the scale for a given tolerance (see the header).
void stops(double tol, Stop out[5]) {
    double a = std::max(tol * 2.0, 10.0), b = std::max(tol * 5.0, 25.0), c = std::max(tol * 10.0, 50.0);
    out[0] = {0.0, 40, 185, 95};
    out[1] = {tol, 165, 215, 55};
    out[2] = {a, 245, 180, 40};
    out[3] = {b, 230, 70, 50};
    out[4] = {c, 170, 70, 210};
}

} // namespace

ImU32 deviation_colour(double abs_cents, bool exact, double tolerance) {
    if (exact) return exact_colour;
    Stop s[5];
    stops(tolerance, s);
    if (!(abs_cents >= 0.0)) abs_cents = s[4].at;
    for (int i = 0; i < 4; ++i) {
        if (abs_cents <= s[i + 1].at) {
            double t = (abs_cents - s[i].at) / (s[i + 1].at - s[i].at);
            auto mix = [t](int x, int y) { return static_cast<int>(std::lround(x + (y - x) * t)); };
            return IM_COL32(mix(s[i].r, s[i + 1].r), mix(s[i].g, s[i + 1].g), mix(s[i].b, s[i + 1].b), 255);
        }
    }
    return IM_COL32(s[4].r, s[4].g, s[4].b, 255);
}

float draw_deviation_legend(ImDrawList* dl, ImVec2 pos, double tolerance, bool with_symbols) {
    Stop s[5];
    stops(tolerance, s);
    const float w = 190.0f, h = 12.0f, line = ImGui::GetTextLineHeight();
    const ImU32 text = IM_COL32(220, 220, 225, 255);
    dl->AddRectFilled(ImVec2(pos.x - 6, pos.y - 4), ImVec2(pos.x + w + 92, pos.y + line * (with_symbols ? 5.6f : 3.4f)), IM_COL32(10, 12, 16, 210), 4.0f);
    dl->AddText(pos, text, "resultants: landing deviation");
    float y = pos.y + line + 2;
    // Exact swatch, then the gradient drawn as thin strips.
    dl->AddRectFilled(ImVec2(pos.x, y), ImVec2(pos.x + 40, y + h), exact_colour);
    float x0 = pos.x + 50;
    for (int i = 0; i < 100; ++i) {
        double c = s[4].at * i / 99.0;
        dl->AddRectFilled(ImVec2(x0 + w * i / 100.0f - 0.5f, y), ImVec2(x0 + w * (i + 1) / 100.0f + 0.5f, y + h), deviation_colour(c, false, tolerance));
    }
    dl->AddText(ImVec2(pos.x, y + h + 1), text, "exact");
    for (int i = 0; i < 5; ++i) {
        float x = x0 + w * static_cast<float>(s[i].at / s[4].at);
        std::string label = fixed(s[i].at, s[i].at < 10 && s[i].at != std::floor(s[i].at) ? 1 : 0) + (i == 4 ? "+ c" : "");
        dl->AddLine(ImVec2(x, y + h), ImVec2(x, y + h + 3), text);
        dl->AddText(ImVec2(x - 4, y + h + 1), text, label.c_str());
    }
    float bottom = y + h + line + 2;
    if (with_symbols) {
        dl->AddText(ImVec2(pos.x, bottom), text, "\xe2\x96\xb2 sharp  \xe2\x96\xbc flat  \xe2\x97\x86 within tolerance");
        dl->AddText(ImVec2(pos.x, bottom + line), text, "marks sit at each resultant's own ratio");
        bottom += 2 * line;
    }
    return bottom - pos.y;
}

} // namespace terzo::gui
