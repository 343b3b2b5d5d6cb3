#!/usr/bin/env python3
"""Checks the links between the manual's pages: every relative link of README.md,
DEVELOPERS.md and docs/*.md must name a file of the repository, and a link to a heading
(`page.md#heading`) must name a heading that page has (GitHub's rule: lower case, spaces to
hyphens, punctuation other than hyphens and underscores dropped). Reports FILE:LINE of each
broken link; exit status 1 when there is one. Standard library only.

    check_links.py ROOT
"""
import pathlib
import re
import sys

LINK = re.compile(r"\]\(([^)\s]+)\)")
HEADING = re.compile(r"^#{1,6} (.*)$")


def anchors(path):
    found, fenced = set(), False
    for line in path.read_text(encoding="utf-8").split("\n"):
        if line.lstrip().startswith("```"):
            fenced = not fenced
        m = None if fenced else HEADING.match(line)
        if m:
            text = re.sub(r"[^\w\- ]", "", m.group(1).strip().lower())
            found.add(text.replace(" ", "-"))
    return found


def main():
    root = pathlib.Path(sys.argv[1]).resolve()
    pages = [root / "README.md", root / "DEVELOPERS.md"] + sorted((root / "docs").glob("*.md"))
    broken, count = 0, 0
    for page in pages:
        fenced = False
        for number, line in enumerate(page.read_text(encoding="utf-8").split("\n"), 1):
            if line.lstrip().startswith("```"):
                fenced = not fenced
            if fenced:
                continue
            for m in LINK.finditer(line):
                link = m.group(1)
                if re.match(r"^[a-z]+:", link):
                    continue  # http:, https:, mailto:
                count += 1
                path, _, anchor = link.partition("#")
                target = (page.parent / path).resolve() if path else page
                problem = None
                if not target.exists():
                    problem = f"{path} does not exist"
                elif anchor and target.suffix == ".md" and anchor not in anchors(target):
                    problem = f"{target.relative_to(root)} has no heading #{anchor}"
                if problem:
                    broken += 1
                    print(f"{page.relative_to(root)}:{number}: error: broken link {link}: {problem}")
    print(f"{count} links checked, {broken} broken")
    return 1 if broken else 0


if __name__ == "__main__":
    sys.exit(main())
