#!/usr/bin/env python3
"""Makes the README's picture of the window with `terzo-gui --screenshot` under Xvfb and checks
it: a PNG of the full window size (1280x800) that is not blank. With --committed PATH it also
checks that the picture committed at PATH (docs/images/window.png) is such a PNG and still
shows the window: at most 10 % of its pixels may differ from the new picture. Used by ctest (docs/window_screenshot, writing
into the build folder) and by the build target docs-screenshot (writing docs/images/window.png).

    window_screenshot.py --gui BUILD/gui/terzo-gui --source ROOT --out OUT.png [--committed PATH]

Standard library only; the PNG reader is tests/gui/gui_test_common.py's."""
import argparse
import os
import pathlib
import subprocess
import sys
import tempfile

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent.parent / "gui"))
import gui_test_common as g  # noqa: E402

# What the picture shows: the demo tuning's lattice with a major triad selected, so its
# resultants are drawn around the nodes. Change it here and run the docs-screenshot target.
TUNINGS = ["assets/demo.scl"]
VIEW = ["--view", "lattice", "--select", "0,2,4"]
WIDTH, HEIGHT = 1280, 800
# Above this share of differing pixels the committed picture counts as out of date.
MAX_DIFFERING = 0.10


def check(path):
    """Asserts that path is a PNG of the window's size with more than a few colours."""
    image = g.read_png(path)
    assert (image[0], image[1]) == (WIDTH, HEIGHT), f"{path}: {image[0]}x{image[1]}, expected {WIDTH}x{HEIGHT}"
    colours = g.distinct_colours(image)
    assert colours > 100, f"{path}: only {colours} colours; the picture looks blank"
    print(f"{path}: {WIDTH}x{HEIGHT}, {colours} colours")


def differing_share(a, b):
    """The share of pixels whose colours differ between two images of the same size."""
    differ = sum(1 for (_, _, ca), (_, _, cb) in zip(g.pixels(a), g.pixels(b)) if ca != cb)
    return differ / (a[0] * a[1])


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument("--gui", required=True)
    parser.add_argument("--source", required=True)
    parser.add_argument("--out", required=True)
    parser.add_argument("--committed")
    args = parser.parse_args()
    out = pathlib.Path(args.out).resolve()
    out.parent.mkdir(parents=True, exist_ok=True)
    with tempfile.TemporaryDirectory(prefix="terzo-shot-") as state:
        # A fresh start with a state folder of its own: the user's saved session is neither
        # read nor overwritten.
        env = dict(os.environ, XDG_STATE_HOME=state)
        cmd = ["xvfb-run", "-a", "-s", f"-screen 0 {WIDTH}x{HEIGHT}x24", args.gui, "--fresh", *VIEW,
               "--screenshot", str(out), "--force", *TUNINGS]
        r = subprocess.run(cmd, cwd=args.source, env=env, capture_output=True, text=True, timeout=90)
    print(r.stdout, r.stderr)
    assert r.returncode == 0, f"terzo-gui exited with {r.returncode}"
    check(out)
    if args.committed:
        committed = pathlib.Path(args.committed)
        check(committed)
        # Rendering is not bit-identical across machines and small changes of the window
        # (a number, a label) need not refresh the picture; a picture that no longer shows
        # the window (another layout, view or demo) must be made again.
        share = differing_share(g.read_png(out), g.read_png(committed))
        print(f"{share:.1%} of the pixels differ from {committed}")
        assert share <= MAX_DIFFERING, (
            f"{committed} no longer shows the window ({share:.1%} of the pixels differ, more than "
            f"{MAX_DIFFERING:.0%}); run `cmake --build build --target docs-screenshot` and commit it")
    print("ok")


if __name__ == "__main__":
    main()
