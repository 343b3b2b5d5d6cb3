// Samples as 16-bit integers: the one conversion used both by the WAV writer's int16 format
// and by playback through audio libraries that take 16-bit samples, so what is played is
// exactly what is written.
#pragma once

#include <cstdint>
#include <vector>

namespace terzo {

/// x * 32768 rounded to the nearest integer (halves to even), clipped to -32768..32767.
std::vector<std::int16_t> to_pcm16(const std::vector<double>& samples);

} // namespace terzo
