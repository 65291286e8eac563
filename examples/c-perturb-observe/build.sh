#!/usr/bin/env sh
# Builds the fixed-point perturb-and-observe example as a shared library for mppt-arena.
#   ./build.sh [OUT_DIR]      default OUT_DIR: ./build
# Linux: libpo_fixed.so; macOS: libpo_fixed.dylib. On Windows build po_fixed.dll with
#   cl /LD /O2 /I..\..\src\MpptArena\Trackers\Native po_fixed.c
# or MinGW: gcc -O2 -shared -o po_fixed.dll -I../../src/MpptArena/Trackers/Native po_fixed.c
set -eu
here=$(cd "$(dirname "$0")" && pwd)
out=${1:-"$here/build"}
mkdir -p "$out"
cc=${CC:-cc}
case "$(uname -s)" in
  Darwin) lib="$out/libpo_fixed.dylib"; shared="-dynamiclib" ;;
  *)      lib="$out/libpo_fixed.so";    shared="-shared -fPIC" ;;
esac
# shellcheck disable=SC2086
"$cc" -std=c99 -O2 -Wall -Wextra -Werror $shared -I"$here/../../src/MpptArena/Trackers/Native" -o "$lib" "$here/po_fixed.c" -lm
echo "$lib"
