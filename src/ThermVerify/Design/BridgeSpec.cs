namespace ThermVerify.Design;

/// <summary>
/// The opposite half of a Wheatstone bridge ([bridge]): two resistors from the same excitation to ground whose midpoint
/// is the converter's negative input. The sensor's half is the design's <see cref="FrontEndDesign.Divider"/> (the sensor
/// and its fixed resistor), so a bridge is the divider read against a second divider; both halves' resistors sit at the
/// board temperature.
/// </summary>
public sealed record BridgeSpec
{
    /// <summary>From the excitation to the opposite midpoint.</summary>
    public required double HighOhms { get; init; }
    /// <summary>Fraction, e.g. 0.001 for 0.1 %.</summary>
    public double HighTolerance { get; init; }
    /// <summary>Fraction per kelvin.</summary>
    public double HighTempcoPerKelvin { get; init; }
    /// <summary>Written with a sign: taken at that sign; without one the tempco is a bound (<see cref="SignWritten"/>).</summary>
    public bool HighTempcoSigned { get; init; }
    /// <summary>From the opposite midpoint to ground.</summary>
    public required double LowOhms { get; init; }
    public double LowTolerance { get; init; }
    public double LowTempcoPerKelvin { get; init; }
    public bool LowTempcoSigned { get; init; }

    /// <summary>The opposite half's ratio R_low/(R_high + R_low) with both resistors at <paramref name="boardCelsius"/>.</summary>
    public double RatioAt(double boardCelsius)
    {
        var high = HighOhms * (1 + HighTempcoPerKelvin * (boardCelsius - 25));
        var low = LowOhms * (1 + LowTempcoPerKelvin * (boardCelsius - 25));
        return low / (high + low);
    }
}
