#!/usr/bin/env python3
"""Makes the README's picture of the window with `terzo-gui --screenshot` under Xvfb and checks
it: a PNG of the full window size (1280x800) that is not blank. With --committed PATH it also
checks that the picture committed at PATH (docs/images/window.png) is such a PNG, so a broken
or truncated file cannot stay in the manual. Used by ctest (docs/window_screenshot, writing
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


def check(path):
    """Asserts that path is a PNG of the window's size with more than a few colours."""
    image = g.read_png(path)
    assert (image[0], image[1]) == (WIDTH, HEIGHT), f"{path}: {image[0]}x{image[1]}, expected {WIDTH}x{HEIGHT}"
    colours = g.distinct_colours(image)
    assert colours > 100, f"{path}: only {colours} colours; the picture looks blank"
    print(f"{path}: {WIDTH}x{HEIGHT}, {colours} colours")


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
        check(pathlib.Path(args.committed))
    print("ok")


if __name__ == "__main__":
    main()
