#include "core/report/compare_report.hpp"
#include "core/report/palette.hpp"

#include <algorithm>
#include <cmath>

#include "core/format.hpp"
#include "core/report/scale_report.hpp"
#include "core/report/sheet_report.hpp"

namespace terzo {

namespace {

using A = Table::Align;
using J = nlohmann::ordered_json;

bool has_fit(const KeyComparison& c) {
    return std::any_of(c.keys.begin(), c.keys.end(),
                       [](const KeyReport& k) { return k.fit.has_value(); });
}

std::string notes_of(const KeyReport& k, Spelling s) {
    return note_text(k.root, s) + " " + note_text(k.third, s) + " " + note_text(k.fifth, s);
}

std::string wolf_label(const Wolf& w, Spelling s) {
    int span = w.interval == "fifth" ? 7 : w.interval == "major third" ? 4 : 3;
    return pitch_class_name(w.from, s) + "-" + pitch_class_name((w.from + span) % 12, s);
}

J beat_json(const Beat& b) {
    return J{{"deviation_cents", b.cents},
             {"beats_per_second", b.hz},
             {"tempering", tempering_name(b.tempering)},
             {"exact", b.exact}};
}

} // namespace

Table key_table(const KeyComparison& c, Spelling spelling) {
    Table t;
    t.header = {"key", "notes", "5th (c)", "5th beats", "M3 (c)", "M3 beats", "m3 (c)", "m3 beats"};
    t.align = {A::left, A::left, A::right, A::right, A::right, A::right, A::right, A::right};
    bool fits = has_fit(c);
    if (fits) {
        t.header.push_back("fit (c)");
        t.align.push_back(A::right);
    }
    for (const KeyReport& k : c.keys) {
        std::vector<std::string> row = {key_name(k.key, spelling),
                                        notes_of(k, spelling),
                                        signed_fixed(k.fifth_beat.cents, 3),
                                        fixed(k.fifth_beat.hz, 2),
                                        signed_fixed(k.major_third.cents, 3),
                                        fixed(k.major_third.hz, 2),
                                        signed_fixed(k.minor_third.cents, 3),
                                        fixed(k.minor_third.hz, 2)};
        if (fits) row.push_back(k.fit ? fixed(*k.fit, 3) : "");
        t.add(std::move(row));
    }
    return t;
}

Table keys_long_table(const std::vector<ComparedTuning>& tunings, Spelling spelling) {
    Table t;
    t.header = {"tuning",
                "key",
                "root",
                "third",
                "fifth",
                "fifth_cents",
                "fifth_beats",
                "fifth_tempering",
                "major_third_cents",
                "major_third_beats",
                "major_third_tempering",
                "minor_third_cents",
                "minor_third_beats",
                "minor_third_tempering",
                "fit_cents"};
    for (const ComparedTuning& tu : tunings) {
        if (!tu.keys) continue;
        for (const KeyReport& k : tu.keys->keys)
            t.add({tu.name, key_name(k.key, spelling), note_text(k.root, spelling),
                   note_text(k.third, spelling), note_text(k.fifth, spelling),
                   fixed(k.fifth_beat.cents, 6), fixed(k.fifth_beat.hz, 6),
                   tempering_name(k.fifth_beat.tempering), fixed(k.major_third.cents, 6),
                   fixed(k.major_third.hz, 6), tempering_name(k.major_third.tempering),
                   fixed(k.minor_third.cents, 6), fixed(k.minor_third.hz, 6),
                   tempering_name(k.minor_third.tempering), k.fit ? fixed(*k.fit, 6) : ""});
    }
    return t;
}

Table summary_table(const std::vector<ComparedTuning>& tunings) {
    Table t;
    t.header = {"tuning",   "5th mean",  "5th worst", "M3 mean", "M3 worst", "m3 mean",
                "m3 worst", "pure 5ths", "pure M3",   "wolves",  "mean fit"};
    t.align = {A::left};
    t.align.resize(t.header.size(), A::right);
    for (const ComparedTuning& tu : tunings) {
        if (!tu.keys) continue;
        const CompareSummary& s = tu.keys->summary;
        t.add({tu.name, fixed(s.mean_fifth, 3), fixed(s.worst_fifth, 3),
               fixed(s.mean_major_third, 3), fixed(s.worst_major_third, 3),
               fixed(s.mean_minor_third, 3), fixed(s.worst_minor_third, 3),
               std::to_string(s.pure_fifths), std::to_string(s.pure_major_thirds),
               std::to_string(s.wolves.size()), s.mean_fit ? fixed(*s.mean_fit, 3) : ""});
    }
    return t;
}

Table wolves_table(const std::vector<ComparedTuning>& tunings, Spelling spelling) {
    Table t;
    t.header = {"tuning", "interval", "notes", "vs pure (c)"};
    t.align = {A::left, A::left, A::left, A::right};
    for (const ComparedTuning& tu : tunings) {
        if (!tu.keys) continue;
        for (const Wolf& w : tu.keys->summary.wolves)
            t.add({tu.name, w.interval, wolf_label(w, spelling), signed_fixed(w.cents, 3)});
    }
    return t;
}

Table classes_table(const std::vector<ComparedTuning>& tunings) {
    Table t;
    t.header = {"tuning", "steps", "cents", "exact value", "count", "nearest", "vs nearest (c)"};
    t.align = {A::left, A::right, A::right, A::left, A::right, A::left, A::right};
    for (const ComparedTuning& tu : tunings)
        for (const IntervalClass& ic : tu.classes)
            for (const IntervalSize& s : ic.sizes)
                t.add({tu.name, std::to_string(ic.steps), fixed(s.size.cents(), 3),
                       s.size.is_exact() ? s.size.str() : "~ (cents only)", std::to_string(s.count),
                       s.nearest.str(), signed_fixed(s.deviation, 3)});
    return t;
}

J compare_json(const std::vector<ComparedTuning>& tunings, const CompareOptions& options,
               int odd_limit, Spelling spelling) {
    J weights = nullptr;
    if (options.weights) {
        weights = J::object();
        for (int i = 0; i < 24; ++i)
            weights[key_name(Key{i % 12, i >= 12}, spelling)] =
                options.weights->weight[static_cast<std::size_t>(i)];
    }
    J list = J::array();
    for (const ComparedTuning& tu : tunings) {
        J j = {{"name", tu.name}, {"description", tu.description}, {"size", tu.size}};
        if (tu.keys) {
            J keys = J::array();
            for (const KeyReport& k : tu.keys->keys)
                keys.push_back({{"key", key_name(k.key, spelling)},
                                {"notes",
                                 {note_text(k.root, spelling), note_text(k.third, spelling),
                                  note_text(k.fifth, spelling)}},
                                {"fifth", beat_json(k.fifth_beat)},
                                {"major_third", beat_json(k.major_third)},
                                {"minor_third", beat_json(k.minor_third)},
                                {"fit_cents", k.fit ? J(*k.fit) : J(nullptr)}});
            const CompareSummary& s = tu.keys->summary;
            J wolves = J::array();
            for (const Wolf& w : s.wolves)
                wolves.push_back({{"interval", w.interval},
                                  {"notes", wolf_label(w, spelling)},
                                  {"deviation_cents", w.cents}});
            J circle = J::array();
            for (const CircleFifth& f : tu.keys->circle) {
                J c = {{"from", pitch_class_name(f.from, spelling)},
                       {"to", pitch_class_name((f.from + 7) % 12, spelling)}};
                c.update(beat_json(f.beat));
                circle.push_back(std::move(c));
            }
            j["keys"] = std::move(keys);
            j["summary"] = {{"weighted", s.weighted},
                            {"mean_fifth_cents", s.mean_fifth},
                            {"worst_fifth_cents", s.worst_fifth},
                            {"mean_major_third_cents", s.mean_major_third},
                            {"worst_major_third_cents", s.worst_major_third},
                            {"mean_minor_third_cents", s.mean_minor_third},
                            {"worst_minor_third_cents", s.worst_minor_third},
                            {"pure_fifths", s.pure_fifths},
                            {"pure_major_thirds", s.pure_major_thirds},
                            {"pure_minor_thirds", s.pure_minor_thirds},
                            {"wolves", std::move(wolves)},
                            {"mean_fit_cents", s.mean_fit ? J(*s.mean_fit) : J(nullptr)}};
            j["circle_of_fifths"] = std::move(circle);
        } else {
            j["keys"] = nullptr;
            j["summary"] = nullptr;
            j["circle_of_fifths"] = nullptr;
        }
        J classes = J::array();
        for (const IntervalClass& ic : tu.classes) {
            J sizes = J::array();
            for (const IntervalSize& s : ic.sizes) {
                J z = pitch_json(s.size);
                z["count"] = s.count;
                z["nearest"] = s.nearest.str();
                z["deviation_cents"] = s.deviation;
                sizes.push_back(std::move(z));
            }
            classes.push_back({{"steps", ic.steps}, {"sizes", std::move(sizes)}});
        }
        j["interval_classes"] = std::move(classes);
        list.push_back(std::move(j));
    }
    return J{
        {"reference",
         {{"note", note_text(options.reference.note, spelling)}, {"hz", options.reference.hz}}},
        {"tonic", pitch_class_name(options.tonic, spelling)},
        {"octave", options.octave},
        {"odd_limit", odd_limit},
        {"fit_order", options.fit ? J(options.fit_order) : J(nullptr)},
        {"weights", std::move(weights)},
        {"wolf_thresholds", {{"fifth_cents", wolf_fifth_cents}, {"third_cents", wolf_third_cents}}},
        {"tunings", std::move(list)}};
}

namespace {

// One colour per tuning, of our own (core/report/palette.hpp): the first four stay apart for
// the common colour-vision deficiencies; every plot also names each tuning in its colour.
const std::vector<std::string>& palette() {
    static const std::vector<std::string> colours = [] {
        std::vector<std::string> out;
        for (const Rgb& c : series_colours(max_compared_tunings)) out.push_back(hex_colour(c));
        return out;
    }();
    return colours;
}

// Per-key bars: for each of the 12 keys in circle-of-fifths order, one bar per tuning of
// the given third's cents from pure. Returns the y below the plot.
double bar_plot(Svg& svg, const std::vector<const ComparedTuning*>& ts, bool minor, double x,
                double y, double w, double h, Spelling sp) {
    auto value = [&](const ComparedTuning* t, int root) {
        const KeyReport& k = t->keys->keys[static_cast<std::size_t>(root + (minor ? 12 : 0))];
        return minor ? k.minor_third.cents : k.major_third.cents;
    };
    double lo = 0, hi = 0;
    for (const auto* t : ts)
        for (int r = 0; r < 12; ++r) {
            lo = std::min(lo, value(t, r));
            hi = std::max(hi, value(t, r));
        }
    lo = std::floor(lo / 10.0 - 0.01) * 10;
    hi = std::ceil(hi / 10.0 + 0.01) * 10;
    const double left = 46, top = 22, bottom = 26;
    double px = x + left, pw = w - left - 10, py = y + top, ph = h - top - bottom;
    auto ypos = [&](double c) { return py + (hi - c) / (hi - lo) * ph; };
    svg.text(x, y + 14,
             minor ? "Minor thirds of the minor keys (root to third): cents from 6/5"
                   : "Major thirds of the major keys (root to third): cents from 5/4",
             {14, SvgFont::Anchor::start, true, "#000"});
    for (double g = lo; g <= hi + 1e-9; g += 10) {
        svg.line(px, ypos(g), px + pw, ypos(g), {"", g == 0 ? "#000" : "#ddd", g == 0 ? 1.2 : 0.6});
        svg.text(px - 6, ypos(g) + 4, signed_fixed(g, 0),
                 {11, SvgFont::Anchor::end, false, "#444"});
    }
    double group = pw / 12, bar = group * 0.8 / static_cast<double>(ts.size());
    for (int i = 0; i < 12; ++i) {
        int root = 7 * i % 12;
        double gx = px + group * i + group * 0.1;
        for (std::size_t t = 0; t < ts.size(); ++t) {
            double v = value(ts[t], root);
            double y0 = ypos(std::max(v, 0.0)), y1 = ypos(std::min(v, 0.0));
            svg.begin_group(ts[t]->name + ", " + key_name(Key{root, minor}, sp) + ": " +
                            signed_fixed(v, 3) + " c");
            svg.rect(gx + bar * static_cast<double>(t), y0, bar * 0.92, std::max(y1 - y0, 0.5),
                     {palette()[t], "", 0});
            svg.end_group();
        }
        std::string label = pitch_class_name(root, sp);
        if (minor) label[0] = static_cast<char>(label[0] - 'A' + 'a'); // minor keys in lower case
        svg.text(px + group * (i + 0.5), py + ph + 16, label,
                 {12, SvgFont::Anchor::middle, true, "#000"});
    }
    return y + h;
}

} // namespace

std::string compare_svg(const std::vector<ComparedTuning>& tunings, Spelling spelling) {
    std::vector<const ComparedTuning*> ts;
    for (const auto& t : tunings)
        if (t.keys) ts.push_back(&t);
    if (ts.empty()) fail({"--svg", 0, 0}, "the plots need at least one 12-note tuning");
    TERZO_ASSERT(ts.size() <= max_compared_tunings);
    const double width = 900, margin = 20, plot_h = 300;
    const std::size_t per_row = 4;
    std::size_t circle_rows = (ts.size() + per_row - 1) / per_row;
    double legend_h = 22.0 * static_cast<double>((ts.size() + 1) / 2) + 10;
    double height =
        margin + 30 + legend_h + 2 * plot_h + 30 + static_cast<double>(circle_rows) * 230 + 30;
    Svg svg(width, height, "", "Comparison of tunings");
    double y = margin + 18;
    svg.text(margin, y, "Comparison of tunings, key by key",
             {20, SvgFont::Anchor::start, true, "#000"});
    y += 16;
    for (std::size_t t = 0; t < ts.size(); ++t) {
        double lx = margin + static_cast<double>(t % 2) * (width / 2),
               ly = y + 22.0 * static_cast<double>(t / 2);
        svg.rect(lx, ly, 14, 14, {palette()[t], "", 0});
        std::string label =
            ts[t]->name + (ts[t]->description.empty() ? "" : ": " + ts[t]->description);
        if (label.size() > 60) label = label.substr(0, 57) + "...";
        svg.text(lx + 20, ly + 12, label, {12, SvgFont::Anchor::start, false, "#000"});
    }
    y += legend_h;
    y = bar_plot(svg, ts, false, margin, y, width - 2 * margin, plot_h, spelling);
    y = bar_plot(svg, ts, true, margin, y, width - 2 * margin, plot_h, spelling);
    svg.text(margin, y + 14, "Circles of fifths: cents from 3/2 (blue narrow, red wide, grey pure)",
             {14, SvgFont::Anchor::start, true, "#000"});
    y += 30;
    double cell = (width - 2 * margin) / static_cast<double>(per_row);
    for (std::size_t t = 0; t < ts.size(); ++t) {
        double cx = margin + cell * (static_cast<double>(t % per_row) + 0.5);
        double cy = y + 230.0 * static_cast<double>(t / per_row) + 105;
        std::string name =
            ts[t]->name.size() > 28 ? ts[t]->name.substr(0, 25) + "..." : ts[t]->name;
        svg.text(cx, cy - 95, name, {12, SvgFont::Anchor::middle, true, palette()[t]});
        draw_fifth_circle(svg, ts[t]->keys->circle, cx, cy, 68, spelling, 12);
    }
    return svg.str();
}

} // namespace terzo
