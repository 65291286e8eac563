#!/usr/bin/env bash
# MpptArena front door. Paths you give are taken from the folder you run it in; results land there too.
#   ./run.sh              run the bundled demo scenario (results under ./results/)
#   ./run.sh test         build and run the test suite
#   ./run.sh bench [...]  run the BenchmarkDotNet suites (Release)
#   ./run.sh ARGS...      any mppt-arena command, e.g. ./run.sh curve scenarios/plant-two-peaks.yaml
set -euo pipefail
ROOT="$(cd "$(dirname "$0")" && pwd)"
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1 DOTNET_SKIP_FIRST_TIME_EXPERIENCE=1
DLL="$ROOT/src/MpptArena.Cli/bin/Release/net10.0/mppt-arena.dll"

cli() {
  # Build quietly; show the build log only when the build fails.
  if [ ! -f "$DLL" ]; then
    echo "building MpptArena (the first build restores packages and takes a minute or two)..." >&2
  fi
  log=$(mktemp)
  if ! dotnet build "$ROOT/src/MpptArena.Cli/MpptArena.Cli.csproj" -c Release -nologo -v quiet >"$log" 2>&1; then
    cat "$log" >&2
    rm -f "$log"
    exit 3
  fi
  rm -f "$log"
  dotnet "$DLL" "$@"
}

case "${1:-}" in
  "")
    cli run "$ROOT/scenarios/demo-moving-shadow.yaml" ;;
  test)
    shift
    dotnet test "$ROOT/MpptArena.sln" -c Release -nologo "$@" ;;
  bench)
    shift
    cd "$ROOT"
    dotnet run --project src/MpptArena.Benchmarks/MpptArena.Benchmarks.csproj -c Release -- "$@" ;;
  *)
    cli "$@" ;;
esac
