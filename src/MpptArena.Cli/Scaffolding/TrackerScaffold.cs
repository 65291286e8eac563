using System.Text;

namespace MpptArena.Cli.Scaffolding;

/// <summary>
/// Writes a ready-to-build C# tracker project: the tracker (a trivial hill climber implementing the
/// contract), an xunit test, a scenario that runs it against built-ins, and a README. The folder gets
/// its own Directory.Build.props and Directory.Packages.props so that it builds the same inside or
/// outside this repository.
/// </summary>
internal static class TrackerScaffold
{
    // The versions the arena itself tests with (Directory.Packages.props).
    private const string TestSdkVersion = "18.0.1", XunitVersion = "2.9.3", XunitRunnerVersion = "3.1.5";

    /// <summary>Name of the package source the scaffold's nuget.config adds.</summary>
    private const string FeedKey = "mppt-arena-local";

    /// <summary>
    /// Writes the project into <paramref name="folder"/>. The tracker references the MpptArena package by
    /// this tool's version, from <paramref name="feed"/> (a folder or URL that holds it) when given, else
    /// from a copy of the package that travels with the tool, placed in the project's own packages/.
    /// </summary>
    public static IReadOnlyList<string> Write(string name, string folder, string? feed = null)
    {
        if (name.Length == 0 || !char.IsAsciiLetter(name[0]) || name.Any(c => !(char.IsAsciiLetterOrDigit(c) || c is '-' or '_')))
        {
            throw new ArenaInputException($"tracker name '{name}' must start with a letter and use only letters, digits, '-' and '_'", "NAME");
        }
        if (Directory.Exists(folder) && Directory.EnumerateFileSystemEntries(folder).Any())
        {
            throw new ArenaInputException($"'{folder}' exists and is not empty; choose another --out", "--out");
        }
        string type = string.Concat(name.Split('-', '_').Where(p => p.Length > 0).Select(p => char.ToUpperInvariant(p[0]) + p[1..]));
        string kind = name.Replace('-', '_').ToLowerInvariant();
        string version = ArenaVersion.Release;
        string? bundled = feed is null ? BundledPackage(version) : null;
        if (feed is null && bundled is null)
        {
            throw new ArenaInputException(
                $"this mppt-arena ({AppContext.BaseDirectory}) carries no MpptArena {version} package in feed/ beside it; " +
                "pass --feed FOLDER-OR-URL where that package is (dotnet pack src/MpptArena -o FOLDER makes one)", "--feed");
        }
        string source = feed is null ? "packages" : (Directory.Exists(feed) ? Path.GetFullPath(feed) : feed);
        string origin = feed is null ? "packages/, copied in by mppt-arena new-tracker" : "--feed";
        string arenaReference = $"""    <PackageReference Include="MpptArena" Version="{version}" />""";
        var files = new Dictionary<string, string>
        {
            ["Directory.Build.props"] = """
                <Project>
                  <!-- Stops MSBuild from importing settings of any folder above this one. -->
                  <PropertyGroup>
                    <TargetFramework>net10.0</TargetFramework>
                    <Nullable>enable</Nullable>
                    <ImplicitUsings>enable</ImplicitUsings>
                    <TreatWarningsAsErrors>true</TreatWarningsAsErrors>
                  </PropertyGroup>
                </Project>
                """,
            ["Directory.Packages.props"] = """
                <Project>
                  <PropertyGroup>
                    <ManagePackageVersionsCentrally>false</ManagePackageVersionsCentrally>
                  </PropertyGroup>
                </Project>
                """,
            [$"src/{type}.csproj"] = $"""
                <Project Sdk="Microsoft.NET.Sdk">
                  <PropertyGroup>
                    <AssemblyName>{type}</AssemblyName>
                    <RootNamespace>{type}</RootNamespace>
                  </PropertyGroup>
                  <ItemGroup>
                {arenaReference}
                  </ItemGroup>
                </Project>
                """,
            ["nuget.config"] = $"""
                <?xml version="1.0" encoding="utf-8"?>
                <configuration>
                  <!-- Where the MpptArena package comes from ({origin}); other packages come from the usual sources. -->
                  <packageSources>
                    <add key="{FeedKey}" value="{source}" />
                  </packageSources>
                  <!-- Packages unpack into this project, not the machine-wide cache: a newer build of the arena
                       with the same version number cannot be shadowed by a stale cached copy. -->
                  <config>
                    <add key="globalPackagesFolder" value=".nuget-packages" />
                  </config>
                </configuration>
                """,
            [$"src/{type}Tracker.cs"] = TrackerSource(type, kind),
            [$"tests/{type}.Tests.csproj"] = $"""
                <Project Sdk="Microsoft.NET.Sdk">
                  <PropertyGroup>
                    <IsPackable>false</IsPackable>
                    <IsTestProject>true</IsTestProject>
                  </PropertyGroup>
                  <ItemGroup>
                    <PackageReference Include="Microsoft.NET.Test.Sdk" Version="{TestSdkVersion}" />
                    <PackageReference Include="xunit" Version="{XunitVersion}" />
                    <PackageReference Include="xunit.runner.visualstudio" Version="{XunitRunnerVersion}" />
                  </ItemGroup>
                  <ItemGroup>
                    <ProjectReference Include="../src/{type}.csproj" />
                  </ItemGroup>
                </Project>
                """,
            [$"tests/{type}Tests.cs"] = TestSource(type),
            ["scenario.yaml"] = ScenarioSource(type, kind),
            ["README.md"] = $"""
                # {name}

                A maximum-power-point tracker for MpptArena.

                ```sh
                dotnet test tests                               # builds the tracker and runs its test
                dotnet build src -c Release                     # the plug-in: src/bin/Release/net10.0/{type}.dll
                mppt-arena run scenario.yaml                    # scores it against built-in trackers
                ```

                `src/{type}Tracker.cs` starts as a plain hill climber. Change `Step`, declare tuning parameters in
                `Parameters`, and compare against the baseline with `mppt-arena compare`. The contract and its
                timing are described in MpptArena's docs/writing-a-tracker.md.
                """,
        };
        Directory.CreateDirectory(folder);
        var written = new List<string>();
        foreach (var (relative, text) in files)
        {
            string path = Path.Combine(folder, relative);
            Directory.CreateDirectory(Path.GetDirectoryName(path)!);
            File.WriteAllText(path, text.Replace("\r\n", "\n") + "\n", new UTF8Encoding(false));
            written.Add(path);
        }
        if (bundled is not null)
        {
            string copy = Path.Combine(folder, "packages", Path.GetFileName(bundled));
            Directory.CreateDirectory(Path.GetDirectoryName(copy)!);
            File.Copy(bundled, copy);
            written.Add(copy);
        }
        return written;
    }

    /// <summary>The MpptArena package of <paramref name="version"/> in feed/ beside this tool, or null.</summary>
    private static string? BundledPackage(string version)
    {
        string path = Path.Combine(AppContext.BaseDirectory, "feed", $"MpptArena.{version}.nupkg");
        return File.Exists(path) ? path : null;
    }

    private static string TrackerSource(string type, string kind) => $$"""
        using MpptArena.Trackers;

        namespace {{type}};

        /// <summary>
        /// A hill climber on the voltage reference: step in one direction while power rises, turn back when
        /// it falls. Replace the body of Step with your algorithm.
        /// </summary>
        [TrackerKind("{{kind}}", Summary = "Hill climber scaffolded by mppt-arena new-tracker")]
        public sealed class {{type}}Tracker : IMpptTracker
        {
            /// <summary>Declared parameters: scenario files, sweeps and reports read these.</summary>
            public static IReadOnlyList<TrackerParameter> Parameters { get; } =
            [
                new("step_v", "V", 2.0, 0.01, 100, "Change of the voltage reference per sample"),
                new("start_fraction", "-", 0.8, 0.1, 1.0, "Initial reference as a fraction of the STC open-circuit voltage"),
            ];

            private readonly double _stepV, _startFraction;
            private TrackerContext _context = null!;
            private double _reference, _previousPowerW;
            private int _direction;

            public {{type}}Tracker(TrackerSettings settings)
            {
                _stepV = settings["step_v"];
                _startFraction = settings["start_fraction"];
            }

            public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;

            public double Reset(TrackerContext context)
            {
                _context = context;
                _previousPowerW = 0;
                _direction = -1;
                _reference = Math.Clamp(_startFraction * context.NominalOpenCircuitVoltageV, context.MinCommand, context.MaxCommand);
                return _reference;
            }

            public double Step(in TrackerMeasurement m)
            {
                if (m.PowerW < _previousPowerW) _direction = -_direction;
                _previousPowerW = m.PowerW;
                _reference = Math.Clamp(_reference + _direction * _stepV, _context.MinCommand, _context.MaxCommand);
                return _reference;
            }
        }
        """;

    private static string TestSource(string type) => $$"""
        using MpptArena.Trackers;
        using Xunit;

        namespace {{type}}.Tests;

        public class {{type}}TrackerTests
        {
            private static readonly TrackerContext Context = new(0.01, 0, 500, 380, 9.5, 500.0 / 4096, 12.0 / 4096, 12, 12);

            private static {{type}}Tracker Create() =>
                new(new TrackerSettings({{type}}Tracker.Parameters, new Dictionary<string, double>()));

            [Fact]
            public void StartsInsideTheCommandRange()
            {
                double first = Create().Reset(Context);
                Assert.InRange(first, Context.MinCommand, Context.MaxCommand);
            }

            [Fact]
            public void TurnsBackWhenPowerFalls()
            {
                var t = Create();
                double v0 = t.Reset(Context);
                double v1 = t.Step(new TrackerMeasurement(0.01, v0, 8.0, 0, 0, v0));     // power rose from 0: keep going down
                double v2 = t.Step(new TrackerMeasurement(0.02, v1, 7.0, 0, 0, v1));     // power fell: turn back up
                Assert.True(v1 < v0);
                Assert.True(v2 > v1);
            }
        }
        """;

    private static string ScenarioSource(string type, string kind) => $$"""
        # Scores the scaffolded tracker against two built-ins on an invented ten-module string under a passing shade.
        # Build the plug-in first: dotnet build src -c Release
        name: {{kind}}-check
        plugins: [ src/bin/Release/net10.0/{{type}}.dll ]
        module:
          datasheet:
            short_circuit_current_a: 9.50
            open_circuit_voltage_v: 38.2
            mpp_current_a: 8.95
            mpp_voltage_v: 31.0
            cells_in_series: 60
            isc_temperature_coefficient_a_per_k: 0.0045
            voc_temperature_coefficient_v_per_k: -0.135
        array:
          modules_per_string: 10
        converter:
          type: boost
          bus_voltage_v: 700
        sensors:
          voltage: { bits: 12, full_scale_v: 500, noise_rms_v: 0.3 }
          current: { bits: 12, full_scale_a: 12, noise_rms_a: 0.01 }
        environment:
          irradiance_w_m2:
            - start: 900
            - hold_s: 4
            - ramp: { to: 500, rate_per_s: 100 }
            - hold_s: 4
          cell_temperature_c: 35
        simulation:
          seed: 1
        trackers:
          - { name: mine, type: {{kind}}, period_ms: 10 }
          - { name: po, type: perturb_observe, period_ms: 10 }
          - { name: cv, type: constant_voltage, period_ms: 10 }
        """;
}
