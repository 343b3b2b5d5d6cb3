#!/usr/bin/env python3
"""Independent cross-check of `terzo resultants --json` with Python's fractions module.

Usage: crosscheck_resultants.py TERZO_CLI SCALE.scl [terzo options...]

Reads the .scl file itself (ratios only), rebuilds the keyboard as exact Fractions, lists
every combination tone a*i*f_low + b*j*f_high > 0 of every dyad, finds each tone's nearest
note of the scale over all periods and decides coincidence with Fraction equality, then
compares all of it with terzo's JSON. With --chord it also checks the common resultant
bass as gcd(numerators) / lcm(denominators). Exit status 0 when everything agrees.
"""
import json
import math
import subprocess
import sys
from fractions import Fraction


def read_scl(path):
    lines = [l.rstrip("\r\n") for l in open(path, encoding="ascii")]
    body = [l for l in lines if not l.startswith("!")]
    count = int(body[1].split()[0])
    pitches = []
    for l in body[2:2 + count]:
        tok = l.split()[0]
        if "." in tok:
            sys.exit(f"{path}: cents value {tok}: this check needs ratios only")
        pitches.append(Fraction(tok))
    return [Fraction(1)] + pitches[:-1], pitches[-1]


def option(args, name, default, kind):
    return kind(args[args.index(name) + 1]) if name in args else default


def log2_fraction(f):
    # Exact-enough log2 of a Fraction of any size: integer bit lengths plus a float mantissa.
    def log2_int(n):
        b = n.bit_length()
        if b <= 1000:
            return math.log2(n)
        return math.log2(n >> (b - 60)) + (b - 60)
    return log2_int(f.numerator) - log2_int(f.denominator)


def fail(msg):
    print("MISMATCH:", msg)
    sys.exit(1)


def main():
    cli, scl, args = sys.argv[1], sys.argv[2], sys.argv[3:]
    degrees, period = read_scl(scl)
    span = option(args, "--span", 1, int)
    order = option(args, "--order", 3, int)
    partials = option(args, "--partials", 1, int)
    ref_hz = option(args, "--ref-hz", 261.6255653, float)
    out = subprocess.run([cli, "resultants", scl, "--json"] + args, capture_output=True, text=True)
    if out.returncode != 0:
        fail(f"terzo exited with {out.returncode}: {out.stderr}")
    doc = json.loads(out.stdout)

    size = len(degrees)
    cents = [1200 * log2_fraction(d) for d in degrees]
    pc = 1200 * log2_fraction(period)

    def note(d, p):
        return degrees[d] * period ** p

    def nearest(f):
        c = 1200 * log2_fraction(f)
        best = None
        for d in range(size):
            k0 = math.floor((c - cents[d]) / pc)
            for k in (k0 - 1, k0, k0 + 1, k0 + 2):
                nc = cents[d] + k * pc
                key = (abs(c - nc), nc, d)  # nearer first; on a tie the lower note
                if best is None or key < best[0]:
                    best = (key, d, k, c - nc)
        _, d, k, dev = best
        exact = f == note(d, k)
        return d, k, (0.0 if exact else dev), exact

    if "--chord" in args:
        items = option(args, "--chord", "", str).split(",")
        chord = []
        for it in items:
            if "/" in it:
                chord.append(Fraction(it))
            else:
                n = int(it)
                chord.append(note(n % size, n // size))
        g = 0
        l = 1
        for f in chord:
            g = math.gcd(g, f.numerator)
            l = math.lcm(l, f.denominator)
        bass = Fraction(g, l)
        cb = doc["chord"]["common_bass"]
        want = f"{bass.numerator}/{bass.denominator}"
        if cb["ratio"] != want or cb["approximate"]:
            fail(f"common bass {cb['ratio']} (approximate {cb['approximate']}), expected {want}")
        mult = [str(f / bass) for f in chord]
        if sorted(map(int, cb["multiples"])) != sorted(map(int, mult)):
            fail(f"bass multiples {cb['multiples']}, expected {mult}")
        d, k, dev, exact = nearest(bass)
        lb = cb["landing"]
        if (lb["degree"], lb["period"], lb["exact"]) != (d, k, exact):
            fail(f"bass landing {lb}, expected {(d, k, exact)}")
        pairs = []
        notes = sorted(chord)
        for i in range(len(notes)):
            for j in range(i + 1, len(notes)):
                if notes[i] != notes[j]:
                    pairs.append((notes[i], notes[j]))
    else:
        keys = [(d, p) for p in range(span) for d in range(size)] + [(0, span)]
        fr = [note(d, p) for d, p in keys]
        pairs = []
        for i in range(len(fr)):
            for j in range(i + 1, len(fr)):
                if fr[i] == fr[j]:
                    continue
                pairs.append((min(fr[i], fr[j]), max(fr[i], fr[j])))

    dyads = doc["dyads"]
    if len(dyads) != len(pairs):
        fail(f"{len(dyads)} dyads, expected {len(pairs)}")
    checked = 0
    for (lo, hi), dy in zip(pairs, dyads):
        if dy["low"]["ratio"] != f"{lo.numerator}/{lo.denominator}" or \
           dy["high"]["ratio"] != f"{hi.numerator}/{hi.denominator}":
            fail(f"dyad {dy['low']['ratio']} {dy['high']['ratio']}, expected {lo} {hi}")
        expected = {}
        for i in range(1, partials + 1):
            for j in range(1, partials + 1):
                for n in range(2, order + 1):
                    for a in range(-(n - 1), n):
                        if a == 0:
                            continue
                        for b in {n - abs(a), -(n - abs(a))}:
                            f = a * i * lo + b * j * hi
                            if f > 0:
                                expected[(a, b, i, j)] = f
        got = {(t["a"], t["b"], t["low_partial"], t["high_partial"]): t for t in dy["tones"]}
        if set(got) != set(expected):
            fail(f"dyad {lo}-{hi}: terms {sorted(set(got) ^ set(expected))} differ")
        for key, f in expected.items():
            t = got[key]
            want = f"{f.numerator}/{f.denominator}"
            if t["ratio"] != want:
                fail(f"dyad {lo}-{hi} term {key}: ratio {t['ratio']}, expected {want}")
            if abs(t["hz"] / (ref_hz * float(f)) - 1) > 1e-12:
                fail(f"dyad {lo}-{hi} term {key}: {t['hz']} Hz, expected {ref_hz * float(f)}")
            d, k, dev, exact = nearest(f)
            la = t["landing"]
            if (la["degree"], la["period"], la["exact"]) != (d, k, exact):
                fail(f"dyad {lo}-{hi} term {key}: landing {la}, expected {(d, k, dev, exact)}")
            if abs(la["deviation_cents"] - dev) > 1e-6:
                fail(f"dyad {lo}-{hi} term {key}: deviation {la['deviation_cents']}, expected {dev}")
            checked += 1
    print(f"ok: {checked} tones of {len(pairs)} dyads agree with fractions.Fraction")


if __name__ == "__main__":
    main()
