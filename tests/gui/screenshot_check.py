"""ctest: terzo-gui --screenshot of one view of the demo tuning under Xvfb, checked to be a
full-size non-blank image, and for the lattice to contain the drawn nodes (pixels of the node
colour) and for the grid to contain its exact cell. With NODES given (a tuning from scales/),
nothing is selected and the lattice must show exactly NODES nodes.
usage: screenshot_check.py TERZO_GUI VIEW TUNING OUT.png [NODES]"""
import os
import subprocess
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import gui_test_common as g

gui, view, tuning, out = sys.argv[1:5]
expected_nodes = int(sys.argv[5]) if len(sys.argv) > 5 else None
if os.path.exists(out):
    os.remove(out)
select = [] if expected_nodes is not None else ["--select", "0,2,4"]
cmd = ["xvfb-run", "-a", "-s", "-screen 0 1280x800x24", gui, "--fresh", *select,
       "--view", view, "--screenshot", out, tuning]
r = subprocess.run(cmd, capture_output=True, text=True, timeout=90)
print(r.stdout, r.stderr)
assert r.returncode == 0, f"terzo-gui exited with {r.returncode}"
assert f"saved {out} (1280x800, view {view})" in r.stdout

image = g.read_png(out)
assert image[0] == 1280 and image[1] == 800, image[:2]
colours = g.distinct_colours(image)
print("distinct colours:", colours)
assert colours > 100, "the screenshot looks blank"
nodes = g.blobs(image, g.NODE)
print("node blobs of the node colour:", [(round(x), round(y), n) for x, y, n in nodes])
if view == "lattice" and expected_nodes is not None:
    assert len(nodes) == expected_nodes, f"expected {expected_nodes} lattice nodes, found {len(nodes)}"
elif view == "lattice":
    # The demo has 8 degrees; 0, 2 and 4 are selected (other colour): 5 unselected nodes.
    assert len(nodes) == 5, f"expected 5 unselected lattice nodes, found {len(nodes)}"
    selected = [b for b in g.blobs(image, g.NODE_SELECTED) if 330 < b[0] < 930 and b[1] < 700]
    assert len(selected) == 3, f"expected 3 selected lattice nodes, found {len(selected)}"
    # Resultant marks proven exact are drawn in the 'exact' colour.
    assert g.count_colour(image, g.EXACT) > 300, "no exact resultant marks drawn"
else:
    assert not nodes, "lattice nodes drawn outside the lattice view"
if view == "grid" and expected_nodes is None:
    # The dyad 0 -> 0 a period up (the octave 2/1) lands every resultant exactly.
    cells = g.blobs(image, g.EXACT, min_size=1000)
    assert len(cells) >= 1, "the grid has no exact cell"
print("ok")
