#include <filesystem>
#include <iostream>
#include <sstream>

#include "cli/commands.hpp"
#include "core/analysis/rank.hpp"
#include "core/tuning/scl.hpp"
#include "core/io/wav.hpp"
#include "core/report/measure_report.hpp"
#include "core/tuning/load.hpp"

namespace terzo::cli {

namespace {

// The tunings of a library folder (any depth) that have 12 notes, named by their path inside
// the folder; unreadable files are errors (a library is expected to be clean).
std::vector<std::pair<std::string, Scale>> read_library(const std::string& folder, std::size_t& skipped) {
    std::error_code ec;
    if (!std::filesystem::is_directory(folder, ec))
        fail({folder, 0, 0}, "is not a folder (--library names a folder of .scl files)");
    std::vector<RankFailure> failures;
    const std::vector<std::string> files = collect_tunings({folder}, failures);
    if (!failures.empty()) throw InputError({failures.front().path, 0, 0}, failures.front().message);
    std::vector<std::pair<std::string, Scale>> out;
    for (const std::string& file : files) {
        Scale s = read_scl_file(file);
        if (s.size() != 12) {
            ++skipped;
            continue;
        }
        out.emplace_back(std::filesystem::path(file).lexically_relative(folder).generic_string(), std::move(s));
    }
    if (out.empty()) fail({folder, 0, 0}, "holds no 12-note tunings to compare with");
    return out;
}

} // namespace

void add_measure(CLI::App& app) {
    auto* cmd = app.add_subcommand(
        "measure",
        "Find the notes in a recording (WAV) and measure each one's pitch; check them against a\n"
        "12-note tuning at a pitch standard, or name the library's tunings they fit best");
    struct Args {
        std::string recording, against, pitch = "A4=440", tonic = "C", library = TERZO_LIBRARY_DIR;
        bool json = false, csv = false;
        std::size_t closest = 5;
    };
    auto a = std::make_shared<Args>();
    cmd->add_option("RECORDING", a->recording, "A WAV file: 8/16/24/32-bit integer or float samples, any channels")
        ->required();
    cmd->add_option("--against", a->against, std::string(tuning_help) + ", with 12 degrees, to check the notes against")
        ->type_name("TUNING");
    cmd->add_option("--pitch", a->pitch,
                    "Pitch standard NOTE=HZ (default A4=440); without --against, where the search for the best "
                    "standard is centred (250 cents below to 150 above)")
        ->type_name("NOTE=HZ");
    cmd->add_option("--tonic", a->tonic, "Note of degree 0 (default C)")->type_name("NOTE");
    cmd->add_option("--library", a->library, "Folder of .scl files to compare with when there is no --against "
                                              "(default: the scales/ folder terzo was built with)")
        ->type_name("FOLDER");
    cmd->add_option("--closest", a->closest, "How many closest tunings the text lists (default 5; JSON has all)")
        ->type_name("N");
    auto* json = cmd->add_flag("--json", a->json, "Print one JSON object (keys in docs/measure.md)");
    auto* csv = cmd->add_flag("--csv", a->csv, "Print the notes as CSV");
    json->excludes(csv);
    cmd->callback([a] {
        const PitchReference ref = parse_pitch_reference(a->pitch, {"--pitch", 0, 0});
        const int tonic = parse_pitch_class(a->tonic, {"--tonic", 0, 0});
        std::optional<Scale> against;
        if (!a->against.empty()) {
            against = load_tuning(a->against);
            if (against->size() != 12)
                fail({a->against, 0, 0}, "has " + std::to_string(against->size()) +
                                             " degrees; --against needs a 12-note tuning");
        }
        const WavAudio audio = read_wav(a->recording);

        MeasureResult r;
        r.recording = a->recording;
        r.seconds = audio.seconds();
        r.sample_rate = audio.sample_rate;
        r.channels = audio.channels;
        r.notes = measure_notes(audio.samples, audio.sample_rate);
        std::vector<double> hz;
        for (const MeasuredNote& n : r.notes) hz.push_back(n.pitch.hz);
        if (against) {
            const NoteMap map(*against, tonic, ref, a->against);
            MeasureResult::Against g;
            g.tuning = a->against;
            g.description = against->description();
            g.reference = ref;
            g.tonic = tonic;
            for (double f : hz) g.notes.push_back(check_note(map, f));
            g.intervals = check_intervals(map, g.notes);
            r.against = std::move(g);
        } else {
            r.library = a->library;
            const auto library = read_library(a->library, r.library_skipped);
            if (!hz.empty()) r.closest = closest_tunings(library, tonic, ref, hz);
        }

        std::ostringstream out;
        if (a->json)
            out << measure_json(r).dump(2) << '\n';
        else if (a->csv)
            write_csv(out, measure_notes_table(r));
        else
            out << measure_text(r, a->closest);
        std::cout << out.str();
    });
}

} // namespace terzo::cli
