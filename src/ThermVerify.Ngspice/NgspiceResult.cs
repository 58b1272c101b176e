using System.Numerics;

namespace ThermVerify.Ngspice;

/// <summary>One vector of an ngspice plot, copied out of the engine at once.</summary>
internal sealed record NgspiceVector(string Name, double[] Real, Complex[]? Complex)
{
    public bool IsComplex => Complex is not null;
    public int Length => Complex?.Length ?? Real.Length;
}

/// <summary>The vectors of one analysis (ngspice calls it a plot: dc1, tran1, ac1, noise1 …).</summary>
internal sealed record NgspicePlot(string Name, string Title, IReadOnlyDictionary<string, NgspiceVector> Vectors)
{
    /// <summary>A vector by name (node "out", branch "v1#branch"), case-insensitive as ngspice is.</summary>
    public NgspiceVector this[string name] =>
        Vectors.TryGetValue(name.ToLowerInvariant(), out var vector)
            ? vector
            : throw new KeyNotFoundException($"ngspice plot '{Name}' has no vector '{name}'; it has {string.Join(", ", Vectors.Keys)}");
}

/// <summary>Everything one deck produced: its plots in order and what ngspice printed.</summary>
internal sealed record NgspiceResult(IReadOnlyList<NgspicePlot> Plots, IReadOnlyList<string> Output)
{
    public NgspicePlot Plot(string namePrefix) =>
        Plots.FirstOrDefault(p => p.Name.StartsWith(namePrefix, StringComparison.OrdinalIgnoreCase))
        ?? throw new KeyNotFoundException($"ngspice produced no '{namePrefix}' plot; it produced {string.Join(", ", Plots.Select(p => p.Name))}");
}
