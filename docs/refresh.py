#!/usr/bin/python3
"""Keep the command output shown in the docs true.

In README.md and docs/*.md, a block

    <!-- run: ellipsa info examples/turnstile.csv -->
    ```console
    ...
    ```

is rewritten with the real output of the command (run from the repository root, with `ellipsa`
meaning build/ellipsa). Several commands may be chained with ' && ' in one marker; each is shown
with its own '$' line. Run `docs/refresh.py` after changing a command's output; `--check`
reports stale blocks without writing (exit 1 if any). ctest runs `--check` as `docs_output`,
with `--ellipsa EXE` (the build's ellipsa; its Python module in EXE's folder/python) and
`--work DIR` (the folder the commands run in; default out/docs).
"""
import os
import re
import shutil
import subprocess
import sys

ROOT = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
EXE = os.path.join(ROOT, "build", "ellipsa")
WORK = os.path.join(ROOT, "out", "docs")
BLOCK = re.compile(r"(<!-- run: (?P<cmd>.*?) -->\n)```console\n.*?```\n", re.S)


def run(cmd):
    shown = []
    for part in cmd.split(" && "):
        exe = part.replace("ellipsa ", EXE + " ", 1) if part.startswith("ellipsa ") else part
        p = subprocess.run(exe, shell=True, cwd=WORK, capture_output=True, text=True,
                           env=dict(os.environ, ELLIPSA_ROOT=ROOT,  # the built Python module (docs/python.md)
                                    PYTHONPATH=os.path.join(os.path.dirname(EXE), "python")))
        out = p.stdout + p.stderr
        shown.append("$ " + part + "\n" + out)
    return "".join(shown)


def option(name, default):
    """The value after `name` in the arguments, else `default`."""
    args = sys.argv[1:]
    return os.path.abspath(args[args.index(name) + 1]) if name in args[:-1] else default


def main():
    global EXE, WORK
    check = "--check" in sys.argv
    EXE, WORK = option("--ellipsa", EXE), option("--work", WORK)
    work = WORK
    # A fresh work folder each run: commands that write refuse to replace a file without --force,
    # as a user's first run would find nothing there either.
    if os.path.isdir(work):
        for name in os.listdir(work):
            p = os.path.join(work, name)
            if os.path.islink(p) or not os.path.isdir(p):
                os.remove(p)
            else:
                shutil.rmtree(p)
    os.makedirs(work, exist_ok=True)
    # commands refer to examples/ relative to the repo: give the work folder a link to it
    link = os.path.join(work, "examples")
    if not os.path.exists(link):
        os.symlink(os.path.join(ROOT, "examples"), link)
    files = [os.path.join(ROOT, "README.md")] + [
        os.path.join(ROOT, "docs", f) for f in sorted(os.listdir(os.path.join(ROOT, "docs"))) if f.endswith(".md")]
    stale = 0
    for path in files:
        text = open(path, encoding="utf-8").read()

        def sub(m):
            return m.group(1) + "```console\n" + run(m.group("cmd")) + "```\n"

        new = BLOCK.sub(sub, text)
        if new != text:
            stale += 1
            if check:
                print("stale:", os.path.relpath(path, ROOT))
            else:
                tmp = path + ".tmp"
                open(tmp, "w", encoding="utf-8").write(new)
                os.replace(tmp, path)
                print("refreshed", os.path.relpath(path, ROOT))
    if check and stale:
        print(f"{stale} file(s) have stale command output; run docs/refresh.py")
        sys.exit(1)


if __name__ == "__main__":
    main()
