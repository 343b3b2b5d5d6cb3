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

/// Rows of degrees off the lattice shown along the bottom; more are counted, not drawn.
constexpr int off_rows_max = 2;

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
        // Room at the bottom for the rows of degrees off the lattice (at zoom 1, the largest).
        int off = 0;
        for (const LatticePlace& pl : places) off += pl.how == LatticeHow::none ? 1 : 0;
        const int off_per_row = std::max(1, static_cast<int>((size.x - 40) / (2 * 17.0f + 12)));
        const int off_rows = std::min(off_rows_max, (off + off_per_row - 1) / off_per_row);
        const float top = 130.0f, bottom = off_row ? 100.0f + static_cast<float>(off_rows) * (2 * 17.0f + 30) : 60.0f, side = 60.0f;
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

    // The degrees by lattice point. A big tuning puts many degrees near one just ratio (4096
    // equal steps put about 140 within 20 c of 3/2): up to stack_max stack downwards as
    // separate nodes; more become one node that counts them.
    const int n = static_cast<int>(kb.scale().size());
    std::map<std::array<int, 3>, std::vector<int>> at_point;
    std::vector<int> off_lattice;
    for (int i = 0; i < n; ++i) {
        const LatticePlace& pl = places[static_cast<std::size_t>(i)];
        if (pl.how == LatticeHow::none) off_lattice.push_back(i);
        else at_point[pl.exponents].push_back(i);
    }
    const std::size_t stack_max = 3;

    // Edges: one step of 3, 5 or 7 between two occupied points (each pair once: the step up).
    const ImU32 edge_col[3] = {IM_COL32(95, 110, 140, 255), IM_COL32(90, 140, 110, 255), IM_COL32(140, 100, 150, 255)};
    for (const auto& [e, degrees] : at_point) {
        for (int k = 0; k < 3; ++k) {
            std::array<int, 3> up = e;
            ++up[static_cast<std::size_t>(k)];
            if (at_point.count(up)) dl->AddLine(at(e), at(up), edge_col[k], 2.0f * std::max(cam.zoom, 0.6f));
        }
    }

    // Degrees: nodes.
    const float r = std::max(9.0f, 17.0f * cam.zoom);
    std::vector<char> selected_degrees(static_cast<std::size_t>(n), 0);
    for (int note : app.session.selection) selected_degrees[static_cast<std::size_t>(note % n)] = 1;
    int hovered_degree = -1;
    const std::vector<int>* hovered_group = nullptr; // a node that counts several degrees
    struct Label {
        ImVec2 centre;
        std::string text;
    };
    std::vector<Label> labels; // drawn last, over the resultant marks, where they fit
    const ImVec2 mouse = io.MousePos;
    auto under_mouse = [&](ImVec2 c) { return hovered && (mouse.x - c.x) * (mouse.x - c.x) + (mouse.y - c.y) * (mouse.y - c.y) <= r * r; };
    auto degree_label = [&](int i) {
        const LatticePlace& pl = places[static_cast<std::size_t>(i)];
        const Pitch& p = kb.scale().degree(static_cast<std::size_t>(i));
        return p.is_rational() ? p.str() : (pl.how == LatticeHow::none ? fixed(p.cents(), 0) : "\xe2\x89\x88" + pl.just.str());
    };
    auto draw_node = [&](ImVec2 c, int degree, bool nearest) {
        const bool sel = selected_degrees[static_cast<std::size_t>(degree)] != 0;
        dl->AddCircleFilled(c, r, sel ? node_selected_colour : node_colour, 32);
        if (nearest) dl->AddCircle(c, r + 3, IM_COL32(200, 200, 210, 200), 32, 1.5f);
        const std::string idx = std::to_string(degree);
        const ImVec2 ts = ImGui::CalcTextSize(idx.c_str());
        dl->AddText(ImVec2(c.x - ts.x * 0.5f, c.y - ts.y * 0.5f), IM_COL32(255, 255, 255, 255), idx.c_str());
        labels.push_back({c, degree_label(degree)});
        if (under_mouse(c)) hovered_degree = degree;
    };
    for (const auto& [e, degrees] : at_point) {
        const ImVec2 c0 = at(e);
        if (c0.x < p0.x - 3 * r || c0.x > p1.x + 3 * r || c0.y < p0.y - 3 * r || c0.y > p1.y + 3 * r) continue; // out of view
        if (degrees.size() <= stack_max) {
            for (std::size_t k = 0; k < degrees.size(); ++k) {
                const int i = degrees[k];
                draw_node(ImVec2(c0.x, c0.y + static_cast<float>(k) * (2 * r + 16)), i,
                          places[static_cast<std::size_t>(i)].how == LatticeHow::nearest);
            }
            continue;
        }
        // One node for the group: a double ring, the count inside, selected when any of its
        // degrees is; the label names the just ratio and the degrees' range.
        bool sel = false;
        for (int i : degrees) sel = sel || selected_degrees[static_cast<std::size_t>(i)] != 0;
        dl->AddCircleFilled(c0, r, sel ? node_selected_colour : node_colour, 32);
        dl->AddCircle(c0, r + 3, IM_COL32(200, 200, 210, 200), 32, 1.5f);
        dl->AddCircle(c0, r + 6, IM_COL32(200, 200, 210, 140), 32, 1.5f);
        const std::string count = "\xc3\x97" + std::to_string(degrees.size());
        const ImVec2 ts = ImGui::CalcTextSize(count.c_str());
        dl->AddText(ImVec2(c0.x - ts.x * 0.5f, c0.y - ts.y * 0.5f), IM_COL32(255, 255, 255, 255), count.c_str());
        const LatticePlace& pl = places[static_cast<std::size_t>(degrees.front())];
        labels.push_back({c0, (pl.how == LatticeHow::exact ? "" : "\xe2\x89\x88") + pl.just.str()});
        if (under_mouse(c0)) hovered_group = &degrees;
    }
    // The degrees off the lattice: a row along the bottom that wraps upwards, at most
    // off_rows_max rows; the rest are counted.
    const int per_row = std::max(1, static_cast<int>((size.x - 40) / (2 * r + 12)));
    const int off_shown = std::min(static_cast<int>(off_lattice.size()), per_row * off_rows_max);
    for (int k = 0; k < off_shown; ++k)
        draw_node(ImVec2(p0.x + 20 + r + (k % per_row) * (2 * r + 12), p1.y - r - 36 - (k / per_row) * (2 * r + 30)), off_lattice[static_cast<std::size_t>(k)], false);
    if (!off_lattice.empty()) {
        const int rows = (off_shown + per_row - 1) / per_row;
        std::string title = "off the lattice (no 7-limit ratio within the lattice tolerance):";
        if (off_shown < static_cast<int>(off_lattice.size()))
            title = std::to_string(off_lattice.size()) + " degrees off the lattice (no 7-limit ratio within the lattice tolerance); the first " +
                    std::to_string(off_shown) + ":";
        dl->AddText(ImVec2(p0.x + 20, p1.y - 2 * r - 62 - (rows - 1) * (2 * r + 30)), IM_COL32(180, 180, 190, 255), title.c_str());
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
        for (std::size_t t = 0; t < a.tone_places[d].size(); ++t) {
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
    // Labels only where they fit: one that would cover a node or a label already placed is
    // left out (its node's tooltip still tells).
    std::vector<ImVec4> placed;
    for (const Label& l : labels) placed.emplace_back(l.centre.x - r, l.centre.y - r, l.centre.x + r, l.centre.y + r); // the nodes
    for (const Label& l : labels) {
        const ImVec2 ls = ImGui::CalcTextSize(l.text.c_str());
        const ImVec2 q(l.centre.x - ls.x * 0.5f, l.centre.y + r + 13);
        const ImVec4 box(q.x - 3, q.y - 1, q.x + ls.x + 3, q.y + ls.y + 1);
        if (box.z < p0.x || box.x > p1.x || box.w < p0.y || box.y > p1.y) continue;
        bool clash = false;
        for (const ImVec4& b : placed) clash = clash || (box.x < b.z && b.x < box.z && box.y < b.w && b.y < box.w);
        if (clash) continue;
        placed.push_back(box);
        dl->AddRectFilled(ImVec2(box.x, box.y), ImVec2(box.z, box.w), IM_COL32(22, 24, 30, 220), 3.0f);
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
    else if (a.tones_not_placed > 0)
        dl->AddText(ImVec2(p0.x + 14, p0.y + 18 + lh), IM_COL32(180, 180, 190, 255),
                    ("the first " + std::to_string(max_placed_tones) + " resultants are placed; " + std::to_string(a.tones_not_placed) +
                     " more are listed at the right").c_str());
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
    } else if (hovered_group) {
        const std::vector<int>& g = *hovered_group;
        ImGui::BeginTooltip();
        double lo = 0, hi = 0;
        for (int i : g) {
            lo = std::min(lo, places[static_cast<std::size_t>(i)].deviation_cents);
            hi = std::max(hi, places[static_cast<std::size_t>(i)].deviation_cents);
        }
        ImGui::Text("%zu degrees near %s", g.size(), places[static_cast<std::size_t>(g.front())].just.str().c_str());
        ImGui::Text("from %s c to %s c from it", signed_fixed(lo, 3).c_str(), signed_fixed(hi, 3).c_str());
        ImGui::TextDisabled("select single degrees with the keyboard strip below");
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
