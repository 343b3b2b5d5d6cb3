"""ctest: the first run (no session file yet), opened the way ./build.sh run opens it
(terzo-gui assets/demo.scl), starts from the demo session: the demo scale current with a
triad selected, and a 12-note meantone open so the keys and sheet views have content; the
demo scale named on the command line is not opened a second time; the reference is C4 at
A4 = 440 Hz, as in the CLI.
usage: first_run_check.py TERZO_GUI DEMO_SCL WORKDIR"""
import json
import os
import shutil
import subprocess
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import gui_test_common as g

gui, demo, work = sys.argv[1:4]
XVFB = ["xvfb-run", "-a", "-s", "-screen 0 1280x800x24"]
for view in ("keys", "sheet"):
    shutil.rmtree(work, ignore_errors=True)
    os.makedirs(work)
    session = os.path.join(work, "state", "session.json")  # its folder does not exist yet
    shot = os.path.join(work, view + ".png")
    r = subprocess.run([*XVFB, gui, "--session", session, "--view", view, "--screenshot", shot, demo],
                       capture_output=True, text=True, timeout=120)
    print(r.stdout, r.stderr)
    assert r.returncode == 0 and not r.stderr.replace("Setting vertical sync not supported\n", ""), r.stderr
    image = g.read_png(shot)
    assert g.distinct_colours(image) > 100, "the screenshot looks blank"
    with open(session) as f:
        s = json.load(f)
    names = [os.path.basename(t["source"]) for t in s["tunings"]]
    print("tunings:", names, "current", s["current"], "selection", s["selection"])
    assert names == ["demo.scl", "meantone-quarter-comma.scl"], names
    assert s["current"] == 0 and s["selection"] == [0, 2, 4]
    # C4 at A4 = 440 Hz in 12-TET: 440 * 2^(-9/12) = 261.6256 Hz (common practice, no source).
    assert abs(s["settings"]["reference_hz"] - 440 * 2 ** (-9 / 12)) < 1e-6, s["settings"]["reference_hz"]
    assert s["settings"]["pitch_reference"] == "A4=440"
print("ok")
