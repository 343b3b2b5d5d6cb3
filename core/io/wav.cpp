#include "core/io/wav.hpp"

#include <algorithm>
#include <cmath>
#include <cstring>
#include <fstream>
#include <iterator>

#include <sndfile.h>

#include "core/error.hpp"
#include "core/io/pcm.hpp"

namespace terzo {

namespace {

// A growable in-memory file for libsndfile's virtual I/O. libsndfile seeks back to the
// header when it closes a file to fill in the sizes, so writes may land anywhere.
struct MemoryFile {
    std::string bytes;
    sf_count_t pos = 0;
};

sf_count_t mem_length(void* user) {
    return sf_count_t(static_cast<MemoryFile*>(user)->bytes.size());
}

sf_count_t mem_seek(sf_count_t offset, int whence, void* user) {
    auto* m = static_cast<MemoryFile*>(user);
    sf_count_t base = whence == SEEK_SET   ? 0
                      : whence == SEEK_CUR ? m->pos
                                           : sf_count_t(m->bytes.size());
    if (base + offset < 0) return -1;
    m->pos = base + offset;
    return m->pos;
}

sf_count_t mem_read(void* ptr, sf_count_t count, void* user) {
    auto* m = static_cast<MemoryFile*>(user);
    sf_count_t available = std::max<sf_count_t>(0, sf_count_t(m->bytes.size()) - m->pos);
    sf_count_t n = std::min(count, available);
    if (n > 0) std::memcpy(ptr, m->bytes.data() + m->pos, std::size_t(n));
    m->pos += n;
    return n;
}

sf_count_t mem_write(const void* ptr, sf_count_t count, void* user) {
    auto* m = static_cast<MemoryFile*>(user);
    if (std::size_t(m->pos + count) > m->bytes.size()) m->bytes.resize(std::size_t(m->pos + count));
    std::memcpy(m->bytes.data() + m->pos, ptr, std::size_t(count));
    m->pos += count;
    return count;
}

sf_count_t mem_tell(void* user) {
    return static_cast<MemoryFile*>(user)->pos;
}

} // namespace

std::string sample_format_name(SampleFormat f) {
    return f == SampleFormat::int16 ? "int16" : "float32";
}

std::string encode_wav(const std::vector<double>& samples, const WavFormat& format) {
    SF_VIRTUAL_IO io{mem_length, mem_seek, mem_read, mem_write, mem_tell};
    MemoryFile file;
    SF_INFO info{};
    info.samplerate = format.sample_rate;
    info.channels = 1;
    info.format = SF_FORMAT_WAV | (format.sample_format == SampleFormat::int16 ? SF_FORMAT_PCM_16
                                                                               : SF_FORMAT_FLOAT);
    TERZO_ASSERT(sf_format_check(&info));
    SNDFILE* sf = sf_open_virtual(&io, SFM_WRITE, &info, &file);
    if (!sf) fail({"wav", 0, 0}, std::string("cannot encode: ") + sf_strerror(nullptr));
    // The float format's optional PEAK chunk carries a time stamp: leave it out so the same
    // render always gives the same bytes.
    sf_command(sf, SFC_SET_ADD_PEAK_CHUNK, nullptr, SF_FALSE);
    // 16-bit samples are converted here (to_pcm16 rounds to nearest; libsndfile's own
    // conversion rounds down), float samples by libsndfile (a plain narrowing to float).
    const sf_count_t written =
        format.sample_format == SampleFormat::int16
            ? sf_write_short(sf, to_pcm16(samples).data(), sf_count_t(samples.size()))
            : sf_write_double(sf, samples.data(), sf_count_t(samples.size()));
    const std::string problem = written == sf_count_t(samples.size()) ? "" : sf_strerror(sf);
    const int closed = sf_close(sf);
    if (!problem.empty() || closed != 0)
        fail({"wav", 0, 0},
             "cannot encode: " + (problem.empty() ? sf_error_number(closed) : problem));
    return std::move(file.bytes);
}

WavAudio decode_wav(const std::string& bytes, const std::string& source) {
    const SourcePos pos{source, 0, 0};
    // libsndfile reads through the same memory file as the encoder; it never writes here.
    MemoryFile file{bytes, 0};
    SF_VIRTUAL_IO io{mem_length, mem_seek, mem_read, mem_write, mem_tell};
    SF_INFO info{};
    SNDFILE* sf = sf_open_virtual(&io, SFM_READ, &info, &file);
    if (!sf)
        fail(pos, "not a WAV file terzo can read (RIFF/WAVE with integer or float samples)");
    struct Closer {
        SNDFILE* f;
        ~Closer() { sf_close(f); }
    } closer{sf};
    if ((info.format & SF_FORMAT_TYPEMASK) != SF_FORMAT_WAV &&
        (info.format & SF_FORMAT_TYPEMASK) != SF_FORMAT_WAVEX)
        fail(pos, "not a WAV file terzo can read (RIFF/WAVE with integer or float samples)");
    if (info.samplerate < min_read_rate || info.samplerate > max_read_rate)
        fail(pos, "sample rate " + std::to_string(info.samplerate) + " Hz is outside " +
                      std::to_string(min_read_rate) + ".." + std::to_string(max_read_rate) +
                      " Hz");
    if (info.channels < 1 || info.channels > 64)
        fail(pos, std::to_string(info.channels) + " channels; at most 64 are read");
    if (info.frames <= 0) fail(pos, "holds no samples");
    if (info.frames > max_read_frames)
        fail(pos, std::to_string(info.frames) + " frames is more than the " +
                      std::to_string(max_read_frames) + " read");
    // Integer samples come back scaled to +-1 (libsndfile divides by 2^(bits-1)); float
    // samples as stored. Read in blocks and mix the channels to their mean.
    WavAudio audio;
    audio.sample_rate = info.samplerate;
    audio.channels = info.channels;
    audio.samples.reserve(std::size_t(info.frames));
    const std::size_t channels = std::size_t(info.channels), block = 4096;
    std::vector<double> buffer(block * channels);
    for (;;) {
        const sf_count_t got = sf_readf_double(sf, buffer.data(), sf_count_t(block));
        if (got <= 0) break;
        for (sf_count_t f = 0; f < got; ++f) {
            double sum = 0;
            for (std::size_t c = 0; c < channels; ++c) sum += buffer[std::size_t(f) * channels + c];
            const double v = sum / double(channels);
            audio.samples.push_back(std::isfinite(v) ? v : 0.0);
        }
        if (audio.samples.size() > std::size_t(max_read_frames)) break;
    }
    if (audio.samples.empty()) fail(pos, "holds no samples");
    return audio;
}

WavAudio read_wav(const std::filesystem::path& path) {
    std::error_code ec;
    if (std::filesystem::is_directory(path, ec))
        fail({path.string(), 0, 0}, "is a folder, not a WAV file");
    if (!std::filesystem::exists(path, ec)) fail({path.string(), 0, 0}, "no such file");
    std::ifstream in(path, std::ios::binary);
    if (!in) fail({path.string(), 0, 0}, "cannot open the file for reading");
    const std::string bytes{std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>()};
    if (in.bad()) fail({path.string(), 0, 0}, "cannot read the file");
    return decode_wav(bytes, path.string());
}

void write_wav(const std::filesystem::path& path, const std::vector<double>& samples,
               const WavFormat& format, Overwrite overwrite) {
    const std::string bytes = encode_wav(samples, format);
    write_file_atomically(
        path, [&](std::ostream& out) { out.write(bytes.data(), std::streamsize(bytes.size())); },
        overwrite);
}

} // namespace terzo
