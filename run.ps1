# MpptArena front door for PowerShell (Windows, macOS, Linux).
#   ./run.ps1              run the bundled demo scenario (results under results/)
#   ./run.ps1 test         build and run the test suite
#   ./run.ps1 bench [...]  run the BenchmarkDotNet suites (Release)
#   ./run.ps1 ARGS...      any mppt-arena command
$ErrorActionPreference = 'Stop'
Set-Location -Path $PSScriptRoot
$env:DOTNET_CLI_TELEMETRY_OPTOUT = '1'
$env:DOTNET_NOLOGO = '1'

function Invoke-Cli([string[]] $CliArgs) {
    # Build quietly; show the build log only when the build fails.
    $log = dotnet build src/MpptArena.Cli/MpptArena.Cli.csproj -c Release -nologo -v quiet 2>&1
    if ($LASTEXITCODE -ne 0) { $log | Out-Host; exit 3 }
    dotnet src/MpptArena.Cli/bin/Release/net10.0/mppt-arena.dll @CliArgs
    exit $LASTEXITCODE
}

if ($args.Count -eq 0) { Invoke-Cli @('run', 'scenarios/demo-moving-shadow.yaml') }
switch ($args[0]) {
    'test'  { dotnet test MpptArena.sln -c Release -nologo @($args | Select-Object -Skip 1); exit $LASTEXITCODE }
    'bench' { dotnet run --project src/MpptArena.Benchmarks/MpptArena.Benchmarks.csproj -c Release -- @($args | Select-Object -Skip 1); exit $LASTEXITCODE }
    default { Invoke-Cli $args }
}
