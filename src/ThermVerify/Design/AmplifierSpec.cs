namespace ThermVerify.Design;

/// <summary>
/// An instrumentation or difference amplifier between a bridge's two outputs and a single-ended converter ([amplifier]):
/// V_out = G·(1 + ε)·(V+ − V− + V_os(T)) + G·CMRR⁻¹·(V+ + V−)/2, with input bias currents drawn from both outputs;
/// it sits at the board temperature. Static errors written without a sign are bounds (<see cref="SignWritten"/>); the
/// common-mode rejection is always a bound (a datasheet's CMRR has no sign), carried as the signed fraction
/// <see cref="CommonModeFraction"/> = ±10^(−CMRR/20).
/// </summary>
public sealed record AmplifierSpec
{
    public required double Gain { get; init; }
    /// <summary>ε, a fraction of the gain.</summary>
    public double GainError { get; init; }
    public bool GainErrorSigned { get; init; }
    public double OffsetVolts { get; init; }
    public bool OffsetSigned { get; init; }
    public double OffsetDriftVoltsPerKelvin { get; init; }
    public bool OffsetDriftSigned { get; init; }
    /// <summary>10^(−CMRR/20): the common-mode gain over the differential gain; 0 without a CMRR (ideal).</summary>
    public double CommonModeFraction { get; init; }
    /// <summary>Into each input, drawn from the bridge's outputs.</summary>
    public double BiasCurrentAmperes { get; init; }
    public bool BiasCurrentSigned { get; init; }
    /// <summary>The output voltages it reaches; null: not checked.</summary>
    public VoltageRange? OutputRange { get; init; }
    /// <summary>The inputs' common mode it works over; null: not checked.</summary>
    public VoltageRange? InputCommonMode { get; init; }

    /// <summary>The offset at <paramref name="celsius"/>: V_os + D·(T − 25 °C).</summary>
    public double OffsetVoltsAt(double celsius) => OffsetVolts + OffsetDriftVoltsPerKelvin * (celsius - 25);
}
