using System.Text;

namespace MpptArena.Cli.Commands;

/// <summary>What `mppt-arena COMMAND --help` prints: what the command does, its options with their defaults, and an example.</summary>
/// <param name="Name">Command name.</param>
/// <param name="Arguments">Positional arguments as the usage line shows them.</param>
/// <param name="Summary">What the command does, in a sentence or two.</param>
/// <param name="Options">Each option or flag, what it means and its default.</param>
/// <param name="Example">A command line that works from the checkout.</param>
internal sealed record CommandHelp(string Name, string Arguments, string Summary, IReadOnlyList<(string Option, string Meaning)> Options, string Example)
{
    private static readonly (string, string)[] Limits =
    [
        ("--call-limit-ms MS", "longest one tracker call may take before the tracker is stopped (default 1000)"),
        ("--run-limit-s S", "total call time a tracker may use in the run (default 600)"),
        ("--memory-limit-mib MIB", "memory a tracker's host may use (default 512)"),
    ];

    /// <summary>Every command, in the order `mppt-arena help` lists them.</summary>
    public static IReadOnlyList<CommandHelp> All { get; } =
    [
        new("run", "SCENARIO.yaml", "Runs every tracker of a scenario against its own copy of the plant and writes a results folder (summary.json, summary.md, series CSVs, plots, logs).",
        [
            ("--tracker NAME", "run only this tracker (repeatable; default: all)"),
            ("--out DIR", "results folder, new or empty (default: results/<scenario>-<UTC time>)"),
            ("--force", "replace DIR when it holds an earlier result of the arena and nothing else"),
            ("--seed N", "one run with this seed of the sensor noise (default: the scenario's seed or seeds, else 1); with --seeds COUNT, the first seed"),
            ("--seeds N|A,B,...", "score over N seeds from the scenario's seed, or over the listed seeds: every score as mean, spread and 95 % confidence interval (default: the scenario's 'seeds', else one)"),
            ("--threads N", "seeds run at once (default: one per core)"),
            ("--full-series", "write a series row every plant step (default: every series_interval_ms)"),
            ("--no-plots", "skip the PNG plots"),
            ("--window START:END", "power and voltage plots show only this part of the run, in seconds (default: all; ':60' and '120:' leave a side open)"),
            ("--junit FILE", "also write the gates as a JUnit report"),
            ("--fail-below [TRACKER:]SCORE=V", "exit 1 when a score is below V (repeatable)"),
            ("--fail-above [TRACKER:]SCORE=V", "exit 1 when a score is above V (repeatable)"),
            ("--plugin DLL", "load tracker kinds from a .NET assembly (repeatable)"),
            .. Limits,
            ("--quiet", "no progress bar and no table"),
            ("--debug", "print a failed tracker's stack trace or last output"),
        ], "./run.sh run scenarios/demo-moving-shadow.yaml --out results/demo --fail-below tracking_efficiency=0.8"),
        new("curve", "PLANT_OR_SCENARIO.yaml", "Writes the array's I-V and P-V curves (CSV, PNG) and a table of every local MPP and the global one, for a plant file or a scenario at a given time.",
        [
            ("--at SECONDS", "the scenario's conditions at this time (default 0)"),
            ("--out DIR", "results folder, new or empty (default: results/<name>-curve)"),
            ("--force", "replace DIR when it holds an earlier result of the arena and nothing else"),
            ("--points N", "points on the curve, 10 to 1000000 (default 1000)"),
        ], "./run.sh curve scenarios/plant-two-peaks.yaml"),
        new("compare", "BASELINE CURRENT", "Compares two summaries (files or results folders) score by score; exit 1 when anything regressed, a score became undefined, or a tracker is missing or failing.",
        [
            ("--tolerances FILE.yaml", "allowed worsening per score (docs/tolerances.example.yaml)"),
            ("--tolerance SCORE=ABS[,REL]", "allowed worsening for one score (repeatable; default: the table in README.md); over common seeds a worsening must also be significant (95 % paired interval)"),
            ("--junit FILE", "also write the comparison as a JUnit report"),
            ("--all", "list unchanged scores too"),
        ], "./run.sh compare results/baseline results/current --tolerances docs/tolerances.example.yaml"),
        new("trackers", "", "Lists the tracker kinds with their parameters, units, defaults, ranges and published sources.",
        [("--plugin DLL", "also list the kinds of a .NET assembly (repeatable)")], "./run.sh trackers"),
        new("validate", "FILE.yaml...", "Checks scenario, plant and sweep files without running them: everything run and sweep would refuse, with its file, line and column.",
        [("--plugin DLL", "tracker kinds of a .NET assembly the files may name (repeatable)")], "./run.sh validate scenarios/*.yaml"),
        new("explain", "SCENARIO.yaml", "Prints the scenario as the arena will run it, every default filled in, with the plant's derived numbers: the fitted single-diode parameters and ideality factor, the module and array at STC, the converter's reachable PV-voltage window, sensor LSBs, the plant step and where it came from.",
        [("--plugin DLL", "tracker kinds of a .NET assembly the scenario may name (repeatable)")], "./run.sh explain scenarios/demo-moving-shadow.yaml"),
        new("new-tracker", "NAME", "Scaffolds a C# tracker project (tracker, xunit test, scenario) that builds and scores out of the box.",
        [("--out DIR", "project folder, new or empty (default: NAME)"),
         ("--feed SOURCE", "folder or URL holding the MpptArena package (default: the copy this tool carries, put in the project's packages/)")], "./run.sh new-tracker my-tracker --out ../my-tracker"),
        new("sweep", "SWEEP.yaml", "Runs a parameter sweep (or one shard of it) in parallel and resumably, or tunes with Nelder-Mead (--tune); writes cases, best settings, heat maps and Pareto plots.",
        [
            ("--out DIR", "sweep folder: new, empty, or this sweep's to resume (default: results/sweep-<name>)"),
            ("--force", "start over in DIR when it holds another sweep or an earlier result of the arena"),
            ("--shard K/N", "run only shard K of N (default: from the batch system's variables, else 1/1)"),
            ("--threads N", "workers (default: one per core, one per two cores with isolated trackers)"),
            ("--seeds N|A,B,...", "run every case over N seeds from each scenario's seed, or over the listed seeds, and rank settings by their mean (default: each scenario's 'seeds', else one)"),
            ("--tune", "tune the sweep's 'tune' section instead of running the grid"),
            ("--no-plots", "skip the PNG plots"),
            ("--plugin DLL", "load tracker kinds from a .NET assembly (repeatable)"),
            ("--quiet", "no progress bar and no table"),
        ], "./run.sh sweep scenarios/sweeps/tuning-demo.yaml --threads 2"),
        new("procedure", "FILE.yaml", "Runs the MPPT efficiency test procedure on a scenario's converter, sensors and trackers: static efficiency at 5 to 100 % of rated power at the minimum, rated and maximum MPP voltage, the European and CEC weighted efficiencies, the 10-50 % and 30-100 % ramp sequences slope by slope and the start-up and shut-down ramp, on the procedure's crystalline-silicon or thin-film test array or the scenario's own; in parallel and resumable. A pre-compliance estimate, not a certified test.",
        [
            ("--tracker NAME", "run only this tracker (repeatable; default: all)"),
            ("--out DIR", "procedure folder: new, empty, or this procedure's to resume (default: results/procedure-<name>)"),
            ("--force", "start over in DIR when it holds another result of the arena"),
            ("--threads N", "points run at once (default: one per core)"),
            ("--seeds N|A,B,...", "run every point over N seeds, or the listed ones, and report means (default: the file's 'seeds', else one)"),
            ("--no-plots", "skip the PNG plots"),
            ("--plugin DLL", "load tracker kinds from a .NET assembly (repeatable)"),
            ("--quiet", "no progress bar and no report on the console"),
        ], "./run.sh procedure scenarios/procedure-string-inverter.yaml --tracker po"),
        new("merge", "SHARD_DIR...", "Joins the shards of one sweep, run from the same inputs, into the result a single machine would have written.",
        [
            ("--out DIR", "merged folder, new or empty (required)"),
            ("--force", "replace DIR when it holds an earlier result of the arena and nothing else"),
            ("--no-plots", "skip the PNG plots"),
        ], "./run.sh merge shards/1 shards/2 --out merged"),
    ];

    /// <summary>The help of <paramref name="command"/>, or null for an unknown one.</summary>
    public static CommandHelp? For(string command) => All.FirstOrDefault(h => h.Name == command);

    /// <summary>The text printed for --help.</summary>
    public string Render()
    {
        var sb = new StringBuilder();
        sb.Append("usage: mppt-arena ").Append(Name).Append(Arguments.Length > 0 ? " " + Arguments : "").Append(Options.Count > 0 ? " [options]" : "").Append("\n\n");
        sb.Append(Summary).Append("\n\n");
        if (Options.Count > 0)
        {
            sb.Append("options:\n");
            int width = Options.Max(o => o.Option.Length) + 2;
            foreach (var (option, meaning) in Options) sb.Append("  ").Append(option.PadRight(width)).Append(meaning).Append('\n');
            sb.Append('\n');
        }
        sb.Append("example:\n  ").Append(Example).Append('\n');
        return sb.ToString();
    }
}
