using ThermVerify.Limits;

namespace ThermVerify.Tolerances;

/// <summary>How a Monte Carlo run is made. The result depends on the design, <see cref="Units"/> and <see cref="Seed"/> only.</summary>
public sealed record MonteCarloOptions
{
    public int Units { get; init; } = 10_000;

    public ulong Seed { get; init; } = 1;

    public int Threads { get; init; } = Environment.ProcessorCount;

    /// <summary>Rerun the sampling transient with each unit's parts at its worst temperature (see <see cref="UnitEvaluator"/>).</summary>
    public bool SimulateSettling { get; init; } = true;

    /// <summary>Percentiles of the error envelope, in percent.</summary>
    public IReadOnlyList<double> Percentiles { get; init; } = [0.135, 2.5, 50, 97.5, 99.865];

    /// <summary>Called from worker threads as units complete (at most about 200 times a run).</summary>
    public IProgress<RunProgress>? Progress { get; init; }

    public CancellationToken Cancel { get; init; }
}
