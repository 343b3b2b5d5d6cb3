// WAV files (the open RIFF/WAVE format), mono, 16-bit integer or 32-bit float samples.
// Encoding is done by libsndfile into memory; the file is then written atomically.
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

} // namespace terzo
