namespace ThermVerify.Baselines;

/// <summary>Which way a figure improves.</summary>
public enum Better
{
    Lower,
    Higher,
}

/// <summary>
/// One key figure of a check, kept for regression: its value (null when it does not exist, e.g. an error at a code
/// no sensor can produce, which counts as the worst possible), its unit, which way is better, and how much it may
/// get worse before a comparison fails.
/// </summary>
public sealed record BaselineFigure(string Id, string Description, double? Value, string Unit, Better Better, double Tolerance);
