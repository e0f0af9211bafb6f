#!/usr/bin/env bash
# The windowed smoke test with Mesa's software renderer forced (--software).
VIEW_EXTRA=--software exec bash "$(dirname "$0")/window_smoke.sh"
