#include <iostream>
#include <sstream>

#include "cli/commands.hpp"
#include "cli/report_output.hpp"
#include "core/format.hpp"
#include "core/report/sheet_report.hpp"
#include "core/tuning/load.hpp"

namespace terzo::cli {

namespace {

void parse_range(const std::string& text, SheetOptions& o) {
    const SourcePos pos{"--range", 0, 0};
    auto dots = text.find("..");
    if (dots == std::string::npos)
        fail(pos, "expected LOW..HIGH such as F3..F4, found \"" + text + "\"");
    o.low = parse_note(text.substr(0, dots), pos);
    o.high = parse_note(text.substr(dots + 2), pos);
}

} // namespace

void add_sheet(CLI::App& app) {
    auto* cmd = app.add_subcommand(
        "sheet",
        "A tuner's sheet for a 12-note tuning: frequencies at a reference pitch, offsets from\n"
        "12-TET, beat rates of fifths, fourths, thirds and sixths, and a tuning order");
    auto tuning = std::make_shared<std::string>();
    auto pitch = std::make_shared<std::string>("A4=440");
    auto tonic = std::make_shared<std::string>("C");
    auto range = std::make_shared<std::string>("F3..F4");
    auto start = std::make_shared<std::string>();
    auto falling = std::make_shared<bool>(false);
    auto spelling = std::make_shared<std::string>("mixed");
    auto paper = std::make_shared<std::string>("a4");
    cmd->add_option("TUNING", *tuning, std::string(tuning_help) + ", with 12 degrees")->required();
    cmd->add_option("--pitch", *pitch, "Reference pitch NOTE=HZ, any note (default A4=440)")
        ->type_name("NOTE=HZ");
    cmd->add_option("--tonic", *tonic, "Note of degree 0 (default C)")->type_name("NOTE");
    cmd->add_option("--range", *range, "Notes on the sheet, at least an octave (default F3..F4)")
        ->type_name("LOW..HIGH");
    cmd->add_option("--start", *start,
                    "First note of the tuning order (default: the reference's note in the lowest "
                    "octave of the range)")
        ->type_name("NOTE");
    cmd->add_flag("--falling", *falling,
                  "Tuning order down a fifth, up a fourth (default: up a fifth, down a fourth)");
    cmd->add_option("--spelling", *spelling, "Black keys as sharps, flats or mixed (default)")
        ->type_name("NAME");
    cmd->add_option("--paper", *paper, "Page size of --svg: a4 (default) or letter")
        ->type_name("SIZE");
    auto out_opts = add_report_options(
        cmd, "Table to print: notes, intervals, order or fifths (--csv: default notes)");
    cmd->callback([=] {
        const ReportOutput& o = *out_opts;
        check_svg_target(o);
        SheetOptions opts;
        opts.reference = parse_pitch_reference(*pitch, {"--pitch", 0, 0});
        opts.tonic = parse_pitch_class(*tonic, {"--tonic", 0, 0});
        parse_range(*range, opts);
        if (!start->empty()) opts.start = parse_note(*start, {"--start", 0, 0});
        opts.rising = !*falling;
        opts.spelling = parse_spelling(*spelling, {"--spelling", 0, 0});
        Paper page = parse_paper(*paper, {"--paper", 0, 0});
        std::string part = o.part;
        if (!part.empty() && part != "notes" && part != "intervals" && part != "order" &&
            part != "fifths")
            fail({"--part", 0, 0},
                 "unknown part \"" + part + "\"; use notes, intervals, order or fifths");
        if (o.csv && part.empty()) part = "notes";

        Scale scale = load_tuning(*tuning);
        Sheet sheet = make_sheet(scale, opts, *tuning);
        std::string svg = o.svg.empty() ? std::string() : sheet_svg(sheet, page);
        std::ostringstream out;
        auto table_of = [&](const std::string& p) {
            if (p == "notes") return sheet_notes_table(sheet);
            if (p == "intervals") return sheet_intervals_table(sheet);
            if (p == "order") return sheet_order_table(sheet);
            return sheet_circle_table(sheet);
        };
        if (o.json) {
            out << sheet_json(sheet).dump(2) << '\n';
        } else if (o.csv) {
            write_csv(out, table_of(part));
        } else {
            const std::string ref = note_text(opts.reference.note, opts.spelling) + " = " +
                                    fixed(opts.reference.hz, 3) + " Hz";
            if (o.md)
                out << "## Tuner's sheet: " << sheet.description << "\n\n";
            else
                out << "Tuner's sheet: " << sheet.description << '\n';
            out << "Reference " << ref << ", degree 0 on "
                << pitch_class_name(opts.tonic, opts.spelling) << ", range "
                << note_text(opts.low, opts.spelling) << ".." << note_text(opts.high, opts.spelling)
                << "\n\n";
            const std::pair<const char*, const char*> parts[] = {
                {"notes", "Notes: Hz, cents from 12-TET at the same reference, beats/s of the "
                          "interval rising from each note"},
                {"intervals", "Intervals"},
                {"order", "Tuning order: set each note against the one before it"},
                {"fifths", "Circle of fifths: how each fifth is tempered"}};
            for (const auto& [key, title] : parts)
                if (part.empty() ? std::string(key) != "intervals" : part == key)
                    write_part(out, o, title, table_of(key));
            out << tuning_advice << '\n';
        }
        write_svg_file(o, svg);
        std::cout << out.str();
    });
}

} // namespace terzo::cli
