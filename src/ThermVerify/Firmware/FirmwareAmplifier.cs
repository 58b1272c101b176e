using ThermVerify.Design;

namespace ThermVerify.Firmware;

/// <summary>
/// The amplifier between a bridge and the converter as firmware takes it: V_out = G′·(V_d + V_os′), with G′ = G·(1 + ε)
/// and V_os′ = V_os + D·(T_board − 25 °C) counting only the errors the designer wrote with a sign (known values, taken as
/// written); errors written as bounds are not known to the firmware and stay the check's and the tolerance analyses'
/// business. The bounds are kept beside it for the fault thresholds only, whose corners must hold for every amplifier:
/// the gain error ±|ε| and an input-referred offset ±(|V_os| + |D|·|ΔT| + |CMRR⁻¹|·E) (the common mode is at most the
/// excitation E), with the output clipped to the amplifier's declared output range.
/// </summary>
internal sealed record FirmwareAmplifier(double Gain, double InputOffsetVolts)
{
    /// <summary>The unsigned gain error, a fraction: a fault threshold's corner.</summary>
    public double GainErrorBound { get; init; }

    /// <summary>The unsigned input-referred offset (offset, its drift, the common mode through the CMRR): a fault threshold's corner.</summary>
    public double OffsetBoundVolts { get; init; }

    /// <summary>The output voltages the amplifier reaches; null: not declared (not clipped).</summary>
    public VoltageRange? OutputRange { get; init; }

    /// <summary>The nominal output for a bridge voltage V_d: what the firmware's table assumes.</summary>
    public double OutputVolts(double differentialVolts) => Gain * (differentialVolts + InputOffsetVolts);

    /// <summary>The bridge voltage behind an output: the inverse of <see cref="OutputVolts"/>.</summary>
    public double DifferentialVolts(double outputVolts) => outputVolts / Gain - InputOffsetVolts;

    /// <summary>The output at a corner of the bounds (each sign ±1), clipped to the output range: what a fault can read.</summary>
    public double CornerOutputVolts(double differentialVolts, double gainSign, double offsetSign)
    {
        var volts = Gain * (1 + gainSign * GainErrorBound) * (differentialVolts + InputOffsetVolts + offsetSign * OffsetBoundVolts);
        return OutputRange is { } range ? Math.Clamp(volts, range.MinVolts, range.MaxVolts) : volts;
    }

    /// <summary>The firmware's amplifier for a design; <paramref name="excitationVolts"/> bounds the common mode.</summary>
    public static FirmwareAmplifier Of(AmplifierSpec a, FrontEndDesign design, double excitationVolts)
    {
        var range = design.Check.Range;
        // The board's temperature when the design fixes one; otherwise the drift is unknown to the firmware (a bound over the range).
        var board = design.Check.BoardCelsius;
        var farthest = board is { } b ? Math.Abs(b - 25) : Math.Max(Math.Abs(range.MinCelsius - 25), Math.Abs(range.MaxCelsius - 25));
        var knownOffset = (a.OffsetSigned ? a.OffsetVolts : 0) + (a.OffsetDriftSigned && board is { } at ? a.OffsetDriftVoltsPerKelvin * (at - 25) : 0);
        var offsetBound = (a.OffsetSigned ? 0 : Math.Abs(a.OffsetVolts))
                          + (a.OffsetDriftSigned && board is not null ? 0 : Math.Abs(a.OffsetDriftVoltsPerKelvin) * farthest)
                          + Math.Abs(a.CommonModeFraction) * excitationVolts;
        return new FirmwareAmplifier(a.Gain * (1 + (a.GainErrorSigned ? a.GainError : 0)), knownOffset)
        {
            GainErrorBound = a.GainErrorSigned ? 0 : Math.Abs(a.GainError),
            OffsetBoundVolts = offsetBound,
            OutputRange = a.OutputRange,
        };
    }
}
