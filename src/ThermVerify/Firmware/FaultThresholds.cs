namespace ThermVerify.Firmware;

/// <summary>Which part failed and how; the Opposite kinds are a bridge's opposite half (from the excitation to its midpoint, and from there to ground).</summary>
public enum FaultKind { SensorOpen, SensorShorted, FixedOpen, FixedShorted, OppositeHighOpen, OppositeHighShorted, OppositeLowOpen, OppositeLowShorted }

/// <summary>The codes one fault can read, over the tolerance corners. An open or shorted part drives the node to a rail (<paramref name="HighRail"/>: above the healthy codes).</summary>
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
