#!/usr/bin/env python3
"""The plain peer of `terzo resultants SCALE.scl --order N --span S --json`: the same tones,
computed the obvious way with Python's fractions module, written as the same compact JSON.

Usage: resultants_peer.py SCALE.scl [--order N] [--span S] [--ref-hz HZ] > out.json

Every note is a Fraction; every combination tone a*f_low + b*f_high of every dyad is a
Fraction; its nearest note is found by bisection in cents and "lands exactly" is Fraction
equality. Audibility and Helmholtz levels follow core/analysis/audibility.cpp and
combination.cpp. Pure tones only (no --partials, no --chord). docs/resultants.md says how it is timed
against terzo.
"""
import bisect
import json
import math
import sys
from fractions import Fraction


def read_scl(path):
    lines = [l.rstrip("\r\n") for l in open(path, encoding="ascii")]
    body = [l for l in lines if not l.startswith("!")]
    count = int(body[1].split()[0])
    pitches = [Fraction(l.split()[0]) for l in body[2:2 + count]]
    return body[0].strip(), [Fraction(1)] + pitches[:-1], pitches[-1]


def option(args, name, default, kind):
    return kind(args[args.index(name) + 1]) if name in args else default


def ratio_text(f):
    return f"{f.numerator}/{f.denominator}"


def terms(order):
    out = []
    for n in range(2, order + 1):
        for a in range(n - 1, -n, -1):
            if a == 0:
                continue
            m = n - abs(a)
            out.append((a, m))
            if a > 0:
                out.append((a, -m))
    return out


def term_name(a, b):
    if (a, b) == (-1, 1):
        return "difference tone"
    if (a, b) == (2, -1):
        return "cubic difference tone"
    if (a, b) == (1, 1):
        return "summation tone"

    def coef(c, letter, first):
        s = "-" if c < 0 else ("" if first else "+")
        return s + ("" if abs(c) == 1 else str(abs(c))) + letter

    if a < 0 < b:
        return coef(b, "H", True) + coef(a, "L", False)
    return coef(a, "L", True) + coef(b, "H", False)


def audibility(a, b, fl, fh):
    r = fh / fl
    if b < 0 and a == 1 - b:
        k = -b
        by_ratio = 1.0 if r <= 1.2 else 0.0 if r >= 1.5 else (1.5 - r) / 0.3
        return by_ratio * max(0.0, 1.0 - (k - 1) / 6.0)
    if (a, b) == (-1, 1):
        return 0.5
    if (a, b) == (1, 1):
        return 0.1
    return 0.05 / max(1, abs(a) + abs(b) - 2)


def helmholtz(fl, fh, order):
    out = {}
    seen = {(-1, 1)}
    level = [(-1, 1)]
    k = 1
    scale = fl + fh
    while level:
        nxt = []
        for a, b in level:
            out[(a, b)] = k
            v = a * fl + b * fh
            for pa, pb in ((1, 0), (0, 1)):
                pv = pa * fl + pb * fh
                if abs(v - pv) <= 1e-9 * scale:
                    continue
                d = (a - pa, b - pb) if v > pv else (pa - a, pb - b)
                if d[0] == 0 or d[1] == 0 or abs(d[0]) + abs(d[1]) > order:
                    continue
                if d in seen:
                    continue
                seen.add(d)
                nxt.append(d)
        level = nxt
        k += 1
    return out


def main():
    path, args = sys.argv[1], sys.argv[2:]
    name, degrees, period = read_scl(path)
    order = option(args, "--order", 3, int)
    span = option(args, "--span", 1, int)
    ref = option(args, "--ref-hz", 261.6255653, float)
    size = len(degrees)
    pc = 1200 * math.log2(period)
    by_cents = sorted((1200 * math.log2(d) % pc, i) for i, d in enumerate(degrees))
    cuts = [c for c, _ in by_cents]
    tt = terms(order)

    def note(d, p):
        return degrees[d] * period ** p

    def land(f):
        c = 1200 * math.log2(f)
        p = math.floor(c / pc)
        inside = c - p * pc
        at = bisect.bisect_right(cuts, inside)
        below = (by_cents[at - 1], p) if at > 0 else (by_cents[-1], p - 1)
        above = (by_cents[at], p) if at < size else (by_cents[0], p + 1)
        best = None
        for (cc, d), pp in (below, above):
            dev = c - (pp * pc + cc)
            if best is None or abs(dev) < abs(best[2]):
                best = (d, pp, dev)
        d, pp, dev = best
        k = pp - math.floor(1200 * math.log2(degrees[d]) / pc)
        exact = f == note(d, k)
        return {"degree": d, "period": k, "deviation_cents": 0.0 if exact else dev, "exact": exact}

    keys = [(d, p) for p in range(span) for d in range(size)] + [(0, span)]
    notes = [(d, p, note(d, p)) for d, p in keys]
    dyads = []
    for i in range(len(notes)):
        for j in range(i + 1, len(notes)):
            lo, hi = notes[i], notes[j]
            if lo[2] == hi[2]:
                continue
            if lo[2] > hi[2]:
                lo, hi = hi, lo
            fl, fh = lo[2], hi[2]
            ladder = helmholtz(ref * float(fl), ref * float(fh), 12)
            tones = []
            for a, b in tt:
                f = a * fl + b * fh
                if f <= 0:
                    continue
                tones.append({"a": a, "b": b, "order": abs(a) + abs(b), "name": term_name(a, b),
                              "low_partial": 1, "high_partial": 1, "hz": ref * float(f),
                              "ratio": ratio_text(f), "exact_value": ratio_text(f), "landing": land(f),
                              "audibility": audibility(a, b, float(fl), float(fh)),
                              "helmholtz_level": ladder.get((a, b))})
            tones.sort(key=lambda t: (t["order"], t["hz"]))
            dyads.append({"low": {"degree": lo[0], "period": lo[1], "hz": ref * float(fl), "ratio": ratio_text(fl)},
                          "high": {"degree": hi[0], "period": hi[1], "hz": ref * float(fh), "ratio": ratio_text(fh)},
                          "tones": tones})
    total = weighted = 0.0
    count = exact = 0
    for d in dyads:
        for t in d["tones"]:
            w = t["audibility"] / (t["order"] - 1)
            if w <= 0:
                continue
            weighted += w * t["landing"]["deviation_cents"] ** 2
            total += w
            count += 1
            exact += t["landing"]["exact"]
    fit = {"rms_cents": math.sqrt(weighted / total) if total > 0 else 0.0, "total_weight": total,
           "tones": count, "exact": exact}
    doc = {"tuning": name, "ref_hz": ref, "span": span, "order": order, "partials": 1, "dyads": dyads,
           "fit": fit}
    json.dump(doc, sys.stdout, separators=(",", ":"))
    sys.stdout.write("\n")


if __name__ == "__main__":
    main()
