// WAV encoding checked by independent readers: Python's wave module (16-bit integer files)
// and sox (both formats; `sox --i` prints header fields one at a time).
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>
#include <unistd.h>
#include <vector>

#include "core/error.hpp"
#include "core/io/wav.hpp"
#include "tests/support/run.hpp"

using namespace terzo;
namespace fs = std::filesystem;

namespace {

std::vector<double> test_signal(std::size_t n) {
    std::vector<double> x(n);
    for (std::size_t i = 0; i < n; ++i)
        x[i] = 0.5 * std::sin(2 * M_PI * 440.0 * double(i) / 44100.0);
    return x;
}

// The ids of a RIFF file's chunks after the "WAVE" form type, in order (RIFF: each chunk is
// a four-letter id, a little-endian 32-bit size and the data, padded to an even size).
std::vector<std::string> chunk_ids(const std::string& riff) {
    std::vector<std::string> ids;
    std::size_t at = 12;
    while (at + 8 <= riff.size()) {
        ids.push_back(riff.substr(at, 4));
        std::uint32_t size = 0;
        for (int i = 3; i >= 0; --i) size = size << 8 | std::uint8_t(riff[at + 4 + std::size_t(i)]);
        at += 8 + size + (size & 1);
    }
    return ids;
}

} // namespace

TEST_CASE("a 16-bit WAV file reads back in Python's wave module with the same header and samples",
          "[wav]") {
    test::ScratchFolder dir("wav");
    const fs::path file = dir.path / "tone.wav";
    std::vector<double> x = test_signal(1000);
    x[1] = 1.5;  // clipped to the largest value
    x[2] = -1.5; // clipped to the smallest value
    x[3] = 0.25;
    write_wav(file, x, WavFormat{44100, SampleFormat::int16});
    const std::string py = "import wave, struct\n"
                           "w = wave.open('" +
                           file.string() +
                           "', 'rb')\n"
                           "n = w.getnframes()\n"
                           "s = struct.unpack('<%dh' % n, w.readframes(n))\n"
                           "print(w.getnchannels(), w.getsampwidth(), w.getframerate(), n, "
                           "w.getcomptype(), s[0], s[1], s[2], s[3], s[10])\n";
    std::ofstream(dir.path / "read.py") << py;
    const std::string got =
        test::output_of("python3 '" + (dir.path / "read.py").string() + "'");
    // Expected sample values: x * 32768 rounded to nearest (not at a half here, so lround
    // agrees); 0.25 becomes 8192 and clipping pins +-1.5 to 32767 and -32768.
    const long s10 = std::lround(0.5 * std::sin(2 * M_PI * 440.0 * 10 / 44100.0) * 32768.0);
    CHECK(got == "1 2 44100 1000 NONE 0 32767 -32768 8192 " + std::to_string(s10));
}

TEST_CASE("a float WAV file reads back in sox with the same header", "[wav]") {
    test::ScratchFolder dir("wav");
    const fs::path file = dir.path / "tone.wav";
    write_wav(file, test_signal(4800), WavFormat{48000, SampleFormat::float32});
    const auto field = [&](const char* flag) {
        return test::output_of(std::string("sox --i ") + flag + " '" + file.string() + "'");
    };
    CHECK(field("-c") == "1");
    CHECK(field("-r") == "48000");
    CHECK(field("-s") == "4800");
    CHECK(field("-b") == "32");
    CHECK(field("-e") == "Floating Point PCM");
    CHECK(field("-t") == "wav");
}

TEST_CASE("sox reads a 16-bit file's header the same way", "[wav]") {
    test::ScratchFolder dir("wav");
    const fs::path file = dir.path / "tone.wav";
    write_wav(file, test_signal(44100), WavFormat{44100, SampleFormat::int16});
    CHECK(test::output_of("sox --i -r '" + file.string() + "'") == "44100");
    CHECK(test::output_of("sox --i -s '" + file.string() + "'") == "44100");
    CHECK(test::output_of("sox --i -e '" + file.string() + "'") == "Signed Integer PCM");
    CHECK(test::output_of("sox --i -b '" + file.string() + "'") == "16");
    CHECK(test::output_of("sox --i -D '" + file.string() + "'") == "1.000000");
}

TEST_CASE("encoding the same samples twice gives the same bytes", "[wav]") {
    const auto x = test_signal(500);
    for (auto f : {SampleFormat::int16, SampleFormat::float32})
        CHECK(encode_wav(x, WavFormat{48000, f}) == encode_wav(x, WavFormat{48000, f}));
    // Two encodings within the same second cannot show a time stamp, so check for the chunk
    // that would carry one: libsndfile's PEAK chunk (a write time and each channel's peak)
    // must be absent. A float file has "fact" (required for non-PCM data by the WAVE format)
    // and libsndfile's "PAD " filler, which holds zeros.
    CHECK(chunk_ids(encode_wav(x, WavFormat{48000, SampleFormat::int16})) ==
          std::vector<std::string>{"fmt ", "data"});
    CHECK(chunk_ids(encode_wav(x, WavFormat{48000, SampleFormat::float32})) ==
          std::vector<std::string>{"fmt ", "fact", "PAD ", "data"});
    // RIFF header: 44 bytes for 16-bit PCM, then two bytes per sample.
    const std::string b = encode_wav(x, WavFormat{48000, SampleFormat::int16});
    CHECK(b.size() == 44 + 2 * 500);
    CHECK(b.substr(0, 4) == "RIFF");
    CHECK(b.substr(8, 4) == "WAVE");
}

TEST_CASE("a WAV file is not overwritten unless asked", "[wav]") {
    test::ScratchFolder dir("wav");
    const fs::path file = dir.path / "tone.wav";
    write_wav(file, test_signal(100), WavFormat{});
    const auto size = fs::file_size(file);
    REQUIRE_THROWS_WITH(write_wav(file, test_signal(200), WavFormat{}),
                        file.string() + ": error: already exists and was not changed (allow "
                                        "overwriting to replace it)");
    CHECK(fs::file_size(file) == size);
    write_wav(file, test_signal(200), WavFormat{}, Overwrite::allow);
    CHECK(fs::file_size(file) == 44 + 2 * 200);
}

TEST_CASE("sample formats have the command line's names", "[wav]") {
    CHECK(sample_format_name(SampleFormat::int16) == "int16");
    CHECK(sample_format_name(SampleFormat::float32) == "float32");
}

TEST_CASE("a 24-bit stereo file written by Python's wave module reads back mixed to mono",
          "[wav]") {
    // Python's wave module writes the file (an independent writer); each frame holds left =
    // i * 1000 and right = -i * 500 as 24-bit integers, so the mean is i * 250 / 2^23.
    test::ScratchFolder dir("wav");
    const fs::path file = dir.path / "stereo.wav";
    const std::string py = "import wave\n"
                           "w = wave.open('" + file.string() + "', 'wb')\n"
                           "w.setnchannels(2); w.setsampwidth(3); w.setframerate(96000)\n"
                           "b = bytearray()\n"
                           "for i in range(2000):\n"
                           "    b += (i * 1000).to_bytes(3, 'little', signed=True)\n"
                           "    b += (-i * 500).to_bytes(3, 'little', signed=True)\n"
                           "w.writeframes(bytes(b)); w.close()\n";
    std::ofstream(dir.path / "write.py") << py;
    REQUIRE(test::run("python3 '" + (dir.path / "write.py").string() + "'").status == 0);
    const WavAudio a = read_wav(file);
    CHECK(a.sample_rate == 96000);
    CHECK(a.channels == 2);
    REQUIRE(a.samples.size() == 2000);
    for (std::size_t i : {std::size_t(0), std::size_t(1), std::size_t(777), std::size_t(1999)})
        CHECK(a.samples[i] == Approx(double(i) * 250.0 / 8388608.0).margin(1e-12));
    CHECK(a.seconds() == Approx(2000.0 / 96000.0));
}

TEST_CASE("16-bit and float files read back as written", "[wav]") {
    const auto x = test_signal(3000);
    const WavAudio f = decode_wav(encode_wav(x, WavFormat{44100, SampleFormat::float32}), "f.wav");
    CHECK(f.sample_rate == 44100);
    CHECK(f.channels == 1);
    REQUIRE(f.samples.size() == x.size());
    for (std::size_t i = 0; i < x.size(); i += 97) CHECK(f.samples[i] == Approx(x[i]).margin(1e-7));
    const WavAudio s = decode_wav(encode_wav(x, WavFormat{22050, SampleFormat::int16}), "s.wav");
    CHECK(s.sample_rate == 22050);
    REQUIRE(s.samples.size() == x.size());
    // to_pcm16 rounds x * 32768 to nearest; reading divides by 32768.
    for (std::size_t i = 0; i < x.size(); i += 97)
        CHECK(s.samples[i] == Approx(std::lround(x[i] * 32768.0) / 32768.0).margin(1e-12));

    SECTION("bad files are refused with the file's name") {
        CHECK_THROWS_WITH(decode_wav("RIFF....WAVEjunk", "x.wav"),
                          "x.wav: error: not a WAV file terzo can read (RIFF/WAVE with integer or float samples)");
        CHECK_THROWS_WITH(decode_wav(encode_wav(x, WavFormat{4000, SampleFormat::int16}), "low.wav"),
                          "low.wav: error: sample rate 4000 Hz is outside 8000..384000 Hz");
        CHECK_THROWS_WITH(read_wav(fs::path("/nonexistent/x.wav")), "/nonexistent/x.wav: error: no such file");
    }
}
