#include <iostream>
#include <optional>

#include "cli/commands.hpp"
#include "cli/text_output.hpp"
#include "core/report/resultants_report.hpp"
#include "core/tuning/load.hpp"

namespace terzo::cli {

void add_resultants(CLI::App& app) {
    auto* cmd = app.add_subcommand(
        "resultants", "Combination tones of every dyad (or of one chord) and where they land");
    struct Args {
        std::string tuning;
        double ref_hz = default_ref_hz;
        int span = 1;
        int order = 3;
        int partials = 1;
        double pitch_floor = 0.0;
        std::string chord;
        bool json = false, pretty = false, csv = false;
    };
    auto a = std::make_shared<Args>();
    cmd->add_option("TUNING", a->tuning, tuning_help)->required();
    cmd->add_option("--ref-hz", a->ref_hz, "Frequency of degree 0 in the lowest period (default 261.6255653, C4)");
    cmd->add_option("--span", a->span, "Periods the keyboard spans, 1 to 11 (default 1)");
    cmd->add_option("--order", a->order, "Highest order |a|+|b| of a term, 2 to 12 (default 3)");
    cmd->add_option("--partials", a->partials, "Harmonics per note, 1 to 32 (default 1: pure tones)");
    cmd->add_option("--pitch-floor", a->pitch_floor, "Leave tones below this many Hz out of the fit (default 0: count every tone; 20 is the lower limit of pitch perception)");
    auto* chord = cmd->add_option("--chord", a->chord, "A chord instead of every dyad: degree numbers or ratios, e.g. 0,4,7 or 1/1,5/4,3/2");
    auto* json = cmd->add_flag("--json", a->json, "Print one JSON object, compact (keys listed in docs/formats.md)");
    auto* pretty = cmd->add_flag("--pretty", a->pretty, "With --json: indent the JSON two spaces per level");
    auto* csv = cmd->add_flag("--csv", a->csv, "Print one CSV row per tone");
    json->excludes(csv);
    pretty->needs(json);
    cmd->callback([a, chord] {
        // Options first, so a mistyped number is reported before the tuning is read.
        ToneOptions opt;
        opt.order = a->order;
        opt.partials = a->partials;
        check_options(opt);
        FitOptions fit_options;
        fit_options.pitch_floor_hz = a->pitch_floor;
        check_fit_options(fit_options);
        Scale scale = load_tuning(a->tuning);
        note_description(scale, a->tuning);
        if (!a->json && !a->csv && !is_printable(scale.description())) // the text goes to a terminal
            scale = Scale(printable(scale.description()),
                          std::vector<Pitch>(scale.degrees().begin() + 1, scale.degrees().end()), scale.period());
        Keyboard kb(std::move(scale), a->ref_hz, a->span, a->tuning);
        std::optional<std::vector<Note>> notes;
        std::optional<CommonBass> bass;
        if (chord->count() > 0) { // also --chord "", which parse_chord rejects
            notes = parse_chord(a->chord, kb, {"--chord"});
            bass = common_bass(kb, *notes);
        }
        const ResultantsFormat format = a->json   ? (a->pretty ? ResultantsFormat::json_pretty : ResultantsFormat::json)
                                        : a->csv  ? ResultantsFormat::csv
                                                  : ResultantsFormat::text;
        // The report streams: each dyad is written as the engine produces it and then
        // forgotten, so memory stays flat up to max_tones tones. The options and the tone
        // count are checked before the first dyad, so a refused request writes nothing.
        ResultantsWriter out(std::cout, format, kb, opt, notes ? &*notes : nullptr, bass ? &*bass : nullptr);
        FitSum fit(fit_options);
        auto visit = [&](const DyadTones& d) {
            out.dyad(d);
            fit.add(d);
        };
        if (notes)
            for_each_chord_dyad(kb, *notes, opt, visit);
        else
            for_each_keyboard_dyad(kb, opt, visit);
        out.finish(fit.result());
    });
}

} // namespace terzo::cli
