namespace ThermVerify.Firmware;

/// <summary>Which part failed and how.</summary>
public enum FaultKind { SensorOpen, SensorShorted, FixedOpen, FixedShorted }

/// <summary>The codes one fault can read, over the tolerance corners. An open or shorted part drives the node to a rail.</summary>
public sealed record FaultCode(FaultKind Kind, bool HighRail, int MinCode, int MaxCode);

/// <summary>
/// Codes firmware should treat as a fault: below <see cref="FaultBelowCode"/> or above <see cref="FaultAboveCode"/>.
/// Each threshold sits midway between the nearest fault code and the nearest code a healthy sensor inside the range
/// can read at any tolerance corner, so both sides keep the same margin.
/// </summary>
public sealed record FaultThresholds(
    IReadOnlyList<FaultCode> Faults,
    int LowestValidCode,
    int HighestValidCode,
    int FaultBelowCode,
    int FaultAboveCode)
{
    public bool IsFault(int code) => code < FaultBelowCode || code > FaultAboveCode;

    public FaultCode For(FaultKind kind) => Faults.Single(f => f.Kind == kind);
}
