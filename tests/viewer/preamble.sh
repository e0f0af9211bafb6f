# Sourced by the windowed viewer tests after their own checks of the variables they need:
# skips the test (exit 77) when xvfb-run is missing (use it through "$XVFB_RUN", tests/xvfb_run.sh),
# makes the temporary folder $out (removed at exit unless KEEP is set) and gives the runs a
# settings folder of their own (XDG_CONFIG_HOME), so no test reads or writes the user's settings.
if [[ -z "${XVFB_RUN:-}" ]] || ! command -v "$XVFB_RUN" >/dev/null; then
  echo "xvfb-run not installed: skipping"; exit 77
fi
out=$(mktemp -d)
trap '[[ -n "${KEEP:-}" ]] || rm -rf "$out"' EXIT
export XDG_CONFIG_HOME="$out/config"
