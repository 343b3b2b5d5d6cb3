#include <iostream>

#include "cli/commands.hpp"
#include "core/analysis/candidates.hpp"
#include "core/analysis/chord.hpp"
#include "core/format.hpp"
#include "core/report/suggest_report.hpp"
#include "core/tuning/load.hpp"

namespace terzo::cli {

void add_suggest(CLI::App& app) {
    auto* cmd = app.add_subcommand(
        "suggest", "Notes to add to a scale (or degrees to remove) so that more resultants land on it");
    struct Args {
        std::string tuning;
        double ref_hz = default_ref_hz;
        int span = 1;
        int order = 3;
        int partials = 1;
        double pitch_floor = pitch_perception_floor_hz;
        double near = 5.0;
        std::string chord;
        std::string candidates{default_candidate_spec};
        bool remove = false, json = false;
        int top = 10;
    };
    auto a = std::make_shared<Args>();
    cmd->add_option("TUNING", a->tuning, tuning_help)->required();
    cmd->add_option("--ref-hz", a->ref_hz, "Frequency of degree 0 in the lowest period (default 261.6255653, C4)");
    cmd->add_option("--span", a->span, "Periods the keyboard spans, 1 to 11 (default 1)");
    cmd->add_option("--order", a->order, "Highest order |a|+|b| of a term, 2 to 12 (default 3)");
    cmd->add_option("--partials", a->partials, "Harmonics per note, 1 to 32 (default 1: pure tones)");
    auto* chord = cmd->add_option("--chord", a->chord, "Fit one chord's resultants instead of every dyad: degree numbers or ratios, e.g. 0,2,4");
    cmd->add_option("--candidates", a->candidates, "Notes to try: odd:N, prime:N with odd:N, edo:N, ratios or cents, comma-separated (default odd:15)")->type_name("SPEC");
    cmd->add_flag("--remove", a->remove, "Also score the removal of each degree");
    cmd->add_option("--top", a->top, "Proposals shown per list (default 10)");
    cmd->add_option("--pitch-floor", a->pitch_floor, "Leave tones below this many Hz out of the fit (default 20, the lower limit of pitch perception; 0 counts every tone)");
    cmd->add_option("--near", a->near, "Cents within which a resultant counts as landing near the new note (default 5)");
    cmd->add_flag("--json", a->json, "Print one JSON object (keys documented in docs/suggest.md)");
    cmd->callback([a, chord] {
        // Options first, so a mistyped number is reported before the tuning is read.
        SuggestOptions o;
        o.tones.order = a->order;
        o.tones.partials = a->partials;
        check_options(o.tones);
        o.fit.pitch_floor_hz = a->pitch_floor;
        check_fit_options(o.fit);
        if (!(a->near >= 0.0 && a->near <= 600.0))
            fail({"--near"}, "near tolerance " + number_text(a->near) +
                                 " cents is outside the allowed range 0 to 600 cents");
        o.near_cents = a->near;
        if (a->top < 1)
            fail({"--top"}, "top " + std::to_string(a->top) + " is not a positive number of proposals");
        const CandidateSpec spec = parse_candidate_spec(a->candidates, {"--candidates"});

        Keyboard kb(load_tuning(a->tuning), a->ref_hz, a->span, a->tuning);
        if (chord->count() > 0) o.chord = parse_chord(a->chord, kb, {"--chord"});
        const auto pitches = candidate_pitches(spec, kb.scale().period(), {"--candidates"});

        SuggestReport r;
        r.keyboard = &kb;
        r.options = o;
        r.results = suggest(kb, pitches, o, a->remove);
        r.candidates = a->candidates;
        r.top = std::size_t(a->top);
        r.removals = a->remove;
        if (a->json)
            std::cout << suggest_json(r).dump(2) << '\n';
        else
            write_suggest_text(std::cout, r);
    });
}

} // namespace terzo::cli
