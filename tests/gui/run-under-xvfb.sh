#!/bin/sh
# Runs one GUI test program in its own virtual X display, with software
# rendering, the memory settings backend and a throwaway cache folder.
set -eu
cache=$(mktemp -d)
trap 'rm -rf "$cache"' EXIT
export GTK_A11Y=none GSK_RENDERER=cairo GSETTINGS_BACKEND=memory
export XDG_CACHE_HOME="$cache" NO_AT_BRIDGE=1
exec xvfb-run -a -s "-screen 0 1280x800x24 -nolisten tcp" "$@"
