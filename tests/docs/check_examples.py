#!/usr/bin/env python3
"""Runs the `$ terzo ...` examples of the manual and compares their output.

    check_examples.py --terzo BUILD/cli/terzo --source ROOT [FILE.md ...]

Without FILEs it reads ROOT/README.md and ROOT/docs/*.md. In each file:

- A fenced block whose first line starts with `$ terzo` is an example. Each line starting
  with `$ ` is a command (a line ending in a backslash continues on the next line); the
  lines up to the next command are its expected output: stdout, then stderr, then
  `(exit status N)` when the status is not 0. A line that is just `...` stands for any
  number of lines (none included). Blank lines at the end of an output are not compared, and CRLF line ends
  (CSV) count as LF.
- A fenced block whose info string holds `file=PATH` (```` ```text file=keys.txt ````) is
  written to PATH before the examples that follow it in the same file run, so an example
  can use a file the page shows.
- An example directly after the line `<!-- unchecked example: REASON -->` is skipped (for
  output that depends on the machine, such as timings).

Commands run through bash in a scratch copy of ROOT (without build folders and .git), one
copy per Markdown file, in document order, with the given terzo first on PATH. A mismatch
is reported as FILE:LINE (the line of the expected output that differs) with both texts;
the exit status is 1 when any example failed. Python 3 standard library only.
"""
import argparse
import os
import pathlib
import re
import shutil
import subprocess
import sys
import tempfile

FENCE = re.compile(r"^(\s*)(`{3,}|~{3,})(.*)$")
SKIP_MARKER = re.compile(r"^<!--\s*unchecked example:.*-->\s*$")


class Block:
    def __init__(self, info, first_line, lines, skipped):
        self.info = info  # the fence's info string
        self.first_line = first_line  # 1-based line number of the block's first content line
        self.lines = lines
        self.skipped = skipped


def fenced_blocks(text):
    """Every fenced block of a Markdown text, with the line number of its first content line."""
    lines = text.split("\n")
    blocks, i = [], 0
    while i < len(lines):
        m = FENCE.match(lines[i])
        if not m:
            i += 1
            continue
        fence, info = m.group(2), m.group(3).strip()
        skipped = i > 0 and bool(SKIP_MARKER.match(lines[i - 1].strip()))
        start, j = i + 1, i + 1
        while j < len(lines) and not (lines[j].strip().startswith(fence[0] * len(fence))
                                      and lines[j].strip().strip(fence[0]) == ""):
            j += 1
        blocks.append(Block(info, start + 1, lines[start:j], skipped))
        i = j + 1
    return blocks


class Command:
    def __init__(self, text, line):
        self.text = text  # the shell command, continuation lines joined
        self.line = line  # line number of its `$ `
        self.expected = []  # (line number, text) of the expected output


def parse_example(block):
    """Splits an example block into commands, each with its expected output lines."""
    commands, i = [], 0
    lines = block.lines
    while i < len(lines):
        line = lines[i]
        number = block.first_line + i
        if line.startswith("$ "):
            text = line[2:]
            while text.endswith("\\") and i + 1 < len(lines):
                i += 1
                text = text + "\n" + lines[i]  # bash joins backslash-newline itself
            commands.append(Command(text, number))
        elif commands:
            commands[-1].expected.append((number, line))
        i += 1
    return commands


def match(expected, actual):
    """None when the actual lines match the expected ones (`...` = any lines), else the index
    into expected of the first line that could not be matched (len(expected) when the actual
    output has lines left over)."""
    segments, current = [], []
    for k, (_, text) in enumerate(expected):
        if text == "...":
            segments.append(current)
            current = []
        else:
            current.append(k)
    segments.append(current)

    def texts(seg):
        return [expected[k][1] for k in seg]

    pos = 0
    for n, seg in enumerate(segments):
        want = texts(seg)
        first, last = n == 0, n == len(segments) - 1
        if first:
            for k, text in zip(seg, want):
                if pos >= len(actual) or actual[pos] != text:
                    return k
                pos += 1
            if last:
                return None if pos == len(actual) else len(expected)
            continue
        if last:
            if not want:
                return None
            start = len(actual) - len(want)
            if start < pos:
                return seg[0]
            for k, text, got in zip(seg, want, actual[start:]):
                if got != text:
                    return k
            return None
        found = next((p for p in range(pos, len(actual) - len(want) + 1)
                      if actual[p:p + len(want)] == want), None)
        if found is None:
            return seg[0] if seg else None
        pos = found + len(want)
    return None


def scratch_copy(source, into):
    def ignore(folder, names):
        if pathlib.Path(folder) == source:
            return [n for n in names if n.startswith("build") or n == ".git"]
        return []
    shutil.copytree(source, into, ignore=ignore, symlinks=True)


def run(command, folder, env):
    r = subprocess.run(["bash", "-c", command], cwd=folder, env=env, stdin=subprocess.DEVNULL,
                       stdout=subprocess.PIPE, stderr=subprocess.PIPE, timeout=300)
    out = r.stdout.decode("utf-8", "replace") + r.stderr.decode("utf-8", "replace")
    lines = out.replace("\r\n", "\n").split("\n")  # CSV ends its lines in CRLF
    while lines and lines[-1] == "":  # a page's block cannot end in blank lines
        lines.pop()
    if r.returncode != 0:
        lines.append(f"(exit status {r.returncode})")
    return lines


def check_file(path, source, bindir, shown):
    """Runs the examples of one Markdown file; returns (examples run, failures)."""
    blocks = fenced_blocks(path.read_text(encoding="utf-8"))
    if not any(b.lines and b.lines[0].startswith("$ terzo") for b in blocks):
        return 0, 0
    env = dict(os.environ, PATH=f"{bindir}{os.pathsep}{os.environ.get('PATH', '')}",
               LC_ALL="C.UTF-8", COLUMNS="100")
    env.pop("DISPLAY", None)
    run_count, failures = 0, 0
    with tempfile.TemporaryDirectory(prefix="terzo-docs-") as tmp:
        folder = pathlib.Path(tmp) / "root"
        scratch_copy(source, folder)
        for block in blocks:
            m = re.search(r"(?:^|\s)file=(\S+)", block.info)
            if m:
                target = folder / m.group(1)
                target.parent.mkdir(parents=True, exist_ok=True)
                target.write_text("\n".join(block.lines) + "\n", encoding="utf-8")
                continue
            if not block.lines or not block.lines[0].startswith("$ terzo") or block.skipped:
                continue
            for command in parse_example(block):
                while command.expected and command.expected[-1][1] == "":
                    command.expected.pop()
                run_count += 1
                actual = run(command.text, folder, env)
                bad = match(command.expected, actual)
                if bad is None:
                    continue
                failures += 1
                line = (command.expected[bad][0] if bad < len(command.expected)
                        else (command.expected[-1][0] + 1 if command.expected else command.line + 1))
                print(f"{shown(path)}:{line}: error: the output of this example differs "
                      f"(command on line {command.line}: $ {command.text})")
                print("--- expected")
                print("\n".join(t for _, t in command.expected))
                print("--- actual")
                print("\n".join(actual))
                print("---")
    return run_count, failures


def main():
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    parser.add_argument("--terzo", required=True, help="the built terzo program")
    parser.add_argument("--source", required=True, help="the repository root")
    parser.add_argument("files", nargs="*", help="Markdown files (default: README.md, docs/*.md)")
    args = parser.parse_args()
    source = pathlib.Path(args.source).resolve()
    files = ([pathlib.Path(f).resolve() for f in args.files] if args.files else
             [source / "README.md"] + sorted((source / "docs").glob("*.md")))

    def shown(p):
        try:
            return str(p.relative_to(source))
        except ValueError:
            return str(p)

    with tempfile.TemporaryDirectory(prefix="terzo-bin-") as bindir:
        os.symlink(pathlib.Path(args.terzo).resolve(), pathlib.Path(bindir) / "terzo")
        total, failed = 0, 0
        for f in files:
            n, bad = check_file(f, source, bindir, shown)
            total += n
            failed += bad
    print(f"{total} example commands run, {failed} differ")
    return 1 if failed or total == 0 else 0


if __name__ == "__main__":
    sys.exit(main())
