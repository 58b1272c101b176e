namespace ThermVerify.Check;

public enum Severity
{
    /// <summary>Information worth knowing; does not affect the verdict.</summary>
    Note,

    /// <summary>A real error, but the budget still holds.</summary>
    Warn,

    /// <summary>The budget is broken, or a requirement is not met: the check fails.</summary>
    Fail,
}

/// <summary>
/// One problem the check found: where, how big, why (the closed-form estimate beside the simulated value) and
/// what would fix it (computed, not guessed).
/// </summary>
public sealed record Finding(
    string Id,
    Severity Severity,
    string Title,
    double FromCelsius,
    double ToCelsius,
    double WorstCelsius,
    double SizeVolts,
    double SizeLsb,
    double SizeKelvin,
    string Cause,
    double? EstimateVolts,
    double? SimulatedVolts,
    IReadOnlyList<Remedy> Remedies);

/// <summary>A computed fix: the quantity to change, the value that brings the error within the target, and how it was found.</summary>
public sealed record Remedy(string Key, string Action, double? Value, string Unit, string Method);
