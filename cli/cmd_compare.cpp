#include <iostream>
#include <sstream>

#include "cli/commands.hpp"
#include "cli/report_output.hpp"
#include "core/report/compare_report.hpp"
#include "core/format.hpp"
#include "core/tuning/load.hpp"

namespace terzo::cli {

void add_compare(CLI::App& app) {
    auto* cmd = app.add_subcommand(
        "compare",
        "Compare tunings key by key: every major and minor triad's fifth and thirds against\n"
        "pure, beat rates, resultant fit, a summary with wolves, and interval classes");
    auto tunings = std::make_shared<std::vector<std::string>>();
    auto pitch = std::make_shared<std::string>("A4=440");
    auto tonic = std::make_shared<std::string>("C");
    auto octave = std::make_shared<int>(4);
    auto weights = std::make_shared<std::string>();
    auto odd_limit = std::make_shared<int>(7);
    auto no_fit = std::make_shared<bool>(false);
    auto order = std::make_shared<int>(3);
    auto spelling = std::make_shared<std::string>("mixed");
    cmd->add_option("TUNING", *tunings, std::string(tuning_help) + "; two to twelve of them")
        ->required()
        ->expected(2, 12);
    cmd->add_option("--pitch", *pitch, "Reference pitch NOTE=HZ for beat rates (default A4=440)")
        ->type_name("NOTE=HZ");
    cmd->add_option("--tonic", *tonic, "Note of degree 0 (default C)")->type_name("NOTE");
    cmd->add_option("--octave", *octave, "Octave of the triads' roots, 0..8 (default 4: C4 to B4)")
        ->type_name("N");
    cmd->add_option("--weights", *weights, "Key usage weights (format in docs/compare.md)")
        ->type_name("FILE");
    cmd->add_option("--odd-limit", *odd_limit,
                    "Odd limit of the simple ratios in interval classes, 1..99 (default 7)")
        ->type_name("N");
    cmd->add_flag("--no-fit", *no_fit, "Leave out the resultant fit");
    cmd->add_option("--order", *order,
                    "Highest combination-tone order in the fit, 2..12 (default 3)")
        ->type_name("N");
    cmd->add_option("--spelling", *spelling, "Black keys as sharps, flats or mixed (default)")
        ->type_name("NAME");
    auto out_opts = add_report_options(
        cmd, "Table to print: keys, summary, wolves or classes (--csv: default keys)");
    cmd->callback([=] {
        const ReportOutput& o = *out_opts;
        check_svg_target(o);
        CompareOptions opts;
        opts.reference = parse_pitch_reference(*pitch, {"--pitch", 0, 0});
        opts.tonic = parse_pitch_class(*tonic, {"--tonic", 0, 0});
        opts.octave = *octave;
        opts.fit = !*no_fit;
        opts.fit_order = *order;
        Spelling sp = parse_spelling(*spelling, {"--spelling", 0, 0});
        std::string part = o.part;
        if (!part.empty() && part != "keys" && part != "summary" && part != "wolves" &&
            part != "classes")
            fail({"--part", 0, 0},
                 "unknown part \"" + part + "\"; use keys, summary, wolves or classes");
        if (o.csv && part.empty()) part = "keys";
        if (!weights->empty()) opts.weights = read_key_weights(*weights);

        std::vector<ComparedTuning> list;
        for (const std::string& arg : *tunings) {
            Scale scale = load_tuning(arg);
            ComparedTuning t;
            t.name = arg;
            t.description = scale.description();
            t.size = scale.size();
            if (scale.size() == 12) t.keys = compare_keys(scale, opts, arg);
            t.classes = interval_classes(scale, *odd_limit, arg);
            list.push_back(std::move(t));
        }
        std::string svg = o.svg.empty() ? std::string() : compare_svg(list, sp);
        std::ostringstream out;
        if (o.json) {
            out << compare_json(list, opts, *odd_limit, sp).dump(2) << '\n';
        } else if (o.csv) {
            if (part == "keys")
                write_csv(out, keys_long_table(list, sp));
            else if (part == "summary")
                write_csv(out, summary_table(list));
            else if (part == "wolves")
                write_csv(out, wolves_table(list, sp));
            else
                write_csv(out, classes_table(list));
        } else {
            auto want = [&](const char* p) { return part.empty() || part == p; };
            out << (o.md ? "## " : "") << "Comparison at " << note_text(opts.reference.note, sp)
                << " = " << fixed(opts.reference.hz, 3) << " Hz, triads on "
                << note_text(NoteName{0, opts.octave}, sp) << ".."
                << note_text(NoteName{11, opts.octave}, sp)
                << (opts.weights ? ", weighted by " + *weights : std::string()) << "\n\n";
            bool any12 = false;
            for (const ComparedTuning& t : list) {
                if (!t.keys) continue;
                any12 = true;
                if (want("keys"))
                    write_part(out, o,
                               t.name + ": " + t.description + " (cents from pure, beats/s" +
                                   (opts.fit ? ", fit" : "") + ")",
                               key_table(*t.keys, sp));
            }
            if (any12 && want("summary"))
                write_part(out, o,
                           std::string("Summary: |cents| from pure, ") +
                               (opts.weights ? "means weighted by key usage"
                                             : "every key weighing the same"),
                           summary_table(list));
            if (any12 && want("wolves")) {
                std::string title = "Wolves: fifths beyond " + fixed(wolf_fifth_cents, 3) +
                                    " c, thirds beyond " + fixed(wolf_third_cents, 3) +
                                    " c from pure";
                Table w = wolves_table(list, sp);
                if (w.rows.empty())
                    out << title << ": none\n\n";
                else
                    write_part(out, o, title, w);
            }
            if (want("classes"))
                write_part(out, o,
                           "Interval classes: nearest ratios within odd limit " +
                               std::to_string(*odd_limit),
                           classes_table(list));
        }
        write_svg_file(o, svg);
        std::cout << out.str();
    });
}

} // namespace terzo::cli
