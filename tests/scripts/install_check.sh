#!/usr/bin/env bash
# The installed copy works: `cmake --install` into a scratch prefix (MODE tree), or the Debian
# package from CPack unpacked with dpkg -x (MODE deb). From there: --version, one analysis that
# must print what the build tree prints, a manual page for ellipsa and every command that man -l
# renders with every option --help lists, completions for bash, zsh and fish (each driven as the shell would), the
# desktop entry and the icon. Usage: install_check.sh MODE BUILD_DIR WORKDIR SOURCE_DIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
MODE=$1; B=$2; W=$3; SRC=$4; rm -rf "$W"; mkdir -p "$W"; cd "$W"
E=$B/ellipsa
viewer=0; has_command "$E" view && viewer=1  # built with the viewer

if [[ $MODE == tree ]]; then
  cmake --install "$B" --prefix "$W/root" >install.log 2>&1 || { bad "cmake --install: $(tail -5 install.log)"; finish; exit; }
  P=$W/root
else
  cpack -G DEB -B "$W/pkg" --config "$B/CPackConfig.cmake" >cpack.log 2>&1 || { bad "cpack: $(tail -5 cpack.log)"; finish; exit; }
  deb=$(ls "$W"/pkg/ellipsa_*.deb)
  ok "package $(basename "$deb") ($(du -k "$deb" | cut -f1) KiB)"
  dpkg-deb -f "$deb" Depends >depends.txt
  # Runtime dependencies: from dpkg-shlibdeps (the C++ runtime, GL, GLFW, Cairo) and the explicit Mesa drivers.
  for p in libc6 libstdc++6 libcairo2 $( ((viewer)) && echo libglfw3 libgl1-mesa-dri); do
    grep -q "\b$p\b" depends.txt && ok "Depends names $p" || bad "Depends lacks $p: $(cat depends.txt)"
  done
  if ((!viewer)); then  # without the viewer, nothing of GL or GLFW is needed
    for p in libglfw3 libgl1-mesa-dri libegl1 libopengl0; do
      grep -q "\b$p\b" depends.txt && bad "Depends names $p without the viewer: $(cat depends.txt)" || ok "Depends leaves out $p"
    done
  fi
  # apt would install it: every dependency is a Debian 12 package (simulated: nothing is installed).
  apt-get install -s "$deb" >apt.txt 2>&1 && grep -q "^Inst ellipsa " apt.txt && ok "apt-get install -s: dependencies resolve" \
    || bad "apt-get install -s: $(tail -3 apt.txt)"
  dpkg-deb -x "$deb" "$W/root" || bad "dpkg-deb -x"
  P=$W/root/usr
fi

# Files in their GNUInstallDirs places (the menu entry and icon only with the viewer).
files="bin/ellipsa share/man/man1/ellipsa.1.gz share/bash-completion/completions/ellipsa
       share/zsh/vendor-completions/_ellipsa share/fish/vendor_completions.d/ellipsa.fish
       share/ellipsa/examples/turnstile.csv share/doc/ellipsa/README.md share/doc/ellipsa/docs/guide.md"
[[ $viewer == 1 ]] && files+=" share/applications/ellipsa.desktop share/icons/hicolor/scalable/apps/ellipsa.svg"
for f in $files; do
  [[ -s $P/$f ]] && ok "installed $f" || bad "missing $f"
done
IE=$P/bin/ellipsa

# --version and one analysis from the installed copy, the same as the build tree's.
expect_rc 0 "installed ellipsa --version" "$IE" --version
[[ $(head -1 out.txt) == "$("$E" --version | head -1)" ]] && ok "version line: $(head -1 out.txt)" || bad "version: $(head -1 out.txt)"
(cd "$P/share/ellipsa/examples" && "$IE" info turnstile.csv --json) >installed.json 2>err.txt || bad "installed info: $(cat err.txt)"
(cd "$SRC/examples" && "$E" info turnstile.csv --json) >built.json
[[ -s installed.json ]] && cmp -s installed.json built.json && ok "info on the installed example = build tree's" || bad "info differs"

# The Python module, when it was built: imported from the installed copy, the same figures as the command.
if ls "$P"/lib/python3/dist-packages/ellipsa*.so >/dev/null 2>&1; then
  if PYTHONPATH=$P/lib/python3/dist-packages /usr/bin/python3 - "$P" installed.json <<'PY'
import json, sys
import ellipsa
prefix, cli = sys.argv[1], json.load(open(sys.argv[2]))
assert ellipsa.__file__.startswith(prefix), ellipsa.__file__
got = ellipsa.read(prefix + "/share/ellipsa/examples/turnstile.csv").info()
assert got["results"][0]["peak_db"] == cli["results"][0]["peak_db"], (got["results"][0], cli["results"][0])
PY
  then ok "import ellipsa from the installed copy: info as the command's"; else bad "installed Python module"; fi
  [[ $MODE == tree ]] || { grep -q "python3-numpy" depends.txt && ok "Depends names python3-numpy" || bad "Depends lacks python3-numpy"; }
fi

# The copyright file in the machine-readable format (DEP-5, Debian policy 12.5): the format line,
# every paragraph with a Files field has Copyright and License, and every licence short name they
# use has a standalone License paragraph with its text. The changelog (policy 12.7): gzip -9n
# (no name, no time stamp), parsed by dpkg-parsechangelog, its version the package's.
doc=$P/share/doc/ellipsa
cr=$doc/copyright
if [[ -s $cr ]] && /usr/bin/python3 - "$cr" <<'PY'
import re, sys
paras = [p for p in re.split(r"\n\s*\n", open(sys.argv[1]).read().strip()) if p.strip()]
assert paras[0].startswith("Format: https://www.debian.org/doc/packaging-manuals/copyright-format/1.0/"), paras[0][:80]
def fields(p):
    out, key = {}, None
    for line in p.split("\n"):
        if line[:1] in (" ", "\t"): out[key] += "\n" + line
        else: key, _, v = line.partition(":"); out[key] = v.strip()
    return out
used, texts = set(), set()
for p in map(fields, paras[1:]):
    lic = p["License"].split("\n")[0].strip()
    if "Files" in p:
        assert "Copyright" in p and p["Copyright"], p
        used |= {n.strip() for n in re.split(r"\bor\b|\band\b|,", lic) if n.strip()}
    else:
        assert "\n" in p["License"], "standalone licence without text: " + lic
        texts.add(lic)
external = {"Apache-2.0"}  # in /usr/share/common-licenses, which the paragraph names
assert used <= texts | external, used - texts - external
assert any(p.startswith("Files: *") for p in paras)
PY
then ok "copyright: machine-readable (DEP-5), every licence named has its text"; else bad "copyright file $cr"; fi
cl=$doc/changelog.Debian.gz
if [[ -s $cl ]] && gzip -t "$cl" && [[ $(od -An -tu4 -j4 -N4 "$cl" | tr -d ' ') == 0 ]] \
   && zcat "$cl" >changelog.txt && dpkg-parsechangelog -l changelog.txt -S Version >cl_version.txt 2>cl_err.txt; then
  want=$( [[ $MODE == deb ]] && dpkg-deb -f "$deb" Version || sed -n '1s/.*(\(.*\)).*/\1/p' changelog.txt )
  [[ $(cat cl_version.txt) == "$want" ]] && ok "changelog.Debian.gz: gzip -9n, version $want" || bad "changelog version $(cat cl_version.txt), package $want"
else bad "changelog.Debian.gz: $(cat cl_err.txt 2>/dev/null)"; fi

# A page for ellipsa and every command --help lists; man -l renders each with every long option of --help.
cmds=$("$E" --help | awk '/^Subcommands:/{s=1; next} s && /^  [a-z]/{print $1}')
[[ $(wc -w <<<"$cmds") -ge 10 ]] && ok "--help lists $(wc -w <<<"$cmds") commands" || bad "commands from --help: $cmds"
for c in "" $cmds; do
  page=$P/share/man/man1/ellipsa${c:+-$c}.1.gz
  help=$("$E" $c --help)
  text=$(MANWIDTH=200 LC_ALL=C man -l "$page" 2>man_err.txt | col -b)
  missing=""
  for o in $(grep -oE -- '--[a-z0-9][a-z0-9-]*' <<<"$help" | sort -u); do
    grep -qF -- "$o" <<<"$text" || missing+=" $o"
  done
  if [[ -n $text && -z $missing && ! -s man_err.txt ]]; then ok "man -l ellipsa${c:+-$c}.1.gz: every option of --help"
  else bad "man -l ellipsa${c:+-$c}.1.gz: missing$missing $(head -c 200 man_err.txt)"; fi
done

# bash completion: commands, then a command's options and an option's choices.
complete_bash() {  # WORDS... -> the completions, one per line
  bash -c 'source "$1"; shift; COMP_WORDS=("$@"); COMP_CWORD=$(($# - 1)); _ellipsa; printf "%s\n" "${COMPREPLY[@]}"' \
    _ "$P/share/bash-completion/completions/ellipsa" "$@"
}
[[ $(complete_bash ellipsa di) == diversity ]] && ok "bash: ellipsa di<Tab> -> diversity" || bad "bash: ellipsa di: $(complete_bash ellipsa di)"
complete_bash ellipsa cut x.csv --thr | grep -qx -- --through-peak && ok "bash: cut --thr<Tab> -> --through-peak" || bad "bash: cut option"
[[ $(complete_bash ellipsa convert a.csv --family cir) == circular-db-phase ]] && ok "bash: convert --family cir<Tab>" || bad "bash: --family choices"
# fish completion, driven with complete -C (the completions fish would offer at the cursor).
fish_file=$P/share/fish/vendor_completions.d/ellipsa.fish
complete_fish() { fish -c "source '$fish_file'; complete -C '$1'" | cut -f1; }
if command -v fish >/dev/null; then
  [[ $(complete_fish "ellipsa di") == diversity ]] && ok "fish: ellipsa di<Tab> -> diversity" || bad "fish: commands: $(complete_fish "ellipsa di")"
  [[ $(complete_fish "ellipsa convert a.csv --family cir") == circular-db-phase ]] && ok "fish: --family choices" || bad "fish: --family"
  complete_fish "ellipsa synth " | grep -qx crossed-dipoles && ok "fish: synth KIND choices" || bad "fish: synth KIND"
else bad "fish not installed (./dev installs it)"; fi
# zsh completion, driven in a pseudo-terminal (zsh_complete.zsh).
complete_zsh() { timeout 30 "$(dirname "$0")/zsh_complete.zsh" "$P/share/zsh/vendor-completions" "$1"; }
if command -v zsh >/dev/null; then
  [[ $(complete_zsh "ellipsa di") == diversity ]] && ok "zsh: ellipsa di<Tab> -> diversity" || bad "zsh: commands: $(complete_zsh "ellipsa di")"
  [[ $(complete_zsh "ellipsa info --fr") == --frequency ]] && ok "zsh: info --fr<Tab> -> --frequency" || bad "zsh: info option"
  complete_zsh "ellipsa synth " | grep -qx crossed-dipoles && ok "zsh: synth KIND choices" || bad "zsh: synth KIND"
else bad "zsh not installed (./dev installs it)"; fi

# The menu entry opens the viewer with the files given; the icon is well-formed SVG.
if [[ $viewer == 0 ]]; then  # no window to open: no menu entry, no icon
  for f in share/applications/ellipsa.desktop share/icons/hicolor/scalable/apps/ellipsa.svg; do
    [[ ! -e $P/$f ]] && ok "no $f without the viewer" || bad "$f installed without the viewer"
  done
  zcat "$P/share/man/man1/ellipsa.1.gz" | grep -Eq "ellipsa (view|render)|The viewer" \
    && bad "ellipsa(1) names the viewer without it" || ok "ellipsa(1) names no viewer, view or render"
  finish; exit
fi
desk=$P/share/applications/ellipsa.desktop
grep -qx "Exec=ellipsa view %F" "$desk" && grep -q "^MimeType=.*text/csv;" "$desk" && ok "desktop entry: view %F, text/csv" || bad "desktop entry"
if command -v desktop-file-validate >/dev/null; then desktop-file-validate "$desk" && ok "desktop-file-validate" || bad "desktop-file-validate"; fi
xmllint --noout "$P/share/icons/hicolor/scalable/apps/ellipsa.svg" && ok "icon is well-formed SVG" || bad "icon SVG"
finish
