// terzo export: writes a tuning for instruments. Every output is built and checked in
// memory first; only when all of them are valid and none would overwrite a file without
// --force are they written, each atomically.
#include <filesystem>
#include <optional>
#include <iostream>
#include <sstream>

#include "cli/commands.hpp"
#include "cli/key_map_options.hpp"
#include "cli/output_file.hpp"
#include "core/io/atomic_file.hpp"
#include "core/format.hpp"
#include "core/io/frequency_table.hpp"
#include "core/io/key_map_file.hpp"
#include "core/io/mts.hpp"
#include "core/tuning/scl.hpp"
#include "core/io/smf.hpp"
#include "core/text.hpp"
#include "cli/text_output.hpp"
#include "core/tuning/load.hpp"

namespace terzo::cli {

namespace {

struct ExportOptions {
    std::string tuning, scl, bulk, note, octave1, octave2, octave1_dump, octave2_dump, smf, table;
    int root_key = 60;
    double ref_hz = 0;
    bool ref_hz_given = false, bank_given = false, root_key_given = false;
    KeyMapOptions keymap;
    std::string save_key_map;
    std::string pitch, name, channels;
    int device = 0x7F, program = 0, bank = 0;
    bool force = false, non_realtime = false;
};

// One file to write: its option, path, content and the line the summary prints for it.
struct Output {
    std::string option, path, data, summary;
};

int checked_byte(int value, const char* option) {
    if (value < 0 || value > 127)
        fail({option, 0, 0}, std::to_string(value) + " is outside 0..127");
    return value;
}

// "1 key", "85 keys".
std::string count_text(std::size_t n, const std::string& word) {
    return std::to_string(n) + " " + word + (n == 1 ? "" : "s");
}

std::string as_string(const Bytes& b) {
    return std::string(b.begin(), b.end());
}

std::string bytes_text(std::size_t n) {
    return std::to_string(n) + " bytes";
}

std::string error_text(double cents) {
    return "largest rounding error " + fixed(cents, 4) + " cents";
}

void run_export(const ExportOptions& o, std::ostream& report) {
    // Options first, so a mistyped number is reported before the tuning is read.
    const int root_key = checked_byte(o.root_key, "--root-key");
    const int device = checked_byte(o.device, "--device");
    const int program = checked_byte(o.program, "--program");
    const bool with_bank = o.bank_given;
    const int bank = with_bank ? checked_byte(o.bank, "--bank") : 0;
    if (!o.pitch.empty() && o.ref_hz_given)
        fail({"--ref-hz", 0, 0}, "give either --ref-hz (the root key's frequency) or --pitch (a "
                                 "named note's), not both");
    std::optional<KeyReference> ref;
    if (!o.pitch.empty()) ref = key_reference(parse_pitch_reference(o.pitch, {"--pitch", 0, 0}));
    if (o.ref_hz_given) {
        if (!(o.ref_hz > 0 && o.ref_hz <= 20000))
            fail({"--ref-hz", 0, 0},
                 number_text(o.ref_hz) +
                     " Hz is outside the accepted range (above 0, at most 20000 Hz)");
        ref = {root_key, o.ref_hz}; // the key is settled below, once the key map is read
    }
    const ChannelSet channels = o.channels.empty() ? all_channels : parse_channels(o.channels, {"--channels", 0, 0});
    const bool realtime = !o.non_realtime;
    if (o.non_realtime && !o.note.empty() && !with_bank)
        fail({"--non-realtime", 0, 0},
             "the single-note tuning change without a bank (sub-ID 02) is real-time only; "
             "add --bank N to write the form with a bank (sub-ID 07)");
    if (!o.table.empty()) {
        const std::string ext = std::filesystem::path(o.table).extension().string();
        if (ext != ".csv" && ext != ".json")
            fail({"--table", 0, 0},
                 "expected a file name ending in .csv or .json, found \"" + o.table + "\"");
    }
    const bool any_mts = !o.bulk.empty() || !o.note.empty() || !o.octave1.empty() ||
                         !o.octave2.empty() || !o.octave1_dump.empty() || !o.octave2_dump.empty();
    if (o.scl.empty() && o.table.empty() && o.smf.empty() && !any_mts && o.save_key_map.empty())
        fail({"export", 0, 0},
             "no output given; name at least one file with --scl, --mts-bulk, --mts-note, "
             "--mts-octave1, --mts-octave2, --mts-octave1-dump, --mts-octave2-dump, --smf, "
             "--table or --save-key-map");

    // The key map: a file and the layout options, with --root-key and the reference on top.
    // A key map file's root key stands unless --root-key is given; --ref-hz tunes that key.
    KeyMapSpec spec = key_map_spec(o.keymap, std::nullopt, std::nullopt);
    if (o.root_key_given || o.keymap.file.empty()) spec.root_key = root_key;
    if (ref) {
        if (o.ref_hz_given) ref->key = spec.root_key;
        spec.reference = ref;
    }
    const Scale scale = load_tuning(o.tuning);
    note_description(scale, o.tuning);
    warn_degree_order(o.tuning, scale, spec.keep_file_order, std::cerr);
    const KeyMap map = make_key_map(scale, spec, key_map_source(o.keymap));
    warn_key_order(map, std::cerr);
    const std::string name_text = o.name.empty() ? mts_name_from_description(scale.description()) : o.name;
    const auto name = mts_name(name_text, {"--name", 0, 0});
    const MtsAddress to{device, program, bank};
    const KeyEncoding keys = encode_keys(map);

    std::vector<Output> outputs;
    std::vector<Bytes> sysex; // every MTS message, in order, for --smf
    auto add_sysex = [&](const std::string& option, const std::string& path,
                         const std::vector<Bytes>& msgs, const std::string& what) {
        std::string data;
        std::size_t total = 0;
        for (const Bytes& m : msgs) {
            data += as_string(m);
            total += m.size();
        }
        sysex.insert(sysex.end(), msgs.begin(), msgs.end());
        outputs.push_back({option, path, data, what + ", " + bytes_text(total)});
    };
    const std::string address = "device " + hex_text({static_cast<std::uint8_t>(device)}) +
                                ", program " + std::to_string(program);
    const std::string bank_text = ", bank " + std::to_string(bank);
    const std::string kind = realtime ? "real-time" : "non-real-time";

    if (!o.bulk.empty() || (!o.smf.empty() && !any_mts)) {
        Bytes msg = with_bank ? key_based_tuning_dump(keys.keys, name, to)
                              : bulk_tuning_dump(keys.keys, name, to);
        const std::string what = std::string(with_bank ? "key-based tuning dump (sub-ID 04), "
                                                       : "bulk tuning dump (sub-ID 01), ") +
                                 address + (with_bank ? bank_text : "") + ", 128 keys, " +
                                 error_text(keys.max_error_cents);
        if (!o.bulk.empty())
            add_sysex("--mts-bulk", o.bulk, {msg}, what);
        else
            sysex = {msg}; // --smf alone holds the bulk dump
    }
    if (!o.note.empty()) {
        std::vector<std::pair<int, MtsFrequency>> changes;
        for (int k = lowest_key; k <= highest_key; ++k)
            if (!(keys.keys[static_cast<std::size_t>(k)] == mts_no_change))
                changes.push_back({k, keys.keys[static_cast<std::size_t>(k)]});
        if (changes.empty())
            fail({"--mts-note", 0, 0}, "no key of this tuning lies in the MIDI Tuning Standard's "
                                       "8.175799..13289.656616 Hz, so there is nothing to send");
        auto msgs = single_note_tuning_changes(changes, to, with_bank, realtime);
        const std::string what =
            std::string("single-note tuning change (sub-ID ") + (with_bank ? "07" : "02") + ", " +
            kind + "), " + address + (with_bank ? bank_text : "") + ", " +
            count_text(changes.size(), "key") + " in " + count_text(msgs.size(), "message") + ", " +
            error_text(keys.max_error_cents);
        add_sysex("--mts-note", o.note, msgs, what);
    }
    const bool octave_forms = !o.octave1.empty() || !o.octave2.empty() || !o.octave1_dump.empty() ||
                              !o.octave2_dump.empty();
    if (octave_forms) {
        const std::string first = !o.octave1.empty()        ? "--mts-octave1"
                                  : !o.octave2.empty()      ? "--mts-octave2"
                                  : !o.octave1_dump.empty() ? "--mts-octave1-dump"
                                                            : "--mts-octave2-dump";
        const OctaveOffsets offsets = octave_offsets(map, {first, 0, 0});
        const std::string ch = channels == all_channels ? "all channels" : "channels " + o.channels;
        if (!o.octave1.empty()) {
            auto e = encode_offsets_1byte(offsets, {"--mts-octave1", 0, 0});
            add_sysex("--mts-octave1", o.octave1,
                      {scale_octave_1byte(e.values, channels, device, realtime)},
                      "scale/octave tuning 1-byte form (sub-ID 08, " + kind + "), " + ch + ", " +
                          error_text(e.max_error_cents));
        }
        if (!o.octave2.empty()) {
            auto e = encode_offsets_2byte(offsets, {"--mts-octave2", 0, 0});
            add_sysex("--mts-octave2", o.octave2,
                      {scale_octave_2byte(e.values, channels, device, realtime)},
                      "scale/octave tuning 2-byte form (sub-ID 09, " + kind + "), " + ch + ", " +
                          error_text(e.max_error_cents));
        }
        if (!o.octave1_dump.empty()) {
            auto e = encode_offsets_1byte(offsets, {"--mts-octave1-dump", 0, 0});
            add_sysex("--mts-octave1-dump", o.octave1_dump,
                      {scale_octave_dump_1byte(e.values, name, to)},
                      "scale/octave tuning dump 1-byte form (sub-ID 05), " + address + bank_text +
                          ", " + error_text(e.max_error_cents));
        }
        if (!o.octave2_dump.empty()) {
            auto e = encode_offsets_2byte(offsets, {"--mts-octave2-dump", 0, 0});
            add_sysex("--mts-octave2-dump", o.octave2_dump,
                      {scale_octave_dump_2byte(e.values, name, to)},
                      "scale/octave tuning dump 2-byte form (sub-ID 06), " + address + bank_text +
                          ", " + error_text(e.max_error_cents));
        }
    }
    if (!o.smf.empty()) {
        Bytes file = sysex_midi_file(sysex);
        outputs.push_back({"--smf", o.smf, as_string(file),
                           "Standard MIDI File with " + count_text(sysex.size(), "SysEx message") +
                               ", " + bytes_text(file.size())});
    }
    if (!o.table.empty()) {
        map.check_frequencies(o.tuning); // the table prints every key's Hz
        std::ostringstream out;
        if (std::filesystem::path(o.table).extension() == ".json")
            out << json_text(frequency_table_json(map)) << '\n';
        else
            write_csv(out, frequency_table(map));
        outputs.push_back({"--table", o.table, out.str(), "frequency table of keys 0-127"});
    }
    if (!o.scl.empty()) {
        std::ostringstream out;
        write_scl(out, scale, std::filesystem::path(o.scl).filename().string());
        outputs.push_back({"--scl", o.scl, out.str(),
                           ".scl scale file, " + std::to_string(scale.size()) + " degrees"});
    }

    if (!o.save_key_map.empty()) {
        std::ostringstream out;
        write_key_map(out, spec);
        outputs.push_back({"--save-key-map", o.save_key_map, out.str(),
                           "key map, layout " + key_layout_name(spec.layout)});
    }

    // Every check on the targets before the first write: nothing is written unless all can be.
    for (std::size_t i = 0; i < outputs.size(); ++i) {
        const std::filesystem::path p =
            std::filesystem::absolute(outputs[i].path).lexically_normal();
        for (std::size_t j = 0; j < i; ++j)
            if (std::filesystem::absolute(outputs[j].path).lexically_normal() == p)
                fail({outputs[i].option, 0, 0},
                     "\"" + outputs[i].path + "\" is also the file of " + outputs[j].option +
                         "; give each output its own file (no file was written)");
        try {
            check_output_file(outputs[i].path, o.force);
        } catch (const InputError& e) {
            fail(e.pos(), e.message() + " (no file was written)");
        }
    }

    report << "Tuning: " << scale.description() << " (" << scale.size() << " degrees, period "
           << scale.period().str() << ")\n";
    report << "Keys: key " << root_key << " (" << note_text(note_of_key(root_key))
           << ") plays degree 0 at " << fixed(map.root_hz(), 6) << " Hz";
    const KeyReference& used = map.reference();
    if (used.key != root_key)
        report << "; key " << used.key << " (" << note_text(note_of_key(used.key)) << ") sounds at "
               << fixed(used.hz, 6) << " Hz";
    report << "\n";
    report << "Layout: " << layout_summary(map, spec) << "\n";
    if (!keys.silent.empty())
        report << "Silent keys: " << keys.silent.size()
               << " of 128, sent as \"no change\" in dumps and left out of single-note "
                  "changes\n";
    if (!keys.out_of_range.empty() && (any_mts || !o.smf.empty()))
        report << "Keys outside the MIDI Tuning Standard's 8.175799..13289.656616 Hz, sent as "
                  "\"no change\" in dumps and left out of single-note changes: "
               << runs_text(keys.out_of_range) << "\n";
    if (any_mts || !o.smf.empty())
        report << "Name field: \"" << std::string(name.begin(), name.end()) << "\"\n";
    // Every output is written beside its target first and renamed into place only when all
    // are complete, so a full disk or a refused folder leaves every target as it was.
    std::vector<FileAt> files;
    for (const Output& out : outputs) files.push_back({out.path, out.data});
    write_files_together(files, o.force ? Overwrite::allow : Overwrite::refuse);
    for (const Output& out : outputs) report << "Wrote " << out.path << ": " << out.summary << "\n";
}

} // namespace

void add_export(CLI::App& app) {
    auto* cmd = app.add_subcommand("export", "Write a tuning for instruments: MIDI Tuning Standard "
                                             ".syx, a MIDI file, a frequency table, .scl");
    auto o = std::make_shared<ExportOptions>();
    cmd->add_option("TUNING", o->tuning, tuning_help)->required();
    cmd->add_option("--scl", o->scl, "Write the tuning as a .scl file")->type_name("FILE");
    cmd->add_option("--mts-bulk", o->bulk,
                    "Write a bulk tuning dump of keys 0-127 (sub-ID 01; 04 with --bank)")
        ->type_name("FILE.syx");
    cmd->add_option("--mts-note", o->note,
                    "Write single-note tuning changes for keys 0-127 (sub-ID 02; 07 with --bank)")
        ->type_name("FILE.syx");
    cmd->add_option("--mts-octave1", o->octave1,
                    "Write a scale/octave tuning, 1-byte form (sub-ID 08; 12 notes at 2/1)")
        ->type_name("FILE.syx");
    cmd->add_option("--mts-octave2", o->octave2,
                    "Write a scale/octave tuning, 2-byte form (sub-ID 09; 12 notes at 2/1)")
        ->type_name("FILE.syx");
    cmd->add_option("--mts-octave1-dump", o->octave1_dump,
                    "Write a scale/octave tuning dump, 1-byte form (sub-ID 05)")
        ->type_name("FILE.syx");
    cmd->add_option("--mts-octave2-dump", o->octave2_dump,
                    "Write a scale/octave tuning dump, 2-byte form (sub-ID 06)")
        ->type_name("FILE.syx");
    cmd->add_option(
           "--smf", o->smf,
           "Write a Standard MIDI File holding the --mts-* messages (alone: the bulk dump)")
        ->type_name("FILE.mid");
    cmd->add_option("--table", o->table,
                    "Write every key's frequency as CSV or JSON (by the file's extension)")
        ->type_name("FILE.csv|FILE.json");
    auto* root_key = cmd->add_option("--root-key", o->root_key,
                    "MIDI key that plays degree 0 (default 60, middle C)")
        ->type_name("KEY");
    auto* ref_hz =
        cmd->add_option("--ref-hz", o->ref_hz, "Frequency of the root key in Hz")->type_name("HZ");
    cmd->add_option("--pitch", o->pitch,
                    "A named note's frequency, such as A4=415 (default: A4=440 for 12-note tunings; for "
                    "other sizes the root key keeps its 12-TET frequency at A4=440)")
        ->type_name("NOTE=HZ");
    cmd->add_option(
        "--name", o->name,
        "Name field of the dumps, up to 16 ASCII characters (default: the description)");
    cmd->add_option("--device", o->device, "Device ID 0-127 (default 127, all devices)")
        ->type_name("ID");
    cmd->add_option("--program", o->program,
                    "Tuning program 0-127 (default 0; shown to players as 1-128)")
        ->type_name("N");
    auto* bank = cmd->add_option("--bank", o->bank,
                                 "Tuning bank 0-127: write the forms with a bank (sub-IDs 04, 07)")
                     ->type_name("N");
    cmd->add_option("--channels", o->channels,
                    "Channels of the scale/octave forms, such as 1,2,10 or 1-16 (default all)")
        ->type_name("LIST");
    cmd->add_flag("--non-realtime", o->non_realtime,
                  "Send sub-IDs 07, 08 and 09 as non-real-time messages");
    add_key_map_options(cmd, o->keymap);
    cmd->add_option("--save-key-map", o->save_key_map,
                    "Write the key map used as a key-map file, for --key-map and the window")
        ->type_name("FILE.json");
    cmd->add_flag("--force", o->force, "Replace files that already exist");
    cmd->callback([o, ref_hz, bank, root_key] {
        o->root_key_given = root_key->count() > 0;
        o->ref_hz_given = ref_hz->count() > 0;
        o->bank_given = bank->count() > 0;
        std::ostringstream report;
        run_export(*o, report);
        print_text(report.str());
    });
}

} // namespace terzo::cli
