namespace ThermVerify.Tolerances;

/// <summary>
/// One toleranced quantity of a design: the key it comes from, its half-width in its own unit (fraction, LSB, V, A,
/// or 1 for an RTD class band), and its distribution.
/// </summary>
public sealed record ToleranceParameter(
    ToleranceKind Kind,
    string Key,
    double HalfWidth,
    string Unit,
    ToleranceDistribution Distribution)
{
    public double StandardDeviation => Distribution.StandardDeviation(HalfWidth);

    /// <summary>The netlist element a [[netlist.part]] tolerance moves (its name as the netlist writes it); null for every other kind.</summary>
    public string? Element { get; init; }
}
