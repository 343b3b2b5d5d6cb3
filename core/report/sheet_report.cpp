#include "core/report/sheet_report.hpp"

#include <algorithm>
#include <cmath>

#include "core/format.hpp"
#include "core/report/scale_report.hpp"

namespace terzo {

const char* const tuning_advice =
    "These are numbers, not permission: follow the instrument maker's and the owner's guidance on "
    "pitch and string tension, and local practice, before tuning.";

std::string beat_cell(const Beat& b, int decimals) {
    if (b.tempering == Tempering::pure) return "pure";
    return fixed(b.hz, decimals) + " " + tempering_name(b.tempering);
}

namespace {

using A = Table::Align;

std::string name(const NoteName& n, const Sheet& s) {
    return note_text(n, s.options.spelling);
}

const SheetInterval* rising_from(const Sheet& s, const NoteName& low, const CheckedInterval& kind) {
    for (const SheetInterval& i : s.intervals)
        if (i.kind == &kind && i.low == low) return &i;
    return nullptr;
}

std::string short_name(const CheckedInterval& k) {
    if (k.name == "fifth") return "5th";
    if (k.name == "fourth") return "4th";
    if (k.name == "major third") return "M3";
    if (k.name == "minor third") return "m3";
    return "M6";
}

std::string step_to_cell(const TuningStep& st, const Sheet& s) {
    return name(st.to, s);
}

} // namespace

Table sheet_notes_table(const Sheet& s) {
    Table t;
    t.header = {"note", "degree", "Hz", "vs 12-TET"};
    t.align = {A::left, A::right, A::right, A::right};
    for (const auto& k : checked_intervals()) {
        t.header.push_back(short_name(k) + " up");
        t.align.push_back(A::right);
    }
    for (const SheetNote& n : s.notes) {
        std::vector<std::string> row = {name(n.note, s), std::to_string(n.degree), fixed(n.hz, 3),
                                        signed_fixed(n.offset, 2)};
        for (const auto& k : checked_intervals()) {
            const SheetInterval* i = rising_from(s, n.note, k);
            row.push_back(i ? beat_cell(i->beat) : "");
        }
        t.add(std::move(row));
    }
    return t;
}

Table sheet_intervals_table(const Sheet& s) {
    Table t;
    t.header = {"interval", "low",         "high",    "low Hz",
                "high Hz",  "vs pure (c)", "beats/s", "tempering"};
    t.align = {A::left, A::left, A::left, A::right, A::right, A::right, A::right, A::left};
    for (const SheetInterval& i : s.intervals)
        t.add({i.kind->name, name(i.low, s), name(i.high, s), fixed(i.low_hz, 3),
               fixed(i.high_hz, 3), signed_fixed(i.beat.cents, 3), fixed(i.beat.hz, 3),
               tempering_name(i.beat.tempering)});
    return t;
}

Table sheet_order_table(const Sheet& s) {
    Table t;
    t.header = {"step", "tune", "from", "by", "Hz", "beats/s", "tempering"};
    t.align = {A::right, A::left, A::left, A::left, A::right, A::right, A::left};
    int n = 0;
    for (const TuningStep& st : s.order) {
        ++n;
        if (st.kind == TuningStep::Kind::reference) {
            // The reference note itself, or (with another start note) that note's frequency.
            t.add({std::to_string(n), step_to_cell(st, s),
                   st.to == s.options.reference.note ? "reference" : "its Hz", "-",
                   fixed(st.to_hz, 3), "", ""});
            continue;
        }
        t.add({std::to_string(n), step_to_cell(st, s), name(*st.from, s), step_name(st.kind),
               fixed(st.to_hz, 3), fixed(st.beat.hz, 2), tempering_name(st.beat.tempering)});
    }
    return t;
}

Table sheet_circle_table(const Sheet& s) {
    Table t;
    t.header = {"fifth", "vs pure (c)", "beats/s (octave 4)", "tempering"};
    t.align = {A::left, A::right, A::right, A::left};
    for (const CircleFifth& f : s.circle)
        t.add({pitch_class_name(f.from, s.options.spelling) + "-" +
                   pitch_class_name((f.from + 7) % 12, s.options.spelling),
               signed_fixed(f.beat.cents, 3), fixed(f.beat.hz, 3),
               tempering_name(f.beat.tempering)});
    return t;
}

nlohmann::ordered_json sheet_json(const Sheet& s) {
    using J = nlohmann::ordered_json;
    auto note = [&](const NoteName& n) { return J(name(n, s)); };
    auto beat_json = [](const Beat& b) {
        return J{{"deviation_cents", b.cents},
                 {"beats_per_second", b.hz},
                 {"tempering", tempering_name(b.tempering)},
                 {"exact", b.exact}};
    };
    J notes = J::array(), intervals = J::array(), order = J::array(), circle = J::array();
    for (const SheetNote& n : s.notes) {
        J j = {{"note", name(n.note, s)},
               {"midi_key", midi_key(n.note)},
               {"degree", n.degree},
               {"hz", n.hz},
               {"offset_cents", n.offset}};
        j["position"] = pitch_json(n.position);
        notes.push_back(std::move(j));
    }
    for (const SheetInterval& i : s.intervals) {
        J j = {{"interval", i.kind->name}, {"pure", i.kind->pure().str()}, {"low", note(i.low)},
               {"high", note(i.high)},     {"low_hz", i.low_hz},           {"high_hz", i.high_hz},
               {"cents", i.size.cents()}};
        j.update(beat_json(i.beat));
        intervals.push_back(std::move(j));
    }
    int step = 0;
    for (const TuningStep& st : s.order) {
        J j = {
            {"step", ++step}, {"kind", step_name(st.kind)}, {"to", note(st.to)}, {"hz", st.to_hz}};
        if (st.kind == TuningStep::Kind::reference) {
            j["from"] = nullptr;
            j["deviation_cents"] = nullptr;
            j["beats_per_second"] = nullptr;
            j["tempering"] = nullptr;
            j["exact"] = nullptr;
        } else {
            j["from"] = note(*st.from);
            j.update(beat_json(st.beat));
        }
        order.push_back(std::move(j));
    }
    for (const CircleFifth& f : s.circle) {
        J j = {{"from", pitch_class_name(f.from, s.options.spelling)},
               {"to", pitch_class_name((f.from + 7) % 12, s.options.spelling)}};
        j.update(beat_json(f.beat));
        circle.push_back(std::move(j));
    }
    return J{{"description", s.description},
             {"reference",
              {{"note", name(s.options.reference.note, s)}, {"hz", s.options.reference.hz}}},
             {"tonic", pitch_class_name(s.options.tonic, s.options.spelling)},
             {"range", {{"low", note(s.options.low)}, {"high", note(s.options.high)}}},
             {"notes", std::move(notes)},
             {"intervals", std::move(intervals)},
             {"order", std::move(order)},
             {"circle_of_fifths", std::move(circle)},
             {"advice", tuning_advice}};
}

void draw_fifth_circle(Svg& svg, const std::vector<CircleFifth>& circle, double cx, double cy,
                       double r, Spelling spelling, double font_size) {
    TERZO_ASSERT(circle.size() == 12);
    svg.begin_group("circle of fifths: colour shows tempering, numbers are cents from 3/2");
    svg.circle(cx, cy, r, {"", "#ddd", r / 100});
    for (std::size_t i = 0; i < 12; ++i) {
        const CircleFifth& f = circle[i];
        double a1 = 30.0 * static_cast<double>(i), a2 = a1 + 30.0, mid = a1 + 15.0;
        double dev = std::fabs(f.beat.cents);
        std::string colour = f.beat.tempering == Tempering::pure     ? "#8a8a8a"
                             : f.beat.tempering == Tempering::narrow ? "#1f5fa8"
                                                                     : "#b8322a";
        // Thickness grows with the deviation up to a Pythagorean comma (23.46 c).
        double width = r * (0.015 + 0.10 * std::min(dev / 23.460010, 1.0));
        svg.begin_group(pitch_class_name(f.from, spelling) + "-" +
                        pitch_class_name((f.from + 7) % 12, spelling) + ": " +
                        signed_fixed(f.beat.cents, 3) + " c, " + tempering_name(f.beat.tempering));
        svg.arc(cx, cy, r, a1 + 2, a2 - 2, {"", colour, width});
        const double pi = 3.14159265358979323846;
        double tx = cx + 0.72 * r * std::sin(mid * pi / 180),
               ty = cy - 0.72 * r * std::cos(mid * pi / 180);
        SvgFont small{font_size * 0.8, SvgFont::Anchor::middle, false, colour};
        svg.text(tx, ty + font_size * 0.3,
                 f.beat.tempering == Tempering::pure ? "0" : signed_fixed(f.beat.cents, 1), small);
        svg.end_group();
        double lx = cx + 1.17 * r * std::sin(a1 * pi / 180),
               ly = cy - 1.17 * r * std::cos(a1 * pi / 180);
        svg.text(lx, ly + font_size * 0.35, pitch_class_name(f.from, spelling),
                 {font_size, SvgFont::Anchor::middle, true, "#000"});
    }
    svg.end_group();
}

namespace {

// Draws a table with the given column widths; returns the y below it.
double draw_table(Svg& svg, const Table& t, const std::vector<double>& widths, double x, double y,
                  double row_h, double font) {
    double total = 0;
    for (double w : widths)
        total += w;
    auto row = [&](const std::vector<std::string>& cells, bool bold, double yy) {
        double cx = x;
        for (std::size_t i = 0; i < cells.size(); ++i) {
            bool right = i < t.align.size() && t.align[i] == Table::Align::right;
            SvgFont f{font, right ? SvgFont::Anchor::end : SvgFont::Anchor::start, bold, "#000"};
            svg.text(right ? cx + widths[i] - 1.0 : cx + 0.5, yy, cells[i], f);
            cx += widths[i];
        }
    };
    row(t.header, true, y + row_h * 0.72);
    svg.line(x, y + row_h, x + total, y + row_h, {"", "#000", 0.25});
    double yy = y + row_h;
    bool shade = false;
    for (const auto& r : t.rows) {
        if (shade) svg.rect(x, yy, total, row_h, {"#f0f0f0", "", 0});
        shade = !shade;
        row(r, false, yy + row_h * 0.72);
        yy += row_h;
    }
    svg.line(x, yy, x + total, yy, {"", "#000", 0.25});
    return yy;
}

} // namespace

namespace {

// Cuts text to what fits in `width` mm at `font` mm, at about 0.55 em per character (a
// sans-serif average), ending in "..." when cut; never splits a UTF-8 sequence.
std::string fit_line(const std::string& text, double width, double font) {
    std::size_t max_chars = static_cast<std::size_t>(width / (font * 0.55));
    std::size_t chars = 0, i = 0;
    for (; i < text.size(); ++i) {
        if ((static_cast<unsigned char>(text[i]) & 0xC0) == 0x80) continue;
        if (++chars > max_chars) break;
    }
    if (i >= text.size()) return text;
    std::size_t cut = i;
    for (int k = 0; k < 3 && cut > 0; ++k) {
        do
            --cut;
        while (cut > 0 && (static_cast<unsigned char>(text[cut]) & 0xC0) == 0x80);
    }
    return text.substr(0, cut) + "...";
}

} // namespace

std::string sheet_svg(const Sheet& s, const Paper& paper) {
    const double margin = 12, row_h = 3.8, font = 2.7;
    Table notes = sheet_notes_table(s), order = sheet_order_table(s);
    // Page plan: header, the notes table across the page, then the order table on the left
    // and the circle of fifths on the right, then the advice.
    const double header_h = 24, gap = 8, circle_block = 75, footer_h = 18;
    auto height_for = [&](std::size_t note_rows, std::size_t order_rows) {
        return margin + header_h + static_cast<double>(note_rows + 1) * row_h + gap +
               std::max(static_cast<double>(order_rows + 1) * row_h, circle_block) + footer_h +
               margin;
    };
    if (height_for(notes.rows.size(), order.rows.size()) > paper.height_mm) {
        // An order has at most two more steps than the range has notes (reference, octaves to it).
        std::size_t fits = 13;
        while (height_for(fits + 1, fits + 3) <= paper.height_mm)
            ++fits;
        fail({"--svg", 0, 0},
             "the range " + note_text(s.options.low) + ".." + note_text(s.options.high) + " (" +
                 std::to_string(notes.rows.size()) + " notes) does not fit on one " + paper.name +
                 " page, which holds " + std::to_string(fits) + " notes; give a smaller --range");
    }
    Svg svg(paper.width_mm, paper.height_mm, "mm", "Tuner's sheet: " + s.description);
    double x = margin, y = margin + 5;
    double usable = paper.width_mm - 2 * margin;
    svg.text(x, y, "Tuner's sheet", {5.0, SvgFont::Anchor::start, true, "#000"});
    y += 5.5;
    svg.text(x, y, fit_line(s.description, usable, 3.4),
             {3.4, SvgFont::Anchor::start, true, "#000"});
    y += 5;
    svg.text(x, y,
             "Reference " + note_text(s.options.reference.note, s.options.spelling) + " = " +
                 fixed(s.options.reference.hz, 3) + " Hz. Degree 0 on " +
                 pitch_class_name(s.options.tonic, s.options.spelling) + ". Range " +
                 note_text(s.options.low, s.options.spelling) + ".." +
                 note_text(s.options.high, s.options.spelling) +
                 ". Beats per second of the interval rising from each note.",
             {3.0, SvgFont::Anchor::start, false, "#000"});
    y += 5;
    svg.text(x, y, "\"vs 12-TET\": cents from equal temperament at the same reference.",
             {2.6, SvgFont::Anchor::start, false, "#444"});
    y = margin + header_h;
    std::vector<double> nw = {14, 13, 21, 19};
    double rest = (usable - 67) / 5;
    for (int i = 0; i < 5; ++i)
        nw.push_back(rest);
    y = draw_table(svg, notes, nw, x, y, row_h, font) + 8;
    svg.text(x, y - 2, "Tuning order", {3.4, SvgFont::Anchor::start, true, "#000"});
    std::vector<double> ow = {9, 12, 17, 22, 19, 14, 17};
    double order_bottom = draw_table(svg, order, ow, x, y, row_h, font);
    double cx = margin + 110 + (usable - 110) / 2, cy = y + 34;
    svg.text(cx, y - 2, "Fifths: cents from 3/2", {3.4, SvgFont::Anchor::middle, true, "#000"});
    draw_fifth_circle(svg, s.circle, cx, cy, 24, s.options.spelling, 3.0);
    svg.text(cx, cy + 37, "blue narrow, red wide, grey pure",
             {2.5, SvgFont::Anchor::middle, false, "#444"});
    double fy = std::max(order_bottom, cy + 40) + 8;
    // Wrap the advice at about half an em per character, which suits the sans-serif faces.
    std::string advice = tuning_advice, line;
    std::size_t per_line = static_cast<std::size_t>(usable / (2.6 * 0.52));
    for (std::size_t pos = 0; pos < advice.size();) {
        std::size_t end = std::min(advice.size(), pos + per_line);
        if (end < advice.size()) end = advice.rfind(' ', end);
        svg.text(x, fy, advice.substr(pos, end - pos),
                 {2.6, SvgFont::Anchor::start, false, "#000"});
        fy += 3.6;
        pos = end + 1;
    }
    svg.text(x, fy + 1, "Beat rate of an interval near p/q: |q f_high - p f_low|. Made with terzo.",
             {2.4, SvgFont::Anchor::start, false, "#444"});
    return svg.str();
}

} // namespace terzo
