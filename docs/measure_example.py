#!/usr/bin/env python3
"""Writes the example recording of docs/measure.md: the temperament octave F3..F4 of a
harpsichord-like instrument in Werckmeister III at A4 = 415 Hz, three notes mistuned
(G3 +4 cents, C#4 -6 cents, E4 +3 cents). Each note is 12 partials at the stiff-string
frequencies f_k = k f0 sqrt(1 + B k^2) with B = 1e-4, decaying (higher partials faster),
with a short burst of noise at the pluck and steady noise 50 dB under the peak. Standard
library only. Usage: python3 measure_example.py OUT.wav"""
import math
import random
import struct
import sys
import wave

RATE = 44100
B = 1e-4
# Werckmeister III, cents above C (docs/references.md section 2): C C# D Eb E F F# G G# A Bb B
CENTS = [0.0, 90.225, 192.180, 294.135, 390.225, 498.045, 588.270, 696.090, 792.180,
         888.270, 996.090, 1092.180]
C4 = 415.0 / 2 ** (CENTS[9] / 1200)
MISTUNED = {(7, 3): 4.0, (1, 4): -6.0, (4, 4): 3.0}  # (pitch class, octave): cents


def hz(pitch_class, octave):
    f = C4 * 2 ** (octave - 4) * 2 ** (CENTS[pitch_class] / 1200)
    return f * 2 ** (MISTUNED.get((pitch_class, octave), 0.0) / 1200)


def main():
    random.seed(1)
    notes = [(pc, 3) for pc in range(5, 12)] + [(pc, 4) for pc in range(0, 6)]  # F3..F4
    length, gap = 0.8, 0.15
    out = [0.0] * int(RATE * (0.3 + len(notes) * (length + gap) + 0.3))
    start = 0.3
    for pc, octave in notes:
        f1 = hz(pc, octave)
        f0 = f1 / math.sqrt(1 + B)
        a = int(start * RATE)
        n = int(length * RATE)
        for k in range(1, 13):
            fk = k * f0 * math.sqrt(1 + B * k * k)
            amp, tau = 0.25 / k, 1.2 / (1 + 0.2 * (k - 1))
            w, ph = 2 * math.pi * fk / RATE, random.uniform(0, 2 * math.pi)
            for i in range(n):
                env = amp * math.exp(-i / RATE / tau) * min(1.0, i / (0.002 * RATE))
                env *= min(1.0, (n - i) / (0.03 * RATE))  # the damper
                out[a + i] += env * math.cos(w * i + ph)
        for i in range(int(0.02 * RATE)):  # the pluck
            out[a + i] += 0.03 * math.exp(-i / (0.004 * RATE)) * random.gauss(0, 1)
        start += length + gap
    peak = max(abs(v) for v in out)
    noise = peak * 10 ** (-50 / 20)
    frames = b"".join(struct.pack("<h", max(-32768, min(32767, round(
        (v + noise * random.gauss(0, 1)) / peak * 0.5 * 32767)))) for v in out)
    with wave.open(sys.argv[1], "wb") as w:
        w.setnchannels(1)
        w.setsampwidth(2)
        w.setframerate(RATE)
        w.writeframes(frames)


if __name__ == "__main__":
    main()
