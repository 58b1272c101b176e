namespace ThermVerify.Limits;

/// <summary>
/// Bounds on the work one run may take on, so that a design cannot make thermverify run out of memory or time before
/// it says why: the temperatures of a sweep, the conversions of one sampling run, the size of every file read. The
/// defaults hold every bundled example with a wide margin; a user who needs more raises them (`--max-points`,
/// `--max-conversions`, `--max-file-size`). docs/design-file.md lists them.
/// </summary>
public sealed record WorkLimits
{
    public static WorkLimits Default { get; } = new();

    /// <summary>Temperatures in one sweep: (high − low)/step + 1. 100,000 is a 0.01 K step over 1,000 K.</summary>
    public int MaximumSweepPoints { get; init; } = 100_000;

    /// <summary>Conversions one sampling run may simulate before it is declared unsettled.</summary>
    public int MaximumConversions { get; init; } = 20_000;

    /// <summary>Bytes of any file a design names or is (design, R–T table, subcircuit file): 4 MiB.</summary>
    public long MaximumFileBytes { get; init; } = 4L << 20;
}
