"""ctest (run inside xvfb-run): real mouse and keyboard input through xdotool. Opens the demo
tuning, clicks the lattice nodes of degrees 0 (1/1) and 4 (3/2) and the keyboard strip's key of
note 2, presses 2 (dyad grid view) and Ctrl+S, and checks the saved session file; exports the lattice as PNG with Ctrl+P and Enter;
then Escape and Ctrl+Q, and checks the session again.
usage: interaction_check.py TERZO_GUI TUNING WORKDIR"""
import json
import os
import shutil
import subprocess
import sys
import time

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import gui_test_common as g

gui, tuning, work = sys.argv[1:4]
shutil.rmtree(work, ignore_errors=True)
os.makedirs(work)
session = os.path.join(work, "session.json")
shot = os.path.join(work, "before.png")


def xdo(*args):
    subprocess.run(["xdotool", *args], check=True, timeout=10)


def wait_for(predicate, what, seconds=10):
    end = time.time() + seconds
    while time.time() < end:
        if predicate():
            return
        time.sleep(0.1)
    raise AssertionError("timed out waiting for " + what)


def settle(factor=1):
    """Gives the program time to take in an event and draw: frames take longer on a loaded
    machine, so the pause is generous rather than tuned."""
    time.sleep(0.7 * factor)


def read_session():
    with open(session) as f:
        return json.load(f)


# Where the nodes are: the same window, fonts and layout as the interactive run, found in a
# screenshot by colour. With degree 0 (1/1) selected it is the one node of the selected colour
# in the lattice canvas; degree 4 (3/2) is the next node to its right on the same row (one
# step of 3).
subprocess.run([gui, "--fresh", "--select", "0", "--screenshot", shot, tuning], check=True, timeout=60)
image = g.read_png(shot)
selected = [b for b in g.blobs(image, g.NODE_SELECTED) if 330 < b[0] < 930 and b[1] < 700]
assert len(selected) == 1, selected
n0 = selected[0]
right = [b for b in g.blobs(image, g.NODE) if abs(b[1] - n0[1]) < 3 and b[0] > n0[0]]
assert right, "no node to the right of 1/1"
n4 = min(right, key=lambda b: b[0])
print("degree 0 at", n0[:2], "degree 4 at", n4[:2])
# The keyboard strip (below the lattice): note 0's key has the selected colour; the keys of
# degree 0 in the next periods (notes 8, 16, 24 of the demo's 8 degrees) give the key pitch.
key0 = [b for b in g.blobs(image, g.NODE_SELECTED) if 330 < b[0] < 930 and b[1] > 700]
assert len(key0) == 1, key0
period_keys = sorted(b[0] for b in g.blobs(image, g.STRIP_PERIOD_KEY) if b[1] > 700)
assert len(period_keys) == 3, period_keys
key2 = (key0[0][0] + 2 * (period_keys[1] - period_keys[0]) / 8, key0[0][1])
print("strip key of note 0 at", key0[0][:2], "note 2 at", key2)

def attempt():
    for leftover in (session, os.path.join(work, "demo-lattice.png")):
        if os.path.exists(leftover):
            os.remove(leftover)
    # Autosave is pushed an hour away, so the session file is written only by Ctrl+S and on quit.
    proc = subprocess.Popen([gui, "--fresh", "--autosave-ms", "3600000", "--session", session, tuning], cwd=work)
    try:
        wait_for(lambda: subprocess.run(["xdotool", "search", "--name", "^terzo$"], capture_output=True).returncode == 0, "the window")
        settle(3)  # the first frames
        assert not os.path.exists(session)
        xdo("mousemove", str(round(n0[0])), str(round(n0[1])))
        settle()
        xdo("click", "1")
        settle()
        xdo("mousemove", str(round(n4[0])), str(round(n4[1])))
        settle()
        xdo("click", "1")
        settle()
        xdo("mousemove", str(round(key2[0])), str(round(key2[1])))
        settle()
        xdo("click", "1")
        settle()
        xdo("key", "2")
        settle()
        assert not os.path.exists(session)
        xdo("key", "ctrl+s")
        wait_for(lambda: os.path.exists(session), "Ctrl+S to save the session")
        s = read_session()
        print("after clicks:", s["selection"], s["view"])
        assert s["selection"] == [0, 2, 4], s["selection"]
        assert s["view"] == "grid"
        assert s["tunings"][0]["source"] == tuning
        # Ctrl+P opens the export dialog in the working folder with a file name filled in; Enter
        # saves the lattice canvas: the 5 unselected demo nodes, the dialog no longer in the way.
        xdo("key", "1")
        settle()
        xdo("key", "ctrl+p")
        settle(2)
        xdo("key", "Return")
        png = os.path.join(work, "demo-lattice.png")
        wait_for(lambda: os.path.exists(png), "the lattice PNG")
        lattice = g.read_png(png)
        print("lattice export:", lattice[0], "x", lattice[1])
        assert 500 < lattice[0] < 700 and 500 < lattice[1] < 700, lattice[:2]
        assert len(g.blobs(lattice, g.NODE)) == 5
        xdo("key", "Escape")
        settle()
        xdo("key", "ctrl+q")
        assert proc.wait(timeout=10) == 0
        s = read_session()
        print("after Escape and Ctrl+Q:", s["selection"], s["view"])
        assert s["selection"] == []
        assert s["view"] == "lattice"
    finally:
        if proc.poll() is None:
            proc.kill()


# Synthetic input under Xvfb on a shared machine can lose a race with a slow frame; a real
# defect fails every attempt, so up to three attempts are made and each failure is shown.
for n in range(1, 4):
    try:
        attempt()
        break
    except (AssertionError, subprocess.TimeoutExpired) as e:
        print(f"attempt {n} failed: {e!r}")
        if n == 3:
            raise
print("ok")
