"""ctest: two windows on one session file. The first holds it; the second opens it read-only,
says so, and writes nothing there, even when it is given tunings and closes with changes; once
the first window is gone the file is free again.
usage: session_lock_check.py TERZO_GUI TUNING WORKDIR"""
import os
import shutil
import signal
import subprocess
import sys
import time

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import gui_test_common as g

gui, tuning, work = sys.argv[1:4]
shutil.rmtree(work, ignore_errors=True)
os.makedirs(work)
session = os.path.join(work, "session.json")
XVFB = ["xvfb-run", "-a", "-s", "-screen 0 1280x800x24"]

# The session file both windows name, made by a first batch run.
subprocess.run([*XVFB, gui, "--fresh", "--session", session, "--screenshot", os.path.join(work, "made.png"), tuning],
               check=True, capture_output=True, timeout=120)
original = open(session, "rb").read()

first = subprocess.Popen([*XVFB, gui, "--session", session, "--autosave-ms", "3600000"], start_new_session=True)
try:
    end = time.time() + 60
    while time.time() < end and not g.pids_in_session(first.pid, "terzo-gui"):
        time.sleep(0.1)
    time.sleep(2)
    # The second window: given another tuning (a change it would save on closing).
    r = subprocess.run([*XVFB, gui, "--session", session, "--screenshot", os.path.join(work, "second.png"), "equal 19"],
                       capture_output=True, text=True, timeout=120)
    print(r.stdout, r.stderr)
    assert r.returncode == 0
    assert "is open in another terzo window: this window shows it read-only and saves nothing there" in r.stderr, r.stderr
    assert open(session, "rb").read() == original, "the read-only window wrote the session file"
finally:
    pids = g.pids_in_session(first.pid, "terzo-gui")
    for p in pids:
        os.kill(int(p), signal.SIGTERM)
    first.wait(timeout=60)

# The first window is gone: the next one holds the file and saves its change.
r = subprocess.run([*XVFB, gui, "--session", session, "--screenshot", os.path.join(work, "third.png"), "equal 19"],
                   capture_output=True, text=True, timeout=120)
print(r.stdout, r.stderr)
assert r.returncode == 0 and "read-only" not in r.stderr, r.stderr
assert b"equal 19" in open(session, "rb").read(), "the session was not saved once free"
print("ok")
