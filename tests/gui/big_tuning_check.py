"""ctest: terzo-gui on tunings far larger than the demo (issue: ImGui's 16-bit vertex indices
aborted the window at about 250 notes). Every view of an equal division of N notes, typed as
a recipe, must render and be saved as a full non-blank screenshot; a session holding the
tuning must be restored and shown again. N is given (300, and 4096, the scale limit).
usage: big_tuning_check.py TERZO_GUI N WORKDIR"""
import json
import os
import shutil
import subprocess
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import gui_test_common as g

gui, n, work = sys.argv[1], int(sys.argv[2]), sys.argv[3]
shutil.rmtree(work, ignore_errors=True)
os.makedirs(work)
recipe = f"equal {n}"
XVFB = ["xvfb-run", "-a", "-s", "-screen 0 1280x800x24"]


def shoot(view, *args):
    out = os.path.join(work, f"{view}{'-restored' if '--session' in args else ''}.png")
    r = subprocess.run([*XVFB, gui, "--view", view, "--screenshot", out, *args], capture_output=True, text=True, timeout=240)
    print(r.stdout, r.stderr)
    assert r.returncode == 0, f"terzo-gui exited with {r.returncode} on view {view}"
    image = g.read_png(out)
    assert image[:2] == (1280, 800), image[:2]
    assert g.distinct_colours(image) > 50, f"the {view} screenshot looks blank"
    return image, r.stderr


for view in ("lattice", "grid", "keys", "sheet"):
    image, err = shoot(view, "--fresh", recipe)
    if view == "lattice":
        # Many degrees share a lattice point: they are drawn as nodes that count them, so
        # some node colour is there, and far fewer blobs than degrees.
        nodes = g.blobs(image, g.NODE, min_size=40)
        print("node blobs:", len(nodes))
        assert 0 < len(nodes) < n, len(nodes)
        # The keyboard strip is drawn (period keys in their own colour), however narrow the keys.
        assert g.count_colour(image, g.STRIP_PERIOD_KEY) > 0, "no keyboard strip"
    if view == "grid" and n > 128:
        assert "dyad grid" in err or "at most 128" in err, "the grid's refusal is not reported"

# A session holding the tuning: written by one run, restored (and drawn) by the next.
session = os.path.join(work, "session.json")
subprocess.run([*XVFB, gui, "--fresh", "--session", session, "--screenshot", os.path.join(work, "first.png"), recipe],
               check=True, capture_output=True, timeout=240)
with open(session) as f:
    saved = json.load(f)
assert saved["tunings"][0]["source"] == recipe, saved["tunings"][0]["source"]
for view in ("lattice", "grid"):
    shoot(view, "--session", session)
print("ok")
