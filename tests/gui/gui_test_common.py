"""Helpers for the terzo-gui tests under Xvfb: a small PNG reader (8-bit RGB/RGBA, the
files terzo-gui writes) built on zlib, pixel counting and blob finding. Standard library only."""
import struct
import zlib

# Colours from gui/colours.hpp.
NODE = (70, 130, 200)
NODE_SELECTED = (235, 140, 50)
EXACT = (120, 230, 255)
STRIP_PERIOD_KEY = (92, 102, 128)


def read_png(path):
    """Returns (width, height, rows) with rows a list of bytes objects, RGBA or RGB."""
    with open(path, "rb") as f:
        data = f.read()
    assert data[:8] == b"\x89PNG\r\n\x1a\n", f"{path}: not a PNG file"
    pos, idat, width = 8, b"", None
    while pos < len(data):
        (length,) = struct.unpack(">I", data[pos:pos + 4])
        kind = data[pos + 4:pos + 8]
        body = data[pos + 8:pos + 8 + length]
        pos += 12 + length
        if kind == b"IHDR":
            width, height, depth, colour, _, _, interlace = struct.unpack(">IIBBBBB", body)
            assert depth == 8 and colour in (2, 6) and interlace == 0, "unsupported PNG"
            bpp = 4 if colour == 6 else 3
        elif kind == b"IDAT":
            idat += body
        elif kind == b"IEND":
            break
    raw = zlib.decompress(idat)
    stride = width * bpp
    rows, prev, i = [], bytearray(stride), 0
    for _ in range(height):
        ftype, line = raw[i], bytearray(raw[i + 1:i + 1 + stride])
        i += 1 + stride
        for x in range(stride):
            a = line[x - bpp] if x >= bpp else 0
            b = prev[x]
            c = prev[x - bpp] if x >= bpp else 0
            if ftype == 1:
                line[x] = (line[x] + a) & 255
            elif ftype == 2:
                line[x] = (line[x] + b) & 255
            elif ftype == 3:
                line[x] = (line[x] + (a + b) // 2) & 255
            elif ftype == 4:
                p = a + b - c
                pa, pb, pc = abs(p - a), abs(p - b), abs(p - c)
                line[x] = (line[x] + (a if pa <= pb and pa <= pc else b if pb <= pc else c)) & 255
        rows.append(bytes(line))
        prev = line
    return width, height, rows, bpp


def pixels(image):
    width, height, rows, bpp = image
    for y, row in enumerate(rows):
        for x in range(width):
            yield x, y, tuple(row[x * bpp:x * bpp + 3])


def count_colour(image, colour):
    return sum(1 for _, _, c in pixels(image) if c == colour)


def distinct_colours(image):
    return len({c for _, _, c in pixels(image)})


def blobs(image, colour, min_size=80):
    """Centres (x, y) and sizes of 4-connected regions of exactly `colour`."""
    width, height = image[0], image[1]
    mask = {(x, y) for x, y, c in pixels(image) if c == colour}
    found = []
    while mask:
        seed = mask.pop()
        stack, members = [seed], [seed]
        while stack:
            x, y = stack.pop()
            for n in ((x + 1, y), (x - 1, y), (x, y + 1), (x, y - 1)):
                if n in mask:
                    mask.remove(n)
                    stack.append(n)
                    members.append(n)
        if len(members) >= min_size:
            cx = sum(p[0] for p in members) / len(members)
            cy = sum(p[1] for p in members) / len(members)
            found.append((cx, cy, len(members)))
    return found


def pids_in_session(session_id, name):
    """Process ids named `name` in the session `session_id` (a Popen started with
    start_new_session=True has its pid as session id), read from /proc (no procps needed)."""
    import os
    found = []
    for entry in os.listdir("/proc"):
        if not entry.isdigit():
            continue
        try:
            with open(f"/proc/{entry}/stat") as f:
                stat = f.read()
        except OSError:
            continue
        # pid (comm) state ppid pgrp session ...: comm may hold spaces, so split after ')'.
        comm = stat[stat.index("(") + 1:stat.rindex(")")]
        fields = stat[stat.rindex(")") + 2:].split()
        if comm == name and int(fields[3]) == session_id:
            found.append(int(entry))
    return found
