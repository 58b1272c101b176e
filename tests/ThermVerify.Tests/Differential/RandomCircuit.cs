using ThermVerify.Circuits;

namespace ThermVerify.Tests.Differential;

/// <summary>Linear circuits hold only linear elements (switches included); nonlinear ones add diodes or op-amp limits.</summary>
internal enum CircuitClass
{
    Linear,
    Nonlinear,
}

/// <summary>
/// A generated circuit and what the differential run does with it: an AC source (AC magnitude 1), a noise output and
/// the voltage source the noise is referred to, a source to sweep, and the transient's stop time.
/// </summary>
internal sealed record RandomCircuit(int Seed, CircuitClass Class, Circuit Circuit)
{
    public required string AcSource { get; init; }

    public required string NoiseOutput { get; init; }

    /// <summary>A voltage source (ngspice's .noise names one), or null when the circuit has none.</summary>
    public string? NoiseInput { get; init; }

    public required string SweepSource { get; init; }

    public required double SweepFrom { get; init; }

    public required double SweepTo { get; init; }

    public required double TransientStopSeconds { get; init; }

    /// <summary>1/|s| of the fastest pole at the operating point (0 when unknown).</summary>
    public double FastestTimeConstantSeconds { get; init; }

    /// <summary>The nodes both engines report (the op-amps' internal nodes are the engines' own business).</summary>
    public IReadOnlyList<string> Nodes => Circuit.NodeNames;

    public string Describe() =>
        $"seed {Seed} ({Class}, {Circuit.NodeNames.Count} nodes): {string.Join(", ", Circuit.Elements.Select(e => e.GetType().Name + " " + e.Name))}";
}
