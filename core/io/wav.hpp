// WAV files (the open RIFF/WAVE format). Writing: mono, 16-bit integer or 32-bit float
// samples, encoded by libsndfile into memory, then written atomically. Reading: 8/16/24/32-bit
// integer or 32/64-bit float, any channel count, decoded by libsndfile and mixed to mono.
#pragma once

#include <filesystem>
#include <string>
#include <vector>

#include "core/io/atomic_file.hpp"

namespace terzo {

enum class SampleFormat { int16, float32 };

/// How samples are stored.
struct WavFormat {
    int sample_rate = 48000;
    SampleFormat sample_format = SampleFormat::int16;
};

/// Text of a sample format as the command line spells it: "int16" or "float32".
std::string sample_format_name(SampleFormat f);

/// The bytes of a mono WAV file holding the samples. Full scale is +-1; int16 samples are
/// to_pcm16(x) (core/io/pcm.hpp), float32 samples are x rounded to float.
std::string encode_wav(const std::vector<double>& samples, const WavFormat& format);
/// Writes the samples as a WAV file through write_file_atomically; throws InputError.
void write_wav(const std::filesystem::path& path, const std::vector<double>& samples,
               const WavFormat& format, Overwrite overwrite = Overwrite::refuse);

/// Sound read from a WAV file, mixed to one channel (the mean of the channels), full scale +-1.
struct WavAudio {
    int sample_rate = 0;
    int channels = 0;             ///< in the file
    std::vector<double> samples; ///< one per frame
    double seconds() const { return sample_rate > 0 ? double(samples.size()) / sample_rate : 0.0; }
};

/// Lowest and highest sample rate read (Hz); other rates are refused.
inline constexpr int min_read_rate = 8000, max_read_rate = 384000;
/// Most frames read (about 46 minutes at 48 kHz); longer files are refused.
inline constexpr long long max_read_frames = 1LL << 27;

/// Decodes the bytes of a WAV file; InputError at `source` for anything that is not a WAV file
/// libsndfile can read, a sample rate outside min_read_rate..max_read_rate, no frames, more
/// than max_read_frames, or more than 64 channels.
WavAudio decode_wav(const std::string& bytes, const std::string& source);
/// Reads and decodes a WAV file; InputError naming the path when it cannot be read.
WavAudio read_wav(const std::filesystem::path& path);

} // namespace terzo
