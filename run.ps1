# MpptArena front door for PowerShell (Windows, macOS, Linux). Paths you give are taken from the folder
# you run it in; results land there too.
#   ./run.ps1              run the bundled demo scenario (results under ./results/)
#   ./run.ps1 test         build and run the test suite
#   ./run.ps1 bench [...]  run the BenchmarkDotNet suites (Release)
#   ./run.ps1 ARGS...      any mppt-arena command
$ErrorActionPreference = 'Stop'
$Root = $PSScriptRoot
$env:DOTNET_CLI_TELEMETRY_OPTOUT = '1'
$env:DOTNET_NOLOGO = '1'
$Dll = Join-Path $Root 'src/MpptArena.Cli/bin/Release/net10.0/mppt-arena.dll'

function Invoke-Cli([string[]] $CliArgs) {
    # Build quietly; show the build log only when the build fails.
    if (-not (Test-Path $Dll)) { [Console]::Error.WriteLine('building MpptArena (the first build restores packages and takes a minute or two)...') }
    $log = dotnet build (Join-Path $Root 'src/MpptArena.Cli/MpptArena.Cli.csproj') -c Release -nologo -v quiet 2>&1
    if ($LASTEXITCODE -ne 0) { $log | Out-Host; exit 3 }
    dotnet $Dll @CliArgs
    exit $LASTEXITCODE
}

if ($args.Count -eq 0) { Invoke-Cli @('run', (Join-Path $Root 'scenarios/demo-moving-shadow.yaml')) }
switch ($args[0]) {
    'test'  { dotnet test (Join-Path $Root 'MpptArena.sln') -c Release -nologo @($args | Select-Object -Skip 1); exit $LASTEXITCODE }
    'bench' { Set-Location -Path $Root; dotnet run --project src/MpptArena.Benchmarks/MpptArena.Benchmarks.csproj -c Release -- @($args | Select-Object -Skip 1); exit $LASTEXITCODE }
    default { Invoke-Cli $args }
}
