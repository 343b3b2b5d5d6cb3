#include <iostream>
#include <sstream>

#include "cli/commands.hpp"
#include "cli/output_file.hpp"
#include "core/error.hpp"
#include "core/format.hpp"
#include "core/report/table.hpp"
#include "core/io/wav.hpp"
#include "core/sound/render.hpp"
#include "core/tuning/load.hpp"

namespace terzo::cli {

namespace {

// "0,4,7" -> {0, 4, 7}: whole numbers (a leading '-' allowed) separated by commas.
std::vector<int> parse_notes(const std::string& text) {
    std::vector<int> notes;
    std::size_t start = 0;
    while (true) {
        const std::size_t comma = text.find(',', start);
        const std::string item =
            text.substr(start, comma == std::string::npos ? std::string::npos : comma - start);
        const std::size_t digits = item.size() - (!item.empty() && item[0] == '-' ? 1 : 0);
        if (digits == 0 || digits > 6 ||
            item.find_first_not_of("0123456789", item.size() - digits) != std::string::npos)
            fail({"--notes", 0, 0}, terzo::excerpt(item) +
                                        " is not a degree number; write whole numbers "
                                        "separated by commas, such as 0,4,7");
        notes.push_back(std::stoi(item));
        if (comma == std::string::npos) break;
        start = comma + 1;
    }
    return notes;
}

std::string model_details(const RenderSettings& s) {
    std::ostringstream o;
    o << model_name(s.model);
    if (s.model == Model::poly)
        o << " (c2 " << s.polynomial.c2 << ", c3 " << s.polynomial.c3 << ")";
    if (s.model == Model::oscillator)
        o << " (resonance " << s.oscillator.resonance_hz << " Hz, Q " << s.oscillator.q << ", c2 "
          << s.oscillator.c2 << ", c3 " << s.oscillator.c3 << ")";
    if (s.model == Model::predicted)
        o << " (tones of order 2.." << s.predicted_order << " at " << s.predicted_db
          << " dB x audibility)";
    return o.str();
}

} // namespace

void add_render(CLI::App& app) {
    auto* cmd = app.add_subcommand(
        "render",
        "Write a dyad or chord of a tuning, optionally through an ear-nonlinearity model, "
        "to a WAV file. " +
            std::string(hearing_caution()));
    struct Options {
        std::string tuning, notes, model = "poly", sample_format = "int16", out;
        std::optional<double> c2, c3;
        RenderSettings s;
        bool force = false;
    };
    auto o = std::make_shared<Options>();
    cmd->add_option("TUNING", o->tuning, "A .scl file")->required();
    cmd->add_option("--notes", o->notes,
                    "Degrees to sound together, e.g. 0,4,7 (12 is degree 0 "
                    "one period up, -1 the top degree one period down)")
        ->required();
    cmd->add_option("--ref-hz", o->s.ref_hz, "Frequency of degree 0 in Hz (16..4000)")
        ->capture_default_str();
    cmd->add_option("--seconds", o->s.seconds, "Duration (0.1..60)")->capture_default_str();
    cmd->add_option("--model", o->model, "none | poly | oscillator | predicted")
        ->capture_default_str();
    cmd->add_option("--sample-rate", o->s.sample_rate, "44100 or 48000")->capture_default_str();
    cmd->add_option("--sample-format", o->sample_format, "int16 or float32")->capture_default_str();
    cmd->add_option("--partials", o->s.timbre.partials, "Harmonics per note, 1 = sine (1..64)")
        ->capture_default_str();
    cmd->add_option("--rolloff", o->s.timbre.rolloff_db_per_octave,
                    "Harmonic roll-off in dB per octave (0..40)")
        ->capture_default_str();
    cmd->add_option("--c2", o->c2, "Quadratic coefficient of the model (-1..1, default 0.2)");
    cmd->add_option("--c3", o->c3, "Cubic coefficient of the model (-1..1, default 0.3)");
    cmd->add_option("--resonance-hz", o->s.oscillator.resonance_hz,
                    "Oscillator resonance in Hz (50..8000)")
        ->capture_default_str();
    cmd->add_option("--q", o->s.oscillator.q, "Oscillator quality factor (0.5..20)")
        ->capture_default_str();
    cmd->add_option("--attack", o->s.envelope.attack_s, "Fade-in in seconds (0.005..10)")
        ->capture_default_str();
    cmd->add_option("--release", o->s.envelope.release_s, "Fade-out in seconds (0.005..10)")
        ->capture_default_str();
    cmd->add_option("--peak-db", o->s.peak_dbfs, "Peak level in dBFS (-60..-6)")
        ->capture_default_str();
    cmd->add_option(
           "--predicted-db", o->s.predicted_db,
           "predicted: level of each predicted tone relative to a note, before its audibility "
           "weight (-60..0)")
        ->capture_default_str();
    cmd->add_option("--order", o->s.predicted_order,
                    "predicted: highest order of the tones added (2..6)")
        ->capture_default_str();
    cmd->add_option("--out", o->out, "The WAV file to write")->required();
    cmd->add_flag("--force", o->force, "Replace the file if it exists");
    cmd->callback([o] {
        RenderSettings s = o->s;
        auto model = parse_model(o->model);
        if (!model)
            fail({"--model", 0, 0}, terzo::excerpt(o->model) +
                                        " is not a model; use none, poly, oscillator or predicted");
        s.model = *model;
        if (o->c2) s.polynomial.c2 = s.oscillator.c2 = *o->c2;
        if (o->c3) s.polynomial.c3 = s.oscillator.c3 = *o->c3;
        WavFormat format{s.sample_rate, SampleFormat::int16};
        if (o->sample_format == "float32")
            format.sample_format = SampleFormat::float32;
        else if (o->sample_format != "int16")
            fail({"--sample-format", 0, 0},
                 terzo::excerpt(o->sample_format) + " is not a sample format; use int16 or float32");
        const std::vector<int> notes = parse_notes(o->notes);
        check_render_settings(s, notes.size());
        check_output_file(o->out, o->force);
        const Scale scale = load_tuning(o->tuning);
        const std::vector<double> samples = render(scale, notes, s);
        const std::vector<double> hz = note_frequencies(scale, notes, s.ref_hz);

        std::ostringstream out;
        out << "wrote " << o->out << ": " << fixed(s.seconds, 3) << " s, " << s.sample_rate
            << " Hz, " << sample_format_name(format.sample_format) << ", mono, model "
            << model_details(s) << ", peak " << fixed(s.peak_dbfs, 1) << " dBFS\n\n";
        Table t;
        t.header = {"note", "Hz"};
        t.align = {Table::Align::right, Table::Align::right};
        for (std::size_t i = 0; i < notes.size(); ++i)
            t.add({std::to_string(notes[i]), fixed(hz[i], 3)});
        write_text(out, t);
        out << '\n' << hearing_caution() << '\n';
        write_wav(o->out, samples, format, o->force ? Overwrite::allow : Overwrite::refuse);
        std::cout << out.str();
    });
}

} // namespace terzo::cli
