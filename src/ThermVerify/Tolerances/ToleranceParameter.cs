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
}
