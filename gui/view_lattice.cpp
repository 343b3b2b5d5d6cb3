// The lattice view: the tuning's degrees on the 3-5-7 lattice (fifths to the right, thirds up,
// sevenths up and to the right), octave-equivalent, with the selected notes' resultants as marks
// coloured by how far each lands from the nearest note. Drag to pan, wheel to zoom.
#include <cmath>
#include <map>
#include <string>

#include "core/format.hpp"
#include "gui/colours.hpp"
#include "gui/gl_render.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

namespace {

// Screen offset of lattice point (e3, e5, e7) at zoom 1.
ImVec2 lattice_offset(const std::array<int, 3>& e) {
    // 7 goes steeply up and right, chosen so that no small combination of steps (such as
    // 3 * 5 / 7^2) lands within a node's diameter of the origin.
    return ImVec2(e[0] * 120.0f + e[2] * 36.0f, -e[1] * 104.0f - e[2] * 70.0f);
}

std::string exponent_text(const std::array<int, 3>& e) {
    std::string s;
    const char* names[3] = {"3", "5", "7"};
    for (int i = 0; i < 3; ++i) {
        if (e[i] == 0) continue;
        if (!s.empty()) s += " \xc2\xb7 ";
        s += std::string(names[i]) + "^" + std::to_string(e[i]);
    }
    return s.empty() ? "origin (1/1)" : s;
}

std::string place_text(const LatticePlace& p) {
    switch (p.how) {
    case LatticeHow::exact: return "on the lattice at " + exponent_text(p.exponents);
    case LatticeHow::nearest:
        return "nearest just " + p.just.str() + " (" + signed_fixed(p.deviation_cents, 3) + " c), at " + exponent_text(p.exponents);
    case LatticeHow::none: break;
    }
    return "no 7-limit ratio within the lattice tolerance";
}

void triangle(ImDrawList* dl, ImVec2 c, float r, bool up, ImU32 col) {
    float s = up ? -1.0f : 1.0f;
    dl->AddTriangleFilled(ImVec2(c.x, c.y + s * r), ImVec2(c.x - r, c.y - s * r * 0.8f), ImVec2(c.x + r, c.y - s * r * 0.8f), col);
    dl->AddTriangle(ImVec2(c.x, c.y + s * r), ImVec2(c.x - r, c.y - s * r * 0.8f), ImVec2(c.x + r, c.y - s * r * 0.8f), IM_COL32(0, 0, 0, 160));
}

void diamond(ImDrawList* dl, ImVec2 c, float r, ImU32 col) {
    dl->AddQuadFilled(ImVec2(c.x, c.y - r), ImVec2(c.x + r, c.y), ImVec2(c.x, c.y + r), ImVec2(c.x - r, c.y), col);
    dl->AddQuad(ImVec2(c.x, c.y - r), ImVec2(c.x + r, c.y), ImVec2(c.x, c.y + r), ImVec2(c.x - r, c.y), IM_COL32(0, 0, 0, 160));
}

} // namespace

std::string note_label(const Keyboard& kb, int degree, int period) {
    (void)kb;
    std::string s = "degree " + std::to_string(degree);
    if (period != 0) s += " (" + std::string(period > 0 ? "+" : "") + std::to_string(period) + " period" + (std::abs(period) == 1 ? "" : "s") + ")";
    return s;
}

void draw_lattice_view(App& app) {
    ImDrawList* dl = ImGui::GetWindowDrawList();
    ImVec2 p0 = ImGui::GetCursorScreenPos();
    ImVec2 size = ImGui::GetContentRegionAvail();
    if (size.x < 50 || size.y < 50) return;
    app.lattice_rect[0] = p0.x;
    app.lattice_rect[1] = p0.y;
    app.lattice_rect[2] = size.x;
    app.lattice_rect[3] = size.y;
    ImGui::InvisibleButton("lattice_canvas", size, ImGuiButtonFlags_MouseButtonLeft | ImGuiButtonFlags_MouseButtonRight | ImGuiButtonFlags_MouseButtonMiddle);
    const bool hovered = ImGui::IsItemHovered();
    ImGuiIO& io = ImGui::GetIO();
    LatticeCamera& cam = app.camera;
    if (ImGui::IsItemActive() && (ImGui::IsMouseDragging(ImGuiMouseButton_Left, 3.0f) || ImGui::IsMouseDragging(ImGuiMouseButton_Right, 1.0f) || ImGui::IsMouseDragging(ImGuiMouseButton_Middle, 1.0f))) {
        cam.pan_x += io.MouseDelta.x;
        cam.pan_y += io.MouseDelta.y;
    }
    if (hovered && io.MouseWheel != 0.0f) cam.zoom = std::clamp(cam.zoom * std::pow(1.15f, io.MouseWheel), 0.25f, 4.0f);

    const ImVec2 p1(p0.x + size.x, p0.y + size.y);
    dl->PushClipRect(p0, p1, true);
    add_clear_fill(dl, canvas_colour);
    const SessionTuning* tuning = current_tuning(app);
    const Analysis& a = app.analysis;
    if (!tuning || !a.keyboard) {
        dl->AddText(ImVec2(p0.x + 20, p0.y + 20), IM_COL32(220, 220, 220, 255), tuning ? a.error.c_str() : "No tuning open: File > Open tuning... (Ctrl+O)");
        dl->PopClipRect();
        return;
    }
    const Keyboard& kb = *a.keyboard;
    const double tol = app.session.settings.landing_tolerance_cents;
    const auto& places = a.degree_places;

    // Framing: the placed degrees fit between the legend and the bottom, never above zoom 1.
    if (cam.fit) {
        cam.fit = false;
        float x0 = 0, x1 = 0, y0 = 0, y1 = 0;
        bool off_row = false;
        for (const LatticePlace& pl : places) {
            if (pl.how == LatticeHow::none) {
                off_row = true;
                continue;
            }
            ImVec2 o = lattice_offset(pl.exponents);
            x0 = std::min(x0, o.x), x1 = std::max(x1, o.x), y0 = std::min(y0, o.y), y1 = std::max(y1, o.y);
        }
        const float top = 130.0f, bottom = off_row ? 150.0f : 60.0f, side = 60.0f;
        float zx = (size.x - 2 * side) / std::max(1.0f, x1 - x0), zy = (size.y - top - bottom) / std::max(1.0f, y1 - y0);
        cam.zoom = std::clamp(std::min(zx, zy), 0.3f, 1.0f);
        // Pan so the bounds' centre sits at the centre of the free area.
        float cx = (x0 + x1) * 0.5f * cam.zoom, cy = (y0 + y1) * 0.5f * cam.zoom;
        cam.pan_x = -cx;
        cam.pan_y = (top - bottom) * 0.5f - cy;
        // Keep the origin exactly where it was when everything already fits at zoom 1 around it.
        if (cam.zoom == 1.0f && -x0 <= size.x * 0.5f - side && x1 <= size.x * 0.5f - side &&
            -y0 <= size.y * 0.5f - top && y1 <= size.y * 0.5f - bottom) {
            cam.pan_x = 0;
            cam.pan_y = 0;
        }
    }
    const ImVec2 origin(p0.x + size.x * 0.5f + cam.pan_x, p0.y + size.y * 0.5f + cam.pan_y);
    auto at = [&](const std::array<int, 3>& e) {
        ImVec2 o = lattice_offset(e);
        return ImVec2(origin.x + o.x * cam.zoom, origin.y + o.y * cam.zoom);
    };

    // Faint lattice points around the origin show the grid the degrees sit on: 3-pixel squares,
    // two triangles each (a smoothed circle is about thirty, which software OpenGL feels).
    for (int e3 = -6; e3 <= 6; ++e3)
        for (int e5 = -3; e5 <= 3; ++e5) {
            const ImVec2 c = at({e3, e5, 0});
            const ImVec2 q(std::round(c.x) - 1.0f, std::round(c.y) - 1.0f);
            dl->AddRectFilled(q, ImVec2(q.x + 3.0f, q.y + 3.0f), IM_COL32(70, 75, 90, 255));
        }

    // Edges: one step of 3, 5 or 7 between two placed degrees.
    const ImU32 edge_col[3] = {IM_COL32(95, 110, 140, 255), IM_COL32(90, 140, 110, 255), IM_COL32(140, 100, 150, 255)};
    for (std::size_t i = 0; i < places.size(); ++i) {
        for (std::size_t j = i + 1; j < places.size(); ++j) {
            if (places[i].how == LatticeHow::none || places[j].how == LatticeHow::none) continue;
            int diff = 0, axis = -1;
            for (int k = 0; k < 3; ++k) {
                int d = std::abs(places[i].exponents[k] - places[j].exponents[k]);
                diff += d;
                if (d) axis = k;
            }
            if (diff == 1) dl->AddLine(at(places[i].exponents), at(places[j].exponents), edge_col[axis], 2.0f * std::max(cam.zoom, 0.6f));
        }
    }

    // Degrees: nodes. Several degrees at one point (e.g. two interpretations) stack downwards.
    const float r = std::max(9.0f, 17.0f * cam.zoom);
    std::map<std::array<int, 3>, int> stacked;
    std::vector<int> selected_degrees(kb.scale().size(), 0);
    const int n = static_cast<int>(kb.scale().size());
    for (int note : app.session.selection) selected_degrees[static_cast<std::size_t>(note % n)] = 1;
    int hovered_degree = -1;
    const float off_x = p0.x + 20;
    int off_count = 0;
    struct Label {
        ImVec2 centre;
        std::string text;
    };
    std::vector<Label> labels; // drawn last, over the resultant marks
    for (int i = 0; i < n; ++i) {
        const LatticePlace& pl = places[static_cast<std::size_t>(i)];
        ImVec2 c;
        if (pl.how == LatticeHow::none) {
            // The row of degrees off the lattice wraps upwards when it fills the width.
            const int per_row = std::max(1, static_cast<int>((size.x - 40) / (2 * r + 12)));
            const int k = off_count++;
            c = ImVec2(off_x + r + (k % per_row) * (2 * r + 12), p1.y - r - 36 - (k / per_row) * (2 * r + 30));
        } else {
            int k = stacked[pl.exponents]++;
            c = at(pl.exponents);
            c.y += k * (2 * r + 16);
        }
        bool sel = selected_degrees[static_cast<std::size_t>(i)] != 0;
        dl->AddCircleFilled(c, r, sel ? node_selected_colour : node_colour, 32);
        if (pl.how == LatticeHow::nearest) dl->AddCircle(c, r + 3, IM_COL32(200, 200, 210, 200), 32, 1.5f);
        std::string idx = std::to_string(i);
        ImVec2 ts = ImGui::CalcTextSize(idx.c_str());
        dl->AddText(ImVec2(c.x - ts.x * 0.5f, c.y - ts.y * 0.5f), IM_COL32(255, 255, 255, 255), idx.c_str());
        const Pitch& p = kb.scale().degree(static_cast<std::size_t>(i));
        labels.push_back({c, p.is_rational() ? p.str() : (pl.how == LatticeHow::none ? fixed(p.cents(), 0) : "\xe2\x89\x88" + pl.just.str())});
        ImVec2 m = io.MousePos;
        if (hovered && (m.x - c.x) * (m.x - c.x) + (m.y - c.y) * (m.y - c.y) <= r * r) hovered_degree = i;
    }
    if (off_count > 0) {
        const int per_row = std::max(1, static_cast<int>((size.x - 40) / (2 * r + 12)));
        const int rows = (off_count + per_row - 1) / per_row;
        dl->AddText(ImVec2(p0.x + 20, p1.y - 2 * r - 62 - (rows - 1) * (2 * r + 30)), IM_COL32(180, 180, 190, 255),
                    "off the lattice (no 7-limit ratio within the lattice tolerance):");
    }

    // Resultant marks: on a ring around their lattice point, coloured by landing deviation.
    // The worst landings come first; a point shows at most 12 marks and counts the rest.
    struct Mark {
        const Tone* tone;
        const LatticePlace* place;
        const DyadTones* dyad;
    };
    std::map<std::array<int, 3>, std::vector<Mark>> marks;
    int unplaced = 0;
    for (std::size_t d = 0; d < a.selection_tones.size(); ++d) {
        const auto& dyad = a.selection_tones[d];
        for (std::size_t t = 0; t < dyad.tones.size(); ++t) {
            const LatticePlace& pl = a.tone_places[d][t];
            if (pl.how == LatticeHow::none) ++unplaced;
            else marks[pl.exponents].push_back({&dyad.tones[t], &pl, &dyad});
        }
    }
    const Tone* hovered_tone = nullptr;
    const LatticePlace* hovered_place = nullptr;
    const DyadTones* hovered_dyad = nullptr;
    const std::size_t shown_max = 12;
    for (auto& [exponents, list] : marks) {
        std::stable_sort(list.begin(), list.end(), [](const Mark& x, const Mark& y) {
            auto key = [](const Mark& m) { return m.tone->landing.exact ? -1.0 : std::abs(m.tone->landing.deviation_cents); };
            return key(x) > key(y);
        });
        ImVec2 c0 = at(exponents);
        const float rr = r + 11.0f;
        for (std::size_t k = 0; k < list.size() && k < shown_max; ++k) {
            const Tone& tone = *list[k].tone;
            float ang = -1.5708f + 0.5236f * static_cast<float>(k); // 30 degrees apart, from the top
            ImVec2 c(c0.x + std::cos(ang) * rr, c0.y + std::sin(ang) * rr);
            double dev = tone.landing.deviation_cents;
            ImU32 col = deviation_colour(std::abs(dev), tone.landing.exact, tol);
            float mr = std::max(4.0f, 5.5f * cam.zoom);
            if (tone.landing.exact || std::abs(dev) <= tol) diamond(dl, c, mr, col);
            else triangle(dl, c, mr, dev > 0, col);
            ImVec2 m = io.MousePos;
            if (hovered && std::abs(m.x - c.x) <= mr + 1 && std::abs(m.y - c.y) <= mr + 1) {
                hovered_tone = &tone;
                hovered_place = list[k].place;
                hovered_dyad = list[k].dyad;
            }
        }
        if (list.size() > shown_max) {
            std::string more = "+" + std::to_string(list.size() - shown_max);
            dl->AddText(ImVec2(c0.x + rr + 8, c0.y - rr - 8), IM_COL32(200, 200, 210, 255), more.c_str());
        }
    }
    for (const Label& l : labels) {
        ImVec2 ls = ImGui::CalcTextSize(l.text.c_str());
        ImVec2 q(l.centre.x - ls.x * 0.5f, l.centre.y + r + 13);
        dl->AddRectFilled(ImVec2(q.x - 3, q.y - 1), ImVec2(q.x + ls.x + 3, q.y + ls.y + 1), IM_COL32(22, 24, 30, 220), 3.0f);
        dl->AddText(q, IM_COL32(235, 238, 245, 255), l.text.c_str());
    }

    // Legend and axis key.
    float lh = draw_deviation_legend(dl, ImVec2(p0.x + 14, p0.y + 12), tol, true);
    const ImU32 key_col = IM_COL32(200, 205, 215, 255);
    float kx = p1.x - 232, ky = p0.y + 12;
    dl->AddRectFilled(ImVec2(kx - 8, ky - 4), ImVec2(p1.x - 6, ky + ImGui::GetTextLineHeight() * 4.2f), IM_COL32(10, 12, 16, 210), 4.0f);
    dl->AddText(ImVec2(kx, ky), key_col, "octave-equivalent lattice");
    dl->AddText(ImVec2(kx, ky + ImGui::GetTextLineHeight()), edge_col[0], "\xe2\x86\x92 \xc3\x97" "3/2 (fifth)");
    dl->AddText(ImVec2(kx, ky + ImGui::GetTextLineHeight() * 2), edge_col[1], "\xe2\x86\x91 \xc3\x97" "5/4 (major third)");
    dl->AddText(ImVec2(kx, ky + ImGui::GetTextLineHeight() * 3), edge_col[2], "\xe2\x86\x97 \xc3\x97" "7/4 (harmonic seventh)");
    if (a.selection_tones.empty())
        dl->AddText(ImVec2(p0.x + 14, p0.y + 18 + lh), IM_COL32(200, 200, 120, 255), "Click two or more degrees (or keys below) to see their resultants.");
    else if (unplaced > 0)
        dl->AddText(ImVec2(p0.x + 14, p0.y + 18 + lh), IM_COL32(180, 180, 190, 255), (std::to_string(unplaced) + " resultants have no 7-limit place; see the list at the right").c_str());
    dl->PopClipRect();

    // Hover and click.
    if (hovered_tone) {
        const Tone& t = *hovered_tone;
        ImGui::BeginTooltip();
        ImGui::Text("%s (%d, %d)", t.term.name().c_str(), t.term.a, t.term.b);
        if (t.low_partial != 1 || t.high_partial != 1) ImGui::Text("between partials %d and %d", t.low_partial, t.high_partial);
        ImGui::Text("of %s and %s", note_label(kb, hovered_dyad->low.degree, hovered_dyad->low.period).c_str(), note_label(kb, hovered_dyad->high.degree, hovered_dyad->high.period).c_str());
        auto exact = exact_value(*hovered_dyad, t);
        ImGui::Text("ratio to degree 0: %s", exact ? exact->str().c_str() : ("~" + fixed(t.cents, 3) + " c").c_str());
        ImGui::Text("%s Hz", fixed(t.hz, 3).c_str());
        ImGui::Text("lands on %s: %s", note_label(kb, t.landing.degree, t.landing.period).c_str(), t.landing.exact ? "exactly" : (signed_fixed(t.landing.deviation_cents, 3) + " c").c_str());
        ImGui::TextDisabled("%s", place_text(*hovered_place).c_str());
        ImGui::EndTooltip();
    } else if (hovered_degree >= 0) {
        const Pitch& p = kb.scale().degree(static_cast<std::size_t>(hovered_degree));
        const Note note = kb.note(hovered_degree, 0);
        ImGui::BeginTooltip();
        ImGui::Text("degree %d: %s", hovered_degree, p.is_exact() ? p.str().c_str() : "cents only");
        ImGui::Text("%s c, %s Hz in the lowest period", fixed(p.cents(), 3).c_str(), fixed(note.hz, 3).c_str());
        ImGui::TextDisabled("%s", place_text(places[static_cast<std::size_t>(hovered_degree)]).c_str());
        ImGui::TextDisabled("click to select or unselect");
        ImGui::EndTooltip();
        ImVec2 from = io.MouseClickedPos[0];
        bool still = std::abs(io.MousePos.x - from.x) < 4 && std::abs(io.MousePos.y - from.y) < 4; // a click, not a drag
        if (ImGui::IsMouseReleased(ImGuiMouseButton_Left) && still)
            toggle_note(app, hovered_degree);
    }
}

} // namespace terzo::gui
