// Key maps end to end: a 9-, a 19- and a 31-note tuning laid on the keyboard in several ways
// by `terzo export`, and every output (bulk dump, single-note changes, the MIDI file holding
// them, the frequency table) decoded and compared with the keys' frequencies worked out here
// from the layouts' definitions, not from terzo's code.
#include <catch2/catch.hpp>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <functional>
#include <map>
#include <set>
#include <optional>

#include <nlohmann/json.hpp>

#include "tests/io/mts_reader.hpp"
#include "tests/io/smf_reader.hpp"
#include "tests/support/run.hpp"

namespace fs = std::filesystem;
using terzo::test::read_message;
using terzo::test::read_smf;
using terzo::test::run_terzo_in;
using terzo::test::slurp;

namespace {

// A 9-note just scale of our own (cents 0, 182.4, 203.9, 386.3, 498.0, 702.0, 884.4, 968.8,
// 1088.3).
const double nine_ratios[] = {1.0, 10.0 / 9, 9.0 / 8, 5.0 / 4, 4.0 / 3, 3.0 / 2, 5.0 / 3, 7.0 / 4, 15.0 / 8};

fs::path folder(const std::string& name) {
    fs::path d = terzo::test::temp_folder("key-map-test-" + name);
    std::ofstream(d / "nine.scl") << "! nine.scl\nnine just\n9\n10/9\n9/8\n5/4\n4/3\n3/2\n5/3\n7/4\n15/8\n2/1\n";
    return d;
}

std::vector<std::uint8_t> bytes(const fs::path& p) {
    const std::string s = slurp(p);
    return {s.begin(), s.end()};
}

// Splits a .syx file into its messages (F0 ... F7).
std::vector<std::vector<std::uint8_t>> messages(const std::vector<std::uint8_t>& b) {
    std::vector<std::vector<std::uint8_t>> out;
    for (std::size_t i = 0; i < b.size(); ++i) {
        if (b[i] == 0xF0) out.emplace_back();
        REQUIRE(!out.empty());
        out.back().push_back(b[i]);
    }
    return out;
}

// The step (degree number from the root key across periods) a key plays, or nullopt.
using Layout = std::function<std::optional<int>(int key)>;

long floor_div(long a, long b) {
    return a / b - ((a % b != 0) && ((a < 0) != (b < 0)));
}

bool black(int key) {
    const long pc = key - 12 * floor_div(key, 12);
    return pc == 1 || pc == 3 || pc == 6 || pc == 8 || pc == 10;
}

// A repeating pattern: per key of the repeat, a step or -1; each repeat adds `advance` steps.
Layout repeating(int root, std::vector<int> pattern, int advance) {
    return [=](int key) -> std::optional<int> {
        const long n = static_cast<long>(pattern.size());
        const long r = floor_div(key - root, n);
        const int e = pattern[static_cast<std::size_t>(key - root - r * n)];
        if (e < 0) return std::nullopt;
        return static_cast<int>(e + r * advance);
    };
}

// White keys counted from the root: the k-th white key above the root plays step k.
Layout white_keys(int root) {
    return [=](int key) -> std::optional<int> {
        if (black(key)) return std::nullopt;
        int step = 0;
        for (int k = root; k < key; ++k) step += !black(k);
        for (int k = key; k < root; ++k) step -= !black(k);
        return step;
    };
}

// Hz of a step: root_hz * degree ratio * 2^periods.
using Degrees = std::function<double(int degree)>; // ratio of degree 0..n-1
double step_hz(double root_hz, int step, int n, const Degrees& ratio) {
    const long p = floor_div(step, n);
    return root_hz * ratio(static_cast<int>(step - p * n)) * std::exp2(static_cast<double>(p));
}

double cents(double a, double b) {
    return 1200.0 * std::log2(a / b);
}

double twelve_tet(int key) {
    return 440.0 * std::exp2((key - 69) / 12.0);
}

// Runs export with every key-based output and checks each against the expected keys.
void check_export(const fs::path& d, const std::string& args, const Layout& layout, int n,
                  const Degrees& ratio, double root_hz) {
    for (const char* f : {"bulk.syx", "note.syx", "tuning.mid", "keys.json", "map.json", "again.json"})
        fs::remove(d / f);
    const auto r = run_terzo_in(d, "export " + args +
                                       " --mts-bulk bulk.syx --mts-note note.syx --smf tuning.mid "
                                       "--table keys.json --save-key-map map.json");
    INFO("export " << args << "\n" << r.out << r.err);
    REQUIRE(r.status == 0);

    // What each key should play, from the layout's definition.
    std::map<int, double> expected; // sounding keys within the MIDI Tuning Standard's range
    std::set<int> sounding;
    for (int key = 0; key <= 127; ++key) {
        if (auto step = layout(key)) {
            sounding.insert(key);
            const double hz = step_hz(root_hz, *step, n, ratio);
            // The standard's range: key 0 of 12-TET at A4 = 440 (00 00 00) to 7F 7F 7E.
            if (hz >= twelve_tet(0) * (1 - 1e-12) && hz <= 13289.656) expected[key] = hz;
        }
    }
    REQUIRE(expected.size() > 40);
    auto same_keys = [&](const std::map<int, double>& decoded, const char* what) {
        INFO(what);
        REQUIRE(decoded.size() == expected.size());
        for (const auto& [key, hz] : expected) {
            INFO("key " << key);
            REQUIRE(decoded.count(key) == 1);
            // Resolution 100/16384 c, rounded to nearest: within 0.0031 c.
            CHECK(std::fabs(cents(decoded.at(key), hz)) < 0.0031);
        }
    };

    const auto bulk = messages(bytes(d / "bulk.syx"));
    REQUIRE(bulk.size() == 1);
    const auto dump = read_message(bulk[0]);
    CHECK(dump.checksum_ok);
    same_keys(dump.key_hz, "bulk dump");

    std::map<int, double> changes;
    for (const auto& m : messages(bytes(d / "note.syx")))
        for (const auto& kv : read_message(m).key_hz) changes.insert(kv);
    same_keys(changes, "single-note changes");

    const auto smf = read_smf(bytes(d / "tuning.mid"));
    REQUIRE(smf.sysex.size() == 1 + messages(bytes(d / "note.syx")).size());
    same_keys(read_message(smf.sysex[0]).key_hz, "bulk dump in the MIDI file");

    const auto table = nlohmann::json::parse(slurp(d / "keys.json"));
    REQUIRE(table["keys"].size() == 128);
    for (const auto& k : table["keys"]) {
        const int key = k["key"].get<int>();
        INFO("table key " << key);
        CHECK(k["sounds"].get<bool>() == (sounding.count(key) == 1));
        if (sounding.count(key))
            CHECK(std::fabs(cents(k["hz"].get<double>(), step_hz(root_hz, *layout(key), n, ratio))) < 1e-9);
    }

    // The saved key map gives the same table when read back.
    const auto again = run_terzo_in(d, "export " + args.substr(0, args.find(" --")) +
                                           " --key-map map.json --table again.json");
    INFO(again.err);
    REQUIRE(again.status == 0);
    CHECK(slurp(d / "again.json") == slurp(d / "keys.json"));
}

Degrees just_nine = [](int d) { return nine_ratios[d]; };
Degrees equal(int n) {
    return [n](int d) { return std::exp2(static_cast<double>(d) / n); };
}

} // namespace

TEST_CASE("a 9-note scale is exported on every key, the white keys, twelve by pitch and a pattern", "[key_map]") {
    const fs::path d = folder("nine");
    SECTION("every key from key 60 at its 12-TET pitch") {
        check_export(d, "nine.scl --layout every-key", repeating(60, {0, 1, 2, 3, 4, 5, 6, 7, 8}, 9),
                     9, just_nine, twelve_tet(60));
    }
    SECTION("white keys from D3, with A4 = 415") {
        // A4 is the 11th white key above D3: step 11, degree 2 (9/8) one period up.
        REQUIRE(*white_keys(50)(69) == 11);
        check_export(d, "nine.scl --layout white-keys --root-key 50 --pitch A4=415", white_keys(50), 9,
                     just_nine, 415.0 / (9.0 / 8 * 2));
    }
    SECTION("twelve by pitch: 10/9 and 9/8 both near key 2 take keys 1 and 2") {
        // Cents / 100: 1.82 2.04 3.86 4.98 7.02 8.84 9.69 10.88; degree 1 cannot share key 0,
        // and keys 1, 2 (0.82 + 0.04 off) beat 2, 3 (0.18 + 0.96 off).
        check_export(d, "nine.scl --layout twelve-by-pitch --ref-hz 200",
                     repeating(60, {0, 1, 2, -1, 3, 4, -1, 5, -1, 6, 7, 8}, 9), 9, just_nine, 200.0);
    }
    SECTION("a pattern of one's own: five degrees on five keys, then a silent key") {
        check_export(d, "nine.scl --pattern \"0 2 3 5 7 x\" --degrees-per-repeat 9 --root-key 48",
                     repeating(48, {0, 2, 3, 5, 7, -1}, 9), 9, just_nine, twelve_tet(48));
    }
}

TEST_CASE("a 19-note scale is exported on every key, 24 keys a period and the white keys", "[key_map]") {
    const fs::path d = folder("nineteen");
    SECTION("every key") {
        check_export(d, "\"equal 19\" --root-key 41", repeating(41, [] {
                         std::vector<int> p;
                         for (int i = 0; i < 19; ++i) p.push_back(i);
                         return p;
                     }(), 19), 19, equal(19), twelve_tet(41));
    }
    SECTION("24 keys a period, the five above the top degree silent") {
        std::vector<int> p(24, -1);
        for (int i = 0; i < 19; ++i) p[static_cast<std::size_t>(i)] = i;
        check_export(d, "\"equal 19\" --keys-per-period 24 --root-key 36", repeating(36, p, 19), 19,
                     equal(19), twelve_tet(36));
    }
    SECTION("white keys") {
        check_export(d, "\"equal 19\" --layout white-keys --root-key 48", white_keys(48), 19,
                     equal(19), twelve_tet(48));
    }
}

TEST_CASE("a 31-note scale is exported on every key, the white keys and a key-map file", "[key_map]") {
    const fs::path d = folder("thirtyone");
    SECTION("every key") {
        std::vector<int> p;
        for (int i = 0; i < 31; ++i) p.push_back(i);
        check_export(d, "\"equal 31\" --root-key 40 --ref-hz 110", repeating(40, p, 31), 31, equal(31), 110.0);
    }
    SECTION("white keys") {
        check_export(d, "\"equal 31\" --layout white-keys", white_keys(60), 31, equal(31), twelve_tet(60));
    }
    SECTION("seven keys a period from a key-map file") {
        // The diatonic degrees of 31 (0 5 10 13 18 23 28) on seven consecutive keys.
        std::ofstream(d / "seven.json")
            << "{\"format\": \"terzo-key-map\", \"version\": 1, \"root_key\": 57, \"reference\": "
               "{\"key\": 57, \"hz\": 220}, \"layout\": \"pattern\", \"pattern\": [0, 5, 10, 13, 18, "
               "23, 28], \"degree_order\": \"pitch\"}";
        check_export(d, "\"equal 31\" --key-map seven.json", repeating(57, {0, 5, 10, 13, 18, 23, 28}, 31),
                     31, equal(31), 220.0);
    }
}

TEST_CASE("a scale written out of order is sorted for the keyboard, with a warning naming the line", "[key_map]") {
    const fs::path d = folder("order");
    std::ofstream(d / "odd.scl") << "! odd.scl\nodd\n!\n4\n5/4\n9/8\n3/2\n2/1\n";
    auto r = run_terzo_in(d, "export odd.scl --ref-hz 200 --table keys.csv");
    REQUIRE(r.status == 0);
    CHECK(r.err == "odd.scl:6: warning: degree 2 (9/8) is lower than degree 1 (5/4)\n"
                   "odd.scl: note: the key map sorts the degrees by pitch inside the period "
                   "(--keep-order keeps the order written)\n");
    const std::string csv = slurp(d / "keys.csv");
    CHECK(csv.find("\n61,,1,0,225.000000,") != std::string::npos); // 9/8 on the key after the root
    r = run_terzo_in(d, "export odd.scl --ref-hz 200 --table kept.csv --keep-order");
    REQUIRE(r.status == 0);
    CHECK(slurp(d / "kept.csv").find("\n61,,1,0,250.000000,") != std::string::npos);
}

TEST_CASE("render sounds MIDI keys through the key map", "[key_map]") {
    const fs::path d = folder("render");
    // Keys 60 64 67 of the pattern "0 x 5 x 10 13 x 18" on 31 equal steps play steps 0 10 18:
    // 261.626 Hz (key 60 at its 12-TET pitch) times 2^(10/31) and 2^(18/31).
    const auto r = run_terzo_in(d, "render \"equal 31\" --pattern \"0 x 5 x 10 13 x 18 x 23 x 28\" "
                                   "--keys 60,64,67 --model none --seconds 0.5 --out triad.wav");
    INFO(r.err);
    REQUIRE(r.status == 0);
    const double root = twelve_tet(60);
    char expected[200];
    std::snprintf(expected, sizeof expected,
                  " 60       0  %.3f\n 64      10  %.3f\n 67      18  %.3f\n", root,
                  root * std::exp2(10.0 / 31), root * std::exp2(18.0 / 31));
    CHECK(r.out.find(expected) != std::string::npos);
    CHECK(fs::file_size(d / "triad.wav") > 1000);
}
