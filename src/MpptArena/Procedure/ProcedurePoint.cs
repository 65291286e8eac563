using MpptArena.Scenarios;

namespace MpptArena.Procedure;

/// <summary>What one operating point of the procedure measures.</summary>
public enum ProcedurePointKind
{
    /// <summary>A static point: constant power level and MPP voltage.</summary>
    Static,

    /// <summary>A ramp sequence, scored slope by slope.</summary>
    Dynamic,

    /// <summary>The start-up and shut-down ramp at low irradiance.</summary>
    StartUpShutDown,
}

/// <summary>One independent run of the procedure.</summary>
/// <param name="Kind">What it measures.</param>
/// <param name="Scenario">The scenario that runs it (its name identifies the point).</param>
/// <param name="LevelFraction">Static power level [-], for static points.</param>
/// <param name="MppVoltageV">MPP voltage at STC of its test array [V].</param>
/// <param name="Window">Name of the window whose efficiency is the point's result (static points), or the group of the ramp windows.</param>
public sealed record ProcedurePoint(ProcedurePointKind Kind, Scenario Scenario, double? LevelFraction, double MppVoltageV, string Window);
