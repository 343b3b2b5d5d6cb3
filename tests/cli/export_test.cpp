// The `terzo export` command end to end: the files it writes, and that a failed check
// leaves every target untouched.
#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>

#include "tests/support/run.hpp"

namespace fs = std::filesystem;
using terzo::test::RunResult;
using terzo::test::run_terzo_in;
using terzo::test::slurp;

namespace {

using Run = RunResult;

// A fresh folder per test holding a 12-note quarter-comma meantone typed in cents and a
// 7-note just scale (scenarios of our own).
fs::path fresh_dir(const std::string& name) {
    fs::path d = terzo::test::temp_folder("export-test-" + name);
    std::ofstream(d / "meantone.scl")
        << "! meantone.scl\nQuarter-comma meantone\n12\n76.04900\n193.15686\n310.26471\n"
           "386.31371\n503.42157\n579.47057\n696.57843\n772.62743\n889.73529\n"
           "1006.84314\n1082.89214\n2/1\n";
    std::ofstream(d / "huge.scl") << "! huge.scl\nhuge\n1\n9999999.0\n";
    std::ofstream(d / "seven.scl") << "! seven.scl\nseven\n7\n9/8\n5/4\n4/3\n3/2\n5/3\n7/4\n2/1\n";
    return d;
}

std::string hex(const std::string& bytes) {
    std::string s;
    char buf[4];
    for (unsigned char c : bytes) {
        std::snprintf(buf, sizeof buf, "%02X", c);
        if (!s.empty()) s += ' ';
        s += buf;
    }
    return s;
}

} // namespace

TEST_CASE("export writes several outputs in one run", "[export]") {
    const fs::path d = fresh_dir("several");
    // 12-TET C4 at A4 = 440 Hz, so that the offsets are those "with C fixed".
    Run r = run_terzo_in(d, "export meantone.scl --pitch C4=261.6255653 --non-realtime --mts-octave1 o1.syx "
           "--mts-bulk bulk.syx --mts-note note.syx --bank 2 --table keys.json --scl copy.scl");
    INFO(r.err);
    REQUIRE(r.status == 0);
    CHECK(r.err.empty());
    // docs/references.md 6.5 [C]: 1/4-comma, 1-byte form, non-real-time, all channels.
    CHECK(hex(slurp(d / "o1.syx")) ==
          "F0 7E 7F 08 08 03 7F 7F 40 28 39 4A 32 43 2B 3D 25 36 47 2F F7");
    // With --bank the dump is the key-based form 04 (409 bytes) and the notes use 07.
    const std::string bulk = slurp(d / "bulk.syx");
    REQUIRE(bulk.size() == 409);
    CHECK(hex(bulk.substr(0, 7)) == "F0 7E 7F 08 04 02 00");
    const std::string note = slurp(d / "note.syx");
    CHECK(note.size() == 2 * (9 + 4 * 64));
    CHECK(hex(note.substr(0, 8)) == "F0 7E 7F 08 07 02 00 40");
    CHECK(slurp(d / "keys.json").find("\"root_key\": 60") != std::string::npos);
    CHECK(slurp(d / "copy.scl").find("Quarter-comma meantone") != std::string::npos);
    CHECK(r.out.find("Wrote o1.syx: scale/octave tuning 1-byte form (sub-ID 08, non-real-time), "
                     "all channels, "
                     "largest rounding error 0.4706 cents, 21 bytes\n") != std::string::npos);
}

TEST_CASE("export without a reference keeps the root key at its 12-TET pitch unless the tuning has 12 notes", "[export]") {
    const fs::path d = fresh_dir("default-reference");
    // 12-TET at A4 = 440 Hz: C4 261.6256 Hz (docs/references.md 4, agreeing with the CRC Handbook's
    // table of equal-tempered frequencies). In the 7-note scale key 69 plays degree 2 of the
    // next period (5/4 above 2/1), which the old default pinned to 440 Hz.
    Run seven = run_terzo_in(d, "export seven.scl --table seven.csv");
    INFO(seven.err);
    REQUIRE(seven.status == 0);
    CHECK(seven.out.find("Keys: key 60 (C4) plays degree 0 at 261.625565 Hz\n") != std::string::npos);
    CHECK(slurp(d / "seven.csv").find("\n69,,2,1,654.063913,") != std::string::npos); // 261.625565 * 2 * 5/4
    // The 12-note meantone is laid at A4 = 440 Hz as before.
    Run twelve = run_terzo_in(d, "export meantone.scl --table twelve.csv");
    REQUIRE(twelve.status == 0);
    CHECK(twelve.out.find("; key 69 (A4) sounds at 440.000000 Hz\n") != std::string::npos);
}

TEST_CASE("export writes nothing when any output fails its checks", "[export]") {
    const fs::path d = fresh_dir("none");
    SECTION("a scale/octave form for a 7-note scale") {
        Run r = run_terzo_in(d, "export seven.scl --table keys.csv --mts-bulk b.syx --mts-octave2 o2.syx");
        CHECK(r.status == 1);
        CHECK(r.out.empty());
        CHECK(
            r.err ==
            "--mts-octave2: error: the scale/octave forms carry 12 notes that repeat every octave; "
            "this tuning has 7 degrees; use --mts-bulk or --mts-note, which tune every key\n");
        CHECK_FALSE(fs::exists(d / "keys.csv"));
        CHECK_FALSE(fs::exists(d / "b.syx"));
    }
    SECTION("one target exists and --force is not given") {
        std::ofstream(d / "b.syx") << "old";
        Run r = run_terzo_in(d, "export seven.scl --table keys.csv --mts-bulk b.syx");
        CHECK(r.status == 1);
        CHECK(r.err == "b.syx: error: already exists and was not changed; give --force to replace "
                       "it (no file was "
                       "written)\n");
        CHECK_FALSE(fs::exists(d / "keys.csv"));
        CHECK(slurp(d / "b.syx") == "old");
        Run forced =
            run_terzo_in(d, "export seven.scl --table keys.csv --mts-bulk b.syx --force --ref-hz 264");
        CHECK(forced.status == 0);
        CHECK(slurp(d / "b.syx").size() == 408);
        // Key 24 is 264 * 7/4 / 64 = 7.22 Hz, below 8.1758; key 100 is 264 * 5/3 * 32 =
        // 14080 Hz, above 13289.66 (docs/references.md 6.3 computed range).
        CHECK(forced.out.find(
                  "Keys outside the MIDI Tuning Standard's 8.175799..13289.656616 Hz, sent as \"no "
                  "change\" in dumps and left out of single-note changes: 0-24, 100-127\n") !=
              std::string::npos);
    }
}

TEST_CASE("export rejects bad options with one message naming the option", "[export]") {
    const fs::path d = fresh_dir("options");
    const std::pair<const char*, const char*> cases[] = {
        {"export meantone.scl",
         "export: error: no output given; name at least one file with --scl, --mts-bulk, "
         "--mts-note, --mts-octave1, --mts-octave2, --mts-octave1-dump, --mts-octave2-dump, "
         "--smf or --table\n"},
        {"export meantone.scl --table t.txt",
         "--table: error: expected a file name ending in .csv or .json, found \"t.txt\"\n"},
        {"export meantone.scl --mts-bulk a.syx --mts-note ./a.syx",
         "--mts-note: error: \"./a.syx\" is also the file of --mts-bulk; give each output its own "
         "file (no file was "
         "written)\n"},
        {"export meantone.scl --pitch A4=415 --ref-hz 400 --table t.csv",
         "--ref-hz: error: give either --ref-hz (the root key's frequency) or --pitch (a named "
         "note's), not both\n"},
        {"export meantone.scl --ref-hz 0 --table t.csv",
         "--ref-hz: error: 0 Hz is outside the accepted range (above 0, at most 20000 "
         "Hz)\n"},
        {"export meantone.scl --pitch H4=440 --table t.csv",
         "--pitch: error: expected a note letter A to G in \"H4\"\n"},
        {"export meantone.scl --root-key 128 --table t.csv",
         "--root-key: error: 128 is outside 0..127\n"},
        {"export meantone.scl --device -1 --mts-bulk b.syx",
         "--device: error: -1 is outside 0..127\n"},
        {"export meantone.scl --program 200 --mts-bulk b.syx",
         "--program: error: 200 is outside 0..127\n"},
        {"export meantone.scl --bank 128 --mts-bulk b.syx",
         "--bank: error: 128 is outside 0..127\n"},
        {"export meantone.scl --bank -1 --mts-bulk b.syx", "--bank: error: -1 is outside 0..127\n"},
        {"export meantone.scl --name 12345678901234567 --mts-bulk b.syx",
         "--name: error: tuning name \"12345678901234567\" has 17 characters; the name field holds "
         "at most 16\n"},
        {"export meantone.scl --non-realtime --mts-note n.syx",
         "--non-realtime: error: the single-note tuning change without a bank (sub-ID 02) is "
         "real-time only; add "
         "--bank N to write the form with a bank (sub-ID 07)\n"},
        {"export meantone.scl --channels 0,3 --mts-octave1 o.syx",
         "--channels: error: channel 0 is outside 1..16\n"},
        {"export meantone.scl --channels 9-2 --mts-octave1 o.syx",
         "--channels: error: channel range 9-2 runs backwards\n"},
        {"export meantone.scl --channels x --mts-octave1 o.syx",
         "--channels: error: expected channel numbers 1..16 such as 1,2,10 or 1-16, found \"x\"\n"},
        {"export meantone.scl --mts-bulk missing/b.syx", ""}, // checked below: names the folder
        {"export nothing.scl --table t.csv",
         "nothing.scl: error: no such file (a TUNING is a .scl file or a recipe such as \"equal 12\")\n"},
        // One degree and a period of 9999999 cents: key 60 at 1 Hz, every other key beyond
        // any frequency.
        {"export huge.scl --ref-hz 1 --table t.csv --mts-note n.syx",
         "--mts-note: error: no key of this tuning lies in the MIDI Tuning Standard's "
         "8.175799..13289.656616 Hz, so there is nothing to send\n"},
        {"export huge.scl --mts-octave1 o.syx",
         "--mts-octave1: error: the scale/octave forms carry 12 notes that repeat every octave; "
         "this tuning has 1 degree; use --mts-bulk or --mts-note, which tune every key\n"},
    };
    for (auto [args, message] : cases) {
        INFO(args);
        Run r = run_terzo_in(d, args);
        CHECK(r.status == 1);
        CHECK(r.out.empty());
        if (*message)
            CHECK(r.err == message);
        else
            CHECK(r.err == "missing/b.syx: error: folder missing does not exist (no file was written)\n");
    }
    for (const char* f : {"t.csv", "t.txt", "a.syx", "b.syx", "n.syx", "o.syx"})
        CHECK_FALSE(fs::exists(d / f));
}

TEST_CASE("export killed mid-way leaves the old file intact", "[export]") {
    // strace stops terzo with SIGKILL on entering a system call of the write: fsync (the new
    // table is in the temporary file, not yet on disk) or rename (about to replace the old
    // file). Either way the old file must be untouched; only the hidden temporary file is
    // left behind, which a killed process cannot remove.
    if (terzo::test::run("strace -o /dev/null true").status != 0) {
        WARN("strace cannot trace here; the interrupted writer is tested in io/atomic_file only");
        return;
    }
    for (const char* call : {"fsync", "rename"}) {
        INFO(call);
        const fs::path d = fresh_dir(std::string("killed-") + call);
        std::ofstream(d / "keys.csv") << "my old table\n";
        const std::string strace = std::string("strace -f -o /dev/null -e trace=") + call +
                                   " -e inject=" + call + ":signal=KILL ";
        Run r = terzo::test::run("cd '" + d.string() + "' && " + strace + TERZO_CLI +
                                 " export seven.scl --table keys.csv --force");
        CHECK(r.status != 0);
        CHECK(r.out.empty());
        CHECK(slurp(d / "keys.csv") == "my old table\n");
        std::size_t temporaries = 0;
        for (const auto& e : fs::directory_iterator(d))
            if (e.path().filename().string().rfind(".keys.csv.tmp-", 0) == 0) {
                ++temporaries;
                CHECK(slurp(e.path()).rfind("key,", 0) == 0); // the new table got that far
            }
        CHECK(temporaries == 1);
        // The same run without the kill replaces the table.
        Run ok = run_terzo_in(d, "export seven.scl --table keys.csv --force");
        CHECK(ok.status == 0);
        CHECK(slurp(d / "keys.csv").rfind("key,", 0) == 0);
        fs::remove_all(d);
    }
}
