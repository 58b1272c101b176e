namespace ThermVerify.Firmware;

/// <summary>
/// What `table` is asked for: the fixed-point unit, how breakpoints are placed (every code when neither a bound nor a
/// count is given), whether the model is corrected for the simulated DC loading, and the C identifier prefix.
/// </summary>
public sealed record TableRequest
{
    public FixedPointScale Scale { get; init; } = FixedPointScale.CentiKelvin;

    /// <summary>Place breakpoints so that interpolation stays within this error (K).</summary>
    public double? BoundKelvin { get; init; }

    /// <summary>Use at most this many breakpoints, placed to minimise the worst error.</summary>
    public int? Breakpoints { get; init; }

    public bool CorrectForLoading { get; init; }

    /// <summary>C identifier prefix; null: from the design's name.</summary>
    public string? Prefix { get; init; }
}
