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
    IReadOnlyList<Remedy> Remedies)
{
    /// <summary>What the remedy search concluded when no single change clears the finding (null when one does, or none was searched).</summary>
    public string? RemedyNote { get; init; }
}

/// <summary>
/// A computed fix: the design key to change, the value that brings the finding within ½ LSB (or the budget), and how
/// it was found. A remedy is only given once a copy of the design with the change applied has been checked and the
/// finding was gone with no new failing finding; <see cref="Proof"/> says what that check found. A combination lists
/// its other changes in <see cref="Together"/>: all of them are applied together.
/// </summary>
public sealed record Remedy(string Key, string Action, double? Value, string Unit, string Method)
{
    public IReadOnlyList<Remedy> Together { get; init; } = [];

    public string Proof { get; init; } = "";
}
