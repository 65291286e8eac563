using MpptArena.Trackers.BuiltIn;

namespace MpptArena.Trackers;

/// <summary>The tracker kinds a run can name: the built-ins plus any registered from plug-ins.</summary>
public sealed class TrackerRegistry
{
    private readonly Dictionary<string, TrackerDescriptor> _byKind = new(StringComparer.Ordinal);

    /// <summary>A registry holding the built-in trackers.</summary>
    public static TrackerRegistry WithBuiltIns()
    {
        var r = new TrackerRegistry();
        r.Register(new("perturb_observe", "Fixed-step perturb and observe on the voltage reference",
            "Femia, Petrone, Spagnuolo, Vitelli, IEEE Trans. Power Electronics 20(4), 2005",
            PerturbAndObserve.Parameters, s => new PerturbAndObserve(s)));
        r.Register(new("perturb_observe_duty", "Fixed-step perturb and observe on the duty cycle",
            "Femia, Petrone, Spagnuolo, Vitelli, IEEE Trans. Power Electronics 20(4), 2005",
            PerturbAndObserveDuty.Parameters, s => new PerturbAndObserveDuty(s)));
        r.Register(new("incremental_conductance", "Incremental conductance with a relative tolerance",
            "Hussein, Muta, Hoshino, Osakada, IEE Proc. Gener. Transm. Distrib. 142(1), 1995",
            IncrementalConductance.Parameters, s => new IncrementalConductance(s)));
        r.Register(new("variable_step_incremental_conductance", "Incremental conductance with step N|dP/dV|",
            "Liu, Duan, Liu, Liu, Kang, IEEE Trans. Industrial Electronics 55(7), 2008",
            VariableStepIncrementalConductance.Parameters, s => new VariableStepIncrementalConductance(s)));
        r.Register(new("fractional_open_circuit", "Periodic open-circuit sample, Vref = k Voc",
            "Esram, Chapman, IEEE Trans. Energy Conversion 22(2), 2007",
            FractionalOpenCircuitVoltage.Parameters, s => new FractionalOpenCircuitVoltage(s)));
        r.Register(new("periodic_scan", "Periodic voltage scan to the best point, local P&O between scans",
            "Esram, Chapman 2007; Patel, Agarwal, IEEE Trans. Industrial Electronics 55(4), 2008",
            PeriodicScanTracker.Parameters, s => new PeriodicScanTracker(s)));
        r.Register(new("constant_voltage", "Fixed fraction of the STC open-circuit voltage (baseline)",
            "Esram, Chapman, IEEE Trans. Energy Conversion 22(2), 2007",
            ConstantVoltage.Parameters, s => new ConstantVoltage(s)));
        return r;
    }

    /// <summary>Adds a kind; a kind registered twice is refused.</summary>
    public void Register(TrackerDescriptor descriptor)
    {
        if (!_byKind.TryAdd(descriptor.Kind, descriptor))
        {
            throw new ArenaInputException($"tracker kind '{descriptor.Kind}' is registered twice", "kind");
        }
    }

    /// <summary>A copy that can take more kinds without changing this one.</summary>
    public TrackerRegistry Clone()
    {
        var r = new TrackerRegistry();
        foreach (var d in _byKind.Values) r._byKind[d.Kind] = d;
        return r;
    }

    /// <summary>All kinds, sorted by name.</summary>
    public IReadOnlyList<TrackerDescriptor> All => _byKind.Values.OrderBy(d => d.Kind, StringComparer.Ordinal).ToList();

    /// <summary>The descriptor of a kind, or null.</summary>
    public TrackerDescriptor? Find(string kind) => _byKind.GetValueOrDefault(kind);
}
